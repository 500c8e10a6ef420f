import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import type { EnergyChartAssessment } from '../../../src/analysis/energy/energy-chart.ts'
import type { CliIo } from '../../../src/cli/command.ts'
import { runCli } from '../../../src/cli/main.ts'

const DEMO = 'climate-demo/energy/quillow-dryer-batches-2026.csv'

function io(files: Record<string, string> = {}) {
  const out: string[] = []
  const err: string[] = []
  const written: Record<string, string> = {}
  const cli: CliIo = {
    stdout: (t) => out.push(t),
    stderr: (t) => err.push(t),
    readFile: async (p) => {
      if (p in files) return new TextEncoder().encode(files[p])
      return new Uint8Array(readFileSync(new URL(`../../../${p}`, import.meta.url)))
    },
    writeFile: async (p, d) => {
      written[p] = typeof d === 'string' ? d : new TextDecoder().decode(d)
    },
  }
  return { cli, out, err, written }
}

describe('dryhours energy-chart', () => {
  it('prints the answer, the limits and every batch for the demo log', async () => {
    const t = io()
    expect(await runCli(['energy-chart', DEMO], t.cli)).toBe(0)
    const text = t.out.join('')
    expect(text).toMatch(/^Answer: .* from batch Q26-041/)
    expect(text).toMatch(/Rows: 65 read, 64 used, 1 rejected/)
    expect(text).toMatch(/Q26-042 .* \| \S*↑/)
  })
  it('--json prints the assessment; --product adds the heat of sorption and raises the efficiency', async () => {
    const plain = io()
    await runCli(['energy-chart', DEMO, '--json'], plain.cli)
    const withCorn = io()
    await runCli(['energy-chart', DEMO, '--json', '--product', 'shelled-corn'], withCorn.cli)
    const a = JSON.parse(plain.out.join('')) as EnergyChartAssessment
    const b = JSON.parse(withCorn.out.join('')) as EnergyChartAssessment
    expect(a.batches[0].sorptionHeatMj).toBeNull()
    expect(b.batches[0].sorptionHeatMj).toBeGreaterThan(0)
    expect(b.batches[0].thermalEfficiencyPct).toBeGreaterThan(a.batches[0].thermalEfficiencyPct)
  })
  it('--format html --out writes the page', async () => {
    const t = io()
    expect(
      await runCli(['energy-chart', DEMO, '--format', 'html', '--out', 'e.html', '--baseline', '25'], t.cli),
    ).toBe(0)
    expect(t.written['e.html']).toContain('first 25 batches')
    expect(t.err.join('')).toBe('wrote e.html\n')
  })
  it('--weather joins outside air for a log without ambient columns', async () => {
    const t0 = Date.UTC(2026, 8, 1)
    const weather = ['time,temperature_c,relative_humidity_pct']
    for (let h = 0; h < 24 * 20; h++) {
      weather.push(
        `${new Date(t0 + h * 3_600_000).toISOString().slice(0, 16)}Z,${(15 + 5 * Math.sin(h / 3.8)).toFixed(1)},${(60 + 20 * Math.cos(h / 5.1)).toFixed(0)}`,
      )
    }
    const log = ['start,duration_h,fresh_mass_kg,final_mass_kg,energy_kwh']
    for (let d = 1; d <= 12; d++) {
      log.push(
        `2026-09-${String(d).padStart(2, '0')}T08:00Z,3,${9000 + 300 * (d % 4)},${8100 + 250 * (d % 4)},${1100 + 40 * ((d * 3) % 7)}`,
      )
    }
    const t = io({ 'log.csv': log.join('\n'), 'w.csv': weather.join('\n') })
    expect(
      await runCli(['energy-chart', 'log.csv', '--weather', 'w.csv', '--baseline', '8', '--json'], t.cli),
    ).toBe(0)
    const a = JSON.parse(t.out.join('')) as EnergyChartAssessment
    expect(a.batches.map((b) => b.ambient?.source)).toEqual(new Array(12).fill('weather'))
    expect(a.assumptions.some((s) => /mean of the batch's hours/.test(s))).toBe(true)
    const bad = io({ 'log.csv': log.join('\n'), 'w.csv': 'nothing,here\n1,2\n' })
    expect(await runCli(['energy-chart', 'log.csv', '--weather', 'w.csv'], bad.cli)).toBe(2)
    expect(bad.err.join('')).toMatch(/^dryhours energy-chart: w\.csv: /)
  })
  it('bad input is one line on stderr with exit code 2', async () => {
    const cases: [string[], RegExp][] = [
      [['energy-chart'], /give exactly one batch log file/],
      [['energy-chart', DEMO, '--baseline', '3'], /baseline must be a whole number of batches from 5 to 64/],
      [['energy-chart', DEMO, '--format', 'pdf'], /--format must be text, json, html or csv, got 'pdf'/],
      [['energy-chart', DEMO, '--fuel', 'coal'], /--fuel must be one of/],
      [['energy-chart', DEMO, '--product', 'moon-rock'], /unknown product 'moon-rock'/],
      [
        ['energy-chart', 'bad.csv'],
        /bad.csv: no usable batch in 1 row; first problem: line 2: start must be an ISO 8601 date-time/,
      ],
    ]
    for (const [args, message] of cases) {
      const t = io({ 'bad.csv': 'start,duration_h,fresh_mass_kg,final_mass_kg,energy_kwh\nmonday,1,2,1,3\n' })
      expect(await runCli(args, t.cli), args.join(' ')).toBe(2)
      expect(t.err.join('')).toMatch(message)
      expect(t.err.join('').trim().split('\n')).toHaveLength(1)
    }
  })
})

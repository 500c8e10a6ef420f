/**
 * Every rejected row findable (issue "no input may freeze or exhaust the server", item 4): the inspect JSON
 * lists every rejected row with its line (the problem notes stay capped at 100, with their counts), and
 * `format=rejected` downloads them as CSV; a batch log refused as a whole lists every bad line, not the first 50.
 * The files are invented here, so the test knows the line of every bad row.
 */
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import type { CliIo } from '../../src/cli/command.ts'
import { runCli } from '../../src/cli/main.ts'
import { app, expectProblem, post } from './hostile-helpers.ts'

interface Built {
  text: string
  /** Line of each row that must be rejected, and why. */
  rejected: Map<number, string>
}

/**
 * 60 days of hourly rows from 2024-05-01 UTC; every 7th row has an unreadable time, every 11th row repeats the
 * hour before it, and days 30–31 have no dry bulb (a 48-hour gap, too long to fill). RH above 100 % every
 * 3rd row gives thousands of notes (clamped, not rejected).
 */
function build(): Built {
  const lines = ['time,temp_c,rh_pct,ghi_wm2,wind_ms']
  const rejected = new Map<number, string>()
  let lastStamp = ''
  for (let h = 0; h < 60 * 24; h++) {
    const line = lines.length + 1
    const stamp = new Date(Date.UTC(2024, 4, 1, h)).toISOString().slice(0, 16) + 'Z'
    const hour = h % 24
    const t = (24 + 8 * Math.sin(((hour - 9) / 24) * 2 * Math.PI)).toFixed(1)
    const rh = h % 3 === 0 ? '100.4' : (50 - 20 * Math.sin(((hour - 9) / 24) * 2 * Math.PI)).toFixed(0)
    const wind = (2 + Math.sin(h)).toFixed(1)
    const ghi = hour >= 6 && hour <= 18 ? Math.round(800 * Math.sin(((hour - 6) / 12) * Math.PI)) : 0
    if (h % 7 === 3) {
      lines.push(`not a time ${h},${t},${rh},${ghi},${wind}`)
      rejected.set(line, 'bad-timestamp')
      continue
    }
    if (h % 11 === 5 && lastStamp !== '') {
      lines.push(`${lastStamp},${t},${rh},${ghi},${wind}`)
      rejected.set(line, 'duplicate-timestamp')
      continue
    }
    const noDryBulb = h >= 29 * 24 && h < 31 * 24
    lines.push(`${stamp},${noDryBulb ? '' : t},${rh},${ghi},${wind}`)
    if (noDryBulb) rejected.set(line, 'core-missing')
    lastStamp = stamp
  }
  return { text: `${lines.join('\n')}\n`, rejected }
}

interface InspectBody {
  rows: { read: number; used: number; repaired: number; rejected: number }
  rejectedRows: { line: number; kind: string }[]
  problems: unknown[]
  problemsListed: number
  problemsTotal: number
}

describe('every rejected weather row is findable', () => {
  const { text, rejected } = build()

  it('the inspect JSON lists every rejected row with its line and kind; notes stay capped with counts', async () => {
    const res = await post('/v1/inspect', text, 'text/csv')
    expect(res.status).toBe(200)
    const body = (await res.json()) as InspectBody
    expect(rejected.size).toBeGreaterThan(300)
    expect(body.rows.rejected).toBe(rejected.size)
    expect(body.rejectedRows).toHaveLength(rejected.size)
    expect(new Map(body.rejectedRows.map((r) => [r.line, r.kind]))).toEqual(rejected)
    // the notes (every problem, clamped RH included) stay capped, with their total
    expect(body.problems).toHaveLength(100)
    expect(body.problemsListed).toBe(100)
    expect(body.problemsTotal).toBeGreaterThan(400)
  })

  it('format=rejected downloads every rejected row as CSV (line, kind, message)', async () => {
    const res = await post('/v1/inspect?format=rejected', text, 'text/csv')
    expect(res.status).toBe(200)
    expect(res.headers.get('content-type')).toBe('text/csv; charset=utf-8')
    expect(res.headers.get('content-disposition')).toMatch(
      /attachment; filename="dryhours-rejected-rows\.csv"/,
    )
    const rows = (await res.text()).trimEnd().split('\r\n')
    expect(rows[0]).toBe('line,kind,message')
    expect(rows).toHaveLength(rejected.size + 1)
    const lines = rows.slice(1).map((r) => Number(r.split(',')[0]))
    expect(lines).toEqual([...rejected.keys()])
  })

  it('the CLI lists them too (JSON: every row; text: the lines as ranges)', async () => {
    const out: string[] = []
    const io: CliIo = {
      stdout: (t) => out.push(t),
      stderr: () => {},
      readFile: async () => new TextEncoder().encode(text),
      writeFile: async () => {},
    }
    expect(await runCli(['inspect', 'f.csv', '--json'], io)).toBe(0)
    const body = JSON.parse(out.join('')) as InspectBody
    expect(body.rejectedRows.map((r) => r.line)).toEqual([...rejected.keys()])
    out.length = 0
    expect(await runCli(['inspect', 'f.csv'], io)).toBe(0)
    const line = out
      .join('')
      .split('\n')
      .find((l) => l.startsWith('rejected'))
    expect(line).toMatch(/^rejected {4}lines 5, 7, 12, /)
    expect(line).toMatch(/--json lists every one in rejectedRows/)
  })
})

describe('a batch log refused as a whole lists every bad line', () => {
  it('120 rows without a usable energy: 422 with 120 errors, one per line', async () => {
    const header = 'start,duration_h,fresh_mass_kg,final_mass_kg,energy_kwh'
    const rows = Array.from(
      { length: 120 },
      (_, i) => `2026-09-${String((i % 28) + 1).padStart(2, '0')}T08:00Z,4,10000,9000,NaN`,
    )
    const p = await expectProblem(
      await post('/v1/energy-chart', `${header}\n${rows.join('\n')}\n`, 'text/csv'),
      [422],
    )
    expect(p.errors).toHaveLength(120)
    expect(p.errors?.map((e) => e.path)).toEqual(rows.map((_, i) => `line ${i + 2}`))
  })

  it('a log with some bad rows: the answer lists each rejected row with its line', async () => {
    const good = readFileLog()
    const bad = good.replace(/\n(Q26-0(0[5-9]|1\d)),/g, '\n$1,not-a-date-')
    const chart = async (log: string) => {
      const res = await app.request('/v1/energy-chart', {
        method: 'POST',
        body: log,
        headers: { 'content-type': 'text/csv' },
      })
      expect(res.status).toBe(200)
      return ((await res.json()) as { rejections: { line: number }[] }).rejections.map((r) => r.line)
    }
    const before = await chart(good)
    const after = await chart(bad)
    // batches Q26-005 to Q26-019 are on lines 8 to 22 (three comment and header lines above them)
    const broken = Array.from({ length: 15 }, (_, i) => i + 8)
    expect(after.sort((x, y) => x - y)).toEqual([...new Set([...before, ...broken])].sort((x, y) => x - y))
  })
})

/** The invented demo log (climate-demo/energy), 65 batches. */
function readFileLog(): string {
  return readFileSync('climate-demo/energy/quillow-dryer-batches-2026.csv', 'utf8')
}

// `dryhours inspect` in-process: the JSON keys issue 3 lists, exit status 2 for unusable input.
import { readFile } from 'node:fs/promises'
import { describe, expect, it } from 'vitest'
import type { CliIo } from '../../src/cli/command.ts'
import { runCli } from '../../src/cli/main.ts'

function io(): CliIo & { out: string; err: string } {
  const state = {
    out: '',
    err: '',
    stdout: (t: string) => {
      state.out += t
    },
    stderr: (t: string) => {
      state.err += t
    },
    readFile: async (p: string) => new Uint8Array(await readFile(p)),
    writeFile: async () => {},
  }
  return state
}

const epw = new URL('../fixtures/weather/invented-mesa-2days.epw', import.meta.url).pathname
const normals = new URL(
  '../../node_modules/vega-datasets/data/seattle-weather-hourly-normals.csv',
  import.meta.url,
).pathname

describe('dryhours inspect', () => {
  it('--json has the keys listed in issue 3 with the documented shapes', async () => {
    const c = io()
    expect(await runCli(['inspect', epw, '--json'], c)).toBe(0)
    const j = JSON.parse(c.out)
    for (const k of [
      'format',
      'rows',
      'period',
      'hours',
      'years',
      'typicalYear',
      'columns',
      'site',
      'coverage',
      'problems',
    ]) {
      expect(j).toHaveProperty(k)
    }
    expect(j.format).toBe('epw')
    expect(Object.keys(j.rows)).toEqual(['read', 'used', 'repaired', 'rejected', 'superseded'])
    expect(j.period).toEqual({ start: '2023-01-01T07:00:00.000Z', end: '2023-01-03T07:00:00.000Z' })
    expect(j.hours).toBe(48)
    expect(j.years).toEqual([2023])
    expect(j.coverage[0]).toMatchObject({ year: 2023, month: 1 })
    expect(Object.keys(j.columns[0]).slice(0, 3)).toEqual(['variable', 'source', 'unit'])
    expect(
      j.problems.every(
        (p: Record<string, unknown>) => 'line' in p && 'variable' in p && 'kind' in p && 'message' in p,
      ),
    ).toBe(true)
  })

  it('the NOAA normals file without humidity exits 2 with what is missing and how to give it', async () => {
    const c = io()
    expect(await runCli(['inspect', normals, '--utc-offset', '-8'], c)).toBe(2)
    expect(c.err).toMatch(/no humidity column/)
    expect(c.err).toMatch(/--map relativeHumidity=/)
    expect(c.out).toBe('')
  })

  it('text output names the format, time basis, rows and coverage', async () => {
    const c = io()
    expect(await runCli(['inspect', epw], c)).toBe(0)
    expect(c.out).toMatch(/EPW/)
    expect(c.out).toMatch(/time basis\s+local standard time, UTC−07:00/)
    expect(c.out).toMatch(/rows\s+read 48, used \d+, repaired \d+, rejected 0/)
    expect(c.out).toMatch(/2023\s+6 /) // 48 of the 744 January hours
  })

  it('a bad --map argument is a usage error (exit 2)', async () => {
    const c = io()
    expect(await runCli(['inspect', normals, '--map', 'humidity'], c)).toBe(2)
    expect(c.err).toMatch(/variable=column/)
  })
})

/**
 * Hostile input through the CLI in-process (`runCli` with a fake io): bad files and bad options end in
 * exit code 2 with a one-line message on stderr — never exit 1 (internal error) or a thrown error.
 */
import { describe, expect, it } from 'vitest'
import type { CliIo } from '../../src/cli/command.ts'
import { runCli } from '../../src/cli/main.ts'
import { csvOf, garbageBytes, inventedDays, THREE_HOURS, utf16 } from './hostile-helpers.ts'

interface Run {
  code: number
  out: string
  err: string
}

async function run(args: string[], file: Uint8Array | string): Promise<Run> {
  const out: string[] = []
  const err: string[] = []
  const bytes = typeof file === 'string' ? new TextEncoder().encode(file) : file
  const io: CliIo = {
    stdout: (t) => out.push(t),
    stderr: (t) => err.push(t),
    readFile: async () => bytes,
    writeFile: async () => {},
  }
  const code = await runCli(args, io)
  return { code, out: out.join(''), err: err.join('') }
}

/** Exit 2, nothing on stdout, exactly one line on stderr naming the command. */
function expectUsageError(r: Run, pattern?: RegExp): void {
  expect(r.code).toBe(2)
  expect(r.out).toBe('')
  expect(r.err.endsWith('\n')).toBe(true)
  expect(r.err.slice(0, -1).includes('\n')).toBe(false)
  expect(r.err).toMatch(/^dryhours [a-z-]+: /)
  if (pattern) expect(r.err).toMatch(pattern)
}

const GOOD = csvOf(THREE_HOURS)
const ASSESS = ['assess', 'site.csv', '--quiet', '--product', 'figs', '--method', 'open-air']
const COARSE = ['--start', '07-01', '--end', '07-02', '--max-days', '10', '--deadline-days', '10']
const JULY = inventedDays(28)

describe('CLI with hostile files', () => {
  it('an empty file: exit 2 naming the file', async () => {
    expectUsageError(await run(['inspect', 'f.csv'], ''), /f\.csv: the file is empty/)
    expectUsageError(await run([...ASSESS, ...COARSE], ''), /empty/)
  })

  it('binary garbage: exit 2, not 1', async () => {
    expectUsageError(await run(['inspect', 'f.csv'], garbageBytes(4096)))
    expectUsageError(await run([...ASSESS, ...COARSE], garbageBytes(4096, 99)))
  })

  it('NUL bytes only: exit 2', async () => {
    expectUsageError(await run(['inspect', 'f.csv'], new Uint8Array(1000)), /header/)
  })

  it('every row in 2999: exit 2 naming the accepted years', async () => {
    expectUsageError(
      await run(['inspect', 'f.csv'], csvOf(THREE_HOURS.map((r) => r.replace('2024', '2999')))),
      /1800–2200/,
    )
  })

  it('declared EPW but garbage after LOCATION: exit 2 naming EPW', async () => {
    expectUsageError(await run(['inspect', 'f.epw'], 'LOCATION,x\n\u0001garbage\n'), /EPW/)
  })

  // Bug (src/weather/read-weather.ts readWeatherBytes, used by the CLI): a UTF-16 file with a BOM is
  // decoded as UTF-8 and refused ("'ÿþt\0i\0m\0e\0' … could both be dryBulb", exit 2), while the API
  // (src/api/upload.ts decodeUploadText) reads the same bytes correctly. Expected: exit 0, 3 rows used.
  it('a UTF-16 LE file with a BOM is read like the API reads it (documents a reader bug)', async () => {
    const r = await run(['inspect', 'f.csv', '--json'], utf16(GOOD, false))
    expect(r.code).toBe(0)
    expect((JSON.parse(r.out) as { rows: { used: number } }).rows.used).toBe(3)
  })

  // Bug (src/weather column/header messages): names from the file are quoted raw, so escape sequences
  // in a hostile header reach the terminal (here ESC[31m turns it red). Expected: control characters
  // shown escaped (e.g. \u001b), as the API's JSON answer does.
  it('terminal escape sequences in a header do not reach stderr raw (documents a message bug)', async () => {
    const r = await run(['inspect', 'f.csv'], 't\u001b[31mRED\r\n1,2\n')
    expect(r.code).toBe(2)
    expect(r.err.includes('\u001b')).toBe(false)
  })
})

describe('CLI with hostile numbers and options', () => {
  it.each(['1e309', 'NaN', 'Infinity', ''])("--lat '%s': exit 2 naming --lat", async (v) => {
    expectUsageError(await run(['inspect', 'f.csv', `--lat=${v}`], GOOD), /--lat/)
  })

  it('--lat -0 is 0: exit 0', async () => {
    const r = await run(['inspect', 'f.csv', '--lat', '-0', '--lon', '0', '--json'], GOOD)
    expect(r.code).toBe(0)
    expect((JSON.parse(r.out) as { site: { latitudeDeg: number } }).site.latitudeDeg).toBe(0)
  })

  // Number('0x10') is 16: numberOption refuses hex, binary and octal literals as the API does.
  it('--lat 0x10: exit 2', async () => {
    expectUsageError(await run(['inspect', 'f.csv', '--lat', '0x10'], GOOD), /--lat/)
  })

  it.each([
    [['--price', 'propane=-1'], /price/],
    [['--price', 'propane=1e309'], /price/],
    [['--loading', '-5'], /loadingKgPerM2/],
    [['--loading', '1e9'], /loadingKgPerM2/],
    [['--batch-kg', '-1'], /batch size/],
    [['--step-days', '0'], /step/],
  ])('assess %j: exit 2 with the reason', async (extra, pattern) => {
    expectUsageError(await run([...ASSESS, ...COARSE, ...extra], JULY), pattern)
  })

  it('assess with maxDays 1,000,000: exit 2 naming the accepted range', async () => {
    const args = [...ASSESS, '--start', '07-01', '--end', '07-02', '--max-days', '1000000']
    expectUsageError(await run(args, JULY), /maximum duration/)
  })

  it('an unknown product id: exit 2 listing the known ones', async () => {
    expectUsageError(
      await run(['assess', 'f.csv', '--quiet', '--product', 'unobtainium', '--method', 'open-air'], JULY),
      /figs/,
    )
  })

  it('a profile file that is not a profile, or not JSON: exit 2', async () => {
    const args = ['assess', 'f.csv', '--quiet', '--product', 'p.json', '--method', 'open-air']
    expectUsageError(await run(args, '{"not": "a profile"}'), /invalid product profile/)
    expectUsageError(await run(args, 'not json at all'), /not valid JSON/)
  })

  it.each([
    [['air', '--tdb', '1e309', '--rh', '50'], /--tdb/],
    [['air', '--tdb', 'NaN', '--rh', '50'], /--tdb/],
    [['equilibrium', '--product', 'figs', '--tdb', '25', '--rh', '1e309'], /--rh/],
  ])('%j: exit 2 naming the option', async (args, pattern) => {
    expectUsageError(await run(args, ''), pattern)
  })

  it('fit and energy-chart with garbage files: exit 2 with the line', async () => {
    expectUsageError(await run(['fit', 'w.csv', '--dry-mass', '150'], garbageBytes(1000)), /line 1/)
    expectUsageError(await run(['energy-chart', 'log.csv'], garbageBytes(1000)), /line 1/)
  })
})

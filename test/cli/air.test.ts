/**
 * `dryhours air`: both output forms and each bad-input path (exit code 2, one line on stderr naming the
 * input). Run in-process through runCli with a fake io, and twice as a user would, through
 * `node bin/dryhours.mjs`. Expected values: ASHRAE HOF 2017 ch. 1 Example 1 (40 °C db, 20 °C wb,
 * 101.325 kPa: RH ≈ 14 %, h ≈ 56.7 kJ/kg, v ≈ 0.896 m³/kg) and psychrolib's W 6.4008 g/kg.
 */
import { execFile } from 'node:child_process'
import { join } from 'node:path'
import { promisify } from 'node:util'
import psychrolib from 'psychrolib'
import { describe, expect, it } from 'vitest'
import type { CliIo } from '../../src/cli/command.ts'
import { runCli } from '../../src/cli/main.ts'

const run = promisify(execFile)
const root = join(import.meta.dirname, '..', '..')

async function cli(args: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = ''
  let err = ''
  const io: CliIo = {
    stdout: (t) => {
      out += t
    },
    stderr: (t) => {
      err += t
    },
    readFile: async () => {
      throw new Error('air reads no file')
    },
    writeFile: async () => {
      throw new Error('air writes no file')
    },
  }
  const code = await runCli(['air', ...args], io)
  return { code, out, err }
}

const KEYS = [
  'dryBulbC',
  'wetBulbC',
  'dewPointC',
  'frostPointC',
  'relativeHumidityPct',
  'humidityRatioGPerKg',
  'enthalpyKjPerKg',
  'specificVolumeM3PerKg',
  'densityKgPerM3',
  'vaporPressureKpa',
  'saturationVaporPressureKpa',
  'pressureKpa',
]

describe('dryhours air (in-process)', () => {
  it('--json prints one object with exactly the documented keys (ASHRAE Example 1)', async () => {
    const r = await cli(['--tdb', '40', '--twb', '20', '--json'])
    expect(r.code).toBe(0)
    expect(r.err).toBe('')
    expect(r.out.trim().split('\n')).toHaveLength(1)
    const j = JSON.parse(r.out)
    expect(Object.keys(j)).toEqual(KEYS)
    expect(j.pressureKpa).toBe(101.325) // sea level by default
    expect(Math.abs(j.relativeHumidityPct - 14)).toBeLessThan(0.5)
    expect(Math.abs(j.enthalpyKjPerKg - 56.7)).toBeLessThan(0.05)
    expect(Math.abs(j.specificVolumeM3PerKg - 0.896)).toBeLessThan(0.0005)
    expect(Math.abs(j.humidityRatioGPerKg - 6.4008)).toBeLessThan(1e-3)
    expect(j.wetBulbC).toBe(20)
  })
  it('the table names each quantity with its unit', async () => {
    const r = await cli(['--tdb', '40', '--twb', '20'])
    expect(r.code).toBe(0)
    expect(r.out).toMatch(/^relative humidity \(over water\)\s+14\.0 %$/m)
    expect(r.out).toMatch(/^humidity ratio\s+6\.401 g\/kg dry air$/m)
    expect(r.out).toMatch(/^enthalpy\s+56\.7\d kJ\/kg dry air$/m)
    expect(r.out).toMatch(/^pressure\s+101\.325 kPa$/m)
    expect(r.out).not.toMatch(/frost point/)
  })
  it('below 0 °C the table adds the frost point', async () => {
    // Written --tdb=-5: node:util parseArgs takes '--tdb -5' for a missing value (reported to the lead).
    const r = await cli(['--tdb=-5', '--rh', '80'])
    expect(r.code).toBe(0)
    expect(r.out).toMatch(/^frost point \(over ice\)\s+-\d+\.\d\d °C$/m)
  })
  it('--rh, --tdp, --w and --elevation / --pressure are accepted', async () => {
    const a = JSON.parse((await cli(['--tdb', '22', '--twb', '13', '--json'])).out)
    const b = JSON.parse((await cli(['--tdb', '22', '--rh', String(a.relativeHumidityPct), '--json'])).out)
    const c = JSON.parse((await cli(['--tdb', '22', '--tdp', String(a.dewPointC), '--json'])).out)
    const d = JSON.parse((await cli(['--tdb', '22', '--w', String(a.humidityRatioGPerKg), '--json'])).out)
    for (const x of [b, c, d]) expect(x.humidityRatioGPerKg).toBeCloseTo(a.humidityRatioGPerKg, 6)
    const e = JSON.parse((await cli(['--tdb', '22', '--rh', '50', '--elevation', '1000', '--json'])).out)
    expect(e.pressureKpa).toBeCloseTo(89.875, 3) // ASHRAE HOF 2017 ch. 1 Table 1
    const f = JSON.parse((await cli(['--tdb', '22', '--rh', '50', '--pressure', '85', '--json'])).out)
    expect(f.pressureKpa).toBe(85)
  })

  const bad: [string, string[], RegExp][] = [
    ['missing --tdb', ['--rh', '50'], /--tdb .*required/],
    ['two humidity options', ['--tdb', '20', '--rh', '50', '--tdp', '5'], /exactly one of --rh/],
    ['no humidity option', ['--tdb', '20'], /exactly one of --rh/],
    ['RH 120', ['--tdb', '20', '--rh', '120'], /relative humidity .*100 %, got 120/],
    ['wet bulb above dry bulb', ['--tdb', '20', '--twb', '25'], /wet bulb .*dry bulb \(20 °C\), got 25/],
    ['dew point above dry bulb', ['--tdb', '20', '--tdp', '25'], /dew point .*dry bulb \(20 °C\), got 25/],
    [
      'pressure in Pa',
      ['--tdb', '20', '--rh', '50', '--pressure', '101325'],
      /pressure .*30 and 110 kPa, got 101325/,
    ],
    ['non-number', ['--tdb', 'warm', '--rh', '50'], /--tdb must be a number, got 'warm'/],
    ['empty number', ['--tdb', '20', '--rh', ''], /--rh must be a number/],
    [
      'elevation and pressure',
      ['--tdb', '20', '--rh', '50', '--elevation', '10', '--pressure', '90'],
      /either --elevation or --pressure/,
    ],
    ['unknown option', ['--tdb', '20', '--rh', '50', '--colour'], /colour/],
  ]
  for (const [name, args, message] of bad) {
    it(`${name} → exit 2, one line on stderr naming it`, async () => {
      const r = await cli(args)
      expect(r.code).toBe(2)
      expect(r.out).toBe('')
      expect(r.err.endsWith('\n')).toBe(true)
      expect(r.err.trimEnd().split('\n')).toHaveLength(1)
      expect(r.err).toMatch(/^dryhours air: /)
      expect(r.err).toMatch(message)
    })
  }
})

describe('dryhours air (as a user runs it: node bin/dryhours.mjs)', () => {
  type Failure = { code: number; stderr: string; stdout: string }
  // Both processes start at once (each pays the tsx start-up, seconds on a loaded machine).
  const both = Promise.all([
    run('node', ['bin/dryhours.mjs', 'air', '--tdb', '40', '--twb', '20', '--json'], { cwd: root }),
    run('node', ['bin/dryhours.mjs', 'air', '--tdb', '20', '--rh', '50', '--pressure', '101325'], {
      cwd: root,
    }).then(
      () => null,
      (x: Failure) => x,
    ),
  ])
  it('--json on stdout, exit 0', async () => {
    const [ok] = await both
    expect(Object.keys(JSON.parse(ok.stdout))).toEqual(KEYS)
  })
  it('pressure given in Pa: exit code 2 and one line on stderr', async () => {
    const [, e] = await both
    expect(e).not.toBeNull()
    expect(e?.code).toBe(2)
    expect(e?.stdout).toBe('')
    expect(e?.stderr.trimEnd().split('\n')).toHaveLength(1)
    expect(e?.stderr).toMatch(/pressure must be between 30 and 110 kPa, got 101325/)
  })
})

describe('every figure the text shows is in the JSON too', () => {
  it('the frost point below the triple point (text and JSON agree; psychrolib 1.1.1 frost point of the same vapour pressure)', async () => {
    const text = (await cli(['--tdb', '-5', '--rh', '60'])).out
    const j = JSON.parse((await cli(['--tdb', '-5', '--rh', '60', '--json'])).out)
    const line = text.split('\n').find((l) => l.startsWith('frost point'))
    expect(line).toBeDefined()
    expect(line).toContain(j.frostPointC.toFixed(2))
    // psychrolib (ASHRAE HOF ch. 1): below 0 °C its dew point from vapour pressure is over ice, the frost point
    psychrolib.SetUnitSystem(psychrolib.SI)
    expect(
      Math.abs(j.frostPointC - psychrolib.GetTDewPointFromVapPres(-5, j.vaporPressureKpa * 1000)),
    ).toBeLessThan(0.05)
    // every number of the text table is a value of the JSON
    const numbers = text
      .split('\n')
      .filter((l) => l.trim() !== '')
      .map((l) =>
        Number(
          l
            .trim()
            .split(/\s+/)
            .find((w) => /^-?\d/.test(w)),
        ),
      )
    const values = Object.values(j).filter((v): v is number => typeof v === 'number')
    for (const n of numbers)
      expect(
        values.some((v) => Math.abs(v - n) < 0.006 * Math.max(1, Math.abs(v))),
        String(n),
      ).toBe(true)
  })
  it('above the triple point the frost point is null in the JSON and absent from the text', async () => {
    const j = JSON.parse((await cli(['--tdb', '30', '--rh', '40', '--json'])).out)
    expect(j.frostPointC).toBeNull()
    expect((await cli(['--tdb', '30', '--rh', '40'])).out).not.toContain('frost point')
  })
})

import { readFile } from 'node:fs/promises'
import { describe, expect, it } from 'vitest'
import { type CliIo, UsageError } from '../../src/cli/command.ts'
import { runCli } from '../../src/cli/main.ts'

function fakeIo() {
  const out: string[] = []
  const err: string[] = []
  const io: CliIo = {
    stdout: (t) => out.push(t),
    stderr: (t) => err.push(t),
    // as src/node/cli.ts: a file that cannot be read is a usage error naming the path
    readFile: async (p) => {
      try {
        return new Uint8Array(await readFile(p))
      } catch (e) {
        throw new UsageError(`cannot read '${p}': ${(e as NodeJS.ErrnoException).code}`)
      }
    },
    writeFile: async () => {},
  }
  return { io, out, err }
}

const typical = 'climate-demo/ardentine-upland-typical-year.epw'

describe('dryhours assess', () => {
  it('--json prints the full assessment with the documented keys; progress goes to stderr', async () => {
    const { io, out, err } = fakeIo()
    const code = await runCli(
      [
        'assess',
        typical,
        '--product',
        'apricot-halves',
        '--method',
        'open-air',
        '--start',
        '07-01',
        '--end',
        '07-31',
        '--step-days',
        '10',
        '--deadline-days',
        '14',
        '--json',
      ],
      io,
    )
    expect(code).toBe(0)
    const a = JSON.parse(out.join(''))
    for (const k of ['site', 'product', 'method', 'monthly', 'startDates', 'assumptions', 'warnings'])
      expect(a).toHaveProperty(k)
    expect(a.monthly[0]).toHaveProperty('usableHours.byYear')
    expect(a.monthly[0]).toHaveProperty('supplementalHeatKwhPerTonne')
    expect(a.startDates[0]).toHaveProperty('daysToTarget.median')
    expect(a.startDates[0]).toHaveProperty('probabilityWithinDeadline')
    expect(a.method).toMatchObject({ kind: 'open-air', absorptivity: 0.7 })
    expect(err.join('')).toMatch(/start-dates/)
  })
  it('prints a readable summary with the monthly table, start windows and fuel', async () => {
    const { io, out } = fakeIo()
    const code = await runCli(
      [
        'assess',
        typical,
        '--product',
        'grapes-to-raisins',
        '--method',
        'heated',
        '--set-point',
        '55',
        '--start',
        '08-01',
        '--end',
        '08-15',
        '--step-days',
        '7',
        '--price',
        'propane=0.9',
        '--quiet',
      ],
      io,
    )
    expect(code).toBe(0)
    const text = out.join('')
    expect(text).toMatch(/Usable drying hours per month/)
    expect(text).toMatch(/Best start windows/)
    expect(text).toMatch(/propane \(LPG\).*at 0\.9\/L\n/)
    expect(text).toMatch(/wood pellets.*\(example price\)/)
  })
  it('bad input: exit 2 and one line naming what is wrong', async () => {
    const cases: [string[], RegExp][] = [
      [
        ['assess', typical, '--product', 'apricot-halves', '--method', 'kiln'],
        /--method must be one of open-air, shade, solar-cabinet, heated/,
      ],
      [['assess', typical, '--product', 'no-such', '--method', 'shade'], /unknown product 'no-such'/],
      [
        ['assess', typical, '--product', 'apricot-halves', '--method', 'open-air', '--absorptivity', '3'],
        /absorptivity/,
      ],
      [
        ['assess', typical, '--product', 'apricot-halves', '--method', 'shade', '--start', '13-01'],
        /season start must be a date MM-DD/,
      ],
      [['assess', 'missing.csv', '--product', 'apricot-halves', '--method', 'shade'], /missing\.csv/],
    ]
    for (const [args, message] of cases) {
      const { io, err } = fakeIo()
      expect(await runCli([...args, '--quiet'], io)).toBe(2)
      expect(err.join('')).toMatch(message)
      expect(err.join('').trim().split('\n')).toHaveLength(1)
    }
  })
})

describe('dryhours compare', () => {
  it('ranks two files side by side and states the criterion', async () => {
    const { io, out } = fakeIo()
    const code = await runCli(
      [
        'compare',
        typical,
        'climate-demo/gullhaven-coast-2022-2024.epw',
        '--product',
        'grapes-to-raisins',
        '--method',
        'open-air',
        '--start',
        '07-15',
        '--end',
        '08-15',
        '--step-days',
        '15',
        '--criterion',
        'usable-hours-p10',
        '--quiet',
      ],
      io,
    )
    expect(code).toBe(0)
    const text = out.join('')
    expect(text).toMatch(/ranked by usable-hours-p10: usable drying hours in the season per year, P10/)
    const lines = text.split('\n').filter((l) => /^\s+[12]\s/.test(l))
    expect(lines[0]).toMatch(/Ardentine/)
    expect(lines[1]).toMatch(/Gullhaven/)
  })
  it('needs at least two files', async () => {
    const { io, err } = fakeIo()
    expect(await runCli(['compare', typical, '--product', 'figs', '--method', 'shade'], io)).toBe(2)
    expect(err.join('')).toMatch(/at least two weather files/)
  })
})

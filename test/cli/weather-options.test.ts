// One set of weather options everywhere (src/weather/option-spec.ts): inspect, assess, compare and
// energy-chart --weather take the same flags; a file that inspect reads with --map can be assessed with
// the same --map; inspect --export writes the hourly series and reading it back changes nothing; messages
// name the flags. Weather values are invented.
import { mkdtemp, readFile, writeFile } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import type { CliIo } from '../../src/cli/command.ts'
import { runCli } from '../../src/cli/main.ts'
import { HOURLY_EXPORT_HEADER } from '../../src/weather/export.ts'
import { WEATHER_OPTION_SPECS } from '../../src/weather/option-spec.ts'

function io(): CliIo & { out: string; err: string; written: Map<string, string> } {
  const written = new Map<string, string>()
  const state = {
    out: '',
    err: '',
    written,
    stdout: (t: string) => {
      state.out += t
    },
    stderr: (t: string) => {
      state.err += t
    },
    readFile: async (p: string) =>
      written.has(p) ? new TextEncoder().encode(written.get(p)) : new Uint8Array(await readFile(p)),
    writeFile: async (p: string, data: string | Uint8Array) => {
      written.set(p, typeof data === 'string' ? data : new TextDecoder().decode(data))
    },
  }
  return state
}

/** Ten days of hourly weather whose columns no reader recognises by name (°F and a fraction). */
async function oddFile(): Promise<string> {
  const dir = await mkdtemp(join(tmpdir(), 'dryhours-wopt-'))
  const rows = ['when;T_a;H_a']
  const start = Date.parse('2021-08-01T00:00:00Z')
  for (let h = 0; h < 240; h++) {
    const t = 68 + 18 * Math.sin(((h % 24) - 9) * (Math.PI / 12))
    const rh = 0.55 - 0.25 * Math.sin(((h % 24) - 9) * (Math.PI / 12))
    rows.push(
      `${new Date(start + h * 3_600_000).toISOString().slice(0, 16).replace('T', ' ')};${t.toFixed(1)};${rh.toFixed(3)}`,
    )
  }
  const file = join(dir, 'odd.csv')
  await writeFile(file, `${rows.join('\n')}\n`)
  return file
}

const MAP = ['--map', 'timestamp=when', '--map', 'dryBulb=T_a:F', '--map', 'relativeHumidity=H_a:fraction']

describe('the weather flags of every command', () => {
  it('inspect, assess, compare and energy-chart list the same weather flags in their help', async () => {
    for (const command of ['inspect', 'assess', 'compare', 'energy-chart']) {
      const c = io()
      await runCli([command, '--help'], c)
      for (const s of WEATHER_OPTION_SPECS) expect(c.out, `${command} --${s.flag}`).toContain(`--${s.flag} `)
    }
  })

  it('a file inspect reads with --map is assessed with the same --map (exit 0), and refused without it (exit 2)', async () => {
    const file = await oddFile()
    const opts = ['--utc-offset', '0', '--lat', '38', '--lon', '-3']
    const a = io()
    expect(await runCli(['inspect', file, ...opts, ...MAP], a)).toBe(0)
    expect(a.out).toMatch(/dryBulb +T_a +\[°F, mapping/)
    const b = io()
    expect(
      await runCli(
        [
          'assess',
          file,
          ...opts,
          ...MAP,
          '--product',
          'figs',
          '--method',
          'open-air',
          '--start',
          '08-01',
          '--end',
          '08-03',
          '--quiet',
        ],
        b,
      ),
    ).toBe(0)
    expect(b.out).toMatch(/usable/i)
    const c = io()
    expect(
      await runCli(['assess', file, ...opts, '--product', 'figs', '--method', 'open-air', '--quiet'], c),
    ).toBe(2)
    expect(c.err).toMatch(/--map/)
  })

  it('compare takes the same flags for every file', async () => {
    const file = await oddFile()
    const c = io()
    const code = await runCli(
      [
        'compare',
        file,
        file,
        '--utc-offset',
        '0',
        '--lat',
        '38',
        '--lon',
        '-3',
        ...MAP,
        '--product',
        'figs',
        '--method',
        'shade',
        '--start',
        '08-01',
        '--end',
        '08-02',
        '--quiet',
      ],
      c,
    )
    expect(c.err).toBe('')
    expect(code).toBe(0)
  })

  it('bad values name the flag: --labels middle, --utc-offset abc, --lat 95', async () => {
    const file = await oddFile()
    for (const [args, pattern] of [
      [['--labels', 'middle'], /--labels: must be one of start, end, got 'middle'/],
      [['--utc-offset', 'abc'], /--utc-offset: must be a number of hours such as -5 or \+5:30, got 'abc'/],
      [['--lat', '95', '--utc-offset', '0'], /--lat: /],
      [
        ['--labels', 'ghi=end:0', '--utc-offset', '0'],
        /--labels: interval in 'ghi=end:0' must be whole minutes/,
      ],
    ] as [string[], RegExp][]) {
      const c = io()
      expect(await runCli(['inspect', file, ...MAP, ...args], c)).toBe(2)
      expect(c.err).toMatch(pattern)
    }
  })

  it('energy-chart refuses weather-file flags without --weather, naming them', async () => {
    const log = new URL('../../climate-demo/energy/quillow-dryer-batches-2026.csv', import.meta.url).pathname
    const c = io()
    expect(await runCli(['energy-chart', log, '--map', 'dryBulb=x', '--site-tz', 'Europe/Madrid'], c)).toBe(2)
    expect(c.err).toMatch(
      /--site-tz, --map apply to the weather file|--map, --site-tz apply to the weather file/,
    )
  })
})

describe('inspect --export and --json', () => {
  it('writes the hourly series with the exact header; reading the export back changes nothing', async () => {
    const file = await oddFile()
    const c = io()
    expect(
      await runCli(
        [
          'inspect',
          file,
          '--utc-offset',
          '0',
          '--lat',
          '38',
          '--lon',
          '-3',
          ...MAP,
          '--export',
          '/out/series.csv',
        ],
        c,
      ),
    ).toBe(0)
    const text = c.written.get('/out/series.csv')!
    expect(text.split('\n')[0]).toBe(HOURLY_EXPORT_HEADER)
    expect(text.split('\n')[1]).toMatch(/^2021-08-01T00:00:00Z,/)
    expect(text.trimEnd().split('\n')).toHaveLength(241)
    const again = io()
    again.written.set('/in/series.csv', text)
    expect(await runCli(['inspect', '/in/series.csv', '--export', '/out/again.csv'], again)).toBe(0)
    expect(again.written.get('/out/again.csv')).toBe(text)
  })

  it('--json lists per variable the hours, mean, min and max in SI', async () => {
    const file = await oddFile()
    const c = io()
    expect(await runCli(['inspect', file, '--utc-offset', '0', ...MAP, '--json'], c)).toBe(0)
    const j = JSON.parse(c.out) as {
      variables: { variable: string; hours: number; mean: number; min: number; max: number }[]
    }
    const dry = j.variables.find((v) => v.variable === 'dryBulb')!
    // 68 ± 18 °F is 20 ± 10 °C
    expect(dry.hours).toBe(240)
    expect(dry.mean).toBeCloseTo(20, 0)
    expect(dry.min).toBeCloseTo(10, 0)
    expect(dry.max).toBeCloseTo(30, 0)
  })
})

// The README's weather sections are a contract: the quick start and every `npx dryhours` line from
// "Your weather file" to the layouts table run (exit 0), the export line writes the documented header,
// and the table of weather options lists exactly the options of src/weather/option-spec.ts.
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import type { CliIo } from '../../src/cli/command.ts'
import { runCli } from '../../src/cli/main.ts'
import { HOURLY_EXPORT_HEADER } from '../../src/weather/export.ts'
import { WEATHER_OPTION_SPECS } from '../../src/weather/option-spec.ts'

const readme = readFileSync('README.md', 'utf8')
const section = readme.slice(
  readme.indexOf('### Your weather file'),
  readme.indexOf('#### Layouts read out of the box'),
)
const quickStart = readme
  .slice(readme.indexOf('## Quick start'), readme.indexOf('## Commands'))
  .split('\n')
  .filter((l) => l.startsWith('npx dryhours '))
const commands = [...quickStart, ...section.split('\n').filter((l) => l.startsWith('npx dryhours '))].map(
  (l) => l.slice('npx dryhours '.length).split(' '),
)

function io() {
  const out: string[] = []
  const err: string[] = []
  const written = new Map<string, string>()
  const cli: CliIo = {
    stdout: (t) => out.push(t),
    stderr: (t) => err.push(t),
    readFile: async (path) => new Uint8Array(readFileSync(path)),
    writeFile: async (path, data) => {
      written.set(path, typeof data === 'string' ? data : new TextDecoder().decode(data))
    },
  }
  return { cli, out: () => out.join(''), err: () => err.join(''), written }
}

describe('README: your weather file', () => {
  it('shows commands for reports, sub-hourly files, the export and the estimate of the sun', () => {
    expect(commands.length).toBeGreaterThanOrEqual(5)
  })

  it.each(commands.map((c) => [c.join(' '), c]))('runs: dryhours %s', async (_line, args) => {
    const f = io()
    expect(await runCli(args as string[], f.cli), f.err()).toBe(0)
    const i = (args as string[]).indexOf('--export')
    if (i >= 0) expect(f.written.get((args as string[])[i + 1])?.split('\n')[0]).toBe(HOURLY_EXPORT_HEADER)
  })

  it('the table of weather options lists every option with its flag, parameter and key, and no other', () => {
    const table = section.slice(section.indexOf('| CLI flag |'))
    const rows = table
      .split('\n')
      .filter((l) => l.startsWith('| `--'))
      .map((l) => l.split(' | ').map((c) => c.replace(/^\| /, '')))
    expect(rows.map((r) => r[0].slice(3, r[0].indexOf(' ')).replace(/`$/, ''))).toEqual(
      WEATHER_OPTION_SPECS.map((s) => s.flag),
    )
    rows.forEach((r, k) => {
      expect(r[1]).toBe(`\`${WEATHER_OPTION_SPECS[k].param}\``)
      expect(r[2]).toContain(`\`${WEATHER_OPTION_SPECS[k].key}\``)
    })
  })
})

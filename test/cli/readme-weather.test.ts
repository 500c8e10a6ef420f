// The README's table of weather options lists exactly the options of src/weather/option-spec.ts (its
// commands run in test/docs/readme-commands.test.ts, with every other command of the README).
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { WEATHER_OPTION_SPECS } from '../../src/weather/option-spec.ts'

const readme = readFileSync('README.md', 'utf8')
const section = readme.slice(
  readme.indexOf('### Your weather file'),
  readme.indexOf('#### Layouts read out of the box'),
)
describe('README: your weather file', () => {
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

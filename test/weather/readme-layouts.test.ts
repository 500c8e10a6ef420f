// The README's table of layouts read out of the box is a contract: every dialect is listed, with example
// commands under it (they run, and name the layout they show, in test/docs/readme-commands.test.ts).
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { DIALECTS } from '../../src/weather/dialects/index.ts'

const readme = readFileSync('README.md', 'utf8')
const section = readme.slice(
  readme.indexOf('#### Layouts read out of the box'),
  readme.indexOf('### Products'),
)
const commands = section
  .split('\n')
  .filter((l) => l.startsWith('npx dryhours '))
  .map((l) => l.slice('npx dryhours '.length).split(' '))

describe('README: layouts read out of the box', () => {
  it.each(DIALECTS.map((d) => d.id))('lists %s', (id) => {
    expect(section).toContain(`(\`${id}`)
  })

  it('shows at least three example commands', () => {
    expect(commands.length).toBeGreaterThanOrEqual(3)
  })
})

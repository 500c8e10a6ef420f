// The README's table of layouts read out of the box is a contract: every dialect is listed, and every
// example command under it runs and names the layout it shows.
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import type { CliIo } from '../../src/cli/command.ts'
import { runCli } from '../../src/cli/main.ts'
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

function io() {
  const out: string[] = []
  const err: string[] = []
  const cli: CliIo = {
    stdout: (t) => out.push(t),
    stderr: (t) => err.push(t),
    readFile: async (path) => new Uint8Array(readFileSync(path)),
    writeFile: async () => {},
  }
  return { cli, out: () => out.join(''), err: () => err.join('') }
}

describe('README: layouts read out of the box', () => {
  it.each(DIALECTS.map((d) => d.id))('lists %s', (id) => {
    expect(section).toContain(`(\`${id}`)
  })

  it('shows at least three example commands', () => {
    expect(commands.length).toBeGreaterThanOrEqual(3)
  })

  it.each(commands.map((c) => [c.join(' '), c]))('runs: dryhours %s', async (_line, args) => {
    const f = io()
    expect(await runCli(args as string[], f.cli), f.err()).toBe(0)
    const file = (args as string[])[1]
    const id =
      DIALECTS.find((d) => file.includes(d.id))?.id ??
      DIALECTS.find((d) => file.includes(d.id.split('-')[0]))?.id
    if ((args as string[]).includes('--json')) expect(JSON.parse(f.out()).dialect.id).toBe(id)
    else expect(f.out()).toMatch(new RegExp(`dialect\\s+.*\\(${id}\\)`))
  })
})

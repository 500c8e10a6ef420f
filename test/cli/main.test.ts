import { describe, expect, it } from 'vitest'
import type { CliIo } from '../../src/cli/command.ts'
import { runCli } from '../../src/cli/main.ts'
import { commands } from '../../src/cli/registry.ts'

function fakeIo() {
  const out: string[] = []
  const err: string[] = []
  const io: CliIo = {
    stdout: (t) => out.push(t),
    stderr: (t) => err.push(t),
    readFile: async () => new Uint8Array(),
    writeFile: async () => {},
  }
  return { io, out: () => out.join(''), err: () => err.join('') }
}

describe('dryhours dispatch', () => {
  it('--help lists every command and exits 0', async () => {
    const f = fakeIo()
    expect(await runCli(['--help'], f.io)).toBe(0)
    for (const c of commands) expect(f.out()).toContain(c.name)
  })
  it('no command prints usage and exits 2', async () => {
    const f = fakeIo()
    expect(await runCli([], f.io)).toBe(2)
    expect(f.out()).toContain('Usage')
  })
  it('an unknown command exits 2 naming it', async () => {
    const f = fakeIo()
    expect(await runCli(['dryy'], f.io)).toBe(2)
    expect(f.err()).toContain("unknown command 'dryy'")
  })
  it.each(commands.map((c) => c.name))('%s --help exits 0 with its usage', async (name) => {
    const f = fakeIo()
    expect(await runCli([name, '--help'], f.io)).toBe(0)
    expect(f.out()).toContain(`dryhours ${name}`)
  })
})

describe('negative numbers and one-line errors', () => {
  it('--tdb -5 is read as a value, not an option (dew points and winter air are negative)', async () => {
    const f = fakeIo()
    expect(await runCli(['air', '--tdb', '-5', '--rh', '80', '--json'], f.io)).toBe(0)
    expect(JSON.parse(f.out()).dryBulbC).toBe(-5)
  })
  it('a parse error is one line on stderr with exit 2', async () => {
    const f = fakeIo()
    expect(await runCli(['air', '--tdb', '20', '--rh'], f.io)).toBe(2)
    expect(f.err().trim().split('\n')).toHaveLength(1)
    expect(f.err()).toContain('--rh')
  })
})

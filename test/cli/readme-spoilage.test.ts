// The README's "Will it dry before it spoils?" section is a contract: its `npx dryhours` lines run (exit 0),
// print the spoilage model and the share of batches that spoiled first, and the tunnel line dries the same
// apricots faster than the open-air line with no more spoilage.
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import type { CliIo } from '../../src/cli/command.ts'
import { runCli } from '../../src/cli/main.ts'

const readme = readFileSync('README.md', 'utf8')
const sectionStart = readme.indexOf('#### Will it dry before it spoils?')
// the section runs to the next heading
const section = readme.slice(sectionStart, readme.indexOf('\n#', sectionStart + 1))
const commands = section
  .split('\n')
  .filter((l) => l.startsWith('npx dryhours '))
  .map((l) => l.slice('npx dryhours '.length).split(' '))

async function run(args: string[]): Promise<{ code: number; out: string; json: unknown }> {
  const out: string[] = []
  const cli: CliIo = {
    stdout: (t) => out.push(t),
    stderr: () => {},
    readFile: async (path) => new Uint8Array(readFileSync(path)),
    writeFile: async () => {},
  }
  const code = await runCli(args, cli)
  const jsonOut: string[] = []
  await runCli([...args, '--json'], { ...cli, stdout: (t) => jsonOut.push(t) })
  return { code, out: out.join(''), json: JSON.parse(jsonOut.join('')) }
}

describe('README: will it dry before it spoils?', () => {
  it('shows an open-air and a tunnel line', () => {
    expect(commands).toHaveLength(2)
    expect(commands[0]).toContain('open-air')
    expect(commands[1]).toContain('tunnel')
  })

  it('runs both, prints the spoilage model, and the tunnel dries faster with no more spoilage', async () => {
    const [open, tunnel] = [await run(commands[0]), await run(commands[1])]
    for (const r of [open, tunnel]) {
      expect(r.code).toBe(0)
      expect(r.out).toMatch(/Spoilage before dry: Mould-free time/)
      expect(r.out).toMatch(/spoiled before they were dry/)
    }
    type J = {
      startDates: { daysToTarget: { median: number | null } }[]
      spoilage: { season: { probability: number } }
    }
    const median = (j: J) => {
      const d = j.startDates
        .map((s) => s.daysToTarget.median ?? Number.POSITIVE_INFINITY)
        .sort((a, b) => a - b)
      return d[Math.floor(d.length / 2)]
    }
    const o = open.json as J
    const t = tunnel.json as J
    expect(median(t)).toBeLessThan(median(o))
    expect(t.spoilage.season.probability).toBeLessThanOrEqual(o.spoilage.season.probability)
  }, 60_000)
})

import { mkdtemp, readFile as readFs, writeFile as writeFs } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import type { CliIo } from '../../src/cli/command.ts'
import { runCli } from '../../src/cli/main.ts'
import { parseUserProfile } from '../../src/product/profile-schema.ts'

async function cli(args: string[]) {
  let out = ''
  let err = ''
  const io: CliIo = {
    stdout: (t) => {
      out += t
    },
    stderr: (t) => {
      err += t
    },
    readFile: async (p) => new Uint8Array(await readFs(p)),
    writeFile: async (p, d) => writeFs(p, d),
  }
  const code = await runCli(args, io)
  return { code, out, err }
}
const DEMO = new URL('../fixtures/product/demo-weighings.csv', import.meta.url).pathname

describe('dryhours products', () => {
  it('lists the catalogue (table and JSON)', async () => {
    const t = await cli(['products'])
    expect(t.code).toBe(0)
    expect(t.out).toMatch(/shelled-corn/)
    const j = await cli(['products', '--json'])
    expect(JSON.parse(j.out).length).toBeGreaterThanOrEqual(15)
  })
  it('shows one product with its sources; unknown id → exit 2', async () => {
    const t = await cli(['products', 'hops'])
    expect(t.out).toMatch(
      /maximum product temperature: 60 °C {2}\[published\] Rybka A\., Heřmánek P\., Honzík I\. 2021/,
    )
    expect(t.out).toMatch(
      /target moisture: 9 % wb {2}\[fitted\] the middle of the 8–10 % given by Brown D\. 2013/,
    )
    expect(t.out).toMatch(/numbers resting on memory: \d+ of \d+/)
    expect(JSON.parse((await cli(['products', 'figs', '--json'])).out).id).toBe('figs')
    const bad = await cli(['products', 'kiwi'])
    expect(bad.code).toBe(2)
    expect(bad.err).toMatch(/unknown product 'kiwi'/)
  })
  it('the plain chilli id is unblanched; the old unblanched id is listed and still gives the same profile', async () => {
    const t = await cli(['products'])
    expect(t.out).toMatch(/^chili-peppers +Chili peppers \(red, whole pods, unblanched\)/m)
    expect(t.out).toMatch(/^chili-peppers-blanched +Chili peppers \(red, whole pods, blanched\)/m)
    expect(t.out).toMatch(/older ids still accepted[^\n]*\n {2}chili-peppers-unblanched = chili-peppers: /)
    const old = await cli(['products', 'chili-peppers-unblanched'])
    expect(old.code).toBe(0)
    expect(old.out).toMatch(/^\(chili-peppers-unblanched is an older id of chili-peppers, still accepted/)
    expect(old.out).toContain('Chili peppers (red, whole pods, unblanched) (chili-peppers)')
    const plain = await cli(['products', 'chili-peppers'])
    expect(old.out.endsWith(plain.out)).toBe(true)
    expect(plain.out).not.toContain('older id')
    const json = JSON.parse((await cli(['products', 'chili-peppers-unblanched', '--json'])).out)
    expect(json.id).toBe('chili-peppers')
  })
})

describe('dryhours equilibrium', () => {
  it('shelled corn 15.6 °C, 80 % → about 16.1 % wb with the JSON keys of the spec', async () => {
    const r = await cli(['equilibrium', '--product', 'shelled-corn', '--tdb', '15.6', '--rh', '80', '--json'])
    expect(r.code).toBe(0)
    const j = JSON.parse(r.out)
    expect(j.productId).toBe('shelled-corn')
    expect(Math.abs(j.equilibriumMoistureWbPct - 16.1)).toBeLessThan(0.1)
    expect(j.equilibriumMoistureDbPct).toBeCloseTo(
      (100 * j.equilibriumMoistureWbPct) / (100 - j.equilibriumMoistureWbPct),
      9,
    )
    expect(j.model).toBe('modified-chung-pfost')
    expect(j.source).toMatch(/Chen & Morey/)
  })
  it('--moisture-wb gives the equilibrium RH (figs 22 % wb → 65 %)', async () => {
    const j = JSON.parse(
      (await cli(['equilibrium', '--product', 'figs', '--tdb', '25', '--moisture-wb', '22', '--json'])).out,
    )
    expect(j.equilibriumRelativeHumidityPct).toBeCloseTo(65, 1)
  })
  it('bad input → exit 2 with one line naming the problem', async () => {
    for (const args of [
      ['equilibrium', '--product', 'figs', '--tdb', '25'],
      ['equilibrium', '--product', 'figs', '--tdb', 'hot', '--rh', '50'],
      ['equilibrium', '--product', 'figs', '--tdb', '25', '--rh', '100'],
      ['equilibrium', '--tdb', '25', '--rh', '50'],
    ]) {
      const r = await cli(args)
      expect(r.code).toBe(2)
      expect(r.err.trim().split('\n')).toHaveLength(1)
    }
  })
})

describe('dryhours fit', () => {
  it('fits the demo weighings, reports the left-out readings and saves a valid profile', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'dryhours-fit-'))
    const save = join(dir, 'apples.json')
    const r = await cli([
      'fit',
      DEMO,
      '--dry-mass',
      '150',
      '--thickness',
      '5',
      '--target-wb',
      '20',
      '--product',
      'apple-slices',
      '--save',
      save,
    ])
    expect(r.code).toBe(0)
    expect(r.out).toMatch(/best model by AICc/)
    expect(r.out).toMatch(/line 14: the weighing at 6.50 h/)
    expect(r.out).toMatch(/lines 21/)
    const profile = parseUserProfile(JSON.parse(await readFs(save, 'utf8')))
    expect(profile.id).toBe('apple-slices-calibrated')
    const e = await cli(['equilibrium', '--profile', save, '--tdb', '30', '--rh', '50', '--json'])
    expect(JSON.parse(e.out).productId).toBe('apple-slices-calibrated')
  })
  it('JSON output has the fit fields', async () => {
    const j = JSON.parse((await cli(['fit', DEMO, '--initial-wb', '85', '--json'])).out)
    expect(j.best.model).toBe('page')
    expect(j.best.standardErrors.n).toBeGreaterThan(0)
    expect(j.periods.intervals.length).toBeGreaterThan(5)
  })
  it('missing final weighing with --final-wb, two references, --save without --product → exit 2', async () => {
    expect((await cli(['fit', DEMO, '--final-wb', '10'])).err).toMatch(/final weighing/)
    expect((await cli(['fit', DEMO, '--dry-mass', '150', '--initial-wb', '85'])).code).toBe(2)
    expect((await cli(['fit', DEMO, '--dry-mass', '150', '--save', '/tmp/x.json'])).err).toMatch(
      /--save needs --product/,
    )
  })
})

describe('the README product commands run (README "Products")', () => {
  it('products figs lists the memory numbers; products --sources counts every level; --json gives the same counts', async () => {
    const figs = await cli(['products', 'figs'])
    expect(figs.code).toBe(0)
    expect(figs.out).toMatch(/every number, its level and its source:/)
    expect(figs.out).toMatch(/numbers resting on memory: \d+ of \d+ \(/)
    const s = await cli(['products', '--sources'])
    expect(s.code).toBe(0)
    for (const kind of [
      'moisture targets and limits',
      'isotherm constants',
      'kinetics constants',
      'all numbers',
    ]) {
      expect(s.out).toContain(kind)
    }
    const j = JSON.parse((await cli(['products', '--sources', '--json'])).out)
    const all = j.groups.find((g: { group: string }) => g.group === 'all')
    expect(all.published + all.transcribed + all.fitted + all.memory + all.user).toBe(all.total)
    expect(all.memoryShare).toBeCloseTo(all.memory / all.total, 12)
  })
  it('products <id> --sources --json lists every number with path, level and source', async () => {
    const j = JSON.parse((await cli(['products', 'cocoa-beans', '--sources', '--json'])).out)
    const xm0 = j.numbers.find((n: { path: string }) => n.path === 'isotherm.desorption.equation.xm0')
    expect(xm0.confidence).toBe('published')
    expect(xm0.source).toMatch(/Sandoval/)
  })
  it('fit reads a weighing log with Spanish headers and a decimal comma, and says which columns it read', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'dryhours-fit-es-'))
    const file = join(dir, 'bandeja.csv')
    const rows = [0, 1, 2, 3, 4.5, 6, 8, 10, 12].map(
      (t) =>
        `${String(t).replace('.', ',')};${(150 + 850 * Math.exp(-0.25 * t)).toFixed(1).replace('.', ',')}`,
    )
    await writeFs(file, `tiempo (h);peso (g)\n${rows.join('\n')}\n`)
    const r = await cli(['fit', file, '--dry-mass', '140'])
    expect(r.code).toBe(0)
    expect(r.out).toMatch(
      /columns read: time from column 1 'tiempo \(h\)' in h; mass from column 2 'peso \(g\)' in g/,
    )
  })
})

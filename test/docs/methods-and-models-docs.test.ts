/**
 * README and docs/ describe every drying method and every spoilage model with its limits and cautions: the
 * method table and paragraph of docs/model.md §4, the spoilage table and its "Limits and cautions" list in
 * docs/spoilage-and-bins.md, and the README's safety words for grain-bin fans and heaters (electrical and fire
 * safety by licensed trades) and for mycotoxin testing where risk was high. A method or model added without
 * its description fails here.
 */
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { METHOD_MODELS } from '../../src/drying/methods/index.ts'
import { spoilageModels } from '../../src/product/spoilage/index.ts'

const readme = readFileSync('README.md', 'utf8')
const model = readFileSync('docs/model.md', 'utf8')
const spoilage = readFileSync('docs/spoilage-and-bins.md', 'utf8')

/** The text from a heading to the next heading of the same or a higher level. */
function section(text: string, heading: string): string {
  const start = text.indexOf(heading)
  expect(start, heading).toBeGreaterThanOrEqual(0)
  const level = /^#+/.exec(heading)?.[0] ?? '#'
  const next = text.slice(start + heading.length).search(new RegExp(`\\n#{1,${level.length}} `))
  return next < 0 ? text.slice(start) : text.slice(start, start + heading.length + next)
}

/** The bullet of a list that starts with `**<title>**`, up to the next bullet. */
function bullet(text: string, title: string): string {
  const start = text.indexOf(`- **${title}**`)
  expect(start, title).toBeGreaterThanOrEqual(0)
  const next = text.indexOf('\n- ', start + 1)
  return next < 0 ? text.slice(start) : text.slice(start, next)
}

describe('every drying method is described', () => {
  const methods = section(model, '## 4. The air at the product, by method')

  it('in the README (the assess command and the methods) and in docs/model.md §4 (table row and module)', () => {
    for (const m of METHOD_MODELS) {
      expect(readme, m.kind).toContain(`\`${m.kind}\``)
      expect(readme, m.kind).toMatch(new RegExp(`--method <[^>]*\\b${m.kind}\\b`))
      expect(methods, m.kind).toContain(`| \`${m.kind}\` |`)
      expect(methods, m.kind).toContain(`(\`${m.kind}.ts\``)
    }
  })

  it('the tunnel and the bin with their sources, what they leave out and their safety', () => {
    const tunnel = bullet(methods, 'Solar tunnel')
    expect(tunnel).toMatch(/Duffie & Beckman/)
    expect(tunnel).toMatch(/Not modelled:/)
    expect(tunnel).toMatch(/from memory/)
    expect(tunnel).toMatch(/electrician/)
    const bin = bullet(methods, 'Natural-air bin')
    expect(bin).toMatch(/Steele \(1967\) \/ Thompson \(1972\)/)
    expect(bin).toMatch(/ASAE D272/)
    expect(bin).toMatch(/Limits:/)
    const tunnelReadme = section(readme, '#### Will it dry before it spoils?')
    expect(tunnelReadme).toMatch(/--method tunnel/)
    expect(tunnelReadme).toMatch(/qualified electrician under local codes/)
  })

  it('the bin in the README: its limits, and fans and heaters as electrical and fire hazards for licensed trades', () => {
    const bin = section(readme, '### Grain in a bin: natural-air drying')
    expect(bin).toMatch(/Limits:/)
    expect(bin).toMatch(/electrical and fire hazards/)
    expect(bin).toMatch(/licensed electricians and gas fitters under local codes/)
    expect(bin).toMatch(/mycotoxins/)
    const limits = section(spoilage, '### Limits and cautions for the report')
    expect(limits).toMatch(/overstates drying speed at high airflow/)
    expect(limits).toMatch(/licensed\s+electricians/)
  })
})

describe('every spoilage model is described', () => {
  /** The bold label of each model's entry in the docs' "Limits and cautions to show with results". */
  const LIMIT_LABEL: Record<string, string> = {
    'grain-dry-matter-loss': 'Grain DML',
    'coffee-ota-window': 'Coffee/cocoa',
    'cocoa-ota-window': 'Coffee/cocoa',
    'mould-free-time': 'Mould-free time',
    'fish-pathogen-exposure': 'Fish',
  }
  const models = section(spoilage, '## Spoilage models (`src/product/spoilage/`)')

  it('with its row (source, level, checks) and its limits in docs/spoilage-and-bins.md', () => {
    for (const m of spoilageModels()) {
      const row = models.split('\n').find((l) => l.startsWith(`| \`${m.id}\` |`))
      expect(row, m.id).toBeDefined()
      expect(row, m.id).toContain(`\`${m.source.confidence}\``)
      expect(row?.split('|').filter((c) => c.trim()).length, m.id).toBe(5)
      const label = LIMIT_LABEL[m.id]
      expect(label, `${m.id}: add its limits to the docs and to this map`).toBeDefined()
      expect(bullet(models, label).length, m.id).toBeGreaterThan(80)
    }
  })

  it('in the README with its source, and mycotoxin testing by a laboratory where risk was high', () => {
    const s = section(readme, '#### Will it dry before it spoils?')
    expect(s).toMatch(/Steele 1967; Thompson 1972; 0\.5 % DML/)
    expect(s).toMatch(/Seiler; Cauvain & Seiler/)
    expect(s).toMatch(/Fish and Fishery Products Hazards and Controls Guidance/)
    expect(s).toMatch(/where risk was high, have lots tested for\s+mycotoxins/)
    expect(s).toMatch(/docs\/spoilage-and-bins\.md/)
    const safety = section(readme, '## Safety')
    expect(safety).toMatch(/tested for mycotoxins by an accredited laboratory/)
    expect(safety).toMatch(/Grain bins: fans and heaters\s+are electrical and fire hazards/)
  })
})

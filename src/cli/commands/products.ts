import { parseArgs } from 'node:util'
import { PRODUCT_ALIASES, PRODUCT_CATALOGUE, productById } from '../../product/catalogue.ts'
import { CONFIDENCE_LEVELS, type ProductProfile } from '../../product/profile.ts'
import {
  confidenceCounts,
  memoryNumbers,
  NUMBER_GROUPS,
  type NumberGroup,
  type ProfileNumber,
  profileNumbers,
  weakestConfidence,
} from '../../product/profile-numbers.ts'
import { productSummaryJson } from '../../report/product-json.ts'
import { type CliCommand, UsageError } from '../command.ts'

const help = `dryhours products: the built-in product catalogue

Usage:
  dryhours products [--json]                list every product
  dryhours products <id> [--json]           one product: every number with its level and source
  dryhours products --sources [--json]      how many catalogue numbers rest on each level, per kind
  dryhours products <id> --sources [--json] only the numbers of one product, with level and source

An older id the list names under "older ids still accepted" gives the profile it now names.

Levels: published (read in the cited document), transcribed (copied from a secondary source
that cites the original; both named), fitted (derived by dryhours from the published data
named), memory (recalled or assumed, not verified: approximate), user (your own values).`

const GROUP_NAMES: Record<NumberGroup | 'all', string> = {
  'moisture-and-limits': 'moisture targets and limits',
  isotherm: 'isotherm constants',
  kinetics: 'kinetics constants',
  'geometry-and-loading': 'thickness and loading',
  all: 'all numbers',
}

function formatValue(n: ProfileNumber): string {
  const v =
    Number.isInteger(n.value) || Math.abs(n.value) >= 0.001 ? String(n.value) : n.value.toExponential()
  return n.unit ? `${v} ${n.unit}` : v
}

function numberLines(numbers: ProfileNumber[]): string[] {
  return numbers.map((n) => `  ${n.label}: ${formatValue(n)}  [${n.confidence}] ${n.source}`)
}

function detail(p: ProductProfile): string {
  const iso = p.isotherm.desorption
  const numbers = profileNumbers(p)
  const memory = memoryNumbers(p)
  const isoLevel = weakestConfidence(numbers.filter((n) => n.path.startsWith('isotherm.')))
  const kinLevel = weakestConfidence(numbers.filter((n) => n.path.startsWith('kinetics.equation')))
  const lines = [
    `${p.name} (${p.id})${p.variantOf ? `, a variant of ${p.variantOf}` : ''}`,
    `category: ${p.category}`,
    `desorption isotherm: ${iso.equation.model}, calibrated ${iso.validTempC[0]}–${iso.validTempC[1]} °C, RH ${iso.validRhPct[0]}–${iso.validRhPct[1]} % (weakest constant: ${isoLevel})`,
    p.isotherm.adsorption
      ? `adsorption isotherm: ${p.isotherm.adsorption.equation.model}`
      : 'adsorption isotherm: none known; rewetting uses the desorption isotherm',
    `kinetics: ${p.kinetics.equation.model} at ${p.kinetics.referenceThicknessMm} mm (${p.kinetics.shape}) (weakest constant: ${kinLevel})`,
    'every number, its level and its source:',
    ...numberLines(numbers),
    `numbers resting on memory: ${memory.length} of ${numbers.length}${memory.length ? ` (${memory.map((n) => n.label).join('; ')})` : ''}`,
    'cautions:',
    ...p.cautions.map((c) => `  - ${c}`),
  ]
  return `${lines.join('\n')}\n`
}

function list(): string {
  const rows = PRODUCT_CATALOGUE.map((p) => {
    const numbers = profileNumbers(p)
    const level = (prefix: string) => weakestConfidence(numbers.filter((n) => n.path.startsWith(prefix)))
    return [
      p.id,
      p.name,
      `${p.initialMoistureWbPct.value} → ${p.targetMoistureWbPct.value} % wb`,
      `${p.isotherm.desorption.equation.model} [${level('isotherm.')}]`,
      `${p.kinetics.equation.model} [${level('kinetics.equation')}]`,
      `${memoryNumbers(p).length}/${numbers.length}`,
    ]
  })
  return table(['id', 'name', 'moisture', 'isotherm', 'kinetics', 'memory'], rows) + aliasesText()
}

/** The older ids still accepted, each with the profile it now names. */
function aliasesText(): string {
  if (PRODUCT_ALIASES.length === 0) return ''
  return `\nolder ids still accepted (the same profile, the same numbers):\n${PRODUCT_ALIASES.map((a) => `  ${a.alias} = ${a.id}: ${a.note}\n`).join('')}`
}

/** A line saying that `asked` is an older id of `p`, or nothing. */
function aliasLine(asked: string, p: ProductProfile): string {
  const a = PRODUCT_ALIASES.find((x) => x.alias === asked)
  return a ? `(${asked} is an older id of ${p.id}, still accepted: ${a.note})\n` : ''
}

function table(head: string[], rows: string[][]): string {
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)))
  const fmt = (r: string[]) =>
    r
      .map((c, i) => (i === 0 ? c.padEnd(widths[i]) : c.padStart(widths[i])))
      .join('  ')
      .trimEnd()
  return `${[fmt(head), ...rows.map(fmt)].join('\n')}\n`
}

function sourcesSummary() {
  const counts = confidenceCounts(PRODUCT_CATALOGUE)
  const share = (memory: number, total: number) => (total ? memory / total : 0)
  return {
    profiles: PRODUCT_CATALOGUE.length,
    groups: [...NUMBER_GROUPS, 'all' as const].map((g) => ({
      group: g,
      ...counts[g],
      memoryShare: share(counts[g].memory, counts[g].total),
    })),
    products: PRODUCT_CATALOGUE.map((p) => {
      const numbers = profileNumbers(p)
      const memory = memoryNumbers(p).length
      return { id: p.id, numbers: numbers.length, memory, memoryShare: share(memory, numbers.length) }
    }),
  }
}

function sourcesText(): string {
  const s = sourcesSummary()
  const pct = (x: number) => `${(100 * x).toFixed(0)} %`
  const groupRows = s.groups.map((g) => [
    GROUP_NAMES[g.group],
    String(g.total),
    ...CONFIDENCE_LEVELS.map((l) => String(g[l])),
    pct(g.memoryShare),
  ])
  const productRows = s.products.map((p) => [p.id, String(p.numbers), String(p.memory), pct(p.memoryShare)])
  return (
    `numbers of the ${s.profiles} built-in profiles by level (memory: recalled or assumed, not verified)\n` +
    table(['kind', 'numbers', ...CONFIDENCE_LEVELS, 'memory share'], groupRows) +
    '\nper product\n' +
    table(['id', 'numbers', 'memory', 'memory share'], productRows) +
    '\nEach number with its source: dryhours products <id>\n'
  )
}

export const productsCommand: CliCommand = {
  name: 'products',
  summary: 'list the product catalogue, or show one product with the level and source of every number',
  help,
  async run(args, io) {
    let parsed: ReturnType<
      typeof parseArgs<{
        options: { json: { type: 'boolean' }; sources: { type: 'boolean' } }
        allowPositionals: true
      }>
    >
    try {
      parsed = parseArgs({
        args,
        options: { json: { type: 'boolean' }, sources: { type: 'boolean' } },
        allowPositionals: true,
      })
    } catch (e) {
      throw new UsageError((e as Error).message)
    }
    const { positionals, values } = parsed
    if (positionals.length > 1) throw new UsageError(`give at most one product id, got ${positionals.length}`)
    if (positionals.length === 1) {
      let p: ProductProfile
      try {
        p = productById(positionals[0])
      } catch (e) {
        if (e instanceof RangeError) throw new UsageError(e.message)
        throw e
      }
      if (values.sources) {
        const numbers = profileNumbers(p)
        io.stdout(
          values.json
            ? `${JSON.stringify({ id: p.id, numbers })}\n`
            : `${aliasLine(positionals[0], p)}${p.name} (${p.id}): every number, its level and its source\n${numberLines(numbers).join('\n')}\n`,
        )
        return 0
      }
      io.stdout(values.json ? `${JSON.stringify(p)}\n` : aliasLine(positionals[0], p) + detail(p))
      return 0
    }
    if (values.sources) {
      io.stdout(values.json ? `${JSON.stringify(sourcesSummary())}\n` : sourcesText())
      return 0
    }
    io.stdout(values.json ? `${JSON.stringify(PRODUCT_CATALOGUE.map(productSummaryJson))}\n` : list())
    return 0
  },
}

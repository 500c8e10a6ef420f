import { parseArgs } from 'node:util'
import { PRODUCT_CATALOGUE, productById } from '../../product/catalogue.ts'
import type { ProductProfile, Sourced } from '../../product/profile.ts'
import { productSummaryJson } from '../../report/product-json.ts'
import { type CliCommand, UsageError } from '../command.ts'

const help = `dryhours products: the built-in product catalogue

Usage:
  dryhours products [--json]          list every product
  dryhours products <id> [--json]     one product with the source of every number

Confidence flags: published (read in the cited source), fitted (fitted by dryhours to the
published data named), memory (recalled, not verified: approximate), user (your own values).`

function sourcedLine(label: string, s: Sourced<number> | null, unit: string): string {
  if (s === null) return `${label}: none`
  return `${label}: ${s.value}${unit}  [${s.confidence}] ${s.source}`
}

function detail(p: ProductProfile): string {
  const iso = p.isotherm.desorption
  const eq = iso.equation
  const isoParams = Object.entries(eq)
    .filter(([k]) => k !== 'model')
    .map(([k, v]) => `${k}=${v}`)
    .join(', ')
  const lines = [
    `${p.name} (${p.id})${p.variantOf ? `, a variant of ${p.variantOf}` : ''}`,
    `category: ${p.category}`,
    sourcedLine('initial moisture', p.initialMoistureWbPct, ' % wb'),
    sourcedLine('target moisture', p.targetMoistureWbPct, ' % wb'),
    sourcedLine('water-activity target', p.waterActivityTarget, ''),
    sourcedLine('maximum product temperature', p.maxProductTempC, ' °C'),
    `desorption isotherm: ${eq.model} (${isoParams}), calibrated ${iso.validTempC[0]}–${iso.validTempC[1]} °C, RH ${iso.validRhPct[0]}–${iso.validRhPct[1]} %  [${iso.confidence}] ${iso.source}`,
  ]
  if (p.isotherm.adsorption) {
    const a = p.isotherm.adsorption
    lines.push(`adsorption isotherm: ${a.equation.model}  [${a.confidence}] ${a.source}`)
  } else {
    lines.push('adsorption isotherm: none known; rewetting uses the desorption isotherm')
  }
  const k = p.kinetics
  lines.push(
    `kinetics: ${k.equation.model} ${JSON.stringify(k.equation)} at ${k.referenceThicknessMm} mm (${k.shape})  [${k.confidence}] ${k.source}`,
    sourcedLine('rewetting rate factor', k.rewettingRateFactor, ''),
    sourcedLine('default thickness', p.defaultThicknessMm, ' mm'),
    sourcedLine('default loading', p.defaultLoadingKgPerM2, ' kg fresh/m²'),
    'cautions:',
    ...p.cautions.map((c) => `  - ${c}`),
  )
  return `${lines.join('\n')}\n`
}

function list(): string {
  const rows = PRODUCT_CATALOGUE.map((p) => [
    p.id,
    p.name,
    `${p.initialMoistureWbPct.value} → ${p.targetMoistureWbPct.value} % wb`,
    `${p.isotherm.desorption.equation.model} [${p.isotherm.desorption.confidence}]`,
    `${p.kinetics.equation.model} [${p.kinetics.confidence}]`,
  ])
  const head = ['id', 'name', 'moisture', 'isotherm', 'kinetics']
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)))
  const fmt = (r: string[]) =>
    r
      .map((c, i) => c.padEnd(widths[i]))
      .join('  ')
      .trimEnd()
  return `${[fmt(head), ...rows.map(fmt)].join('\n')}\n`
}

export const productsCommand: CliCommand = {
  name: 'products',
  summary: 'list the product catalogue, or show one product with its sources',
  help,
  async run(args, io) {
    let parsed: ReturnType<
      typeof parseArgs<{ options: { json: { type: 'boolean' } }; allowPositionals: true }>
    >
    try {
      parsed = parseArgs({ args, options: { json: { type: 'boolean' } }, allowPositionals: true })
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
      io.stdout(values.json ? `${JSON.stringify(p)}\n` : detail(p))
      return 0
    }
    io.stdout(values.json ? `${JSON.stringify(PRODUCT_CATALOGUE.map(productSummaryJson))}\n` : list())
    return 0
  },
}

/**
 * Renders docs/product-sources.md (every catalogue number with its level and citation, counts per level, the
 * publications that could not be read, pretreatment factors) and docs/experiments.md (the published drying
 * experiments in test/fixtures/experiments). `npx tsx test/docs/product-docs.ts` (npm run docs:products) writes
 * both files; test/docs/product-docs.test.ts fails when the committed files differ from what this renders.
 */
import { readdirSync, readFileSync, writeFileSync } from 'node:fs'
import { PRODUCT_CATALOGUE } from '../../src/product/catalogue.ts'
import { type Experiment, type ExperimentRun, experimentSchema } from '../../src/product/experiment.ts'
import { CONFIDENCE_LEVELS } from '../../src/product/profile.ts'
import { confidenceCounts, NUMBER_GROUPS, profileNumbers } from '../../src/product/profile-numbers.ts'

const ROOT = new URL('../../', import.meta.url)
const EXPERIMENTS_DIR = new URL('test/fixtures/experiments/', ROOT)

export interface Pretreatment {
  id: string
  treatment: string
  product: string
  catalogueIds: string[]
  effect: {
    quantity: string
    statement: string
    factor: { min: number; max: number } | null
    factorNote: string
  }
  conditions: string
  citation: string
  partRead: string
  level: string
}

export function loadExperiments(): Experiment[] {
  return readdirSync(EXPERIMENTS_DIR)
    .filter((f) => f.endsWith('.json'))
    .sort()
    .map((f) => experimentSchema.parse(JSON.parse(readFileSync(new URL(f, EXPERIMENTS_DIR), 'utf8'))))
}

export function loadPretreatments(): Pretreatment[] {
  return JSON.parse(readFileSync(new URL('test/fixtures/pretreatments.json', ROOT), 'utf8')) as Pretreatment[]
}

const cell = (s: string) => s.replaceAll('|', '\\|').replaceAll('\n', ' ')

function fmt(v: number): string {
  return Number.isInteger(v) || Math.abs(v) >= 0.001 ? String(v) : v.toExponential()
}

const GROUP_NAMES: Record<string, string> = {
  'moisture-and-limits': 'moisture targets and limits',
  isotherm: 'isotherm constants',
  kinetics: 'kinetics constants',
  'geometry-and-loading': 'thickness and loading',
  all: 'all numbers',
}

/** Counts of the catalogue before the re-grading, measured with the same counting on commit c2abc6a. */
const BEFORE = { total: 345, published: 78, transcribed: 0, fitted: 14, memory: 253 }

const NOT_READ_PUBLICATIONS = [
  'ASAE D245.5 (1995) / ASABE D245.6 (2007), Moisture relationships of plant-based agricultural products: the constant tables for corn, wheat, rough rice, soybean, sorghum and others (only the cover page of a copy was reachable).',
  'Chen C.C., Morey R.V. 1989, Comparison of four EMC/ERH equations, Trans. ASAE 32(3): the corn modified Chung–Pfost constants.',
  'Thompson T.L., Peart R.M., Foster G.H. 1968, Mathematical simulation of corn drying — a new model, Trans. ASAE 11: the thin-layer constants (title and authors read, constants not).',
  'Wang C.Y., Singh R.P. 1978, ASAE paper 78-3001: the rough-rice Page equation.',
  'Basunia M.A., Abe T. 2001, Moisture desorption isotherms of medium-grain rough rice, J. Stored Prod. Res. 37:205–219: modified Chung–Pfost coefficients (abstract read; table not).',
  'Kaymak-Ertekin F., Gedik A. 2004, Sorption isotherms and isosteric heat of sorption for grapes, apricots, apples and potatoes, LWT 37(4):429–438: Halsey and GAB constants at 30, 45 and 60 °C (abstract read; tables not). The temperature terms the fruit isotherms lack are in this paper.',
  'Tsami E., Marinos-Kouris D., Maroulis Z.B. 1990, Water sorption isotherms of raisins, currants, figs, prunes and apricots, J. Food Sci. 55:1594; Ayranci E., Ayranci G., Dogantan Z. 1990, Moisture sorption isotherms of dried apricot, fig and raisin at 20 °C and 36 °C, J. Food Sci. 55:1591–1593 (seen in a reference list).',
  'Farahnaky A., Ansari S., Majzoobi M. 2009, Effect of glycerol on the moisture sorption isotherms of figs, J. Food Eng. 93:468–473: GAB and BET constants at 5, 25 and 40 °C (abstract read).',
  'Getahun E., Gabbiye N., Delele M.A., Fanta S.W., Gebrehiwot M.G., Vanierschot M. 2020, Heliyon 6:e04608: chilli GAB (green) and Oswin (red, brown) constants (abstract read).',
  'Corrêa P.C., Goneli A.L.D., Júnior P.C.A., de Oliveira G.H.H., Valente D.S.M. 2010, Int. J. Food Sci. Technol.: coffee fruit, pulped and green coffee modified Henderson and GAB constants (abstract read).',
  'Hadrich B., Boudhrioua N., Kechaou N. 2008, Food Bioprod. Process. 86:242–247: sardine desorption Oswin constants at 25, 35 and 50 °C (abstract read).',
  'Viswanathan R., Jayas D.S., Hulasare R.B. 2003, Biosyst. Eng. 86:465: tomato (modified Henderson) and onion (modified Halsey) constants.',
  'Liquid diffusion during drying of sorghum grains under different conditions, Eng. Agríc. 39(6):737 (2019): activation energies 20.94–27.32 kJ/mol by initial moisture, 40–100 °C (abstract read; authors not shown on the copy read, so not used).',
  'Drying of ground and half-cut figs (var. Mission), J. Eng. (Hindawi) 2013:710830: Deff at 45, 55 and 65 °C and activation energy 56.86 kJ/mol for half-cut figs, 28.21 for ground figs (abstract read; authors not shown on the copy read, so not used).',
  'Hssaini L., Ouaabou R., Hanine H., Razouk R., Idlimam A. 2021, Sci. Rep. 11:21266: fig slices in a convective solar dryer at 60–80 °C, activation energy 4699–7502 kJ/kg (about 85–135 kJ/mol): slices, not whole figs, so not used for the whole-fig profile.',
  "Doymaz I. 2012 (grapes), Doymaz 2005 (figs, J. Food Eng. 71:403–407), Xanthopoulos et al. 2010 (figs): the thin-layer model constants and the experiments' weather (abstracts read; tables not).",
]

export function renderProductSourcesDoc(): string {
  const out: string[] = []
  out.push('# Product constants and their sources', '')
  out.push(
    'Generated by `npm run docs:products` from the catalogue (`src/product/catalogue-*.ts`, citations in',
    '`src/product/citations.ts`) and `test/fixtures/pretreatments.json`; a test fails when this file differs from what',
    'they say, so do not edit it by hand. `dryhours products <id>` prints the same numbers; `dryhours products',
    '--sources` prints the counts.',
    '',
    '## Levels',
    '',
    '- **published**: read in the cited document (its abstract, table or text), cited with authors or issuing body and',
    '  year (`n.d.` when the copy read shows none);',
    '- **transcribed**: copied from a secondary source that cites the original; both are named ("X, as given in Y");',
    '- **fitted**: derived by dryhours from named published data: a least-squares fit, or a representative value',
    '  inside a published range ("the middle of …");',
    '- **memory**: recalled or assumed, not verified in a document: approximate;',
    '- **user**: given by the user.',
    '',
    'A number is counted once per constant: each isotherm and kinetics constant (a GAB isotherm without a temperature',
    'term counts its three zero ΔH terms as assumed constants), the reference temperature of a rate constant, the',
    'thickness at which kinetics hold, the rewetting factor, the moisture targets and limits, thickness and loading.',
    '',
    '## How many numbers rest on each level',
    '',
  )
  const counts = confidenceCounts(PRODUCT_CATALOGUE)
  out.push(`| kind | numbers | ${CONFIDENCE_LEVELS.join(' | ')} | memory share |`)
  out.push(`|---|---:|${CONFIDENCE_LEVELS.map(() => '---:').join('|')}|---:|`)
  for (const g of [...NUMBER_GROUPS, 'all' as const]) {
    const c = counts[g]
    out.push(
      `| ${GROUP_NAMES[g]} | ${c.total} | ${CONFIDENCE_LEVELS.map((l) => c[l]).join(' | ')} | ${((100 * c.memory) / c.total).toFixed(0)} % |`,
    )
  }
  out.push(
    '',
    `Before this re-grading (same counting, catalogue of commit c2abc6a): ${BEFORE.total} numbers, ${BEFORE.published} marked`,
    `published, ${BEFORE.fitted} fitted, ${BEFORE.memory} memory. Twelve of the "published" ones said "computed by dryhours",`,
    '"our assumption" or "from memory" in their own text; most of the others cited only the project\'s gathering notes,',
    'not a document a user can open. They were re-read where a copy could be found and re-graded where not: the',
    'share of memory rose because nothing is called published any more that was not read.',
    '',
    '## Publications that exist but could not be read here',
    '',
    'Only the first part of each stored copy (usually the abstract) could be read, so constants printed in tables',
    'deeper in a paper stay at `memory` until someone reads the table:',
    '',
    ...NOT_READ_PUBLICATIONS.map((p) => `- ${p}`),
    '',
    '## Every number, per product',
    '',
  )
  for (const p of PRODUCT_CATALOGUE) {
    out.push(`### ${p.name} (\`${p.id}\`)`, '')
    out.push('| quantity | value | level | source (document, table or equation) |', '|---|---|---|---|')
    for (const n of profileNumbers(p)) {
      out.push(
        `| ${cell(n.label)} | ${fmt(n.value)}${n.unit ? ` ${n.unit}` : ''} | ${n.confidence} | ${cell(n.source)} |`,
      )
    }
    out.push('')
  }
  out.push(
    '## Pretreatment factors (data for the profile variants; not yet used by the engine)',
    '',
    'Factors multiply the named quantity of the untreated product. A factor the paper does not print is derived by',
    'dryhours from the printed figures, as the note says; where no factor could be read, there is none.',
    '',
    '| treatment | product | quantity | factor | published statement | conditions | source | level |',
    '|---|---|---|---|---|---|---|---|',
  )
  for (const t of loadPretreatments()) {
    const f = t.effect.factor
    const factor = f ? (f.min === f.max ? fmt(f.min) : `${fmt(f.min)}–${fmt(f.max)}`) : 'none read'
    out.push(
      `| ${cell(t.treatment)} | ${cell(t.product)} | ${cell(t.effect.quantity)} | ${factor} (${cell(t.effect.factorNote)}) | ${cell(t.effect.statement)} | ${cell(t.conditions)} | ${cell(t.citation)} (${cell(t.partRead)}) | ${t.level} |`,
    )
  }
  out.push('')
  return `${out.join('\n')}\n`
}

function rangeText(v: number | { min: number; max: number } | null, unit = ''): string {
  if (v === null) return '—'
  if (typeof v === 'number') return `${fmt(v)}${unit}`
  return v.min === v.max ? `${fmt(v.min)}${unit}` : `${fmt(v.min)}–${fmt(v.max)}${unit}`
}

function moistureText(m: ExperimentRun['initialMoisture']): string {
  return m
    ? `${rangeText(m.value)} % ${m.basis}`.replace(/^(\d+(?:\.\d+)?(?:–\d+(?:\.\d+)?)?) % db$/, '$1 kg/kg db')
    : '?'
}

/** A run can go through the engine when its time and both moistures are known. */
export function readyToRun(r: ExperimentRun): boolean {
  return r.timeH !== null && r.initialMoisture !== null && r.finalMoisture !== null
}

export function renderExperimentsDoc(): string {
  const experiments = loadExperiments()
  const out: string[] = []
  out.push('# Published drying experiments', '')
  out.push(
    'Generated by `npm run docs:products` from `test/fixtures/experiments/*.json` (schema: `src/product/experiment.ts`);',
    'a test fails when this file differs. Every figure was read in the part of the paper named; a field the part read',
    'does not give is left empty, never guessed. Times are in hours (days × 24 where the paper gives days).',
    '',
    '- **elapsed**: clock time including nights; **active**: hours of drying only; **unknown**: the part read does not',
    '  say (most abstracts); the engine calibration must decide it from the full paper before fitting;',
    '- **role**: `calibration` runs may be used by a fit; `validation` runs never are (they measure the fit);',
    '  `context` runs lack what the engine needs (a time, a method that can be modelled, or consistent figures);',
    '- **ready**: time, initial and final moisture are all known from the part read.',
    '',
    'None of the abstracts read gives the daily temperature, humidity, sunshine and wind of the trial: rebuilding',
    "an experiment's weather needs the full paper (or the site's climate, said so) before it can be run.",
    '',
    '## Runs',
    '',
    '| experiment | run | product | method | time (h) | time kind | moisture | role | ready |',
    '|---|---|---|---|---:|---|---|---|---|',
  )
  for (const e of experiments) {
    for (const r of e.runs) {
      out.push(
        `| ${e.id} | ${r.id} | ${e.product.catalogueId ?? '—'} | ${r.method} | ${rangeText(r.timeH)} | ${r.timeKind} | ${moistureText(r.initialMoisture)} → ${moistureText(r.finalMoisture)} | ${r.role} | ${readyToRun(r) ? 'yes' : 'no'} |`,
      )
    }
  }
  const byRole = (role: ExperimentRun['role']) =>
    experiments.flatMap((e) => e.runs.filter((r) => r.role === role).map((r) => `${e.id}/${r.id}`))
  out.push(
    '',
    `Calibration (${byRole('calibration').length}): ${byRole('calibration').join(', ')}.`,
    '',
    `Validation (${byRole('validation').length}): ${byRole('validation').join(', ')}.`,
    '',
    '## Experiments',
    '',
  )
  for (const e of experiments) {
    const c = e.citation
    out.push(`### ${e.id}`, '')
    out.push(
      `${c.authors ? c.authors.join(', ') : 'Authors not shown on the copy read'} ${c.year ?? 'n.d.'}, ${c.title}, ${c.publishedIn}${c.doi ? `, doi:${c.doi}` : ''}. Part read: ${c.partRead} (${c.readFrom}).`,
      '',
      `- product: ${e.product.description}${e.product.catalogueId ? ` (catalogue \`${e.product.catalogueId}\`)` : ''}`,
      `- site: ${e.site.place ?? 'not in the part read'}${e.site.period ? `; ${e.site.period}` : ''}`,
      `- weather: ${e.weather.airTempC ? `air ${rangeText(e.weather.airTempC, ' °C')}; ` : ''}${e.weather.rhPct ? `RH ${rangeText(e.weather.rhPct, ' %')}; ` : ''}${e.weather.notes}`,
    )
    for (const r of e.runs) {
      out.push(
        `- run \`${r.id}\` (${r.role}): ${r.methodDetails}; time ${rangeText(r.timeH, ' h')} (${r.timeKind}: ${r.timeNote}); pretreatment: ${r.pretreatment}; nights: ${r.nightPractice}${r.sizeKind ? `; size: ${rangeText(r.sizeMm, ' mm')} ${r.sizeKind}` : ''}${r.loading ? `; loading: ${r.loading}` : ''}. ${r.roleReason}.`,
      )
    }
    out.push('')
  }
  return `${out.join('\n')}\n`
}

if (import.meta.url === `file://${process.argv[1]}`) {
  writeFileSync(new URL('docs/product-sources.md', ROOT), renderProductSourcesDoc())
  writeFileSync(new URL('docs/experiments.md', ROOT), renderExperimentsDoc())
  console.log('wrote docs/product-sources.md and docs/experiments.md')
}

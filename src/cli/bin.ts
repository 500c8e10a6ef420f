/**
 * @module cli/bin
 * The natural-air bin method on the command line: its flags (`--airflow`, `--bin-depth`, …) into the method's
 * parameters (drying/methods/natural-air-bin.ts), and the text of a bin answer (`assessment.bin`): the fan at each
 * airflow, the minimum airflow per start month, and per start date and airflow the days until the top layer is
 * dry, its dry-matter loss against the limit and the fan energy per tonne.
 */
import type { Assessment } from '../analysis/assessment.ts'
import type { BinAssessment } from '../analysis/assessment-bin.ts'
import { BUSHEL_WEIGHT_KG, m3PerMinPerTonneFromCfmPerBu } from '../drying/deep-bed/airflow-resistance.ts'
import type { ProductProfile } from '../product/profile.ts'
import { numberOption, UsageError } from './command.ts'

export const BIN_FLAGS_HELP = `  natural-air-bin: grain in a bin (grains only); give the harvest season with --start/--end
                  --airflow <m³/min per t>[,…]  one airflow, or several to compare (default 0.5,1,1.5,2,3)
                  --airflow-cfm-bu <cfm/bu>[,…]  the same in cubic feet per minute per bushel
                  --bin-depth <m> (default 4)  --bin-diameter <m> (default 9.1) | --floor-area <m²>
                  --heat-rise <K> [--heater-above-rh <%>]  --fan-efficiency <0–1> (default 0.5)
                  --fan-control continuous|air-emc-below|rh-below [--fan-set-point <% wb | % RH>]
                  --layers <n> (default 20)  --max-days <n> = days the top layer has to dry (default 60)`

export const BIN_PARSE_OPTIONS = {
  airflow: { type: 'string' },
  'airflow-cfm-bu': { type: 'string' },
  'bin-depth': { type: 'string' },
  'bin-diameter': { type: 'string' },
  'floor-area': { type: 'string' },
  'heat-rise': { type: 'string' },
  'heater-above-rh': { type: 'string' },
  'fan-efficiency': { type: 'string' },
  'fan-control': { type: 'string' },
  'fan-set-point': { type: 'string' },
  layers: { type: 'string' },
} as const

const BIN_ONLY = Object.keys(BIN_PARSE_OPTIONS)

function numberList(flag: string, text: string): number[] {
  const parts = text.split(',').map((p) => p.trim())
  if (parts.length === 0 || parts.some((p) => p === ''))
    throw new UsageError(`--${flag} must be a number or a comma-separated list of numbers, got '${text}'`)
  return parts.map((p) => numberOption(flag, p) as number)
}

/**
 * Sets the natural-air bin parameters of `method` from the flags in `values` (kind `natural-air-bin`); refuses
 * them with another method. cfm per bushel converts with the grain's standard bushel weight.
 */
export function setBinOptions(
  method: Record<string, unknown>,
  values: Record<string, unknown>,
  product: ProductProfile,
): void {
  const given = BIN_ONLY.filter((k) => values[k] !== undefined)
  if (method.kind !== 'natural-air-bin') {
    if (given.length > 0) throw new UsageError(`--${given[0]} goes with --method natural-air-bin`)
    return
  }
  const str = (k: string) => values[k] as string | undefined
  const num = (k: string) => numberOption(k, str(k))
  const set = (key: string, v: unknown) => {
    if (v !== undefined) method[key] = v
  }
  const si = str('airflow')
  const us = str('airflow-cfm-bu')
  if (si !== undefined && us !== undefined)
    throw new UsageError('give --airflow or --airflow-cfm-bu, not both')
  if (si !== undefined) method.airflowsM3PerMinPerTonne = numberList('airflow', si)
  if (us !== undefined) {
    const key = product.variantOf ?? product.id
    const bushelKg = BUSHEL_WEIGHT_KG[key]
    if (bushelKg === undefined) throw new UsageError(`--airflow-cfm-bu: no standard bushel weight for ${key}`)
    method.airflowsM3PerMinPerTonne = numberList('airflow-cfm-bu', us).map(
      (q) => Math.round(m3PerMinPerTonneFromCfmPerBu(q, bushelKg) * 1e4) / 1e4,
    )
  }
  set('depthM', num('bin-depth'))
  set('binDiameterM', num('bin-diameter'))
  set('floorAreaM2', num('floor-area'))
  set('heatRiseK', num('heat-rise'))
  set('heaterOnAboveRhPct', num('heater-above-rh'))
  set('fanEfficiency', num('fan-efficiency'))
  set('layers', num('layers'))
  const control = str('fan-control')
  if (control !== undefined) {
    if (!['continuous', 'air-emc-below', 'rh-below'].includes(control))
      throw new UsageError(`--fan-control must be continuous, air-emc-below or rh-below, got '${control}'`)
    method.fanControl = control
  }
  const setPoint = num('fan-set-point')
  if (setPoint !== undefined) {
    if (control === 'air-emc-below') method.fanMaxEmcWbPct = setPoint
    else if (control === 'rh-below') method.fanMaxRhPct = setPoint
    else throw new UsageError('--fan-set-point goes with --fan-control air-emc-below or rh-below')
  }
}

const MONTHS = 'Jan Feb Mar Apr May Jun Jul Aug Sep Oct Nov Dec'.split(' ')
const f = (x: number | null | undefined, d: number): string =>
  x === null || x === undefined || !Number.isFinite(x) ? '–' : x.toFixed(d)

function airflowText(q: number | null, b: BinAssessment): string {
  if (q === null) return 'none of the airflows'
  const cfm = q / m3PerMinPerTonneFromCfmPerBu(1, b.grain.bushelKg)
  return `${f(q, 2)} m³/min per t (${f(cfm, 2)} cfm/bu)`
}

/** The bin part of `dryhours assess` text. */
export function binText(a: Assessment, b: BinAssessment): string[] {
  const out: string[] = []
  const bin = b.bin
  const limit = b.spoilage.dryMatterLossLimitPct
  const yearsWord = b.typicalYear
    ? 'the typical year'
    : `${Math.round(b.requiredShareOfYears * 10)} of 10 years`
  out.push(
    `Natural-air bin: ${f(bin.depthM, 1)} m (${f(bin.depthM / 0.3048, 1)} ft) of grain on ${f(bin.floorAreaM2, 1)} m², ${f(bin.grainTonnes, 0)} t (${f(bin.bushels, 0)} bu at ${f(b.grain.bushelKg / 0.45359237, 0)} lb/bu); ${bin.fanControl}; ${bin.heatRiseK > 0 ? `heater +${bin.heatRiseK} K${bin.heaterOnAboveRhPct !== null ? ` above ${bin.heaterOnAboveRhPct} % RH` : ''}` : 'no heater'}`,
  )
  out.push(
    `Safe = the top layer (1/${bin.layers} of the depth) reaches ${a.product.targetMoistureWbPct} % wb within ${b.seasonDays} days with its dry-matter loss below ${limit} %`,
  )
  out.push('')
  out.push('airflow m³/min/t  cfm/bu  static pressure Pa (in. w.c.)  fan kW  kW/t')
  for (const q of b.airflows) {
    out.push(
      `${f(q.airflowM3PerMinPerTonne, 2).padStart(16)}  ${f(q.airflowCfmPerBushel, 2).padStart(6)}  ${`${f(q.staticPressurePa, 0)} (${f(q.staticPressureInchesWater, 2)})`.padStart(28)}  ${f(q.fanPowerKw, 1).padStart(6)}  ${f(q.fanPowerKwPerTonne, 3)}`,
    )
  }
  out.push('')
  out.push(`Minimum airflow per start month (safe in ${yearsWord} at every start date of the month):`)
  for (const m of b.minimumAirflowByMonth) {
    out.push(
      `  ${MONTHS[m.month - 1]}: ${airflowText(m.minimumAirflowM3PerMinPerTonne, b)}${m.minimumAirflowM3PerMinPerTonne === null ? ` (best: safe in ${f(100 * m.shareOfYearsSafe, 0)} % of years)` : ''}`,
    )
  }
  out.push('')
  out.push(
    `start  m³/min/t  days top dry median (P90)  top DML % median (P90)  P90 < ${limit} %  safe years  fan kWh/t median`,
  )
  for (const s of b.startDates) {
    const days = `${f(s.daysUntilTopLayerDry.median, 1)} (${f(s.daysUntilTopLayerDry.p90, 1)})`
    const dml = `${f(s.topLayerDryMatterLossPct.median, 2)} (${f(s.topLayerDryMatterLossPct.p90, 2)})`
    out.push(
      `${s.startDate}  ${f(s.airflowM3PerMinPerTonne, 2).padStart(8)}  ${days.padStart(25)}  ${dml.padStart(22)}  ${(s.passesDryMatterLossLimitP90 ? 'yes' : 'no').padStart(10)}  ${`${s.yearsSafe}/${s.years}`.padStart(10)}  ${f(s.fanEnergyKwhPerTonne.median, 1).padStart(16)}`,
    )
  }
  out.push(`  – = the top layer is not dry within ${b.seasonDays} days in that share of years`)
  return out
}

/**
 * @module cli/bin
 * The natural-air bin method on the command line: its flags (`--airflow`, `--bin-depth`, …) into the method's
 * parameters (drying/methods/natural-air-bin.ts). The text of a bin answer is in report/bin-text.ts.
 */
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

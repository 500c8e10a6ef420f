/**
 * @module climate-demo/energy/batch-log-model
 * An INVENTED batch log of a propane-fired batch grain dryer at Quillow Landing (the invented humid-valley
 * demo site), one autumn of shelled-corn batches, with a deliberate step change in the dryer's
 * performance partway through (a made-up fault: a torn plenum seal leaking heated air). Every number is
 * invented; the energy model below only has the signs a heated dryer would show. Pure and seeded: same
 * seed, same text.
 *
 * True model of the specific energy [MJ per kg water] (invented):
 *   SE = 4.6 − 0.05·(T − 10) + 0.12·(W − 7) − 0.14·(load_t − 11) + ε,  ε ~ N(0, 0.07²)
 * and, from batch {@link STEP_BATCH_NUMBER} on, SE × (1 + {@link STEP_FRACTION}).
 * Colder intake air needs more heat per kg of air; moister air carries less water per kg; part loads waste
 * heat through the unused plenum. The weather and load spread (≈ ±0.4 MJ/kg) is made large against the
 * step so that the raw chart is slow to see it, and the regression can take the weather and load out.
 */

import {
  humidityRatioFromVaporPressure,
  standardPressureKpaAtElevation,
} from '../../src/physics/moist-air.ts'
import { saturationVaporPressureLiquidKpa } from '../../src/physics/saturation.ts'
import { randomStream } from '../random.ts'
import { QUILLOW_VALLEY } from '../sites.ts'
import { dayOfYearFraction, monthlyValue } from '../sky.ts'

/** Seed of the committed demo log. */
export const BATCH_LOG_SEED = 20_260_901
/** Batches in the demo season. */
export const BATCH_COUNT = 64
/** 1-based number of the first batch after the (invented) fault. */
export const STEP_BATCH_NUMBER = 41
/** Relative rise of specific energy after the fault (invented). */
export const STEP_FRACTION = 0.07
/** Propane heating value [MJ/L] used to turn heat into litres: US EIA 91,333 Btu/gal (as src/drying/fuels.ts). */
const PROPANE_MJ_PER_L = (91_333 * 1055.056) / 1e6 / 3.785411784

export interface DemoBatchTruth {
  number: number
  faulty: boolean
  trueSpecificEnergyMjPerKg: number
}

const pad = (n: number) => String(n).padStart(2, '0')

/** Build the demo log text and the truth behind it. */
export function buildDemoBatchLog(seed: number = BATCH_LOG_SEED): { csv: string; truth: DemoBatchTruth[] } {
  const site = QUILLOW_VALLEY
  const rT = randomStream(seed, 'energy/temperature')
  const rD = randomStream(seed, 'energy/dew-point')
  const rL = randomStream(seed, 'energy/load')
  const rM = randomStream(seed, 'energy/moisture')
  const rE = randomStream(seed, 'energy/noise')
  const rS = randomStream(seed, 'energy/schedule')
  const pressureKpa = standardPressureKpaAtElevation(site.elevationM)
  const lines = [
    '# INVENTED demo data (dryhours climate-demo/energy): batch log of a propane batch grain dryer, Quillow Landing.',
    '# Start times in local standard time (UTC-06:00). A step change in dryer performance is built in; see climate-demo/energy/README.md.',
    'batch_id,start,duration_h,fresh_mass_kg,final_mass_kg,initial_moisture_wb_pct,final_moisture_wb_pct,fuel_amount,fuel_unit,fuel,drying_temp_c,ambient_temp_c,ambient_rh_pct',
  ]
  const truth: DemoBatchTruth[] = []
  let dayMs = Date.UTC(2026, 8, 7) // 7 September 2026, local date
  let tAnomaly = 0
  let dAnomaly = 0
  for (let k = 1; k <= BATCH_COUNT; k++) {
    dayMs += (rS.uniform() < 0.75 ? 1 : 2) * 86_400_000
    const startLocalMs = dayMs + (6 + Math.floor(rS.uniform() * 4)) * 3_600_000
    const doy = dayOfYearFraction(startLocalMs)
    // Weather over the batch: monthly means of the site plus day-to-day anomalies (AR(1), φ = 0.5).
    tAnomaly = 0.5 * tAnomaly + Math.sqrt(1 - 0.25) * site.dryBulbAnomalySdK * rT.normal()
    dAnomaly = 0.5 * dAnomaly + Math.sqrt(1 - 0.25) * 2.5 * rD.normal()
    const tC = monthlyValue(site.dryBulbMeanC, doy) + 3 + tAnomaly // +3 K: daytime-weighted batch hours
    const dewC = Math.min(tC - 1, monthlyValue(site.dewPointMeanC, doy) + 0.6 * tAnomaly + dAnomaly)
    const rhPct = (100 * saturationVaporPressureLiquidKpa(dewC)) / saturationVaporPressureLiquidKpa(tC)
    const wGPerKg = 1000 * humidityRatioFromVaporPressure(saturationVaporPressureLiquidKpa(dewC), pressureKpa)
    const loadT = 7 + 8 * rL.uniform()
    const freshKg = Math.round((loadT * 1000) / 10) * 10
    const m0 = 19 + 8 * rM.uniform()
    const m1 = 15.5 + 0.3 * rM.normal()
    const waterKg = (freshKg * (m0 - m1)) / (100 - m1)
    const finalKg = Math.round(freshKg - waterKg)
    const faulty = k >= STEP_BATCH_NUMBER
    const base =
      4.6 - 0.05 * (tC - 10) + 0.12 * (wGPerKg - 7) - 0.14 * (freshKg / 1000 - 11) + 0.07 * rE.normal()
    const se = base * (faulty ? 1 + STEP_FRACTION : 1)
    const litres = (se * (freshKg - finalKg)) / PROPANE_MJ_PER_L
    const hours = (freshKg - finalKg) / 450 + 1.5 // invented evaporation rate 450 kg/h plus cooling
    const d = new Date(startLocalMs)
    const start = `${d.getUTCFullYear()}-${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())}T${pad(d.getUTCHours())}:00-06:00`
    truth.push({ number: k, faulty, trueSpecificEnergyMjPerKg: se })
    lines.push(
      [
        `Q26-${String(k).padStart(3, '0')}`,
        start,
        hours.toFixed(1),
        freshKg,
        finalKg,
        m0.toFixed(1),
        m1.toFixed(1),
        litres.toFixed(1),
        'L',
        'propane',
        70,
        tC.toFixed(1),
        rhPct.toFixed(0),
      ].join(','),
    )
    if (k === 23) {
      // One row as a tired operator might leave it: no final weighing, no moisture readings. It is rejected.
      lines.push(
        `Q26-${String(k).padStart(3, '0')}b,${start.slice(0, 11)}16:00-06:00,2.0,3000,,,,40.0,L,propane,70,,`,
      )
    }
  }
  return { csv: `${lines.join('\n')}\n`, truth }
}

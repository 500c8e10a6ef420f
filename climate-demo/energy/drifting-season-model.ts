/**
 * @module climate-demo/energy/drifting-season-model
 * INVENTED batch logs of a propane-fired batch grain dryer drying wheat at an invented farm, Tessaby
 * Flats, over one early summer: a baseline in cool, humid weather, then warmer and drier weather that
 * drifts beyond anything the baseline saw, and (optionally) a step rise in fuel per kg of water from a
 * known batch (an invented fault: a fouled heat exchanger). Used by the detection study
 * (bench/sections/energy-detection.ts, docs/energy-charts.md) and the tests; every number is invented.
 * Pure and seeded: same options, same text.
 *
 * The "true" dryer is deliberately not the model dryhours fits (src/analysis/energy/dryer-physics.ts), so
 * the study measures how well that model carries across weather rather than repeating it:
 * - a fan moves a fixed volume of outside air (6 m³/s) through the grain; the heater lifts it to 60 °C;
 * - the air leaves the grain along its adiabatic line at a batch-mean exhaust relative humidity of
 *   70 % (batch to batch ±1.2 points, one standard deviation), not at a fixed share of its capacity;
 * - the casing loses 0.4 kW per K of drying-air temperature above outside for the drying hours, and the
 *   dryer's steel takes 3 MJ per K to warm up each batch (both depend on the weather; the fitted model
 *   has one fixed loss per batch);
 * - the heater delivers 86 % of the fuel's heat (higher heating value); after the fault, 86 %/(1 + step);
 * - the propane meter reads within 1 % and the weighbridge within 10 kg (one standard deviation).
 * `noiseScale` multiplies the three random errors (exhaust humidity, meter, weighbridge).
 */

import {
  dryBulbFromEnthalpyC,
  humidityRatioFromVaporPressure,
  moistAirDensityKgPerM3,
  moistAirEnthalpyKjPerKg,
  standardPressureKpaAtElevation,
  vaporPressureFromHumidityRatio,
} from '../../src/physics/moist-air.ts'
import { saturationVaporPressureLiquidKpa } from '../../src/physics/saturation.ts'
import { randomStream } from '../random.ts'

export interface DriftingSeasonOptions {
  seed: number
  /** Batches in the log (default 40). */
  batches?: number
  /** Batches of cool, humid weather at the start (default 20): the baseline the chart is meant to use. */
  coolBatches?: number
  /** 1-based number of the first batch after the fault (default 29); null for a log without a fault. */
  stepBatch?: number | null
  /** Relative rise of fuel heat per kg of water after the fault (default 0.07). */
  stepFraction?: number
  /** Multiplier of the random errors (default 1). */
  noiseScale?: number
}

export interface DriftingSeasonBatch {
  number: number
  batchId: string
  faulty: boolean
  outsideTempC: number
  outsideRhPct: number
  /** Fuel heat per kg of water as the log records it [MJ/kg]. */
  loggedSpecificEnergyMjPerKg: number
}

/** Seed of the committed demo log tessaby-wheat-2026.csv (the first of the detection study's ten seeds). */
export const TESSABY_DEMO_SEED = 1
/** Site elevation [m] of the invented farm (sets the air pressure). */
export const TESSABY_ELEVATION_M = 350
const DRYING_TEMP_C = 60
const FAN_FLOW_M3_PER_S = 6
const EXHAUST_RH_PCT = 70
const EXHAUST_RH_SD_PCT = 1.2
const CASING_LOSS_KW_PER_K = 0.4
const WARM_UP_MJ_PER_K = 3
const HEATER_EFFICIENCY = 0.86
const METER_SD = 0.01
const SCALE_SD_KG = 10
/** Propane higher heating value [MJ/L]: US EIA 91,333 Btu/gal, as src/drying/fuels.ts. */
const PROPANE_MJ_PER_L = (91_333 * 1055.056) / 1e6 / 3.785411784

/**
 * Humidity ratio [kg/kg] at which air of enthalpy `h` [kJ/kg] (the heated air's, kept along the adiabatic
 * line) reaches relative humidity `rhPct`: bisection between `wLow` (RH below) and `wHigh` (RH above).
 */
function exhaustHumidityRatio(h: number, rhPct: number, wLow: number, wHigh: number, p: number): number {
  const rhAt = (w: number) =>
    (100 * vaporPressureFromHumidityRatio(w, p)) /
    saturationVaporPressureLiquidKpa(dryBulbFromEnthalpyC(h, w))
  let lo = wLow
  let hi = wHigh
  for (let i = 0; i < 60; i++) {
    const mid = 0.5 * (lo + hi)
    if (rhAt(mid) < rhPct) lo = mid
    else hi = mid
  }
  return 0.5 * (lo + hi)
}

const pad = (n: number) => String(n).padStart(2, '0')

/** Build one invented log (CSV text) and the truth behind it. */
export function buildDriftingSeasonLog(options: DriftingSeasonOptions): {
  csv: string
  truth: DriftingSeasonBatch[]
} {
  const n = options.batches ?? 40
  const cool = options.coolBatches ?? 20
  const stepBatch = options.stepBatch === undefined ? 29 : options.stepBatch
  const step = options.stepFraction ?? 0.07
  const noise = options.noiseScale ?? 1
  const seed = options.seed
  const rW = randomStream(seed, 'drift/weather')
  const rL = randomStream(seed, 'drift/load')
  const rX = randomStream(seed, 'drift/exhaust')
  const rM = randomStream(seed, 'drift/meter')
  const rS = randomStream(seed, 'drift/schedule')
  const p = standardPressureKpaAtElevation(TESSABY_ELEVATION_M)
  const lines = [
    '# INVENTED data (dryhours climate-demo/energy/drifting-season-model.ts): propane batch grain dryer, wheat, Tessaby Flats.',
    `# seed ${seed}; cool humid batches 1-${cool}, then warmer and drier; ${stepBatch === null ? 'no fault' : `fault (+${(100 * step).toFixed(1)} % fuel per kg water) from batch ${stepBatch}`}.`,
    'batch_id,start,duration_h,fresh_mass_kg,final_mass_kg,fuel_amount,fuel_unit,fuel,drying_temp_c,ambient_temp_c,ambient_rh_pct',
  ]
  const truth: DriftingSeasonBatch[] = []
  let dayMs = Date.UTC(2026, 5, 8)
  let tAnomaly = 0
  let rhAnomaly = 0
  for (let k = 1; k <= n; k++) {
    dayMs += (rS.uniform() < 0.7 ? 1 : 2) * 86_400_000
    const startMs = dayMs + (7 + Math.floor(rS.uniform() * 5)) * 3_600_000
    // Weather over the batch: a cool, humid start; then warmer and drier, drifting further each batch.
    const late = k > cool ? (k - cool - 1) / Math.max(1, n - cool - 1) : 0
    const tTrend = k <= cool ? 14.5 + (2.5 * (k - 1)) / Math.max(1, cool - 1) : 20 + 9 * late
    const rhTrend = k <= cool ? 86 - (4 * (k - 1)) / Math.max(1, cool - 1) : 68 - 26 * late
    tAnomaly = 0.5 * tAnomaly + Math.sqrt(0.75) * 1.5 * rW.normal()
    rhAnomaly = 0.5 * rhAnomaly + Math.sqrt(0.75) * 5 * rW.normal()
    const tC = Math.round(10 * (tTrend + tAnomaly)) / 10
    const rhPct = Math.round(Math.min(98, Math.max(20, rhTrend + rhAnomaly)))
    const wa = humidityRatioFromVaporPressure((rhPct / 100) * saturationVaporPressureLiquidKpa(tC), p)
    // Load: 12–18 t of wheat from 18.5–23 % to about 14 % moisture (wet basis).
    const fresh = 12_000 + 6_000 * rL.uniform()
    const m0 = 0.185 + 0.045 * rL.uniform()
    const m1 = 0.135 + 0.01 * rL.uniform()
    const final = (fresh * (1 - m0)) / (1 - m1)
    const water = fresh - final
    // Air: heated at constant W, leaves along its adiabatic line at the batch's exhaust RH.
    const hHeated = moistAirEnthalpyKjPerKg(DRYING_TEMP_C, wa)
    const exhaustRh = EXHAUST_RH_PCT + noise * EXHAUST_RH_SD_PCT * rX.normal()
    const wSat = humidityRatioFromVaporPressure(saturationVaporPressureLiquidKpa(35), p)
    const wEx = exhaustHumidityRatio(hHeated, exhaustRh, wa, Math.max(wSat, wa + 0.03), p)
    const airKg = water / (wEx - wa)
    const massFlowKgPerS = FAN_FLOW_M3_PER_S * moistAirDensityKgPerM3(tC, wa, p)
    const dryingH = airKg / massFlowKgPerS / 3600
    const lift = DRYING_TEMP_C - tC
    const heatMj =
      (airKg * (hHeated - moistAirEnthalpyKjPerKg(tC, wa))) / 1000 +
      (CASING_LOSS_KW_PER_K * lift * dryingH * 3600) / 1000 +
      WARM_UP_MJ_PER_K * lift
    const faulty = stepBatch !== null && k >= stepBatch
    const fuelMj = (heatMj / HEATER_EFFICIENCY) * (faulty ? 1 + step : 1)
    const litres = ((fuelMj / PROPANE_MJ_PER_L) * (1 + noise * METER_SD * rM.normal())).toFixed(1)
    const freshLogged = Math.round(fresh + noise * SCALE_SD_KG * rM.normal())
    const finalLogged = Math.round(final + noise * SCALE_SD_KG * rM.normal())
    const d = new Date(startMs)
    const start = `${d.getUTCFullYear()}-${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())}T${pad(d.getUTCHours())}:00+01:00`
    const batchId = `W26-${String(k).padStart(3, '0')}`
    lines.push(
      [
        batchId,
        start,
        (dryingH + 0.75).toFixed(1),
        freshLogged,
        finalLogged,
        litres,
        'L',
        'propane',
        DRYING_TEMP_C,
        tC.toFixed(1),
        rhPct,
      ].join(','),
    )
    truth.push({
      number: k,
      batchId,
      faulty,
      outsideTempC: tC,
      outsideRhPct: rhPct,
      loggedSpecificEnergyMjPerKg: (Number(litres) * PROPANE_MJ_PER_L) / (freshLogged - finalLogged),
    })
  }
  return { csv: `${lines.join('\n')}\n`, truth }
}

/**
 * @module analysis/equilibrium-answers
 * The answers of `dryhours equilibrium` and GET /v1/equilibrium: equilibrium moisture at an air state, or
 * equilibrium RH (water activity) at a moisture, with the isotherm model, its source and confidence,
 * whether the point lies outside the isotherm's calibrated range, and the net isosteric heat there.
 */
import {
  equilibriumMoistureDb,
  equilibriumRelativeHumidityPct,
  heatOfSorption,
  type SorptionDirection,
} from '../product/equilibrium.ts'
import { moistureDbFromWbPct, moistureWbPctFromDb } from '../product/moisture-basis.ts'
import { isothermFor, type ProductProfile } from '../product/profile.ts'

function isothermBase(profile: ProductProfile, dryBulbC: number, direction: SorptionDirection) {
  const iso = isothermFor(profile, direction)
  return {
    iso,
    base: {
      productId: profile.id,
      dryBulbC,
      direction,
      model: iso.equation.model,
      source: iso.source,
      confidence: iso.confidence,
      calibratedTempC: iso.validTempC,
      calibratedRhPct: iso.validRhPct,
    },
  }
}

function outsideCalibration(iso: ReturnType<typeof isothermFor>, tC: number, rhPct: number): boolean {
  return (
    tC < iso.validTempC[0] || tC > iso.validTempC[1] || rhPct < iso.validRhPct[0] || rhPct > iso.validRhPct[1]
  )
}

/**
 * Equilibrium moisture at (T, RH) with the model, its source and whether the point lies outside the
 * isotherm's calibrated range. Throws RangeError outside the model's domain.
 */
export function equilibriumMoistureAnswer(
  profile: ProductProfile,
  dryBulbC: number,
  relativeHumidityPct: number,
  direction: SorptionDirection,
) {
  const { iso, base } = isothermBase(profile, dryBulbC, direction)
  const db = equilibriumMoistureDb(profile, dryBulbC, relativeHumidityPct, direction)
  const heat = heatOfSorption(profile, dryBulbC, db, direction)
  return {
    ...base,
    relativeHumidityPct,
    equilibriumMoistureWbPct: moistureWbPctFromDb(db),
    equilibriumMoistureDbPct: 100 * db,
    netIsostericHeatKjPerMol: heat.netKjPerMol,
    heatOfSorptionMethod: heat.method,
    extrapolated: outsideCalibration(iso, dryBulbC, relativeHumidityPct),
  }
}

/** Equilibrium RH (water activity × 100) at (T, M wet basis). Throws RangeError outside the model's domain. */
export function equilibriumHumidityAnswer(
  profile: ProductProfile,
  dryBulbC: number,
  moistureWbPct: number,
  direction: SorptionDirection,
) {
  const { iso, base } = isothermBase(profile, dryBulbC, direction)
  const db = moistureDbFromWbPct(moistureWbPct)
  const erh = equilibriumRelativeHumidityPct(profile, dryBulbC, db, direction)
  return {
    ...base,
    moistureWbPct,
    moistureDbPct: 100 * db,
    equilibriumRelativeHumidityPct: erh,
    waterActivity: erh / 100,
    extrapolated: outsideCalibration(iso, dryBulbC, erh),
  }
}

/**
 * @module report/air-json
 * The JSON shape of one air state, shared by `dryhours air --json` and GET /v1/air.
 */
import type { AirState } from '../physics/air-state.ts'

/** The keys of `dryhours air --json` and of GET /v1/air, in this order: every figure the text shows. */
export function airStateJson(s: AirState): Record<string, number | null> {
  return {
    dryBulbC: s.dryBulbC,
    wetBulbC: s.wetBulbC,
    dewPointC: s.dewPointC,
    frostPointC: s.frostPointC,
    relativeHumidityPct: s.relativeHumidityPct,
    humidityRatioGPerKg: s.humidityRatioGPerKg,
    enthalpyKjPerKg: s.enthalpyKjPerKg,
    specificVolumeM3PerKg: s.specificVolumeM3PerKg,
    densityKgPerM3: s.densityKgPerM3,
    vaporPressureKpa: s.vaporPressureKpa,
    saturationVaporPressureKpa: s.saturationVaporPressureKpa,
    pressureKpa: s.pressureKpa,
  }
}

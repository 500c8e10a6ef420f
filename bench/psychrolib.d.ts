/**
 * Types for the parts of psychrolib 1.1.1 (npm; a copy of PsychroLib 2.5.0, MIT) used by the tests and
 * the benchmark. SI mode: °C, Pa, RH as a fraction, W in kg/kg, h in J/kg, v in m³/kg. Dev only.
 */
declare module 'psychrolib' {
  interface Psychrolib {
    SI: number
    IP: number
    SetUnitSystem(units: number): void
    GetSatVapPres(tDryBulbC: number): number
    GetSatHumRatio(tDryBulbC: number, pressurePa: number): number
    GetHumRatioFromRelHum(tDryBulbC: number, relHum: number, pressurePa: number): number
    GetRelHumFromHumRatio(tDryBulbC: number, humRatio: number, pressurePa: number): number
    GetHumRatioFromTWetBulb(tDryBulbC: number, tWetBulbC: number, pressurePa: number): number
    GetTWetBulbFromHumRatio(tDryBulbC: number, humRatio: number, pressurePa: number): number
    GetTWetBulbFromRelHum(tDryBulbC: number, relHum: number, pressurePa: number): number
    GetTDewPointFromVapPres(tDryBulbC: number, vapPresPa: number): number
    GetTDewPointFromHumRatio(tDryBulbC: number, humRatio: number, pressurePa: number): number
    GetMoistAirEnthalpy(tDryBulbC: number, humRatio: number): number
    GetMoistAirVolume(tDryBulbC: number, humRatio: number, pressurePa: number): number
    GetMoistAirDensity(tDryBulbC: number, humRatio: number, pressurePa: number): number
    GetStandardAtmPressure(elevationM: number): number
    /** → [W, Twb, Tdp, pw, h, v, degree of saturation] */
    CalcPsychrometricsFromRelHum(tDryBulbC: number, relHum: number, pressurePa: number): number[]
    /** → [W, Tdp, RH, pw, h, v, degree of saturation] */
    CalcPsychrometricsFromTWetBulb(tDryBulbC: number, tWetBulbC: number, pressurePa: number): number[]
    /** → [W, Twb, RH, pw, h, v, degree of saturation] */
    CalcPsychrometricsFromTDewPoint(tDryBulbC: number, tDewPointC: number, pressurePa: number): number[]
  }
  const psychrolib: Psychrolib
  export default psychrolib
}

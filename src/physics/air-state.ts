/**
 * @module physics/air-state
 * The full moist-air state from dry bulb plus any one humidity variable, and its column form for
 * hourly series. Relative humidity, in and out, is relative to saturation over liquid water at every
 * temperature (WMO practice for weather stations); the dew point is over liquid water, and the frost
 * point (over ice) is reported separately below the triple point.
 */
import {
  checkDryBulb,
  checkPressure,
  dewPointFromVaporPressureC,
  frostPointFromVaporPressureC,
  humidityRatioFromVaporPressure,
  humidityRatioFromWetBulb,
  moistAirDensityKgPerM3,
  moistAirEnthalpyKjPerKg,
  moistAirSpecificVolumeM3PerKg,
  STANDARD_PRESSURE_KPA,
  standardPressureKpaAtElevation,
  VAPOR_PRESSURE_MIN_KPA,
  vaporPressureFromHumidityRatio,
} from './moist-air.ts'
import { saturationVaporPressureLiquidKpa, TRIPLE_POINT_C } from './saturation.ts'
import { wetBulbFromHumidityRatioC } from './wet-bulb.ts'

/** One humidity variable with the dry bulb, and pressure or elevation (sea level when neither). */
export interface AirStateInput {
  dryBulbC: number
  relativeHumidityPct?: number
  wetBulbC?: number
  dewPointC?: number
  humidityRatioGPerKg?: number
  pressureKpa?: number
  elevationM?: number
}

export interface AirState {
  dryBulbC: number
  wetBulbC: number
  /** Dew point over liquid water [°C]. */
  dewPointC: number
  /** Frost point over ice [°C] when the dew point is below the triple point, else null. */
  frostPointC: number | null
  /** Relative humidity over liquid water [%]. */
  relativeHumidityPct: number
  humidityRatioGPerKg: number
  enthalpyKjPerKg: number
  specificVolumeM3PerKg: number
  densityKgPerM3: number
  vaporPressureKpa: number
  /** Saturation vapour pressure over liquid water at the dry bulb [kPa]. */
  saturationVaporPressureKpa: number
  pressureKpa: number
}

/** Resolve the total pressure [kPa] from an explicit pressure or an elevation; sea level if neither. */
export function resolvePressureKpa(pressureKpa: number | undefined, elevationM: number | undefined): number {
  if (pressureKpa !== undefined && elevationM !== undefined) {
    throw new RangeError('give either pressure or elevation, not both')
  }
  const p =
    pressureKpa ??
    (elevationM !== undefined ? standardPressureKpaAtElevation(elevationM) : STANDARD_PRESSURE_KPA)
  checkPressure(p)
  return p
}

/**
 * The full state of moist air. Throws a RangeError naming the input and its accepted range for RH
 * outside (0, 100] %, a wet bulb or dew point above the dry bulb, pressure outside 30–110 kPa, or more
 * than one humidity variable.
 */
export function airState(input: AirStateInput): AirState {
  const { dryBulbC } = input
  checkDryBulb(dryBulbC)
  const pressureKpa = resolvePressureKpa(input.pressureKpa, input.elevationM)
  const given = [
    input.relativeHumidityPct,
    input.wetBulbC,
    input.dewPointC,
    input.humidityRatioGPerKg,
  ].filter((v) => v !== undefined).length
  if (given !== 1) {
    throw new RangeError('give exactly one of relative humidity, wet bulb, dew point or humidity ratio')
  }
  const pwsLiquidKpa = saturationVaporPressureLiquidKpa(dryBulbC)
  if (pwsLiquidKpa >= pressureKpa) {
    throw new RangeError(`dry bulb ${dryBulbC} °C is at or above the boiling point at ${pressureKpa} kPa`)
  }
  let vaporPressureKpa: number
  if (input.relativeHumidityPct !== undefined) {
    const rh = input.relativeHumidityPct
    if (!(rh > 0 && rh <= 100)) {
      throw new RangeError(`relative humidity must be greater than 0 and at most 100 %, got ${rh}`)
    }
    vaporPressureKpa = (rh / 100) * pwsLiquidKpa
  } else if (input.dewPointC !== undefined) {
    const td = input.dewPointC
    if (!(td >= -100 && td <= dryBulbC)) {
      throw new RangeError(`dew point must be between -100 °C and the dry bulb (${dryBulbC} °C), got ${td}`)
    }
    vaporPressureKpa = saturationVaporPressureLiquidKpa(td)
  } else if (input.wetBulbC !== undefined) {
    const twb = input.wetBulbC
    if (!(twb >= -100 && twb <= dryBulbC)) {
      throw new RangeError(`wet bulb must be between -100 °C and the dry bulb (${dryBulbC} °C), got ${twb}`)
    }
    const w = humidityRatioFromWetBulb(dryBulbC, twb, pressureKpa)
    if (!(w > 0)) {
      throw new RangeError(`wet bulb ${twb} °C is below the wet bulb of perfectly dry air at ${dryBulbC} °C`)
    }
    vaporPressureKpa = vaporPressureFromHumidityRatio(w, pressureKpa)
  } else {
    const wG = input.humidityRatioGPerKg as number
    const wMaxG = 1000 * humidityRatioFromVaporPressure(pwsLiquidKpa, pressureKpa)
    if (!(wG > 0 && wG <= wMaxG * (1 + 1e-9))) {
      throw new RangeError(
        `humidity ratio must be greater than 0 and at most ${wMaxG.toFixed(3)} g/kg (saturation at ${dryBulbC} °C), got ${wG}`,
      )
    }
    vaporPressureKpa = vaporPressureFromHumidityRatio(wG / 1000, pressureKpa)
  }
  if (!(vaporPressureKpa >= VAPOR_PRESSURE_MIN_KPA)) {
    const [name, value] =
      input.relativeHumidityPct !== undefined
        ? ['relative humidity', `${input.relativeHumidityPct} %`]
        : input.wetBulbC !== undefined
          ? ['wet bulb', `${input.wetBulbC} °C`]
          : ['humidity ratio', `${input.humidityRatioGPerKg} g/kg`]
    throw new RangeError(
      `${name} ${value} at ${dryBulbC} °C gives a dew point below -100 °C, outside ASHRAE HOF 2017 ch. 1 eqs 5–6`,
    )
  }
  if (vaporPressureKpa > pwsLiquidKpa * (1 + 1e-9)) {
    throw new RangeError(`the humidity given is above saturation at ${dryBulbC} °C`)
  }
  const w = humidityRatioFromVaporPressure(vaporPressureKpa, pressureKpa)
  const dewPointC = Math.min(dewPointFromVaporPressureC(vaporPressureKpa), dryBulbC)
  const frost = dewPointC < TRIPLE_POINT_C ? frostPointFromVaporPressureC(vaporPressureKpa) : null
  return {
    dryBulbC,
    wetBulbC: input.wetBulbC ?? wetBulbFromHumidityRatioC(dryBulbC, w, pressureKpa),
    dewPointC,
    frostPointC: frost,
    relativeHumidityPct: (100 * vaporPressureKpa) / pwsLiquidKpa,
    humidityRatioGPerKg: w * 1000,
    enthalpyKjPerKg: moistAirEnthalpyKjPerKg(dryBulbC, w),
    specificVolumeM3PerKg: moistAirSpecificVolumeM3PerKg(dryBulbC, w, pressureKpa),
    densityKgPerM3: moistAirDensityKgPerM3(dryBulbC, w, pressureKpa),
    vaporPressureKpa,
    saturationVaporPressureKpa: pwsLiquidKpa,
    pressureKpa,
  }
}

/**
 * @module analysis/energy/dryer-physics
 * The heat an ideal convective dryer needs per kg of water, from the psychrometric state of the outside
 * air and the drying-air temperature, with the moist-air relations of src/physics (ASHRAE Handbook —
 * Fundamentals 2017 ch. 1):
 *
 * 1. The burner heats outside air (tₐ, Wₐ) to the drying temperature t_d at constant humidity ratio:
 *    q = h(t_d, Wₐ) − h(tₐ, Wₐ) [kJ per kg dry air] (eq 30).
 * 2. The heated air takes up water adiabatically; at most until it is saturated at its thermodynamic wet
 *    bulb t* (eqs 33/35): pick-up capacity ΔW* = W_s(t*) − Wₐ [kg water per kg dry air].
 * 3. Bound water needs its heat of sorption q_s on top of the latent heat λ(t*) (FAO-56 Annex 3 eq 3-1);
 *    the air cools by the same sensible heat per kg of water taken up, so it can carry λ/(λ + q_s) of ΔW*.
 * 4. The air flow that carries the water removed is then m_w·(1 + q_s/λ)/ΔW* kg, and the ideal heat per
 *    kg of water φ = q·(1 + q_s/λ)/ΔW*: the latent and sorption heat of the water plus the sensible heat
 *    the saturated exhaust carries away (its temperature above outside) — the energy balance of an
 *    adiabatic convective dryer. The same construction (heat the outside air, follow its adiabatic cooling
 *    line to saturation for the air's potential pick-up, then allow a pick-up factor below 1) is the one of
 *    Practical Action's technical brief "How to use the DRYIT semi-continuous tray dryer", p. 21 (read in
 *    the online copy); here the pick-up factor is part of the fitted efficiency.
 *
 * A real dryer needs more: the exhaust leaves short of saturation, the heater loses flue heat, the casing
 * loses heat, the dryer mass warms up. ./physics-fit.ts fits one overall efficiency and one fixed loss per
 * batch over the baseline. Cold, humid outside air needs more heat per kg of water (more heating per kg of
 * air, less room for water); warm, dry air less. Because this form follows the physics rather than a
 * straight line fitted to the baseline's weather, it carries over to weather the baseline never saw.
 */
import { latentHeatVaporizationMjPerKg } from '../../physics/evaporation.ts'
import {
  moistAirEnthalpyKjPerKg,
  saturationHumidityRatio,
  wetBulbFromHumidityRatioC,
} from '../../physics/moist-air.ts'

export interface DryerAirState {
  /** Outside dry bulb [°C]. */
  outsideTempC: number
  /** Outside humidity ratio [kg water per kg dry air]. */
  outsideHumidityRatioKgPerKg: number
  /** Drying-air (plenum) temperature [°C]. */
  dryingTempC: number
  /** Total pressure [kPa]. */
  pressureKpa: number
  /** Net heat of sorption of the water removed, averaged per kg of water [MJ/kg]; 0 for free water. */
  sorptionHeatMjPerKgWater?: number
}

export interface IdealDryerHeat {
  /** Heating of the outside air to the drying temperature, q [kJ per kg dry air]. */
  heatingKjPerKgAir: number
  /** Thermodynamic wet bulb of the heated air, t* [°C]. */
  heatedWetBulbC: number
  /** Water one kg of heated air can take up until saturated, ΔW* [kg/kg]. */
  pickupCapacityKgPerKgAir: number
  /** Dry air that carries one kg of water [kg]. */
  airPerKgWaterKg: number
  /** Ideal heat per kg of water removed, φ [MJ/kg]. */
  idealHeatMjPerKgWater: number
}

/**
 * Ideal heat per kg of water for one batch's air. Example (checked in test/analysis/energy/dryer-physics.test.ts):
 * outside 15 °C with W = 9 g/kg, drying at 60 °C, 101.325 kPa, free water → q = 46.0 kJ/kg, t* ≈ 27.1 °C,
 * ΔW* ≈ 13.8 g/kg, φ ≈ 3.33 MJ per kg water. Throws RangeError when the drying air is not warmer than the outside air or the
 * state is outside the moist-air relations' range.
 */
export function idealDryerHeat(s: DryerAirState): IdealDryerHeat {
  const { outsideTempC, outsideHumidityRatioKgPerKg: wa, dryingTempC, pressureKpa } = s
  if (!(dryingTempC > outsideTempC)) {
    throw new RangeError(
      `drying air (${dryingTempC} °C) must be warmer than the outside air (${outsideTempC} °C) for the physics model`,
    )
  }
  if (!(wa >= 0)) throw new RangeError(`outside humidity ratio must be ≥ 0, got ${wa}`)
  const qs = s.sorptionHeatMjPerKgWater ?? 0
  if (!(qs >= 0)) throw new RangeError(`sorption heat must be ≥ 0 MJ/kg, got ${qs}`)
  const heating = moistAirEnthalpyKjPerKg(dryingTempC, wa) - moistAirEnthalpyKjPerKg(outsideTempC, wa)
  const wetBulb = wetBulbFromHumidityRatioC(dryingTempC, wa, pressureKpa)
  const capacity = saturationHumidityRatio(wetBulb, pressureKpa) - wa
  if (!(capacity > 0)) {
    throw new RangeError(`the heated air (${dryingTempC} °C) has no room for water at this humidity`)
  }
  const air = (1 + qs / latentHeatVaporizationMjPerKg(wetBulb)) / capacity
  return {
    heatingKjPerKgAir: heating,
    heatedWetBulbC: wetBulb,
    pickupCapacityKgPerKgAir: capacity,
    airPerKgWaterKg: air,
    idealHeatMjPerKgWater: (heating * air) / 1000,
  }
}

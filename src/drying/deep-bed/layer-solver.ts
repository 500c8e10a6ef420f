/**
 * @module drying/deep-bed/layer-solver
 * One layer's balance for one sub-step, solved fast: the kernel of `simulateDeepBed` (bin-run.ts). The model is
 * that of `layer-model.ts` (air leaves the layer in equilibrium with the grain; water and enthalpy conserved); the
 * moist-air relations are the physics layer's (ASHRAE HOF 2017 ch. 1 eq 20 and eq 30 with their named
 * coefficients, saturation over liquid water from the Hyland–Wexler table of `physics/saturation-table.ts`); the
 * grain's ERH and sorption heat come from its tables (`grain-tables.ts`, errors stated there).
 *
 * Inside `solve` the enthalpy (eq 30) and the vapour pressure (eq 20) are written out with the physics layer's
 * coefficients rather than called: the balance needs their derivatives in m1 anyway, and each call there used up
 * the compiler's inlining budget for the loop, which then called the saturation read instead of inlining it
 * (about 5 % slower, measured with the bench's A/B run).
 */
import {
  CP_DRY_AIR_KJ_PER_KG_K,
  CP_LIQUID_WATER_KJ_PER_KG_K,
  CP_WATER_VAPOR_KJ_PER_KG_K,
  humidityRatioFromVaporPressure,
  MOLAR_MASS_RATIO_WATER_AIR,
  moistAirHeatCapacityKjPerKgK,
  VAPOR_ENTHALPY_0C_KJ_PER_KG,
  vaporPressureFromHumidityRatio,
} from '../../physics/moist-air.ts'
import { liquidSaturationPressureFromTableKpa } from '../../physics/saturation-table.ts'
import type { GrainTables } from './grain-tables.ts'
import type { DeepBedGrain } from './layer-model.ts'

/** Ratio of molar masses of water and dry air (eq 20), for the slope of the exit RH. */
const EPS = MOLAR_MASS_RATIO_WATER_AIR
/** Smallest moisture a layer is taken to [kg/kg db] (as in the reference). */
const M_FLOOR_DB = 0.005
/**
 * The solver stops when Newton's next step is shorter than {@link NEWTON_STEP_TOL} [kg/kg db] (it takes that
 * step; the error left is about (g''/2g')·δ², below 1e-10 here), when the imbalance is below
 * {@link SOLVER_F_TOL} [% RH], or when the bracket is narrower than {@link SOLVER_X_TOL}: all below the
 * reference's bisection tolerance (1e-7).
 */
const NEWTON_STEP_TOL = 1e-6
const SOLVER_X_TOL = 1e-10
const SOLVER_F_TOL = 1e-9

/** Scratch for the derivatives of saturation pressure: [dpws/dT kPa/K, d²pws/dT² kPa/K²] of the last call. */
const PWS_SLOPES = new Float64Array(2)

/** Saturation pressure over liquid water [kPa] from the physics table (error below 1e-9 relative). */
function liquidPwsKpa(tC: number): number {
  return liquidSaturationPressureFromTableKpa(tC, PWS_SLOPES)
}

/** RH [%] over liquid water of air at tC with humidity ratio w, pressure p [kPa] (eq 20 inverted over pws). */
export function tableRhPct(tC: number, w: number, p: number): number {
  return (100 * vaporPressureFromHumidityRatio(w, p)) / liquidPwsKpa(tC)
}

/** Humidity ratio [kg/kg] of air at tC with RH rhPct [%] over liquid water, pressure p [kPa] (eq 20). */
export function tableHumidityRatio(tC: number, rhPct: number, p: number): number {
  return humidityRatioFromVaporPressure((liquidPwsKpa(tC) * rhPct) / 100, p)
}

/**
 * One layer's balance for one sub-step, as a function of the layer's new moisture m1: the air (dry mass ma,
 * entering at airT, airW) leaves in equilibrium with the grain (dry mass md, at m0, tg). Water and enthalpy
 * are conserved (see `layer-model.ts`); the exit state is linear (humidity) and linear-fractional (temperature)
 * in m1, and the imbalance g(m1) = exit RH − grain ERH at the exit temperature [% RH] falls with m1.
 *
 * For speed the per-hour constants are fields and the layer state is read from and written to typed arrays, so
 * no number crosses a call boundary boxed in the loop over layers.
 */
export class LayerSolver {
  private readonly e = new Float64Array(2)
  /** dpws/dT and d²pws/dT² of the last saturation read. */
  private readonly s = new Float64Array(2)
  private readonly md: number
  private readonly mdCd: number
  private readonly mdCw: number
  private readonly cd: number
  // the ERH table, for reading it inline
  private readonly erhValues: Float64Array
  private readonly nM: number
  private readonly tMin: number
  private readonly mMin: number
  private readonly invDt: number
  private readonly invDm: number
  private readonly tSpan: number
  private readonly mSpan: number
  // per hour
  private p = 0
  private ma = 0
  private r = 0
  private dtH = 0

  constructor(
    private readonly tables: GrainTables,
    private readonly grain: DeepBedGrain,
    dryMatterPerLayerKgPerM2: number,
  ) {
    this.cd = grain.dryMatterCpKjPerKgK
    this.md = dryMatterPerLayerKgPerM2
    this.mdCd = this.md * this.cd
    this.mdCw = this.md * CP_LIQUID_WATER_KJ_PER_KG_K
    const t = tables.erh
    this.erhValues = t.values
    this.nM = t.nM
    this.tMin = t.tMin
    this.mMin = t.mMin
    this.invDt = t.invDt
    this.invDm = t.invDm
    this.tSpan = t.tSpan
    this.mSpan = t.mSpan
  }

  /** Sets the hour's pressure [kPa], dry air per sub-step [kg/m²] and sub-step [h]. */
  startHour(p: number, maPerSubstep: number, dtH: number): void {
    this.p = p
    this.ma = maPerSubstep
    this.r = this.md / maPerSubstep
    this.dtH = dtH
  }

  /** The layer's new moisture no lower than a thin layer in the entering air reaches (when the grain has a rate). */
  private thinLayerLimit(m0: number, m1: number, airT: number, airW: number): number {
    const rhIn = tableRhPct(airT, airW, this.p)
    const mRate = (this.grain.thinLayerStep as NonNullable<DeepBedGrain['thinLayerStep']>).call(
      this.grain,
      m0,
      airT,
      Math.min(rhIn, 99.5),
      this.dtH,
    )
    return mRate > m1 ? Math.min(mRate, m0) : m1
  }

  /**
   * Solves layer `i` for one sub-step with the air in `air` ([°C, kg/kg] entering): updates moisture[i] and
   * temp[i] and leaves the exit air in `air`. Newton's method on g(m1) from the layer's moisture, kept inside
   * the bracket the signs of g give (bisection when a step leaves it).
   *
   * Written as one function, the evaluation of g and its slope and the table reads inline: numbers passed to or
   * returned from a call the compiler does not inline are boxed, and this runs some ten million times per
   * assessment.
   */
  solve(i: number, moisture: Float64Array, temp: Float64Array, air: Float64Array): void {
    const airT = air[0]
    const airW = air[1]
    const m0 = moisture[i]
    const tg = temp[i]
    const { md, ma, r, p, mdCd, mdCw, erhValues: values, nM } = this
    const eIn =
      ma *
        (CP_DRY_AIR_KJ_PER_KG_K * airT +
          airW * (VAPOR_ENTHALPY_0C_KJ_PER_KG + CP_WATER_VAPOR_KJ_PER_KG_K * airT)) +
      md * (this.cd + CP_LIQUID_WATER_KJ_PER_KG_K * m0) * tg
    const mdq = md * this.tables.netSorptionHeatKjPerKg(tg, m0)
    // d(numerator)/dm1 and d(denominator)/dm1 of the exit temperature t1 = num/den
    const dNum = mdq + md * VAPOR_ENTHALPY_0C_KJ_PER_KG
    const dDen = md * (CP_LIQUID_WATER_KJ_PER_KG_K - CP_WATER_VAPOR_KJ_PER_KG_K)
    // bracket [a, b] with g(a) > 0 > g(b), set after the first evaluation; an end not yet evaluated has g = NaN
    let a = m0
    let b = m0
    let ga = Number.NaN
    let gb = Number.NaN
    let g0 = 0
    let x = m0
    let next = m0
    let w1 = airW
    let t1 = tg
    let taken = false
    for (let it = 0; it < 100; it++) {
      // g(next) = exit RH − grain ERH at the exit temperature, and dg/dm1
      const dm = m0 - next
      w1 = airW + r * dm
      const den = ma * (CP_DRY_AIR_KJ_PER_KG_K + CP_WATER_VAPOR_KJ_PER_KG_K * w1) + mdCd + mdCw * next
      t1 = (eIn - mdq * dm - ma * w1 * VAPOR_ENTHALPY_0C_KJ_PER_KG) / den
      const dT = (dNum - t1 * dDen) / den
      const pws = liquidSaturationPressureFromTableKpa(t1, this.s)
      const dPws = this.s[0] // dpws/dT of that call
      const rh = (100 * ((p * w1) / (EPS + w1))) / pws
      const dRh = ((100 * p * EPS) / ((EPS + w1) * (EPS + w1) * pws)) * -r - ((rh * dPws) / pws) * dT
      let erh: number
      let erhDt: number
      let erhDm: number
      const sT = (t1 - this.tMin) * this.invDt
      const sM = (next - this.mMin) * this.invDm
      if (sT >= 0 && sT < this.tSpan && sM >= 0 && sM < this.mSpan) {
        const ci = sT | 0
        const cj = sM | 0
        const u = sT - ci
        const v = sM - cj
        const k = ci * nM + cj
        const k2 = k + nM
        const dLo = values[k + 1] - values[k]
        const dHi = values[k2 + 1] - values[k2]
        const lo = values[k] + v * dLo
        const hi = values[k2] + v * dHi
        erh = lo + u * (hi - lo)
        erhDt = (hi - lo) * this.invDt
        erhDm = (dLo + u * (dHi - dLo)) * this.invDm
      } else {
        erh = this.tables.erhPctWithSlopes(t1, next, this.e)
        erhDt = this.e[0]
        erhDm = this.e[1]
      }
      const g = rh - erh
      const slope = dRh - (erhDt * dT + erhDm)
      x = next
      if (it === 0) {
        g0 = g
        if (Math.abs(g) <= SOLVER_F_TOL) break
        if (g < 0) {
          // drying; the air can take up at most what saturation at the warmer of air and grain allows
          const pwsMax = liquidSaturationPressureFromTableKpa(Math.max(airT, tg), this.s)
          const wSat = pwsMax < p ? humidityRatioFromVaporPressure(pwsMax, p) : airW + 1
          a = Math.max(M_FLOOR_DB, m0 - Math.max(1e-6, wSat - airW) / r)
          gb = g
        } else {
          // wetting: the air cannot give more water than it carries
          b = m0 + (airW / r) * 0.999999
          ga = g
        }
      } else {
        if (g > 0) {
          a = x
          ga = g
        } else {
          b = x
          gb = g
        }
        // converged, or pinned at an end of the bracket (the air's capacity: a = b)
        if (Math.abs(g) < SOLVER_F_TOL || b - a < SOLVER_X_TOL) break
      }
      next = slope < 0 ? x - g / slope : Number.NaN
      const inside = next > a && next < b
      if (inside && Math.abs(next - x) < NEWTON_STEP_TOL) {
        // Newton's next step is tiny: take it without reading the isotherm there
        x = next
        taken = true
        break
      }
      if (!inside) {
        // the Newton step leaves the bracket: try an unevaluated end first, else bisect
        if (Number.isNaN(ga)) next = a
        else if (Number.isNaN(gb)) next = b
        else next = 0.5 * (a + b)
      }
    }
    const m1 = g0 < 0 && this.grain.thinLayerStep ? this.thinLayerLimit(m0, x, airT, airW) : x
    if (taken || m1 !== x) {
      // exit state at m1 (linear in the humidity, linear-fractional in the temperature)
      const dm = m0 - m1
      w1 = airW + r * dm
      t1 =
        (eIn - mdq * dm - ma * w1 * VAPOR_ENTHALPY_0C_KJ_PER_KG) /
        (ma * moistAirHeatCapacityKjPerKgK(w1) + mdCd + mdCw * m1)
    }
    moisture[i] = m1
    temp[i] = t1
    air[0] = t1
    air[1] = w1
  }
}

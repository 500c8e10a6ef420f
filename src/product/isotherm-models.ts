/**
 * @module product/isotherm-models
 * Sorption isotherms in both directions: equilibrium moisture content (EMC) at (T, RH) and equilibrium
 * relative humidity (ERH, = 100 × water activity) at (T, M). Moisture is dry basis [kg water/kg dry matter]
 * at this interface; the ASABE D245 forms are written, as in the standard, with Me in % dry basis.
 *
 * Forms (ASAE D245.5 (1995), *Moisture relationships of plant-based agricultural products*, and
 * D245.6 (2007); the forms are from memory, the standard's text was not read; T in °C, RH a fraction):
 * - modified Henderson:     RH = 1 − exp[−A(T + C)·Me^B]
 * - modified Chung–Pfost:   RH = exp[−A/(T + C)·exp(−B·Me)]
 * - modified Halsey:        RH = exp[−exp(A + B·T)/Me^C]
 * - modified Oswin:         Me = (A + B·T)·[RH/(1 − RH)]^(1/C)
 * - GAB (Guggenheim–Anderson–de Boer): X = Xm·C·K·aw/[(1 − K·aw)(1 − K·aw + C·K·aw)], X in kg/kg db,
 *   with the temperature dependence of Kiranoudis et al. 1993 (*J. Food Eng.* 20:55):
 *   Xm = Xm0·exp(Hx/RT), C = C0·exp(Hc/RT), K = K0·exp(Hk/RT), T in K (all H = 0: no T dependence).
 * Outside a model's domain the functions throw RangeError; they never return NaN.
 */

/** Molar gas constant [J/(mol·K)] (CODATA 2018, 8.314462618). */
export const GAS_CONSTANT_J_PER_MOL_K = 8.314462618
const KELVIN = 273.15

export type IsothermEquation =
  | { model: 'modified-henderson'; a: number; b: number; c: number }
  | { model: 'modified-chung-pfost'; a: number; b: number; c: number }
  | { model: 'modified-halsey'; a: number; b: number; c: number }
  | { model: 'modified-oswin'; a: number; b: number; c: number }
  | {
      model: 'gab'
      /** Monolayer moisture [kg/kg db] (at every T when hxJPerMol = 0). */
      xm0: number
      c0: number
      k0: number
      hxJPerMol: number
      hcJPerMol: number
      hkJPerMol: number
    }

export type IsothermModelName = IsothermEquation['model']

export const ISOTHERM_MODEL_NAMES: readonly IsothermModelName[] = [
  'modified-henderson',
  'modified-chung-pfost',
  'modified-halsey',
  'modified-oswin',
  'gab',
]

/** Accepted air temperature for every isotherm [°C]; a model's calibrated range is narrower. */
export const ISOTHERM_T_MIN_C = -20
export const ISOTHERM_T_MAX_C = 100

function checkT(tC: number): void {
  if (!(tC >= ISOTHERM_T_MIN_C && tC <= ISOTHERM_T_MAX_C)) {
    throw new RangeError(
      `temperature must be between ${ISOTHERM_T_MIN_C} and ${ISOTHERM_T_MAX_C} °C for an isotherm, got ${tC}`,
    )
  }
}

function checkRh(rhPct: number): number {
  if (!(rhPct > 0 && rhPct < 100)) {
    throw new RangeError(
      `relative humidity must be above 0 % and below 100 % for an equilibrium moisture, got ${rhPct} (at 100 % no equilibrium exists: the product wets)`,
    )
  }
  return rhPct / 100
}

/** GAB constants at temperature tC. */
export function gabConstantsAt(
  eq: Extract<IsothermEquation, { model: 'gab' }>,
  tC: number,
): { xm: number; c: number; k: number } {
  const rt = GAS_CONSTANT_J_PER_MOL_K * (tC + KELVIN)
  return {
    xm: eq.xm0 * Math.exp(eq.hxJPerMol / rt),
    c: eq.c0 * Math.exp(eq.hcJPerMol / rt),
    k: eq.k0 * Math.exp(eq.hkJPerMol / rt),
  }
}

/** Equilibrium moisture content [kg/kg db] at air temperature tC [°C] and RH rhPct [%], by `eq`. */
export function emcDb(eq: IsothermEquation, tC: number, rhPct: number): number {
  checkT(tC)
  const rh = checkRh(rhPct)
  let mePct: number
  switch (eq.model) {
    case 'modified-henderson': {
      const tc = eq.a * (tC + eq.c)
      if (!(tc > 0))
        throw new RangeError(`modified Henderson: T + C must be > 0, got T = ${tC} °C, C = ${eq.c}`)
      mePct = (-Math.log(1 - rh) / tc) ** (1 / eq.b)
      break
    }
    case 'modified-chung-pfost': {
      const tc = tC + eq.c
      if (!(tc > 0))
        throw new RangeError(`modified Chung–Pfost: T + C must be > 0, got T = ${tC} °C, C = ${eq.c}`)
      const arg = (-tc * Math.log(rh)) / eq.a
      mePct = -Math.log(arg) / eq.b
      if (!(mePct > 0)) {
        const rhMin = 100 * Math.exp(-eq.a / tc)
        throw new RangeError(
          `modified Chung–Pfost gives no positive moisture at RH ${rhPct} % and ${tC} °C (valid above RH ${rhMin.toFixed(1)} %)`,
        )
      }
      break
    }
    case 'modified-halsey':
      mePct = (-Math.exp(eq.a + eq.b * tC) / Math.log(rh)) ** (1 / eq.c)
      break
    case 'modified-oswin': {
      const ab = eq.a + eq.b * tC
      if (!(ab > 0)) throw new RangeError(`modified Oswin: A + B·T must be > 0, got ${ab} at ${tC} °C`)
      mePct = ab * (rh / (1 - rh)) ** (1 / eq.c)
      break
    }
    case 'gab': {
      const { xm, c, k } = gabConstantsAt(eq, tC)
      const y = k * rh
      if (!(y < 1)) {
        throw new RangeError(
          `GAB: K·aw must be < 1, got ${y.toFixed(4)} at RH ${rhPct} % (the isotherm diverges there)`,
        )
      }
      return (xm * c * y) / ((1 - y) * (1 - y + c * y))
    }
  }
  return mePct / 100
}

/**
 * Equilibrium relative humidity [%] (= 100·aw) of a product at moisture `moistureDb` [kg/kg db] and tC [°C].
 * Returns 100 when the moisture is at or above what the model holds at saturation (free water; GAB with K < 1).
 */
export function erhPct(eq: IsothermEquation, tC: number, moistureDb: number): number {
  checkT(tC)
  if (!(moistureDb > 0 && Number.isFinite(moistureDb))) {
    throw new RangeError(
      `moisture must be a finite number > 0 kg/kg db for an equilibrium RH, got ${moistureDb}`,
    )
  }
  const mPct = 100 * moistureDb
  let rh: number
  switch (eq.model) {
    case 'modified-henderson': {
      const tc = eq.a * (tC + eq.c)
      if (!(tc > 0))
        throw new RangeError(`modified Henderson: T + C must be > 0, got T = ${tC} °C, C = ${eq.c}`)
      rh = 1 - Math.exp(-tc * mPct ** eq.b)
      break
    }
    case 'modified-chung-pfost': {
      const tc = tC + eq.c
      if (!(tc > 0))
        throw new RangeError(`modified Chung–Pfost: T + C must be > 0, got T = ${tC} °C, C = ${eq.c}`)
      rh = Math.exp((-eq.a / tc) * Math.exp(-eq.b * mPct))
      break
    }
    case 'modified-halsey':
      rh = Math.exp(-Math.exp(eq.a + eq.b * tC) / mPct ** eq.c)
      break
    case 'modified-oswin': {
      const ab = eq.a + eq.b * tC
      if (!(ab > 0)) throw new RangeError(`modified Oswin: A + B·T must be > 0, got ${ab} at ${tC} °C`)
      const r = (mPct / ab) ** eq.c
      rh = r / (1 + r)
      break
    }
    case 'gab':
      rh = gabWaterActivity(eq, tC, moistureDb)
      break
  }
  return Math.min(100, 100 * rh)
}

/** GAB inverted for aw: the root in (0, 1/K) of M(C−1)y² + (Xm·C − M(C−2))y − M = 0 with y = K·aw. */
function gabWaterActivity(eq: Extract<IsothermEquation, { model: 'gab' }>, tC: number, m: number): number {
  const { xm, c, k } = gabConstantsAt(eq, tC)
  const qa = m * (c - 1)
  const qb = xm * c - m * (c - 2)
  const qc = -m
  let y: number
  if (Math.abs(qa) < 1e-12 * Math.max(1, Math.abs(qb))) {
    y = -qc / qb
  } else {
    const disc = qb * qb - 4 * qa * qc
    // Numerically stable root of the quadratic (Press et al. 2007, Numerical Recipes 3rd ed. §5.6).
    const q = -0.5 * (qb + Math.sign(qb || 1) * Math.sqrt(Math.max(0, disc)))
    const r1 = q / qa
    const r2 = qc / q
    const inRange = [r1, r2].filter((r) => r > 0 && r < 1)
    y = inRange.length > 0 ? Math.min(...inRange) : 1
  }
  return Math.min(1, y / k)
}

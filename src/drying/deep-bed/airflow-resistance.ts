/**
 * @module drying/deep-bed/airflow-resistance
 * Static pressure of air forced through a bed of grain, and the fan power and heat it takes.
 *
 * Pressure drop per metre of bed: the Hukill & Ives (1955) form fitted to Shedd's data, as in ASAE D272
 * ("Resistance to airflow of grains, seeds, other agricultural products, and perforated metal sheets"):
 *   ΔP/L = a·Q² / ln(1 + b·Q),  ΔP/L in Pa/m, Q the superficial airflow in m³/(s·m²).
 * D272 notes (read in ASAE D272.3 MAR96, the note under its chart of empirical curves): the curves are for loose
 * fill of clean, relatively dry grain; packing of the grain in a bin may cause 50 % higher resistance; for a loose
 * fill of clean grain in equilibrium with relative humidities above 85 %, use 80 % of the pressure drop.
 *
 * The constants a, b per grain are as recalled from D272's table (from memory: the copy of D272.3 that could be
 * read shows its first page only, not the table; no transcription was found). Grades, per entry:
 * - shelled corn: memory, but checked against two published tables that it reproduces within their rounding with
 *   the packing factor 1.5 (tests in `test/drying/deep-bed/`): the static pressure of a 27 ft bin at four depths
 *   (Dorn, University of Nebraska CropWatch, 12 Sept 2008, Table 1, from the University of Minnesota FANS
 *   program) and the expected static pressure at 8–20 ft and 0.5–2 cfm/bu (Dorn, CropWatch, 3 Oct 2008,
 *   "Selecting the right aeration fan for your bin", Table 1);
 * - wheat, rough rice, soybean, sorghum, barley: memory, unchecked.
 */

/** Hukill–Ives constants: a [Pa·s²/m³], b [m²·s/m³]. */
export interface AirflowResistanceConstants {
  a: number
  b: number
  source: string
}

const D272_MEMORY =
  'ASAE D272 table of Hukill–Ives constants for Shedd’s data (from memory; the table was not read; unchecked)'

export const AIRFLOW_RESISTANCE: Readonly<Record<string, AirflowResistanceConstants>> = {
  'shelled-corn': {
    a: 2.07e4,
    b: 30.4,
    source:
      'ASAE D272 table of Hukill–Ives constants for Shedd’s data (from memory; the table was not read); with packing 1.5 reproduces the static pressures tabulated by University of Nebraska CropWatch (Dorn 2008, two tables) within their rounding',
  },
  wheat: { a: 2.7e4, b: 8.77, source: D272_MEMORY },
  'rough-rice': { a: 2.57e4, b: 13.2, source: D272_MEMORY },
  soybean: { a: 1.02e4, b: 16.0, source: D272_MEMORY },
  sorghum: { a: 2.12e4, b: 8.06, source: D272_MEMORY },
  barley: { a: 2.14e4, b: 13.2, source: D272_MEMORY },
}

/** Packing in a bin: up to 50 % more resistance than loose fill (ASAE D272.3 note). */
export const BIN_PACKING_FACTOR = 1.5
/** Clean grain wetter than equilibrium with 85 % RH: 80 % of the loose-fill value (ASAE D272.3 note). */
export const WET_GRAIN_FACTOR = 0.8

/** Pressure drop per metre of bed [Pa/m] at superficial airflow q [m³/(s·m²)], loose fill. */
export function pressureGradientPaPerM(constants: AirflowResistanceConstants, qM3PerSM2: number): number {
  if (!(qM3PerSM2 > 0 && qM3PerSM2 < 2)) {
    throw new RangeError(`superficial airflow must be between 0 and 2 m³/(s·m²), got ${qM3PerSM2}`)
  }
  return (constants.a * qM3PerSM2 * qM3PerSM2) / Math.log(1 + constants.b * qM3PerSM2)
}

/** Static pressure across a bed of depth [m] [Pa], with a packing or moisture factor (default packed bin). */
export function bedPressureDropPa(
  constants: AirflowResistanceConstants,
  qM3PerSM2: number,
  depthM: number,
  factor = BIN_PACKING_FACTOR,
): number {
  if (!(depthM > 0 && depthM <= 60))
    throw new RangeError(`bed depth must be between 0 and 60 m, got ${depthM}`)
  if (!(factor > 0 && factor <= 3)) throw new RangeError(`resistance factor must be in (0, 3], got ${factor}`)
  return factor * pressureGradientPaPerM(constants, qM3PerSM2) * depthM
}

/**
 * Default total efficiency of fan and motor (air power Q·ΔP over electrical power): 0.5. Common practice, no
 * source: no published typical value was found in the extension fan guides that could be read. Consistent with
 * North Dakota State University's statement that bin fans warm the air 3–5 °F at 4–6 in of static pressure
 * (Hellevang, NDSU Extension, 2010), which implies 0.45–0.5 when all fan and motor power ends up in the air
 * (checked in the tests), and the same default as a public bin-aeration simulation code (fan efficiency 50 %).
 * A measured fan (from its rating curve: air power at the operating point over motor input) should replace it.
 */
export const DEFAULT_FAN_EFFICIENCY = 0.5

/** Electrical power [W] a fan draws to move flow [m³/s] against static pressure [Pa] at total efficiency η. */
export function fanPowerW(flowM3PerS: number, staticPressurePa: number, efficiency: number): number {
  if (!(efficiency > 0 && efficiency <= 1))
    throw new RangeError(`fan efficiency must be in (0, 1], got ${efficiency}`)
  return (flowM3PerS * staticPressurePa) / efficiency
}

/**
 * Temperature rise of the air [K] when the whole electrical power of fan and motor ends up in the airstream
 * (motor in the duct): ΔT = ΔP/(ρ·c_p·η). ρ·c_p of the air [J/(m³·K)] from the caller.
 */
export function fanHeatRiseK(staticPressurePa: number, efficiency: number, rhoCpJPerM3K: number): number {
  return staticPressurePa / (efficiency * rhoCpJPerM3K)
}

/** US bushel [m³]: the Winchester bushel, 2150.42 in³ (a defined unit). */
export const BUSHEL_M3 = 2150.42 * 0.0254 ** 3
/**
 * Standard weights per bushel [kg]: corn and sorghum 56 lb, wheat and soybean 60 lb, rough rice 45 lb, barley
 * 48 lb: USDA's official weights per bushel, as given in Wikipedia, "Test weight" (read; it cites the official US
 * grain standards) (`transcribed`); the same numbers in University of Missouri Extension G4020 (Murphy, "Tables
 * for weights and measurement: crops"), as quoted. Used as the bulk density of grain in the bin (bushel weight /
 * bushel volume): real test weight differs with variety, moisture and fines.
 */
export const BUSHEL_WEIGHT_KG: Readonly<Record<string, number>> = {
  'shelled-corn': 56 * 0.45359237,
  sorghum: 56 * 0.45359237,
  wheat: 60 * 0.45359237,
  soybean: 60 * 0.45359237,
  'rough-rice': 45 * 0.45359237,
  barley: 48 * 0.45359237,
}

/** Airflow per tonne [m³/min per t] from cfm per bushel, for a grain of given bushel weight [kg]. */
export function m3PerMinPerTonneFromCfmPerBu(cfmPerBu: number, bushelKg: number): number {
  return (cfmPerBu * 0.3048 ** 3 * 1000) / bushelKg
}

/**
 * Pascals per inch of water, the unit of static pressure in US bin practice: inch of water (39.2 °F) =
 * 2.49082 × 10² Pa (NIST SP 811, 2008, Appendix B.8; as transcribed in the SysML v2 SI/ISQ units library).
 */
export const PA_PER_INCH_OF_WATER = 249.082

/**
 * @module physics/constants
 * Physical constants and unit definitions used across the core, each defined once here with its source.
 * Constants that belong to one published relation (the ASHRAE moist-air coefficients, FAO-56's rounded
 * forms) live beside that relation instead.
 */

/** Offset between °C and K [K]: definition of the Celsius scale (BIPM, *The International System of Units*, 9th ed. 2019, §2.3.1). */
export const KELVIN_OFFSET = 273.15

/** Molar gas constant R [J mol⁻¹ K⁻¹]: CODATA 2018 recommended value (Tiesinga et al. 2021, Rev. Mod. Phys. 93:025010; exact since the 2019 SI). */
export const GAS_CONSTANT_J_PER_MOL_K = 8.314462618

/** Molar mass of water [kg/mol], 18.015268 g/mol: IAPWS-95 (Wagner & Pruss 2002, J. Phys. Chem. Ref. Data 31:387, Table 6.1). */
export const MOLAR_MASS_WATER_KG_PER_MOL = 0.018015268

/** Specific gas constant of water vapour R/M_w [J kg⁻¹ K⁻¹] ≈ 461.52, from the two constants above. */
export const GAS_CONSTANT_WATER_VAPOR_J_PER_KG_K = GAS_CONSTANT_J_PER_MOL_K / MOLAR_MASS_WATER_KG_PER_MOL

/** Stefan–Boltzmann constant σ [W m⁻² K⁻⁴]: CODATA 2018 (exact since the 2019 SI). */
export const STEFAN_BOLTZMANN_WM2K4 = 5.670374419e-8

/** Hours per day. Definition. */
export const HOURS_PER_DAY = 24
/** Seconds per hour. Definition. */
export const S_PER_HOUR = 3600
/** Seconds per day. Definition. */
export const S_PER_DAY = 86_400
/** Milliseconds per minute (UTC time stamps are in ms). Definition. */
export const MS_PER_MINUTE = 60_000
/** Milliseconds per hour. Definition. */
export const MS_PER_HOUR = 3_600_000
/** Milliseconds per day. Definition. */
export const MS_PER_DAY = 86_400_000

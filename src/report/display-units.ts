/**
 * @module report/display-units
 * SI (default) or US customary display of report quantities. A display choice only: the assessment stays
 * SI, and every conversion happens here, at the edge, on the way to the page. Conversion factors are exact
 * definitions from NIST SP 811 (2008), *Guide for the Use of the International System of Units*, appendix B.
 */

export type UnitSystem = 'si' | 'us'

/** 1 lb = 0.45359237 kg (NIST SP 811 B.8, exact). */
export const POUND_KG = 0.45359237
/** 1 US gallon = 3.785411784 L (NIST SP 811 B.8, exact). */
export const US_GALLON_L = 3.785411784
/** 1 ft³ = 0.028316846592 m³ (NIST SP 811 B.8, exact). */
export const CUBIC_FOOT_M3 = 0.028316846592
/** 1 ft² = 0.09290304 m² (NIST SP 811 B.8, exact). */
export const SQUARE_FOOT_M2 = 0.09290304
/** 1 short ton = 2000 lb = 907.18474 kg (NIST SP 811 B.8, exact). */
export const SHORT_TON_KG = 907.18474
/** 1 lb = 7000 grains (NIST SP 811 B.8), so 1 g/kg = 7 gr/lb. */
export const GRAINS_PER_POUND = 7000

export interface Quantity {
  value: number
  unit: string
}

/** Converters from the SI value of each report quantity to the chosen system. */
export interface UnitFormatter {
  system: UnitSystem
  temperature(c: number): Quantity
  temperatureUnit: string
  humidityRatio(gPerKg: number): Quantity
  humidityRatioUnit: string
  /** Energy per mass of fresh product: kWh/t → kWh per short ton in US units. */
  energyPerMass(kwhPerTonne: number): Quantity
  energyPerMassUnit: string
  mass(kg: number): Quantity
  /** A fuel quantity in its sale unit: L → US gal, m³ → ft³, kg → lb, kWh stays kWh. */
  fuel(value: number, siUnit: string): Quantity
  /** Price per fuel sale unit: the inverse conversion. */
  pricePerFuelUnit(pricePerSiUnit: number, siUnit: string): Quantity
}

function fuelFactor(siUnit: string): { factor: number; unit: string } {
  switch (siUnit) {
    case 'L':
      return { factor: 1 / US_GALLON_L, unit: 'gal' }
    case 'm³':
    case 'm3':
      return { factor: 1 / CUBIC_FOOT_M3, unit: 'ft³' }
    case 'kg':
      return { factor: 1 / POUND_KG, unit: 'lb' }
    default:
      return { factor: 1, unit: siUnit }
  }
}

const SI: UnitFormatter = {
  system: 'si',
  temperature: (c) => ({ value: c, unit: '°C' }),
  temperatureUnit: '°C',
  humidityRatio: (g) => ({ value: g, unit: 'g/kg' }),
  humidityRatioUnit: 'g/kg',
  energyPerMass: (v) => ({ value: v, unit: 'kWh/t' }),
  energyPerMassUnit: 'kWh/t',
  mass: (kg) => ({ value: kg, unit: 'kg' }),
  fuel: (value, unit) => ({ value, unit }),
  pricePerFuelUnit: (price, unit) => ({ value: price, unit: `per ${unit}` }),
}

const US: UnitFormatter = {
  system: 'us',
  temperature: (c) => ({ value: (c * 9) / 5 + 32, unit: '°F' }),
  temperatureUnit: '°F',
  humidityRatio: (g) => ({ value: (g * GRAINS_PER_POUND) / 1000, unit: 'gr/lb' }),
  humidityRatioUnit: 'gr/lb',
  energyPerMass: (v) => ({ value: (v * SHORT_TON_KG) / 1000, unit: 'kWh/ton' }),
  energyPerMassUnit: 'kWh/ton',
  mass: (kg) => ({ value: kg / POUND_KG, unit: 'lb' }),
  fuel: (value, unit) => {
    const f = fuelFactor(unit)
    return { value: value * f.factor, unit: f.unit }
  },
  pricePerFuelUnit: (price, unit) => {
    const f = fuelFactor(unit)
    return { value: price / f.factor, unit: `per ${f.unit}` }
  },
}

export function unitFormatter(system: UnitSystem): UnitFormatter {
  if (system !== 'si' && system !== 'us') {
    throw new RangeError(`units must be "si" or "us", got ${JSON.stringify(system)}`)
  }
  return system === 'si' ? SI : US
}

/**
 * A number for display: `digits` decimals, no trailing "-0", an en dash for null/NaN, a narrow
 * no-break space as thousands separator (ISO 80000-1 §7.3.1 digit grouping).
 */
export function formatNumber(value: number | null | undefined, digits = 0): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '–'
  let text = value.toFixed(digits)
  if (/^-0(\.0+)?$/.test(text)) text = text.slice(1)
  const [int, frac] = text.split('.')
  const sign = int.startsWith('-') ? '-' : ''
  const digitsOnly = sign ? int.slice(1) : int
  const grouped = digitsOnly.length > 4 ? digitsOnly.replace(/\B(?=(\d{3})+(?!\d))/g, '\u202F') : digitsOnly
  return sign + grouped + (frac !== undefined ? `.${frac}` : '')
}

/** A price per unit: two decimals, or four below 0.1 (a natural-gas price per ft³ is a few hundredths). */
export function formatPrice(value: number | null | undefined): string {
  return formatNumber(value, value !== null && value !== undefined && Math.abs(value) < 0.1 ? 4 : 2)
}

/** 1 Btu (International Table) per pound = 2.326 kJ/kg exactly (NIST SP 811, 2008, B.8). */
export const KJ_PER_KG_PER_BTU_PER_LB = 2.326

/** `formatNumber` of a quantity with its unit, separated by a no-break space. */
export function formatQuantity(q: Quantity, digits = 0): string {
  return `${formatNumber(q.value, digits)}\u00A0${q.unit}`
}

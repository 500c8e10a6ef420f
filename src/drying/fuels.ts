/**
 * @module drying/fuels
 * Fuels for heated and supplemental drying: heating value per sale unit, with sources, and example
 * prices. Heating values are higher (gross) heating values, so the heater efficiency must be stated on
 * the same (HHV) basis. Prices are **examples only** in an unnamed currency unit: give your own.
 */

/** Fuel ids of {@link FUELS}. */
export const FUEL_IDS = ['propane', 'natural-gas', 'heating-oil', 'wood-pellets', 'electricity'] as const
export type FuelId = (typeof FUEL_IDS)[number]

export interface Fuel {
  id: FuelId
  name: string
  /** Unit the fuel is bought in. */
  unit: 'L' | 'm³' | 'kg' | 'kWh'
  /** Heat per unit [MJ per unit], higher heating value. */
  heatingValueMjPerUnit: number
  /** Where the heating value comes from. */
  source: string
  /** Example price per unit (currency-neutral, NOT market data). */
  examplePricePerUnit: number
}

/** 1 Btu = 1055.056 J (International Table Btu, ISO 31-4 / NIST SP 811). */
const BTU_J = 1055.056
/** 1 US gallon = 3.785411784 L (NIST SP 811). */
const GALLON_L = 3.785411784
/** 1 ft³ = 0.028316846592 m³ (NIST SP 811). */
const CUBIC_FOOT_M3 = 0.028316846592
/** 1 short ton = 907.18474 kg (NIST SP 811). */
const SHORT_TON_KG = 907.18474

export const FUELS: Record<FuelId, Fuel> = {
  propane: {
    id: 'propane',
    name: 'propane (LPG)',
    unit: 'L',
    heatingValueMjPerUnit: (91_333 * BTU_J) / 1e6 / GALLON_L,
    source: 'US EIA, Btu conversion factors (2012): 91,333 Btu per US gallon (HHV) → 25.46 MJ/L',
    examplePricePerUnit: 0.6,
  },
  'natural-gas': {
    id: 'natural-gas',
    name: 'natural gas',
    unit: 'm³',
    heatingValueMjPerUnit: (1_025 * BTU_J) / 1e6 / CUBIC_FOOT_M3,
    source: 'US EIA, Btu conversion factors: 1,025 Btu per ft³ (HHV) → 38.19 MJ/m³',
    examplePricePerUnit: 0.4,
  },
  'heating-oil': {
    id: 'heating-oil',
    name: 'heating oil (No. 2)',
    unit: 'L',
    heatingValueMjPerUnit: (138_500 * BTU_J) / 1e6 / GALLON_L,
    source: 'US EIA, Btu conversion factors: No. 2 heating oil 138,500 Btu per US gallon (HHV) → 38.60 MJ/L',
    examplePricePerUnit: 1.0,
  },
  'wood-pellets': {
    id: 'wood-pellets',
    name: 'wood pellets (about 10 % moisture)',
    unit: 'kg',
    heatingValueMjPerUnit: (16e6 * BTU_J) / 1e6 / SHORT_TON_KG,
    source:
      'US EIA and UConn (Bartok 2013): 16 million Btu per short ton at about 10 % moisture → 18.61 MJ/kg',
    examplePricePerUnit: 0.3,
  },
  electricity: {
    id: 'electricity',
    name: 'electricity (resistance heating)',
    unit: 'kWh',
    heatingValueMjPerUnit: 3.6,
    source: 'definition: 1 kWh = 3.6 MJ (EIA: 3,412 Btu/kWh)',
    examplePricePerUnit: 0.15,
  },
}

export interface FuelUse {
  fuel: FuelId
  unit: Fuel['unit']
  /** Fuel quantity in its sale unit. */
  quantity: number
  pricePerUnit: number
  /** True when the price is the built-in example, not one the user gave. */
  priceIsExample: boolean
  cost: number
}

/**
 * Fuel to deliver `heatToAirKwh` [kWh] to the air. `heatToAirKwh` is heat in the air; the fuel heat is
 * that divided by `heaterEfficiency` (HHV basis). Example: 100 kWh to the air at 0.8 efficiency with
 * propane → 100 × 3.6 / 0.8 / 25.46 = 17.7 L.
 */
export function fuelForHeat(
  heatToAirKwh: number,
  heaterEfficiency: number,
  fuelId: FuelId,
  pricePerUnit?: number,
): FuelUse {
  if (!(heatToAirKwh >= 0)) throw new RangeError(`heat must be ≥ 0 kWh, got ${heatToAirKwh}`)
  if (!(heaterEfficiency > 0 && heaterEfficiency <= 1)) {
    throw new RangeError(`heater efficiency must be in (0, 1], got ${heaterEfficiency}`)
  }
  const fuel = FUELS[fuelId]
  if (!fuel) throw new RangeError(`fuel must be one of ${Object.keys(FUELS).join(', ')}, got '${fuelId}'`)
  if (pricePerUnit !== undefined && !(pricePerUnit >= 0 && Number.isFinite(pricePerUnit))) {
    throw new RangeError(`fuel price must be a number ≥ 0, got ${pricePerUnit}`)
  }
  const quantity = (heatToAirKwh * 3.6) / heaterEfficiency / fuel.heatingValueMjPerUnit
  const price = pricePerUnit ?? fuel.examplePricePerUnit
  return {
    fuel: fuelId,
    unit: fuel.unit,
    quantity,
    pricePerUnit: price,
    priceIsExample: pricePerUnit === undefined,
    cost: quantity * price,
  }
}

/**
 * @module report/assessment-view
 * The part of an assessment (analysis/ output, JSON-safe) that the report reads. Written as a structural
 * subset so the report renders any object of that shape: the full `Assessment` from analysis/, the JSON
 * of `dryhours assess --json`, or the body of `POST /v1/assess`. Optional members render as "not
 * available" rather than failing, so a smaller assessment (e.g. a typical year) still gives a report.
 */

export interface SpreadView {
  median: number | null
  p10: number | null
  p90: number | null
}

export interface MonthlyView {
  /** 1–12. */
  month: number
  usableHours: SpreadView & { byYear?: { year: number; hours: number | null }[] }
  /** Supplemental heat for batches started in this month [kWh per tonne of fresh product]. */
  supplementalHeatKwhPerTonne?: SpreadView | null
}

export interface StartDateView {
  /** Start day, "MM-DD". */
  start: string
  daysToTarget: { median: number | null; p90: number | null; p10?: number | null }
  /** Share of years (0–1) in which the batch reaches the target within the deadline. */
  probabilityWithinDeadline: number | null
  /** Share of years (0–1) with at least one rewetting hour, or mean rewetting hours, when reported. */
  rewettingRisk?: number | null
  supplementalHeatKwhPerTonne?: SpreadView | number | null
}

export interface FuelView {
  id: string
  name: string
  /** Sale unit: L, m³, kg or kWh. */
  unit: string
  /** Fuel per tonne of fresh product in that unit. */
  quantityPerTonne: SpreadView | number | null
  pricePerUnit?: number | null
  costPerTonne?: SpreadView | number | null
  /** True when the price is the example value, not the user's. */
  examplePrice?: boolean
}

export interface AssessmentView {
  site: {
    name: string
    latitudeDeg?: number | null
    longitudeDeg?: number | null
    elevationM?: number | null
    timeZone?: string | null
    utcOffsetHours?: number | null
    /** Uploaded file name (untrusted). */
    fileName?: string | null
    /** What the data are: reader format, station, provider (untrusted). */
    source?: string | null
  }
  product: {
    id: string
    name: string
    initialMoistureWbPct?: number | null
    targetMoistureWbPct?: number | null
  }
  method: { kind: string; [key: string]: unknown }
  /** Years covered, first and last timestamps (ISO 8601), typical-year flag. */
  period?: { start?: string | null; end?: string | null; years?: number[]; typicalYear?: boolean } | null
  coverage?: {
    hoursTotal?: number
    hoursUsable?: number
    /** Fraction 0–1 of hours with the data needed. */
    fraction?: number | null
    [key: string]: unknown
  } | null
  monthly: MonthlyView[]
  /** `fractions[month-1][hour]` or rows with month and 24 fractions: usable share by hour of day. */
  hourOfDay?: { month: number; usableFraction: (number | null)[] }[] | (number | null)[][] | null
  season?: { start?: string; end?: string } | null
  deadlineDays?: number | null
  startDates: StartDateView[]
  bestStartWindows?: { start: string; end: string; [key: string]: unknown }[] | null
  supplementalHeat?: {
    kwhPerTonne?: SpreadView | number | null
    fuels?: FuelView[]
    fuel?: FuelView | null
    [key: string]: unknown
  } | null
  assumptions: string[]
  warnings: string[]
}

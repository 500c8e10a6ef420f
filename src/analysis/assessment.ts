/**
 * @module analysis/assessment
 * The `Assessment`: what analysis/ returns and report/ renders. Plain data, JSON-safe (no functions,
 * no typed arrays, no NaN or Infinity: a figure that cannot be computed is null and a warning says why).
 */
import type { DryingMethod, FuelId } from '../drying/method.ts'
import type { HourStatusName } from '../drying/usable-hour.ts'
import type { FigureCounts, MemoryFigure } from '../product/memory-figures.ts'
import type { BinAssessment } from './assessment-bin.ts'
import type { PsychrometricSummary } from './psychrometric.ts'
import type { SeasonCalendar } from './season-calendar.ts'
import type { Spread } from './statistics.ts'

export const ASSESSMENT_SCHEMA = 'dryhours.assessment/1'

export interface AssessmentSite {
  name: string
  latitudeDeg: number | null
  longitudeDeg: number | null
  elevationM: number | null
  /** Offset of the site's local standard time [h]; months, hours and start dates follow it when `timeZone` is null. */
  utcOffsetHours: number
  utcOffsetSource: 'option' | 'file' | 'timestamps' | 'longitude' | 'assumed-utc'
  /**
   * IANA zone of the site's clock when known: months, hours and start dates then follow that clock,
   * daylight saving included; null: local standard time (UTC + `utcOffsetHours`) all year.
   */
  timeZone: string | null
  typicalYear: boolean
}

export interface AssessmentProduct {
  id: string
  name: string
  initialMoistureWbPct: number
  targetMoistureWbPct: number
  /** Equilibrium RH [%] of the product at its target moisture, at 25 °C (desorption isotherm). */
  targetErhPctAt25C: number
  /** What "dry" means for this assessment: the target's basis and the water activities (product/dry-target.ts). */
  dryTarget: AssessmentDryTarget
  maxProductTempC: number | null
  thicknessMm: number
  loadingKgPerM2: number
  cautions: string[]
  /**
   * The product's figures this answer uses that were recalled, not read in a publication (level `memory`,
   * `dryhours products <id>` gives each with its source); empty when none. A figure the user replaced (initial
   * moisture, thickness, loading) or that does not decide "dry" (the profile's target moisture) is not listed.
   */
  figuresFromMemory: MemoryFigure[]
  /** Per kind (moisture-and-limits, isotherm, kinetics, geometry-and-loading): figures used, and from memory. */
  figureCounts: FigureCounts
}

/**
 * Spoilage along the batches of one start date (or of one month's monthly batches): the product family's
 * spoilage model (see {@link AssessmentSpoilage}) stepped hour by hour along each batch of the method alone.
 */
export interface SpoilageSummary {
  /** Id of the spoilage model (`spoilage.model.id` of the assessment). */
  modelId: string
  /** Its source in short (authors and years); the full citation is in `spoilage.model.source`. */
  source: string
  /** Batches summarised (one per year for a start date; two per year, the 1st and 16th, for a month). */
  batches: number
  /** Batches whose spoilage measure reached the model's limit before the product reached its target. */
  batchesSpoiledBeforeDry: number
  /** Share of those batches [0–1]: the probability that a batch spoils before it is dry; null without batches. */
  probability: number | null
  /** Hours the product spent in conditions the model counts as at risk, until dry (or the batch's end). */
  hoursAtRisk: { median: number | null; p90: number | null }
  /** The model's measure when the batch was dry (or at its end) as a share of its limit (1 = spoiled). */
  shareOfLimitUsed: { median: number | null; p90: number | null }
}

/** The spoilage model of an assessment, what it counts and how the engine steps it. */
export interface AssessmentSpoilage {
  model: {
    id: string
    name: string
    source: { citation: string; equation: string; confidence: string }
    /** What the measure is, e.g. "dry-matter loss", and its unit ('' for a fraction). */
    measureName: string
    measureUnit: string
    /** The measure at which a batch counts as spoiled, and where that comes from. */
    limit: number
    limitSource: string
    atRiskWhen: string
    validity: string
    /**
     * Which water activity the model is fed along a batch: 'surface' (models of mould: the water activity at
     * the product's surface) or 'piece' (the isotherm at the mean moisture), the rule in words and its sources.
     */
    waterActivity: { of: 'surface' | 'piece'; rule: string; source: string }
  }
  /** How the model is stepped along a batch, in words. */
  rule: string
  /** All the season's start-date batches together. */
  season: SpoilageSummary
  /** What a reader must know with these figures (the model's own cautions first). */
  cautions: string[]
}

export interface AssessmentDryTarget {
  /**
   * 'water-activity': the moisture of the product's safe water activity at the storage temperature;
   * 'profile-moisture': the profile's own moisture figure, drier than that; 'user': given by the user.
   */
  basis: 'water-activity' | 'profile-moisture' | 'user'
  /** Water activity at or below which the dried product is safe [–], and its source. */
  safeWaterActivity: number
  safeWaterActivitySource: string
  /** Temperature of the store at which the water activity is judged [°C]. */
  storageTempC: number
  /** Water activity at the target moisture and storage temperature [–]; null when the isotherm gives none. */
  waterActivityAtTarget: number | null
  /** Moisture [% wb] at the safe water activity and storage temperature; null when the isotherm gives none. */
  moistureAtSafeWaterActivityWbPct: number | null
  /** The profile's own moisture figure [% wb] and its water activity at the storage temperature. */
  profileMoistureWbPct: number
  waterActivityAtProfileMoisture: number | null
  /** What "dry" means here, in one sentence (also in the CLI text and the report). */
  sentence: string
}

export interface YearValue {
  year: number
  hours: number
}

export interface MonthlyRow {
  month: number
  /** Usable drying hours in the month: per year and across years (see assumptions for the convention). */
  usableHours: Spread & { byYear: YearValue[] }
  /** Usable share of ALL the month's hours with data (day and night), all years pooled [0–1]. */
  usableFraction: number | null
  /**
   * Usable share of the month's DAYLIGHT hours with data (sun above the night threshold of the
   * assumptions), all years pooled [0–1]: the figure to read for methods that stop at night.
   */
  usableDaylightFraction: number | null
  /** Share of the month's usable hours that fall at night (heated air, a collector's stored heat) [0–1]. */
  usableNightHoursShare: number | null
  /** Hours per reason, median across years. */
  medianHoursByReason: Record<HourStatusName, number>
  /** Mean humidity-ratio deficit to the product's equilibrium RH at target, over daylight hours [g/kg]. */
  meanDaytimeDeficitToTargetGPerKg: number | null
  /** Wet-surface evaporation per day for exposed methods, summed over the hours the product is exposed [kg m⁻² d⁻¹]; null for forced air. */
  meanEvaporationKgPerM2Day: number | null
  /** Heat to reach the target by the deadline for batches starting on the 1st and 16th [kWh per tonne fresh]. */
  supplementalHeatKwhPerTonne: Spread
  /** Median days to target for those batches; null when the median batch does not finish within the maximum duration. */
  medianDaysToTarget: number | null
  /** Years with enough data in the month (≥ the stated coverage). */
  yearsWithData: number
  /** Spoilage along those batches (the 1st and 16th); null when the assessment ran without spoilage. */
  spoilage: SpoilageSummary | null
}

export interface HourOfDayTable {
  /** Hour 0–23 on the site's clock (start of the hour; see `site.timeZone`). */
  hours: number[]
  months: number[]
  /** usableFraction[month − 1][hour], null where there is no data. */
  usableFraction: (number | null)[][]
}

export interface StartDateRow {
  /** 'MM-DD' on the site's clock. */
  start: string
  /** Years with a complete batch from this start whose outcome is known (no hour without weather). */
  years: number
  /** Years whose batch from this start ran into hours without weather: outcome unknown, left out of the figures. */
  yearsUnknown: number
  /** Hours without weather those batches ran into (summed). */
  missingWeatherHours: number
  /** Days to target by the method alone; null when that percentile does not finish within `maxDays`. */
  daysToTarget: { median: number | null; p90: number | null }
  /** Share of years finishing within the deadline by the method alone, without supplemental heat [0–1]. */
  probabilityWithinDeadline: number
  /** Share of years finishing within the maximum duration [0–1]. */
  probabilityWithinMaxDuration: number
  rewettingHours: { median: number | null; p90: number | null }
  rainExposureHours: { median: number | null; p90: number | null }
  /** Heat into the air to reach the target by the deadline [kWh per tonne fresh]. */
  supplementalHeat: {
    medianKwhPerTonne: number | null
    p90KwhPerTonne: number | null
    yearsNeedingHeat: number
  }
  /** Years in which even heating every hour could not reach the target by the deadline. */
  yearsNotReachable: number
  /** Solar collector heat used by the method alone over the batch [kWh per tonne fresh] (0 unless solar cabinet). */
  solarHeatKwhPerTonne: { median: number | null; p90: number | null }
  /** Spoilage along the batches of the method alone; null when the assessment ran without spoilage. */
  spoilage: SpoilageSummary | null
}

export interface StartWindow {
  from: string
  to: string
  /** Start dates in the window (rows of the start-date table, `season.stepDays` apart). */
  days: number
  minProbabilityWithinDeadline: number
  medianDaysToTarget: number | null
}

export interface FuelFigure {
  fuel: FuelId
  /** The fuel in words, e.g. "propane (LPG)". */
  name: string
  unit: string
  quantityPerTonne: number | null
  quantityPerBatch: number | null
  costPerTonne: number | null
  costPerBatch: number | null
  pricePerUnit: number
  priceIsExample: boolean
  heatingValueMjPerUnit: number
  heatingValueSource: string
}

export interface HeatSummary {
  /** Heater used for supplemental heat (the method itself when it is heated). */
  heaterEfficiency: number
  airFlowKgPerSPerTonne: number
  targetRhPct: number | null
  setPointC: number | null
  batchKgFresh: number
  /** Across all start dates and years of the season. */
  heatToAirKwhPerTonne: Spread
  heatToAirKwhPerBatch: Spread
  fuelHeatKwhPerTonne: Spread
  /** Fuel quantity and cost at the median heat, for every fuel. */
  fuels: FuelFigure[]
  selectedFuel: FuelId
  /** The currency of the prices and costs as the user named it; null when not named (example prices are in no currency). */
  currency: string | null
  crossCheck: {
    waterToRemoveKgPerTonne: number
    /** λ(T) + net heat of sorption at the target moisture [kJ/kg water], and how it was obtained. */
    heatOfEvaporationKjPerKg: number
    heatOfEvaporationMethod: string
    /** Water to remove × heat of evaporation ÷ heater efficiency [kWh fuel heat per tonne]. */
    evaporationHeatFuelKwhPerTonne: number
    /** Median fuel heat of batches heated every hour ÷ the figure above (air leaves warm and unsaturated: > 1). */
    ratioHeatedEveryHour: number | null
    note: string
  }
}

export interface Assumption {
  name: string
  value: string
  source: string
}

export interface Coverage {
  firstHourUtc: string
  lastHourUtc: string
  hours: number
  missingHours: number
  years: number[]
  /** Minimum share of a month's hours with data for that month-year to enter the statistics. */
  monthCoverageRequired: number
  assumedIrradianceHours: number
  /** Daylight hours whose irradiance the weather reader estimated (cloud cover or daily temperature range; see the assumptions). */
  estimatedIrradianceHours: number
  assumedWindHours: number
  hasRainData: boolean
  startDateBatchesRun: number
  startDateBatchesSkippedForData: number
  /**
   * Batches (start dates and the monthly 1st/16th batches) that ran into hours without weather: their outcome is
   * unknown and they are left out of the time, probability and heat figures; and the hours they missed.
   */
  batchesWithUnknownOutcome: number
  missingWeatherHoursInBatches: number
}

export interface Assessment {
  schema: typeof ASSESSMENT_SCHEMA
  site: AssessmentSite
  product: AssessmentProduct
  method: DryingMethod
  /** The method in plain words (drying/methods/<kind>.ts label). */
  methodLabel: string
  season: { start: string; end: string; stepDays: number; startHourLocal: number }
  deadlineDays: number
  maxDays: number
  monthly: MonthlyRow[]
  hourOfDay: HourOfDayTable
  /** Hours per reason over the whole file. */
  hoursByReason: Record<HourStatusName, number>
  startDates: StartDateRow[]
  /** The spoilage model and the season's figures; null when the assessment ran without spoilage. */
  spoilage: AssessmentSpoilage | null
  bestStartWindows: StartWindow[]
  bestStartWindowCriterion: string
  /** The start-date table folded into start weeks, each with one state (dries, marginal, needs heat …) and the criterion; no cells for a bin. */
  seasonCalendar: SeasonCalendar
  heat: HeatSummary
  /** The site's hours on a psychrometric chart, with the air that dries the product to its target. */
  psychrometric: PsychrometricSummary
  assumptions: Assumption[]
  warnings: string[]
  coverage: Coverage
  /**
   * Natural-air bin drying (methods with deep-bed batches): per start date and airflow, days until the top layer
   * is dry, its dry-matter loss and fan energy; per start month the minimum airflow. Absent for other methods,
   * whose start-date table, best windows and heat come from batches instead (those are then empty).
   */
  bin?: BinAssessment
}

/**
 * @module analysis/assessment-bin
 * `assessment.bin`: what a natural-air bin assessment reports (the `deep-bed` methods, analysis/bin-stage.ts).
 * JSON-safe, SI, every name spells out its quantity and unit. US customary equivalents (cfm per bushel, bushels,
 * inches of water) are given beside the SI figures that people usually read in them.
 */

/** One year's run from a start date at one airflow. */
export interface BinYearFigures {
  year: number
  /** Days from filling until the top layer was at or below the target; null: not within the season. */
  daysUntilTopLayerDry: number | null
  /** The top layer's dry-matter loss when it was dry, or at the end of the season [%]. */
  topLayerDryMatterLossPct: number
  /** The top layer stayed below the dry-matter loss limit. */
  passesDryMatterLossLimit: boolean
  fanEnergyKwhPerTonne: number
  heaterEnergyKwhPerTonne: number
  /** Dry within the season and below the limit: a safe year. */
  safe: boolean
}

/** Median and 90th percentile across years (Hyndman–Fan type 7); null where the percentile is not reached. */
export interface MedianP90 {
  median: number | null
  p90: number | null
}

/** A start (harvest, filling) date at one candidate airflow, across years. */
export interface BinStartAirflow {
  /** 'MM-DD', local standard time. */
  startDate: string
  month: number
  airflowM3PerMinPerTonne: number
  airflowCfmPerBushel: number
  years: number
  yearsTopLayerDryWithinSeason: number
  yearsDryMatterLossLimitExceeded: number
  yearsSafe: number
  /** Share of the years that are safe [0–1]. */
  shareOfYearsSafe: number
  /** Safe in at least the required share of years (9 of 10). */
  meetsRequiredShare: boolean
  /** Days until the top layer is dry (P90: within that in 9 of 10 years); null = not within the season. */
  daysUntilTopLayerDry: MedianP90
  /** The top layer's dry-matter loss [%]. */
  topLayerDryMatterLossPct: MedianP90
  /** The top layer's P90 dry-matter loss is below the limit. */
  passesDryMatterLossLimitP90: boolean
  fanEnergyKwhPerTonne: MedianP90
  heaterEnergyKwhPerTonne: MedianP90
  /** Water removed from the whole bin by the time the top layer is dry or the season ends [kg per tonne]. */
  waterRemovedKgPerTonne: MedianP90
  byYear: BinYearFigures[]
}

/** A start month's smallest candidate airflow that is safe in the required share of years at each of its start dates. */
export interface BinMinimumAirflow {
  month: number
  startDates: string[]
  /** Null when no candidate is safe often enough. */
  minimumAirflowM3PerMinPerTonne: number | null
  minimumAirflowCfmPerBushel: number | null
  /** Share of safe years at that airflow (the lowest over the month's start dates; at the largest candidate when none met the rule). */
  shareOfYearsSafe: number
  years: number
}

/** A candidate airflow's fan figures (no weather needed). */
export interface BinAirflowFan {
  airflowM3PerMinPerTonne: number
  airflowCfmPerBushel: number
  /** Air through the whole bin [m³/min]. */
  airflowM3PerMin: number
  staticPressurePa: number
  staticPressureInchesWater: number
  fanPowerKw: number
  fanPowerKwPerTonne: number
}

export interface BinAssessment {
  /** The model in words, with its source and limits. */
  model: { id: 'equilibrium-deep-bed'; description: string; source: string; limits: string[] }
  grain: {
    /** Bulk density as loaded [kg/m³]. */
    bulkDensityKgPerM3: number
    /** US standard bushel weight of this grain [kg] (for cfm/bu and bushels). */
    bushelKg: number
    airflowResistanceSource: string
  }
  bin: {
    depthM: number
    floorAreaM2: number
    /** The given or assumed diameter [m]; null when a floor area was given. */
    diameterM: number | null
    grainTonnes: number
    bushels: number
    layers: number
    fanEfficiency: number
    fanHeatToAir: boolean
    heatRiseK: number
    heaterOnAboveRhPct: number | null
    /** The fan control in words. */
    fanControl: string
  }
  spoilage: {
    modelId: string
    model: string
    source: string
    /** The top layer's dry-matter loss limit [%]. */
    dryMatterLossLimitPct: number
    limitSource: string
    validity: string
  }
  /** Longest run from a start date [days]: a top layer not dry by then is "not dry within the season". */
  seasonDays: number
  requiredShareOfYears: number
  /** The rule that decides "safe" and the minimum airflow, in words. */
  rule: string
  typicalYear: boolean
  years: number[]
  airflows: BinAirflowFan[]
  startDates: BinStartAirflow[]
  minimumAirflowByMonth: BinMinimumAirflow[]
  runs: number
  /** Runs left out (season past the end of the file, or no weather on the first day). */
  runsLeftOut: number
  /** Cautions that go with every bin answer (safety, mycotoxins, the model's limits). */
  cautions: string[]
}

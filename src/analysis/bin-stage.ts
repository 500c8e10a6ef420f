/**
 * @module analysis/bin-stage
 * The stage of an assessment that stands in for batches when the method is a bin (`batches: 'deep-bed'`,
 * drying/methods/natural-air-bin.ts): the deep-bed model (drying/deep-bed/) run for every start date of the season
 * × candidate airflow × year, from filling until the top layer is dry or the season (`maxDays`) ends, and turned
 * into `assessment.bin` (analysis/assessment-bin.ts). The planner (plan.ts) counts this work before it runs.
 */
import {
  BUSHEL_M3,
  BUSHEL_WEIGHT_KG,
  m3PerMinPerTonneFromCfmPerBu,
  PA_PER_INCH_OF_WATER,
} from '../drying/deep-bed/airflow-resistance.ts'
import { assessBinDrying } from '../drying/deep-bed/bin-assessment.ts'
import type { BinStartResult, BinYearRun } from '../drying/deep-bed/bin-summary.ts'
import { deepBedGrainFromProfile } from '../drying/deep-bed/grain-from-profile.ts'
import { binFan } from '../drying/deep-bed/layer-model.ts'
import {
  binAirflows,
  binFloorAreaM2,
  binSetupOf,
  DEFAULT_BIN_DIAMETER_M,
  type NaturalAirBinMethod,
} from '../drying/methods/natural-air-bin.ts'
import { quantileOf } from '../math/quantile.ts'
import { grainDryMatterLossModel } from '../product/spoilage/grain-dml.ts'
import type { HourlySeries } from '../weather/series.ts'
import type { ResolvedAssessOptions } from './assess-options.ts'
import type { BinAirflowFan, BinAssessment, BinStartAirflow, MedianP90 } from './assessment-bin.ts'
import { roundOrNull } from './statistics.ts'

/** The equilibrium deep-bed model in words, with its sources and limits (see drying/deep-bed/layer-model.ts). */
const MODEL = {
  id: 'equilibrium-deep-bed' as const,
  description:
    'the grain is cut into layers; each hour the air passes up through them and leaves each layer in equilibrium with it (exit RH = the grain’s equilibrium RH), water and enthalpy conserved, the net heat of sorption from the isotherm; the top layer’s dry-matter loss is stepped hour by hour',
  source:
    'equilibrium deep-bed model (Hukill’s approach, as reviewed by Sharp 1982, J. Agric. Eng. Res. 27:169; from memory); static pressure by the Hukill–Ives form of Shedd’s data, ASAE D272 (packing factor 1.5, D272.3 note); fan power Q·ΔP/η; dry-matter loss by Steele 1967 / Thompson 1972',
  limits: [
    'Air is taken to leave each layer in equilibrium with it: right for natural-air and low-temperature drying at a few m³/min per tonne; it overstates drying speed at high airflow or with heated air.',
    'Days and dry-matter loss depend on the number of layers: the top layer is 1/layers of the depth, and thinner top layers come out wetter.',
    'The dry-matter loss model was measured on shelled corn and is used for every grain; damaged or low-test-weight grain spoils faster.',
    'Airflow resistance for grains other than shelled corn and every grain’s bulk density are not checked against published tables; fines and packing raise static pressure, and a real fan delivers less air at higher static pressure (no fan curve here).',
    'The bin is filled at once; wall and roof heat exchange, stirring and rewetting hysteresis are not modelled; with the fan off the grain keeps its state.',
    'Cold air holds little water: late in the season natural-air drying nearly stops, which the model shows as “not dry within the season”, not as safe storage.',
  ],
}

/** Cautions shown with every bin answer (safety first: they defer to local codes and licensed trades). */
export const BIN_CAUTIONS: readonly string[] = [
  'Grain-bin fans and heaters are electrical and fire hazards: wiring and installation by licensed electricians, gas heaters by licensed gas fitters, following local codes; keep fan inlets guarded and lock out power during service.',
  'Never enter a bin while grain is being moved or unloaded, or when grain has crusted or bridged: flowing grain engulfs a person in seconds. Follow confined-space entry rules: lock out unloading equipment, wear a harness and lifeline, and keep an attendant outside.',
  'Grain dust is explosive and harmful to breathe; wear a respirator in dusty bins.',
  'Where the top layer came near or past the dry-matter loss limit, or the grain stayed wet and warm for long, have it tested for mycotoxins before it is fed or sold.',
  'Check the grain: probe the top layer and measure its moisture and temperature every few days; a rising temperature or a musty smell means it is spoiling.',
]

const r = (x: number, digits: number): number => roundOrNull(x, digits) ?? 0

function medianP90(values: number[], digits: number): MedianP90 {
  return {
    median: roundOrNull(quantileOf(values, 0.5), digits),
    p90: roundOrNull(quantileOf(values, 0.9), digits),
  }
}

function startFigures(s: BinStartResult, bushelKg: number, limitPct: number, share: number): BinStartAirflow {
  const runs: BinYearRun[] = s.runs
  return {
    startDate: s.startDate,
    month: s.month,
    airflowM3PerMinPerTonne: s.airflowM3PerMinPerT,
    airflowCfmPerBushel: r(s.airflowM3PerMinPerT / m3PerMinPerTonneFromCfmPerBu(1, bushelKg), 2),
    years: s.years,
    yearsTopLayerDryWithinSeason: s.yearsDryWithinSeason,
    yearsDryMatterLossLimitExceeded: s.yearsLimitExceeded,
    yearsSafe: s.yearsSafe,
    shareOfYearsSafe: r(s.shareOfYearsSafe, 3),
    meetsRequiredShare: s.years > 0 && s.shareOfYearsSafe >= share,
    daysUntilTopLayerDry: {
      median: roundOrNull(s.medianDaysUntilTopDry ?? Number.NaN, 1),
      p90: roundOrNull(s.p90DaysUntilTopDry ?? Number.NaN, 1),
    },
    topLayerDryMatterLossPct: {
      median: roundOrNull(s.medianTopDryMatterLossPct, 3),
      p90: roundOrNull(s.p90TopDryMatterLossPct, 3),
    },
    passesDryMatterLossLimitP90: s.years > 0 && s.p90TopDryMatterLossPct < limitPct,
    fanEnergyKwhPerTonne: {
      median: roundOrNull(s.medianFanEnergyKwhPerT, 2),
      p90: roundOrNull(s.p90FanEnergyKwhPerT, 2),
    },
    heaterEnergyKwhPerTonne: medianP90(
      runs.map((y) => y.heaterEnergyKwhPerT),
      1,
    ),
    waterRemovedKgPerTonne: medianP90(
      runs.map((y) => y.waterRemovedKgPerT),
      1,
    ),
    byYear: runs.map((y) => ({
      year: y.year,
      daysUntilTopLayerDry: y.daysUntilTopDry === null ? null : r(y.daysUntilTopDry, 2),
      topLayerDryMatterLossPct: r(y.topDryMatterLossPct, 4),
      passesDryMatterLossLimit: !y.topLimitExceeded,
      fanEnergyKwhPerTonne: r(y.fanEnergyKwhPerT, 3),
      heaterEnergyKwhPerTonne: r(y.heaterEnergyKwhPerT, 2),
      safe: y.safe,
    })),
  }
}

/** Runs of the deep-bed model an assessment with this plan makes at most (the planner's count; plan.ts). */
export function binRunCount(starts: number, airflows: number, years: number): number {
  return starts * airflows * years
}

/** The bin stage: runs the deep-bed model and returns `assessment.bin`. */
export function binStage(
  series: HourlySeries,
  run: ResolvedAssessOptions,
  clock: {
    utcOffsetHours: number
    toUtcMs: (year: number, month: number, day: number, hour: number) => number
  },
): BinAssessment {
  const method = run.method as NaturalAirBinMethod
  const grain = deepBedGrainFromProfile(run.profile)
  const key = run.profile.variantOf ?? run.profile.id
  const bushelKg = BUSHEL_WEIGHT_KG[key] ?? grain.bulkDensityKgPerM3 * BUSHEL_M3
  const bin = binSetupOf(method, run.initialWbPct, run.targetWbPct)
  const spoilage = grainDryMatterLossModel({ spoiledAtPct: method.dryMatterLossLimitPct })
  const airflows = binAirflows(method)
  const total = binRunCount(run.startDays.length, airflows.length, 1)
  let done = 0
  const result = assessBinDrying({
    weather: series,
    grain,
    bin,
    startDates: run.startDays,
    airflowsM3PerMinPerT: airflows,
    seasonDays: Math.max(1, Math.round(run.maxDays)),
    spoilage,
    // the fan starts at the season's hour on the site's clock (daylight saving where the zone keeps it)
    utcOffsetHours: clock.utcOffsetHours,
    toUtcMs: clock.toUtcMs,
    startHourLocal: run.season.startHourLocal,
    onRun: () => {
      // progress by start date × airflow (the years of each are run together)
      done++
      run.onProgress?.({ stage: 'bin-runs', done, total })
    },
  })
  const tonnes = (bin.floorAreaM2 * bin.depthM * grain.bulkDensityKgPerM3) / 1000
  const fans = airflows.map((q): BinAirflowFan => {
    const f = binFan(grain, { ...bin, airflowM3PerMinPerT: q, initialGrainTempC: 10 })
    return {
      airflowM3PerMinPerTonne: q,
      airflowCfmPerBushel: r(q / m3PerMinPerTonneFromCfmPerBu(1, bushelKg), 2),
      airflowM3PerMin: r(f.airflowM3PerS * 60, 1),
      staticPressurePa: r(f.staticPressurePa, 0),
      staticPressureInchesWater: r(f.staticPressurePa / PA_PER_INCH_OF_WATER, 2),
      fanPowerKw: r(f.fanPowerW / 1000, 2),
      fanPowerKwPerTonne: r(f.fanPowerW / 1000 / f.grainTonnes, 4),
    }
  })
  const cfmPerBu = (q: number | null) =>
    q === null ? null : r(q / m3PerMinPerTonneFromCfmPerBu(1, bushelKg), 2)
  return {
    model: MODEL,
    grain: {
      bulkDensityKgPerM3: r(grain.bulkDensityKgPerM3, 1),
      bushelKg: r(bushelKg, 3),
      airflowResistanceSource: grain.airflowResistance.source,
    },
    bin: {
      depthM: method.depthM,
      floorAreaM2: r(binFloorAreaM2(method), 2),
      diameterM: method.floorAreaM2 !== undefined ? null : (method.binDiameterM ?? DEFAULT_BIN_DIAMETER_M),
      grainTonnes: r(tonnes, 1),
      bushels: r((tonnes * 1000) / bushelKg, 0),
      layers: method.layers,
      fanEfficiency: method.fanEfficiency,
      fanHeatToAir: method.fanHeatToAir,
      heatRiseK: method.heatRiseK,
      heaterOnAboveRhPct: method.heaterOnAboveRhPct ?? null,
      fanControl: result.fanControl,
    },
    spoilage: {
      modelId: spoilage.id,
      model: spoilage.name,
      source: spoilage.source.citation,
      dryMatterLossLimitPct: spoilage.spoiledAt,
      limitSource: spoilage.spoiledAtSource,
      validity: spoilage.validity,
    },
    seasonDays: result.seasonDays,
    requiredShareOfYears: result.requiredShareOfYears,
    rule: result.rule,
    typicalYear: result.typicalYear,
    years: result.years,
    airflows: fans,
    startDates: result.starts.map((s) =>
      startFigures(s, bushelKg, spoilage.spoiledAt, result.requiredShareOfYears),
    ),
    minimumAirflowByMonth: result.minimumAirflowByMonth.map((m) => ({
      month: m.month,
      startDates: m.startDates,
      minimumAirflowM3PerMinPerTonne: m.minimumAirflowM3PerMinPerT,
      minimumAirflowCfmPerBushel: cfmPerBu(m.minimumAirflowM3PerMinPerT),
      shareOfYearsSafe: r(m.shareOfYearsSafe, 3),
      years: m.years,
    })),
    runs: result.runs,
    runsLeftOut: result.runsLeftOut,
    cautions: [...BIN_CAUTIONS],
  }
}

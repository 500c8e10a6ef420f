/**
 * @module bench/sections/bins
 * Natural-air bin drying (src/drying/deep-bed/): one 40-day run of a 20-layer, 5 m corn bin at 1 cfm/bu under
 * invented autumn weather, by the fast model (`simulateDeepBed`: typed arrays, isotherm tables, Newton per layer)
 * and by the same model's reference implementation (`simulateDeepBedReference`: exact isotherm, bisection),
 * measured in the same process; their agreement on that run; the one-off cost of the grain's tables; and an
 * assessment-sized workload (`assessBinDrying`: 10 years of the dry upland demo site × 4 start dates × 4
 * airflows, each run until the top layer is dry or 60 days); and the cost of a bin layer-hour in batch-hours, the
 * weight the planner gives bin work (analysis/plan.ts `BIN_LAYER_HOUR_IN_BATCH_HOURS`): CPU time of a natural-air
 * bin assessment per layer-hour the planner counts over CPU time of a slow batch assessment (shade drying of
 * corn) per batch-hour it counts, on the dry upland and humid valley demo files.
 *
 * Timing: one warm-up of each, then the median of the timed runs, by wall clock and by process CPU time.
 */
import { readFileSync } from 'node:fs'
import { longUtcCsv } from '../../climate-demo/demo-files.ts'
import { assess } from '../../src/analysis/assess.ts'
import { assessmentCost, planAssessment } from '../../src/analysis/plan.ts'
import {
  assessBinDrying,
  BUSHEL_WEIGHT_KG,
  deepBedGrainFromProfile,
  grainTables,
  m3PerMinPerTonneFromCfmPerBu,
  simulateDeepBed,
  simulateDeepBedReference,
} from '../../src/drying/deep-bed/index.ts'
import { productById } from '../../src/product/catalogue.ts'
import { grainDryMatterLossModel } from '../../src/product/spoilage/index.ts'
import { readWeather } from '../../src/weather/read-weather.ts'
import { type BenchFigure, type BenchSection, median } from '../section.ts'

const REFERENCE_RUNS = 2
const FAST_RUNS = 15
const DAYS = 40
const SEED = 20_210_003

function measure<T>(f: () => T): { wallMs: number; cpuMs: number; value: T } {
  const c0 = process.cpuUsage()
  const t0 = performance.now()
  const value = f()
  const wallMs = performance.now() - t0
  const c = process.cpuUsage(c0)
  return { wallMs, cpuMs: (c.user + c.system) / 1000, value }
}

/** Invented autumn weather: a daily cycle of 12 ± 6 °C and 70 ± 18 % RH with slower swings. */
function autumn(days: number) {
  const n = days * 24
  const dryBulbC = new Float64Array(n)
  const relativeHumidityPct = new Float64Array(n)
  for (let i = 0; i < n; i++) {
    const daily = Math.cos((2 * Math.PI * ((i % 24) - 5)) / 24)
    const slow = Math.sin((2 * Math.PI * i) / (24 * 9.3))
    dryBulbC[i] = 12 - 6 * daily + 3 * slow
    relativeHumidityPct[i] = Math.min(98, 70 + 18 * daily - 8 * slow)
  }
  return { dryBulbC, relativeHumidityPct, pressureKpa: 101.325 }
}

export const section: BenchSection = {
  id: 'bins',
  title: 'natural-air bin model: fast form vs its reference implementation; an assessment-sized workload',
  run() {
    const figures: BenchFigure[] = []
    const profile = productById('shelled-corn')
    const grain = deepBedGrainFromProfile(profile)
    const tables = measure(() => grainTables(grain))
    figures.push({
      name: 'grain tables, first build',
      value: Math.round(tables.wallMs),
      unit: 'ms',
      note: `CPU ${Math.round(tables.cpuMs)} ms; once per grain and process`,
    })

    const weather = autumn(DAYS)
    const rows = Array.from(weather.dryBulbC, (t, i) => ({
      dryBulbC: t,
      rhPct: weather.relativeHumidityPct[i],
      pressureKpa: 101.325,
    }))
    const setup = {
      floorAreaM2: 50,
      depthM: 5,
      layers: 20,
      initialMoistureWbPct: 21,
      initialGrainTempC: 12,
      airflowM3PerMinPerT: m3PerMinPerTonneFromCfmPerBu(1, BUSHEL_WEIGHT_KG['shelled-corn']),
      targetMoistureWbPct: 15.5,
    }
    const model = grainDryMatterLossModel()
    // warm-up
    simulateDeepBedReference(grain, { ...setup, layers: 4 }, rows.slice(0, 48), model)
    simulateDeepBed(grain, setup, weather, model)

    const refWall: number[] = []
    const refCpu: number[] = []
    let ref = simulateDeepBedReference(grain, { ...setup, layers: 2 }, rows.slice(0, 2), model)
    for (let k = 0; k < REFERENCE_RUNS; k++) {
      const m = measure(() => simulateDeepBedReference(grain, setup, rows, model))
      refWall.push(m.wallMs)
      refCpu.push(m.cpuMs)
      ref = m.value
    }
    const fastWall: number[] = []
    const fastCpu: number[] = []
    let fast = simulateDeepBed(grain, setup, weather, model)
    for (let k = 0; k < FAST_RUNS; k++) {
      const m = measure(() => simulateDeepBed(grain, setup, weather, model))
      fastWall.push(m.wallMs)
      fastCpu.push(m.cpuMs)
      fast = m.value
    }
    const label = `${DAYS}-day run, 20 layers, 5 m, 1 cfm/bu`
    figures.push({
      name: `reference implementation, ${label}`,
      value: Math.round(median(refWall)),
      unit: 'ms',
      note: `median of ${REFERENCE_RUNS}; CPU ${Math.round(median(refCpu))} ms`,
    })
    figures.push({
      name: `fast model, ${label}`,
      value: median(fastWall),
      unit: 'ms',
      note: `median of ${FAST_RUNS}; CPU ${median(fastCpu).toFixed(1)} ms`,
    })
    figures.push({
      name: 'fast model runs per second (CPU time)',
      value: Math.round(1000 / median(fastCpu)),
      unit: 'runs/s',
      note: label,
    })
    figures.push({
      name: 'ratio fast / reference by CPU time',
      value: median(refCpu) / median(fastCpu),
      unit: 'x',
      note: 'same run, same process',
    })
    figures.push({
      name: 'ratio fast / reference by wall clock',
      value: median(refWall) / median(fastWall),
      unit: 'x',
    })
    figures.push({
      name: 'agreement: hours until the top layer is dry (fast − reference)',
      value:
        fast.hoursUntilTopDry !== null && ref.hoursUntilTopDry !== null
          ? fast.hoursUntilTopDry - ref.hoursUntilTopDry
          : Number.NaN,
      unit: 'h',
      note: `reference ${ref.hoursUntilTopDry ?? 'not dry'} h`,
    })
    figures.push({
      name: 'agreement: top-layer DML, relative difference',
      value: Math.abs(fast.topDryMatterLossPct / ref.topDryMatterLossPct - 1),
      unit: '',
      note: `reference ${ref.topDryMatterLossPct.toFixed(4)} %`,
    })
    let worstLayer = 0
    for (let i = 0; i < 20; i++) {
      worstLayer = Math.max(worstLayer, Math.abs(fast.finalMoistureWbPct[i] - ref.finalMoistureWbPct[i]))
    }
    figures.push({
      name: 'agreement: final layer moisture, largest difference',
      value: worstLayer,
      unit: '% wb',
    })

    // an assessment-sized workload on 10 years of the demo site
    const read = readWeather(longUtcCsv(SEED, 2011, 2020), {
      latitudeDeg: 38.3,
      longitudeDeg: -2.6,
      elevationM: 1050,
      utcOffsetHours: 1,
    })
    const series = read.series
    const assessment = measure(() =>
      assessBinDrying({
        weather: series,
        grain,
        bin: { floorAreaM2: 50, depthM: 5, initialMoistureWbPct: 21, targetMoistureWbPct: 15.5 },
        startDates: [
          { month: 9, day: 15 },
          { month: 10, day: 1 },
          { month: 10, day: 15 },
          { month: 11, day: 1 },
        ],
        airflowsM3PerMinPerT: [0.5, 1, 2, 3].map((x) =>
          m3PerMinPerTonneFromCfmPerBu(x, BUSHEL_WEIGHT_KG['shelled-corn']),
        ),
        seasonDays: 60,
        utcOffsetHours: 1,
      }),
    )
    const a = assessment.value
    let simulatedDays = 0
    for (const s of a.starts) for (const r of s.runs) simulatedDays += r.daysUntilTopDry ?? 60
    figures.push({
      name: 'assessment: 10 years × 4 start dates × 4 airflows',
      value: Math.round(assessment.wallMs),
      unit: 'ms',
      note: `CPU ${Math.round(assessment.cpuMs)} ms; ${a.runs} runs, ${a.runsLeftOut} left out`,
    })
    figures.push({
      name: 'assessment runs per second (CPU time)',
      value: a.runs / (assessment.cpuMs / 1000),
      unit: 'runs/s',
      note: `mean run ${(simulatedDays / Math.max(1, a.runs)).toFixed(1)} days (stops when the top layer is dry)`,
    })
    figures.push(...layerHourWeight())
    return figures
  },
}

/** The planner's weight of a bin layer-hour, measured on two demo files (see the module comment). */
function layerHourWeight(): BenchFigure[] {
  const figures: BenchFigure[] = []
  const sites = [
    { name: 'dry upland', file: 'ardentine-upland-2021-2024-utc.csv', options: { utcOffsetHours: 1 } },
    {
      name: 'humid valley',
      file: 'quillow-valley-2021-2023-local-dst-imperial.csv',
      options: { timeZone: 'America/Chicago' },
    },
  ]
  for (const site of sites) {
    const text = readFileSync(`climate-demo/${site.file}`, 'utf8')
    const series = readWeather(text, site.options).series
    const base = { product: productById('shelled-corn'), seasonStart: '09-01', seasonEnd: '10-31' }
    const batch = { ...base, method: { kind: 'shade' as const } }
    const bin = { ...base, method: { kind: 'natural-air-bin' as const } }
    assess(series, batch)
    assess(series, { ...bin, seasonEnd: '09-01' })
    const tBatch = Math.min(
      measure(() => assess(series, batch)).cpuMs,
      measure(() => assess(series, batch)).cpuMs,
    )
    const tBin = measure(() => assess(series, bin)).cpuMs
    const batchHours = assessmentCost(planAssessment(batch), series.hours).batchHours
    const layerHours = assessmentCost(planAssessment(bin), series.hours).binLayerHours
    figures.push({
      name: `bin layer-hour in batch-hours, ${site.name}`,
      value: tBin / layerHours / (tBatch / batchHours),
      unit: 'x',
      note: `bin ${Math.round(tBin)} ms CPU for ${(layerHours / 1e6).toFixed(2)} M layer-h counted; shade batches ${Math.round(tBatch)} ms for ${(batchHours / 1e6).toFixed(2)} M batch-h`,
    })
  }
  return figures
}

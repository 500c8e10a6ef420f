/**
 * @module bench/sections/engine
 * The drying engine on a 30-year hourly file (the dry upland demo site, 1991–2020, generated in memory by
 * climate-demo `longUtcCsv` and read by the weather reader): a full `assess` with a 90-day start-date
 * table (one start per day × 30 years), its memory, and the per-hour engine's throughput beside the
 * moist-air column throughput (physics/air-columns.ts) measured on the same hours in the same process.
 * Timings: the first assessment of the process is reported on its own (V8 compiles the engine while it runs); after
 * a second warm-up, the assessment's figure is the median of {@link ASSESS_REPEATS} runs, the others the median of
 * {@link REPEATS}.
 */
import { longUtcCsv } from '../../climate-demo/demo-files.ts'
import { assess } from '../../src/analysis/assess.ts'
import { simulateBatch } from '../../src/drying/batch.ts'
import { computeHourlyConditions, computeSolarColumns } from '../../src/drying/hourly-conditions.ts'
import { parseDryingMethod } from '../../src/drying/method.ts'
import { productResponse } from '../../src/drying/product-response.ts'
import { tabulatedResponse } from '../../src/drying/product-tables.ts'
import { parseDryingThresholds } from '../../src/drying/thresholds.ts'
import { fillAirStateColumns } from '../../src/physics/air-columns.ts'
import { productById } from '../../src/product/catalogue.ts'
import { moistureDbFromWbPct } from '../../src/product/moisture-basis.ts'
import { readWeather } from '../../src/weather/read-weather.ts'
import { type BenchFigure, type BenchSection, median } from '../section.ts'

const REPEATS = 3
/** Timed assessments after the warm-ups (five: a median of three moved by ±20 % between runs on a shared machine). */
const ASSESS_REPEATS = 5
/** Pairs of runs without and with the spoilage models for their cost. */
const SPOILAGE_PAIRS = 6
const SEED = 20_210_003

function timed<T>(f: () => T): { ms: number; value: T } {
  const t0 = performance.now()
  const value = f()
  return { ms: performance.now() - t0, value }
}

export const section: BenchSection = {
  id: 'engine',
  title: 'drying engine: 30-year assessment with a 90-day start-date table; per-hour throughput vs moist air',
  run() {
    const figures: BenchFigure[] = []
    const read = timed(() =>
      readWeather(longUtcCsv(SEED, 1991, 2020), {
        latitudeDeg: 38.3,
        longitudeDeg: -2.6,
        elevationM: 1050,
        utcOffsetHours: 0,
        siteTimeZone: 'Europe/Madrid',
      }),
    )
    const series = read.value.series
    figures.push({ name: 'hours in the file', value: series.hours, unit: 'h' })
    figures.push({
      name: 'generate + read the 30-year CSV',
      value: Math.round(read.ms),
      unit: 'ms',
      note: 'not part of the assessment',
    })

    const profile = productById('grapes-to-raisins')
    const options = {
      product: profile,
      method: { kind: 'open-air' } as const,
      seasonStart: '06-15',
      seasonEnd: '09-12',
      startStepDays: 1,
      deadlineDays: 21,
      maxDays: 40,
    }
    // the first assessment in this process (the engine compiled while it runs), then a second warm-up
    const first = timed(() => assess(series, options))
    assess(series, options)
    const gc = (globalThis as { gc?: () => void }).gc
    gc?.()
    const heapBefore = process.memoryUsage().heapUsed
    const runs: number[] = []
    const cpuRuns: number[] = []
    let startRows = 0
    let batches = 0
    for (let r = 0; r < ASSESS_REPEATS; r++) {
      const c0 = process.cpuUsage()
      const t = timed(() => assess(series, options))
      const c = process.cpuUsage(c0)
      cpuRuns.push((c.user + c.system) / 1000)
      runs.push(t.ms)
      startRows = t.value.startDates.length
      batches = t.value.coverage.startDateBatchesRun
    }
    const heapAfter = process.memoryUsage().heapUsed
    // The same assessment without the spoilage models (the engine before they were stepped along every
    // batch) against with them, in interleaved pairs (without, with) so that both see the same load and heap:
    // the ratio per pair, median over the pairs, is the cost of spoilage in this run.
    const noSpoilage = { ...options, spoilage: false }
    assess(series, noSpoilage) // warm-up
    const refCpu: number[] = []
    const withCpu: number[] = []
    const pairRatios: number[] = []
    const cpuOf = (o: typeof options): number => {
      const c0 = process.cpuUsage()
      assess(series, o)
      const c = process.cpuUsage(c0)
      return (c.user + c.system) / 1000
    }
    for (let r = 0; r < SPOILAGE_PAIRS; r++) {
      const off = cpuOf(noSpoilage)
      const on = cpuOf(options)
      refCpu.push(off)
      withCpu.push(on)
      pairRatios.push(on / off)
    }
    figures.push({
      name: '30-year assessment, CPU time',
      value: Math.round(median(cpuRuns)),
      unit: 'ms',
      note: 'process user + system CPU, median; differs from wall time when the machine is shared',
    })
    figures.push({
      name: '30-year assessment (open-air raisins, 90 start days)',
      value: Math.round(median(runs)),
      unit: 'ms',
      note: `median of ${ASSESS_REPEATS} after two warm-ups; best ${Math.round(Math.min(...runs))} ms; target < 500 ms; ${startRows} start days, ${batches} batches`,
    })
    figures.push({
      name: 'first assessment in this process',
      value: Math.round(first.ms),
      unit: 'ms',
      note: 'wall time; V8 compiles the engine while it runs (a one-off command pays this; a running server does not)',
    })
    figures.push({
      name: 'the same assessment without spoilage models, CPU time',
      value: Math.round(median(refCpu)),
      unit: 'ms',
      note: `median of ${SPOILAGE_PAIRS}, interleaved with as many runs with them (median ${Math.round(median(withCpu))} ms)`,
    })
    figures.push({
      name: 'with / without spoilage models (CPU time)',
      value: Math.round(100 * median(pairRatios)) / 100,
      unit: 'x',
      note: `median of ${SPOILAGE_PAIRS} interleaved pairs (${pairRatios.map((x) => x.toFixed(2)).join(', ')}); the spoilage model steps every hour of every batch`,
    })
    figures.push({
      name: 'heap growth over the timed assessments',
      value: Math.round((heapAfter - heapBefore) / 2 ** 20),
      unit: 'MiB',
      note: gc ? 'after a forced GC before' : 'no --expose-gc: includes garbage',
    })
    figures.push({
      name: 'resident set size after',
      value: Math.round(process.memoryUsage().rss / 2 ** 20),
      unit: 'MiB',
    })

    // Per-hour engine throughput (open air) vs moist-air columns, same hours.
    const response = tabulatedResponse(productResponse(profile))
    const solar = computeSolarColumns(series)
    const condOptions = {
      targetDb: moistureDbFromWbPct(18),
      initialWbPct: 78.2,
      loadingKgPerM2: 12,
      thresholds: parseDryingThresholds({}),
      maxProductTempC: 70,
      solar,
    }
    const method = parseDryingMethod({ kind: 'open-air' })
    computeHourlyConditions(series, method, response, condOptions)
    const engineMs = median(
      Array.from(
        { length: REPEATS },
        () => timed(() => computeHourlyConditions(series, method, response, condOptions)).ms,
      ),
    )
    const solarMs = median(Array.from({ length: REPEATS }, () => timed(() => computeSolarColumns(series)).ms))
    const n = series.hours
    const w = new Float64Array(n)
    const h = new Float64Array(n)
    const twb = new Float64Array(n)
    const airMs = median(
      Array.from(
        { length: REPEATS },
        () =>
          timed(() =>
            fillAirStateColumns(series, { humidityRatioKgPerKg: w, enthalpyKjPerKg: h, wetBulbC: twb }),
          ).ms,
      ),
    )
    const engineRate = n / (engineMs / 1000)
    const airRate = n / (airMs / 1000)
    figures.push({
      name: 'per-hour engine (open air, all columns + verdict)',
      value: Math.round(engineRate),
      unit: 'hours/s',
    })
    figures.push({
      name: 'sun and radiation columns (shared by methods)',
      value: Math.round(n / (solarMs / 1000)),
      unit: 'hours/s',
    })
    figures.push({
      name: 'moist-air columns (W, h, wet bulb)',
      value: Math.round(airRate),
      unit: 'hours/s',
      note: 'physics/air-columns.ts, same hours',
    })
    figures.push({ name: 'engine / moist-air throughput', value: engineRate / airRate, unit: 'x' })
    figures.push({
      name: 'assessment time / moist-air columns time',
      value: median(runs) / airMs,
      unit: 'x',
      note: 'whole assessment against one pass of the moist-air columns over the same 30 years',
    })

    const c = computeHourlyConditions(series, method, response, condOptions)
    let steps = 0
    const batchMs = timed(() => {
      for (let start = 8; start + 24 * 40 < n; start += 24 * 7) {
        steps += simulateBatch(c, response, {
          startIndex: start,
          maxHours: 24 * 40,
          initialDb: moistureDbFromWbPct(78.2),
          targetDb: moistureDbFromWbPct(18),
        }).hoursSimulated
      }
    }).ms
    figures.push({
      name: 'batch simulation',
      value: Math.round(steps / (batchMs / 1000)),
      unit: 'batch-hours/s',
      note: `${steps} hours, weekly starts over 30 years`,
    })
    return figures
  },
}

/**
 * @module bench/sections/ingest
 * Reading a 30-year hourly CSV end to end (papaparse, column mapping, unit conversion, time basis,
 * quality control, gap filling, humidity, row accounting: `readWeather`) against a bare papaparse
 * parse (`Papa.parse(text)`, default options) of the same text, in the same process.
 *
 * The text is generated here (seeded, invented weather: 30 years × 8766 h ≈ 263,000 rows, UTC ISO
 * timestamps, dry bulb, dew point, RH, station pressure, wind, GHI, rain) with a few faults (missing
 * codes, gaps) so that the quality-control paths run. One warm-up run of each, then {@link REPEATS}
 * timed runs of each in blocks, papaparse first: alternating them made each reading pay for the
 * garbage of the papaparse run before it (263,000 row arrays of strings), so the ratio measured the
 * collector's timing more than either parser. Figures are medians, with process CPU time (user +
 * system, all threads) beside the wall clock. Peak memory is the process's maximum resident
 * set size (`process.resourceUsage().maxRSS`) after each phase, so it includes the text and papaparse's
 * row arrays.
 */
import Papa from 'papaparse'
import { readWeather } from '../../src/weather/read-weather.ts'
import { type BenchFigure, type BenchSection, median, seededRandom } from '../section.ts'

const YEARS = 30
const REPEATS = 5
const SEED = 20261201

/** Invented 30-year hourly CSV text starting 1991-01-01T00:00Z at an invented site (40° N, 5° E). */
export function generateCsv(): { text: string; rows: number } {
  const random = seededRandom(SEED)
  const start = Date.UTC(1991, 0, 1)
  const end = Date.UTC(1991 + YEARS, 0, 1)
  const lines = [
    'time (UTC),dry bulb (°C),dew point (°C),relative humidity (%),station pressure (hPa),wind speed (m/s),GHI (W/m2),rain (mm)',
  ]
  let anomaly = 0
  let rows = 0
  for (let t = start; t < end; t += 3_600_000) {
    const day = (t - start) / 86_400_000
    const hour = new Date(t).getUTCHours()
    anomaly = 0.98 * anomaly + 0.3 * (random() - 0.5)
    const season = Math.cos(((day % 365.25) / 365.25 - 0.55) * 2 * Math.PI)
    const daily = Math.cos(((hour + 5 / 15 - 14.5) / 24) * 2 * Math.PI)
    const dryBulb = 14 + 9 * season + 5 * daily + 3 * anomaly
    const dew = Math.min(dryBulb - 0.5, 7 + 5 * season + anomaly + random())
    const es = (x: number) => 0.6112 * Math.exp((17.62 * x) / (243.12 + x)) // Magnus form, WMO-No. 8 (2018) Annex 4.B; for generating only
    const rh = (100 * es(dew)) / es(dryBulb)
    const sun = Math.max(0, Math.sin(((hour + 5 / 15 - 6) / 12) * Math.PI)) * (0.6 + 0.4 * season)
    const ghi = Math.round(850 * sun * (0.5 + 0.5 * random()))
    const rain = random() < 0.03 ? (random() * 3).toFixed(1) : '0.0'
    let dryText = dryBulb.toFixed(1)
    if (rows % 5000 === 17) dryText = '-9999'
    if (rows % 7919 === 3) dryText = ''
    lines.push(
      `${new Date(t).toISOString().slice(0, 16)}Z,${dryText},${dew.toFixed(1)},${rh.toFixed(1)},${(1013 + 8 * anomaly).toFixed(1)},${(2 + 3 * random()).toFixed(1)},${ghi},${rain}`,
    )
    rows++
  }
  return { text: `${lines.join('\n')}\n`, rows }
}

function seriesBytes(series: object): number {
  let bytes = 0
  for (const v of Object.values(series)) if (ArrayBuffer.isView(v)) bytes += v.byteLength
  return bytes
}

function cpuMs(): number {
  const u = process.cpuUsage()
  return (u.user + u.system) / 1000
}

function maxRssMb(): number {
  return process.resourceUsage().maxRSS / 1024
}

export const section: BenchSection = {
  id: 'ingest',
  title: 'readWeather on a 30-year hourly CSV vs a bare papaparse parse of the same text',
  run() {
    const { text, rows } = generateCsv()
    const mb = text.length / 1e6
    const rssAfterText = maxRssMb()
    const options = { latitudeDeg: 40, longitudeDeg: 5, elevationM: 300 }
    let parsedRows = Papa.parse(text).data.length
    let result = readWeather(text, options)
    const bare: number[] = []
    const full: number[] = []
    const bareCpu: number[] = []
    const fullCpu: number[] = []
    for (let k = 0; k < REPEATS; k++) {
      const c0 = cpuMs()
      const t0 = performance.now()
      parsedRows = Papa.parse(text).data.length
      bare.push((performance.now() - t0) / 1000)
      bareCpu.push((cpuMs() - c0) / 1000)
    }
    for (let k = 0; k < REPEATS; k++) {
      const c0 = cpuMs()
      const t0 = performance.now()
      result = readWeather(text, options)
      full.push((performance.now() - t0) / 1000)
      fullCpu.push((cpuMs() - c0) / 1000)
    }
    const rssEnd = maxRssMb()
    const bareS = median(bare)
    const fullS = median(full)
    const figures: BenchFigure[] = [
      {
        name: 'rows in the file',
        value: rows,
        unit: 'rows',
        note: `${mb.toFixed(1)} MB of text, ${parsedRows} papaparse rows incl. header and final empty line`,
      },
      {
        name: 'bare papaparse throughput',
        value: rows / bareS,
        unit: 'rows/s',
        note: `median of ${REPEATS}, ${(bareS * 1000).toFixed(0)} ms`,
      },
      {
        name: 'readWeather throughput',
        value: rows / fullS,
        unit: 'rows/s',
        note: `median of ${REPEATS}, ${(fullS * 1000).toFixed(0)} ms; best ${(Math.min(...full) * 1000).toFixed(0)} ms`,
      },
      {
        name: 'end-to-end / bare parse throughput',
        value: bareS / fullS,
        unit: 'x',
        note: 'medians (wall clock); target ≥ 1.0',
      },
      {
        name: 'end-to-end / bare parse, CPU time',
        value: median(bareCpu) / median(fullCpu),
        unit: 'x',
        note: 'medians (process CPU time)',
      },
      {
        name: 'end-to-end / bare parse, best runs',
        value: Math.min(...bare) / Math.min(...full),
        unit: 'x',
        note: 'fastest of each (less sensitive to machine load)',
      },
      { name: 'readWeather throughput', value: mb / fullS, unit: 'MB/s' },
      {
        name: 'peak RSS after generating the text',
        value: rssAfterText,
        unit: 'MB',
        note: 'process.resourceUsage().maxRSS',
      },
      {
        name: 'peak RSS after all runs',
        value: rssEnd,
        unit: 'MB',
        note: 'includes papaparse row arrays and the series',
      },
      {
        name: 'series size (typed arrays)',
        value: seriesBytes(result.series) / 1e6,
        unit: 'MB',
        note: 'what the engine keeps after the text and rows are freed',
      },
      {
        name: 'series hours',
        value: result.series.hours,
        unit: 'h',
        note: `rows used ${result.rows.used}, repaired ${result.rows.repaired}, rejected ${result.rows.rejected}`,
      },
    ]
    const r = result.rows
    if (r.used + r.repaired + r.rejected + r.superseded !== r.read) {
      throw new Error('row counts do not add up')
    }
    return figures
  },
}

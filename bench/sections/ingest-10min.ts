/**
 * @module bench/sections/ingest-10min
 * Reading a 30-year file of 10-minute readings (about 1.58 million rows): `readWeather` end to end,
 * which averages the instants and sums the rain of each hour under the coverage rule, against a bare
 * papaparse parse of the same text in its streaming mode (10 MB chunks, rows counted and dropped, so
 * that the reference does not hold 1.58 million row arrays at once). Target: read in under 10 s.
 *
 * The text is generated here (seeded, invented weather at an invented site, 40° N 5° E, UTC ISO
 * stamps every 10 minutes) with faults: about one reading in 997 missing, missing codes, a blank.
 * One warm-up run of each, then {@link REPEATS} timed runs of each in blocks (neither pays for the
 * other's garbage); figures are medians, with process CPU time beside the wall clock.
 */
import Papa from 'papaparse'
import { readWeather } from '../../src/weather/read-weather.ts'
import { type BenchFigure, type BenchSection, median, seededRandom } from '../section.ts'

const YEARS = 30
const REPEATS = 3
const SEED = 20261212
const STEP_MS = 600_000

/** Invented 30-year text of 10-minute readings starting 1991-01-01T00:00Z. */
export function generateTenMinuteCsv(): { text: string; rows: number } {
  const random = seededRandom(SEED)
  const start = Date.UTC(1991, 0, 1)
  const end = Date.UTC(1991 + YEARS, 0, 1)
  const parts: string[] = [
    'time (UTC),dry bulb (°C),relative humidity (%),station pressure (hPa),wind speed (m/s),GHI (W/m2),rain (mm)\n',
  ]
  let anomaly = 0
  let rows = 0
  let block: string[] = []
  for (let t = start; t < end; t += STEP_MS) {
    const day = (t - start) / 86_400_000
    const hour = (t % 86_400_000) / 3_600_000
    anomaly = 0.997 * anomaly + 0.12 * (random() - 0.5)
    const season = Math.cos(((day % 365.25) / 365.25 - 0.55) * 2 * Math.PI)
    const daily = Math.cos(((hour + 5 / 15 - 14.5) / 24) * 2 * Math.PI)
    const dryBulb = 14 + 9 * season + 5 * daily + 3 * anomaly
    const rh = Math.min(100, Math.max(5, 65 - 20 * daily - 10 * season + 8 * anomaly + 4 * random()))
    const sun = Math.max(0, Math.sin(((hour + 5 / 15 - 6) / 12) * Math.PI)) * (0.6 + 0.4 * season)
    const ghi = Math.round(850 * sun * (0.5 + 0.5 * random()))
    const rain = random() < 0.01 ? (random() * 0.8).toFixed(1) : '0.0'
    rows++
    if (rows % 997 === 0) continue // a reading the logger missed
    let dryText = dryBulb.toFixed(1)
    if (rows % 30_011 === 17) dryText = '-9999'
    if (rows % 47_521 === 3) dryText = ''
    block.push(
      `${new Date(t).toISOString().slice(0, 16)}Z,${dryText},${rh.toFixed(1)},${(1013 + 8 * anomaly).toFixed(1)},${(2 + 3 * random()).toFixed(1)},${ghi},${rain}\n`,
    )
    if (block.length === 10_000) {
      parts.push(block.join(''))
      block = []
    }
  }
  parts.push(block.join(''))
  const text = parts.join('')
  let lines = 0
  for (let k = text.indexOf('\n'); k >= 0; k = text.indexOf('\n', k + 1)) lines++
  return { text, rows: lines - 1 }
}

function cpuMs(): number {
  const u = process.cpuUsage()
  return (u.user + u.system) / 1000
}

/** Papaparse in its streaming mode over the text: rows counted, arrays dropped chunk by chunk. */
function papaStream(text: string): number {
  let rows = 0
  // papaparse streams a string in chunks too when given `chunk` (its StringStreamer); the typings
  // list `chunk` only for files and streams
  const config = {
    chunkSize: 10 * 1024 * 1024,
    chunk: (results: Papa.ParseResult<string[]>) => {
      rows += results.data.length
    },
  }
  Papa.parse<string[]>(text, config as unknown as Papa.ParseConfig<string[]>)
  return rows
}

export const section: BenchSection = {
  id: 'ingest-10min',
  title:
    'readWeather on a 30-year file of 10-minute readings vs a streaming papaparse parse of the same text',
  run() {
    const { text, rows } = generateTenMinuteCsv()
    const mb = text.length / 1e6
    const options = { latitudeDeg: 40, longitudeDeg: 5, elevationM: 300 }
    let papaRows = papaStream(text)
    let result = readWeather(text, options)
    const bare: number[] = []
    const bareCpu: number[] = []
    const full: number[] = []
    const fullCpu: number[] = []
    for (let k = 0; k < REPEATS; k++) {
      const c0 = cpuMs()
      const t0 = performance.now()
      papaRows = papaStream(text)
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
    const r = result.rows
    if (r.used + r.repaired + r.rejected + r.superseded !== r.read)
      throw new Error('row counts do not add up')
    if (result.hourly.stepMinutes !== 10)
      throw new Error(`step read as ${result.hourly.stepMinutes} min, not 10`)
    const fullS = median(full)
    const bareS = median(bare)
    const figures: BenchFigure[] = [
      {
        name: 'rows in the file',
        value: rows,
        unit: 'rows',
        note: `${mb.toFixed(0)} MB of text, ${papaRows} papaparse rows incl. header`,
      },
      {
        name: '30-year 10-minute file read',
        value: fullS,
        unit: 's',
        note: `readWeather, median of ${REPEATS}; best ${Math.min(...full).toFixed(2)} s; target < 10 s`,
      },
      {
        name: '30-year 10-minute file read, CPU time',
        value: median(fullCpu),
        unit: 's',
        note: 'process CPU time (user + system, all threads)',
      },
      {
        name: 'bare papaparse (streaming)',
        value: bareS,
        unit: 's',
        note: `median of ${REPEATS}; CPU ${median(bareCpu).toFixed(2)} s`,
      },
      {
        name: '10-minute read / bare parse throughput',
        value: bareS / fullS,
        unit: 'x',
        note: 'medians (wall clock)',
      },
      {
        name: '10-minute read / bare parse, CPU time',
        value: median(bareCpu) / median(fullCpu),
        unit: 'x',
        note: 'medians (process CPU time)',
      },
      {
        name: 'hours in the series',
        value: result.series.hours,
        unit: 'h',
        note: `${result.hourly.partialHours} hours with a reading missing, kept (coverage rule); rows used ${r.used}, repaired ${r.repaired}, rejected ${r.rejected}`,
      },
      {
        name: 'peak RSS after all runs',
        value: process.resourceUsage().maxRSS / 1024,
        unit: 'MB',
        note: 'process.resourceUsage().maxRSS',
      },
    ]
    return figures
  },
}

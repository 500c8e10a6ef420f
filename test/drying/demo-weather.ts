/**
 * The demo climates (invented sites, climate-demo/), read with the site metadata of climate-demo/sites.json
 * (the CSV files carry no coordinates): the UTC files as UTC (`utcOffsetHours` is the offset of the file's
 * own time stamps) with the site's zone as `siteTimeZone`. Cached per test process.
 */
import { readFileSync } from 'node:fs'
import { readWeather } from '../../src/weather/read-weather.ts'
import type { HourlySeries } from '../../src/weather/series.ts'

interface DemoSpec {
  file: string
  options: Record<string, unknown>
}

export const DEMO = {
  dryUpland: {
    file: 'climate-demo/ardentine-upland-2021-2024-utc.csv',
    options: {
      latitudeDeg: 38.3,
      longitudeDeg: -2.6,
      elevationM: 1050,
      utcOffsetHours: 0,
      siteTimeZone: 'Europe/Madrid',
    },
  },
  humidValley: {
    file: 'climate-demo/quillow-valley-2021-2023-local-dst-imperial.csv',
    options: { latitudeDeg: 43.6, longitudeDeg: -89.4, elevationM: 262, timeZone: 'America/Chicago' },
  },
  coolCoast: { file: 'climate-demo/gullhaven-coast-2022-2024.epw', options: {} },
  tropical: {
    file: 'climate-demo/tamarel-lowland-2021-2023-utc.csv',
    options: {
      latitudeDeg: 11.9,
      longitudeDeg: 104.6,
      elevationM: 95,
      utcOffsetHours: 0,
      siteTimeZone: 'Asia/Bangkok',
    },
  },
  typicalUpland: { file: 'climate-demo/ardentine-upland-typical-year.epw', options: {} },
  faultyLogger: {
    file: 'climate-demo/tamarel-lowland-2023-logger-faulty.csv',
    options: { latitudeDeg: 11.9, longitudeDeg: 104.6, elevationM: 95 },
  },
} satisfies Record<string, DemoSpec>

export type DemoKey = keyof typeof DEMO

const cache = new Map<string, HourlySeries>()

export function demoSeries(key: DemoKey): HourlySeries {
  const hit = cache.get(key)
  if (hit) return hit
  const spec: DemoSpec = DEMO[key]
  const series = readWeather(readFileSync(spec.file, 'utf8'), spec.options).series
  if (series.site.name === '') series.site.name = key
  cache.set(key, series)
  return series
}

/** The first `hours` hours of a series from index `from` (a smaller copy for fast tests). */
export function sliceSeries(s: HourlySeries, from: number, hours: number): HourlySeries {
  const to = Math.min(s.hours, from + hours)
  return {
    ...s,
    site: { ...s.site },
    hours: to - from,
    startUtcMs: s.startUtcMs.slice(from, to),
    dryBulbC: s.dryBulbC.slice(from, to),
    relativeHumidityPct: s.relativeHumidityPct.slice(from, to),
    pressureKpa: s.pressureKpa.slice(from, to),
    windMs: s.windMs.slice(from, to),
    ghiWm2: s.ghiWm2.slice(from, to),
    rainMm: s.rainMm.slice(from, to),
    quality: s.quality.slice(from, to),
  }
}

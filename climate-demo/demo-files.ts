/**
 * @module climate-demo/demo-files
 * Everything the demo generator writes, built in memory: which site goes into which format, which years,
 * and the `sites.json` catalogue. Pure: no file system, no clock; same seed → same bytes.
 */
import { localDstImperialCsv, utcSiCsv } from './csv-formats.ts'
import { multiYearEpw, typicalYearEpw } from './epw-format.ts'
import { faultyLoggerCsv } from './faulty-logger.ts'
import { ARDENTINE_UPLAND, type DemoSite, GULLHAVEN_COAST, QUILLOW_VALLEY, TAMAREL_LOWLAND } from './sites.ts'
import { chooseTypicalMonths } from './typical-year.ts'
import { type DemoHours, generateSiteHours } from './weather-model.ts'

/** The seed of the committed demo files. */
export const DEMO_SEED = 20_210_003

const HOUR_MS = 3_600_000
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec']

export interface DemoFile {
  /** Path relative to `climate-demo/`. */
  path: string
  text: string
}

/** One file's entry in `sites.json`. */
export interface DemoFileEntry {
  file: string
  format: string
  timeBasis: string
  units: string
  period: { start: string; end: string }
  rows: number
  shows: string
}

/**
 * Hours of `site` covering calendar years `firstYear`..`lastYear` in every clock used here, with a
 * day of margin either side; every file of a site is a slice of this one series, so its files agree.
 */
export function siteHoursForYears(
  site: DemoSite,
  firstYear: number,
  lastYear: number,
  seed: number,
): DemoHours {
  const firstStartUtcMs = Date.UTC(firstYear - 1, 11, 31)
  const hours = (Date.UTC(lastYear + 1, 0, 2) - firstStartUtcMs) / HOUR_MS
  return generateSiteHours(site, { firstStartUtcMs, hours, seed })
}

const rowsOf = (text: string, headerLines: number): number => text.split('\n').length - 1 - headerLines

function siteEntry(site: DemoSite, years: number[], files: DemoFileEntry[]) {
  return {
    id: site.id,
    name: site.name,
    region: site.region,
    climateType: site.climateType,
    latitudeDeg: site.latitudeDeg,
    longitudeDeg: site.longitudeDeg,
    elevationM: site.elevationM,
    timeZone: site.timeZone,
    utcOffsetHours: site.utcOffsetHours,
    windHeightM: 10,
    years,
    shows: site.shows,
    files,
  }
}

/** All committed demo files for `seed`, `sites.json` and the fault manifest included. */
export function buildDemoFiles(seed: number = DEMO_SEED): DemoFile[] {
  const out: DemoFile[] = []
  const catalogue: ReturnType<typeof siteEntry>[] = []

  // Dry upland: UTC multi-year CSV 2021–2024 (leap day 2024-02-29) and a typical-year EPW.
  const upland = ARDENTINE_UPLAND
  const uplandHours = siteHoursForYears(upland, 2021, 2024, seed)
  const uplandCsv = utcSiCsv(uplandHours, Date.UTC(2021, 0, 1), Date.UTC(2025, 0, 1))
  const choice = chooseTypicalMonths(upland, uplandHours, [2021, 2022, 2023, 2024])
  const note = choice.map((y, m) => `${MONTHS[m]} ${y}`).join('; ')
  const uplandEpw = typicalYearEpw(upland, uplandHours, choice, note)
  out.push({ path: 'ardentine-upland-2021-2024-utc.csv', text: uplandCsv })
  out.push({ path: 'ardentine-upland-typical-year.epw', text: uplandEpw })
  catalogue.push(
    siteEntry(
      upland,
      [2021, 2022, 2023, 2024],
      [
        {
          file: 'ardentine-upland-2021-2024-utc.csv',
          format: 'csv',
          timeBasis: 'UTC, ISO 8601 with Z; timestamp = start of the hour',
          units: 'SI: °C, %, kPa, m/s, W/m² (hour mean), mm (hour total)',
          period: { start: '2021-01-01T00:00Z', end: '2024-12-31T23:00Z' },
          rows: rowsOf(uplandCsv, 1),
          shows: 'a UTC multi-year file with a leap day (2024-02-29); the raisin/apricot sun-drying case',
        },
        {
          file: 'ardentine-upland-typical-year.epw',
          format: 'epw',
          timeBasis: 'local standard time UTC+1, no daylight saving; hour 1–24 = end of the interval',
          units: 'EPW (SI): °C, %, Pa, m/s, Wh/m² over the preceding hour, mm',
          period: { start: '01-01', end: '12-31' },
          rows: rowsOf(uplandEpw, 8),
          shows: `a typical year whose months come from different years (${note}); 8760 rows, no 29 February`,
        },
      ],
    ),
  )

  // Humid lake valley: local clock with daylight saving, °F and mph, 2021–2023.
  const valley = QUILLOW_VALLEY
  const valleyHours = siteHoursForYears(valley, 2021, 2023, seed)
  const off = valley.utcOffsetHours * HOUR_MS
  const valleyCsv = localDstImperialCsv(
    valley,
    valleyHours,
    Date.UTC(2021, 0, 1) - off,
    Date.UTC(2024, 0, 1) - off,
  )
  out.push({ path: 'quillow-valley-2021-2023-local-dst-imperial.csv', text: valleyCsv })
  catalogue.push(
    siteEntry(
      valley,
      [2021, 2022, 2023],
      [
        {
          file: 'quillow-valley-2021-2023-local-dst-imperial.csv',
          format: 'csv',
          timeBasis:
            'local wall clock America/Chicago WITH daylight saving, no offset written; timestamp = start of the hour; ' +
            'spring-forward hour (02:00) absent, fall-back hour (01:00) written twice',
          units: 'US customary: °F, %, inHg (station pressure), mph, W/m² (hour mean), inches (hour total)',
          period: { start: '2021-01-01T06:00Z', end: '2024-01-01T05:00Z' },
          rows: rowsOf(valleyCsv, 1),
          shows:
            'a logger export in local time with DST gaps and doubled hours, in °F and mph; humid grain-drying site',
        },
      ],
    ),
  )

  // Cool maritime coast: multi-year EPW 2022–2024 (leap year 2024 inside an EPW).
  const coast = GULLHAVEN_COAST
  const coastHours = siteHoursForYears(coast, 2022, 2024, seed)
  const coastEpw = multiYearEpw(coast, coastHours, 2022, 2024)
  out.push({ path: 'gullhaven-coast-2022-2024.epw', text: coastEpw })
  catalogue.push(
    siteEntry(
      coast,
      [2022, 2023, 2024],
      [
        {
          file: 'gullhaven-coast-2022-2024.epw',
          format: 'epw',
          timeBasis: 'local standard time UTC+0; hour 1–24 = end of the interval',
          units: 'EPW (SI): °C, %, Pa, m/s, Wh/m² over the preceding hour, mm',
          period: { start: '2022-01-01T00:00Z', end: '2024-12-31T23:00Z' },
          rows: rowsOf(coastEpw, 8),
          shows:
            'a multi-year (actual-year) EPW with m/d/yyyy data period and a leap day; windy, cloudy, humid',
        },
      ],
    ),
  )

  // Tropical wet/dry: UTC CSV 2021–2023 and the faulty logger year 2023.
  const tropic = TAMAREL_LOWLAND
  const tropicHours = siteHoursForYears(tropic, 2021, 2023, seed)
  const tropicCsv = utcSiCsv(tropicHours, Date.UTC(2021, 0, 1), Date.UTC(2024, 0, 1))
  const faulty = faultyLoggerCsv(tropic, tropicHours, 2023)
  out.push({ path: 'tamarel-lowland-2021-2023-utc.csv', text: tropicCsv })
  out.push({ path: 'tamarel-lowland-2023-logger-faulty.csv', text: faulty.text })
  out.push({
    path: 'tamarel-lowland-2023-logger-faulty.faults.json',
    text:
      JSON.stringify({ file: 'tamarel-lowland-2023-logger-faulty.csv', faults: faulty.faults }, null, 2) +
      '\n',
  })
  catalogue.push(
    siteEntry(
      tropic,
      [2021, 2022, 2023],
      [
        {
          file: 'tamarel-lowland-2021-2023-utc.csv',
          format: 'csv',
          timeBasis: 'UTC, ISO 8601 with Z; timestamp = start of the hour',
          units: 'SI: °C, %, kPa, m/s, W/m² (hour mean), mm (hour total)',
          period: { start: '2021-01-01T00:00Z', end: '2023-12-31T23:00Z' },
          rows: rowsOf(tropicCsv, 1),
          shows: 'wet season (May–Oct) against dry season (Nov–Apr) for coffee and cocoa',
        },
        {
          file: 'tamarel-lowland-2023-logger-faulty.csv',
          format: 'csv',
          timeBasis:
            'local standard time UTC+07:00 (in the header), `YYYY-MM-DD HH:MM`; timestamp = start of the hour',
          units: 'SI: °C, %, kPa, m/s, W/m² (hour mean), mm (hour total)',
          period: { start: '2022-12-31T17:00Z', end: '2023-12-31T16:00Z' },
          rows: faulty.rows,
          shows:
            'quality control: missing codes (-9999, 999.9), short and long gaps, a stuck RH sensor, negative night ' +
            'irradiance, a doubled row, a doubled hour with different values, an out-of-order row; ' +
            'see tamarel-lowland-2023-logger-faulty.faults.json for every fault with its line numbers',
        },
      ],
    ),
  )

  out.push({
    path: 'sites.json',
    text:
      JSON.stringify(
        {
          note: 'Invented data for invented sites (the Verrowmark co-operative scenario); for demonstration only.',
          periodNote:
            'period.start and period.end are the UTC starts of the first and the last hour of each file',
          seed,
          generator: 'climate-demo/generate.ts (npm run demo:generate)',
          sites: catalogue,
        },
        null,
        2,
      ) + '\n',
  })
  return out
}

/** Hourly UTC SI CSV of the dry upland over `firstYear`..`lastYear` (benchmarks: 30 years ≈ 263,000 rows). */
export function longUtcCsv(seed: number, firstYear = 1991, lastYear = 2020): string {
  const hours = siteHoursForYears(ARDENTINE_UPLAND, firstYear, lastYear, seed)
  return utcSiCsv(hours, Date.UTC(firstYear, 0, 1), Date.UTC(lastYear + 1, 0, 1))
}

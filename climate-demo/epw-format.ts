/**
 * @module climate-demo/epw-format
 * EPW (EnergyPlus weather) renderings of generated demo hours, following the EPW data dictionary as
 * summarised in the project's weather-file reference: 8 header lines, then 35 comma-separated fields per
 * hour in local STANDARD time (no daylight saving); hour 1–24 labels the END of the interval; radiation
 * fields are totals over the preceding hour [Wh/m²]; fields this model does not produce carry the
 * dictionary's missing codes. Pure functions returning text.
 */
import { fixed } from './csv-formats.ts'
import type { DemoSite } from './sites.ts'
import { inverseRelativeDistance, SOLAR_CONSTANT_WM2 } from './sky.ts'
import type { DemoHours } from './weather-model.ts'

const HOUR_MS = 3_600_000
const WEEKDAYS = ['Sunday', 'Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday']

/** Field 6 (data source and uncertainty flags): one text string; "?9" = source and uncertainty unknown. */
const SOURCE_FLAGS = '?9?9?9?9?9?9?9?9'

/** `LOCATION` header line: city, region, country, source, WMO (text), lat (+N), lon (+E), time zone [h], elevation [m]. */
export function epwLocationLine(site: DemoSite): string {
  return [
    'LOCATION',
    site.name,
    site.region.split(',')[0],
    'Verrowmark',
    'dryhours invented demo data',
    '000000',
    fixed(site.latitudeDeg, 2),
    fixed(site.longitudeDeg, 2),
    fixed(site.utcOffsetHours, 1),
    fixed(site.elevationM, 1),
  ].join(',')
}

/** One EPW data row for the hour of `hours` with index `k`, written at local standard time. */
export function epwDataRow(site: DemoSite, hours: DemoHours, k: number): string {
  const startUtcMs = hours.firstStartUtcMs + k * HOUR_MS
  const local = new Date(startUtcMs + site.utcOffsetHours * HOUR_MS)
  const dayStart = Date.UTC(local.getUTCFullYear(), 0, 1)
  const dayOfYear = Math.floor((local.getTime() - dayStart) / 86_400_000) + 1
  const etHorizontal = hours.extraterrestrialHorizontalWm2[k]
  const etNormal = etHorizontal > 0 ? SOLAR_CONSTANT_WM2 * inverseRelativeDistance(dayOfYear) : 0
  const cloudTenths = fixed(Math.round(hours.cloudFraction[k] * 10), 0)
  const fields = [
    String(local.getUTCFullYear()), // 1 year (for a typical year: the source year)
    String(local.getUTCMonth() + 1), // 2 month
    String(local.getUTCDate()), // 3 day
    String(local.getUTCHours() + 1), // 4 hour 1–24, end of the interval
    '0', // 5 minute
    SOURCE_FLAGS, // 6
    fixed(hours.dryBulbC[k], 1), // 7 dry bulb °C
    fixed(hours.dewPointC[k], 1), // 8 dew point °C
    fixed(Math.min(100, hours.relativeHumidityPct[k]), 0), // 9 RH %
    fixed(hours.pressureKpa[k] * 1000, 0), // 10 station pressure Pa
    fixed(etHorizontal, 0), // 11 extraterrestrial horizontal Wh/m²
    fixed(etNormal, 0), // 12 extraterrestrial direct normal Wh/m²
    '9999', // 13 horizontal infrared (not modelled)
    fixed(hours.ghiWm2[k], 0), // 14 global horizontal Wh/m² (hour mean W/m² × 1 h)
    '9999', // 15 direct normal (not modelled)
    '9999', // 16 diffuse horizontal (not modelled)
    '999999', // 17 global illuminance
    '999999', // 18 direct normal illuminance
    '999999', // 19 diffuse illuminance
    '9999', // 20 zenith luminance
    '999', // 21 wind direction (not modelled)
    fixed(hours.windMs[k], 1), // 22 wind speed m/s
    cloudTenths, // 23 total sky cover, tenths
    cloudTenths, // 24 opaque sky cover, tenths (taken equal to total)
    '9999', // 25 visibility
    '99999', // 26 ceiling height
    '9', // 27 present weather observation: not observed
    '999999999', // 28 present weather codes
    '999', // 29 precipitable water
    '.999', // 30 aerosol optical depth
    '999', // 31 snow depth
    '99', // 32 days since last snowfall
    '999', // 33 albedo
    fixed(hours.rainMm[k], 1), // 34 liquid precipitation depth mm
    '1', // 35 liquid precipitation quantity hr
  ]
  return fields.join(',')
}

interface EpwHeaderParts {
  site: DemoSite
  leapYearObserved: boolean
  comment1: string
  comment2: string
  /** e.g. `1,1,Data,Saturday,1/1/2022,12/31/2024`. */
  dataPeriods: string
}

function epwHeader(p: EpwHeaderParts): string[] {
  return [
    epwLocationLine(p.site),
    'DESIGN CONDITIONS,0',
    'TYPICAL/EXTREME PERIODS,0',
    'GROUND TEMPERATURES,0',
    `HOLIDAYS/DAYLIGHT SAVINGS,${p.leapYearObserved ? 'Yes' : 'No'},0,0,0`,
    `COMMENTS 1,${p.comment1}`,
    `COMMENTS 2,${p.comment2}`,
    `DATA PERIODS,${p.dataPeriods}`,
  ]
}

const isLeap = (y: number): boolean => (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0

/** Multi-year (actual-year) EPW for local standard years `firstYear`..`lastYear`, one data period. */
export function multiYearEpw(site: DemoSite, hours: DemoHours, firstYear: number, lastYear: number): string {
  const from = Date.UTC(firstYear, 0, 1) - site.utcOffsetHours * HOUR_MS
  const to = Date.UTC(lastYear + 1, 0, 1) - site.utcOffsetHours * HOUR_MS
  const weekday = WEEKDAYS[new Date(Date.UTC(firstYear, 0, 1)).getUTCDay()]
  let leap = false
  for (let y = firstYear; y <= lastYear; y++) leap ||= isLeap(y)
  const lines = epwHeader({
    site,
    leapYearObserved: leap,
    comment1: `Invented demo weather for an invented site; not a real station. Generated by the dryhours demo generator.`,
    comment2: `Actual-year series ${firstYear} to ${lastYear} in local standard time UTC${site.utcOffsetHours >= 0 ? '+' : ''}${site.utcOffsetHours}; leap days kept.`,
    dataPeriods: `1,1,Data,${weekday},1/1/${firstYear},12/31/${lastYear}`,
  })
  const k0 = (from - hours.firstStartUtcMs) / HOUR_MS
  const k1 = (to - hours.firstStartUtcMs) / HOUR_MS
  if (k0 < 0 || k1 > hours.hours)
    throw new RangeError(`EPW period ${firstYear}–${lastYear} is outside the generated hours`)
  for (let k = k0; k < k1; k++) lines.push(epwDataRow(site, hours, k))
  return lines.join('\n') + '\n'
}

/** A typical year: for each month, the source year it is taken from. */
export type TypicalYearChoice = readonly number[]

/**
 * Typical-year EPW: month m taken from year `choice[m]` (local standard time), 8760 rows, 29 February
 * left out (typical years have 365 days); the year field of each row is its source year.
 */
export function typicalYearEpw(
  site: DemoSite,
  hours: DemoHours,
  choice: TypicalYearChoice,
  note: string,
): string {
  if (choice.length !== 12) throw new RangeError(`typical-year choice needs 12 months, got ${choice.length}`)
  const weekday = WEEKDAYS[new Date(Date.UTC(choice[0], 0, 1)).getUTCDay()]
  const lines = epwHeader({
    site,
    leapYearObserved: false,
    comment1:
      'Invented demo weather for an invented site; not a real station. Generated by the dryhours demo generator.',
    comment2: `Typical year assembled from months of different years (${note}); 29 February left out; local standard time.`,
    dataPeriods: `1,1,Typical Year,${weekday},1/1,12/31`,
  })
  for (let m = 0; m < 12; m++) {
    const y = choice[m]
    const from = Date.UTC(y, m, 1) - site.utcOffsetHours * HOUR_MS
    const to = Date.UTC(y, m + 1, 1) - site.utcOffsetHours * HOUR_MS
    for (let t = from; t < to; t += HOUR_MS) {
      const k = (t - hours.firstStartUtcMs) / HOUR_MS
      if (k < 0 || k >= hours.hours)
        throw new RangeError(`month ${m + 1}/${y} is outside the generated hours`)
      const local = new Date(t + site.utcOffsetHours * HOUR_MS)
      if (local.getUTCMonth() === 1 && local.getUTCDate() === 29) continue
      lines.push(epwDataRow(site, hours, k))
    }
  }
  return lines.join('\n') + '\n'
}

/**
 * @module weather/dialects/nasa-power
 * NASA POWER hourly point CSV: a `-BEGIN HEADER-` … `-END HEADER-` block (title; `Dates
 * (month/day/year): … in UTC` or `in LST`; `Location: latitude … longitude …`; the elevation of the
 * MERRA-2 grid cell; the missing code, usually −999; one line per parameter with its unit), then
 * `YEAR,MO,DY,HR,<parameters>`. The row time is the start of the hour its averages and totals
 * describe (pvlib `iotools/nasa_power.py`: "the index corresponds to the start (left) of the
 * interval"). Units: T2M °C, RH2M %, PS kPa, WS10M m/s, ALLSKY_SFC_SW_DWN Wh/m² per hour (= W/m²
 * hour mean), PRECTOTCORR mm/hour. T2MDEW is the dew/frost point ("Dew/Frost Point" in the
 * header), so RH2M is taken for humidity. Local solar time (LST) is UTC + longitude/15 h.
 */
import { readDelimited } from '../delimited.ts'
import {
  type DialectContext,
  type DialectHead,
  type DialectReading,
  findLine,
  numberOf,
  stated,
  type WeatherDialect,
} from './dialect.ts'

/** The number after `key` in `line` (e.g. `latitude  40.4200`), NaN when absent. Hand-written scanner. */
function numberAfter(line: string, key: string): number {
  const at = line.toLowerCase().indexOf(key)
  if (at < 0) return Number.NaN
  let k = at + key.length
  while (k < line.length && (line[k] === ' ' || line[k] === ':' || line[k] === '=')) k++
  const from = k
  if (line[k] === '-' || line[k] === '+') k++
  while (k < line.length && ((line[k] >= '0' && line[k] <= '9') || line[k] === '.')) k++
  return numberOf(line.slice(from, k))
}

export const nasaPower: WeatherDialect = {
  id: 'nasa-power',
  title: 'NASA POWER hourly CSV',
  detect(head: DialectHead): boolean {
    return (head.lower[0] ?? '').trim() === '-begin header-' && head.lower.some((l) => l.includes('power'))
  },
  read(text: string, head: DialectHead, ctx: DialectContext): DialectReading {
    const end = findLine(head, (l) => l.trim() === '-end header-')
    const dates = head.lines[findLine(head, (l) => l.startsWith('dates'))] ?? ''
    const location = head.lines[findLine(head, (l) => l.startsWith('location'))] ?? ''
    const elevationLine = head.lines[findLine(head, (l) => l.startsWith('elevation'))] ?? ''
    const missingLine = head.lines[findLine(head, (l) => l.includes('missing'))] ?? ''
    const lat = numberAfter(location, 'latitude')
    const lon = numberAfter(location, 'longitude')
    const eq = elevationLine.lastIndexOf('=')
    const elevation = eq < 0 ? Number.NaN : numberAfter(elevationLine.slice(eq), '=')
    const colon = missingLine.lastIndexOf(':')
    const missingCode = colon < 0 ? -999 : numberOf(missingLine.slice(colon + 1))
    const lowerDates = dates.toLowerCase()
    const solarTime = lowerDates.includes(' lst')
    const { table, info } = readDelimited(text, ctx.mapping, ctx.log, ctx.warnings, {
      headerLine: ctx.headerLine,
      headerRow: end < 0 ? undefined : end + 1,
      missingCodes: [Number.isFinite(missingCode) ? missingCode : -999],
      columns: {
        only: true,
        columns: {
          year: { names: ['YEAR'] },
          month: { names: ['MO'] },
          day: { names: ['DY'] },
          dayOfYear: { names: ['DOY'] },
          hour: { names: ['HR'] },
          dryBulb: { names: ['T2M'], unit: 'C' },
          relativeHumidity: { names: ['RH2M'], unit: '%' },
          pressure: { names: ['PS'], unit: 'kPa' },
          wind: { names: ['WS10M', 'WS2M', 'WS50M'], unit: 'm/s' },
          ghi: { names: ['ALLSKY_SFC_SW_DWN'], unit: 'Wh/m2' },
          rain: { names: ['PRECTOTCORR', 'PRECTOT'], unit: 'mm' },
        },
      },
    })
    // T2MDEW (dew/frost point) only when the file has no RH2M.
    if (!table.columns.relativeHumidity && table.plan) {
      ctx.warnings.push('no RH2M column: give --map dewPoint=T2MDEW (it is the frost point below 0 °C)')
    }
    for (const variable of ['dryBulb', 'relativeHumidity', 'pressure', 'wind'] as const) {
      const col = table.columns[variable]
      if (col) col.timing = { kind: 'interval-mean', label: 'start', intervalMinutes: 60 }
    }
    if (table.columns.ghi)
      table.columns.ghi.timing = { kind: 'interval-mean', label: 'start', intervalMinutes: 60 }
    if (table.columns.rain)
      table.columns.rain.timing = { kind: 'interval-total', label: 'start', intervalMinutes: 60 }
    table.labels = 'start'
    table.sampling = 'readings'
    const windHeight =
      table.columns.wind?.source.toUpperCase() === 'WS2M'
        ? 2
        : table.columns.wind?.source.toUpperCase() === 'WS50M'
          ? 50
          : 10
    table.statements = stated({
      latitudeDeg: lat,
      longitudeDeg: lon,
      elevationM: elevation,
      windHeightM: table.columns.wind ? windHeight : undefined,
      timestampUtcOffsetHours: solarTime
        ? Number.isFinite(lon)
          ? lon / 15
          : undefined
        : lowerDates.includes('utc')
          ? 0
          : undefined,
      dialect: 'nasa-power',
    })
    ctx.notes.push(
      `NASA POWER header: ${solarTime ? 'local solar time (UTC + longitude/15 h)' : 'times in UTC'}; ` +
        `elevation ${Number.isFinite(elevation) ? `${elevation} m is the grid cell's mean` : 'not stated'}; ` +
        'each row describes the hour that starts at its time',
    )
    return { table, info }
  },
}

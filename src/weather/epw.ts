/**
 * @module weather/epw
 * EPW weather files (EnergyPlus Auxiliary Programs, "EnergyPlus Weather File (EPW) Data
 * Dictionary"): eight header lines (LOCATION gives latitude +N, longitude +E, time zone in hours
 * from GMT and elevation in m), then hourly rows of 35 fields. Hour 1–24 labels the end of the
 * interval in local standard time; radiation fields are totals over the preceding hour [Wh/m²],
 * equal in number to the mean irradiance over it [W/m²]; a value at or above its field's missing
 * code is missing.
 */

import type { ProblemLog } from './problem-log.ts'
import type { RawColumn, RawTable } from './raw-table.ts'
import { snippet } from './snippet.ts'
import { createTimestampColumns } from './timestamp-columns.ts'
import { siUnit, type UnitConversion, type WeatherVariable } from './units.ts'
import { WeatherInputError } from './weather-input-error.ts'

/** Fields used, 0-based index into the 35, missing code ("missing at or above") and unit. EPW data dictionary. */
export const EPW_FIELDS: Record<
  WeatherVariable,
  { index: number; name: string; missingAtOrAbove: number; unit: UnitConversion }
> = {
  dryBulb: {
    index: 6,
    name: 'Dry Bulb Temperature (field 7)',
    missingAtOrAbove: 99.9,
    unit: siUnit('dryBulb'),
  },
  dewPoint: {
    index: 7,
    name: 'Dew Point Temperature (field 8)',
    missingAtOrAbove: 99.9,
    unit: siUnit('dewPoint'),
  },
  relativeHumidity: {
    index: 8,
    name: 'Relative Humidity (field 9)',
    missingAtOrAbove: 999,
    unit: siUnit('relativeHumidity'),
  },
  pressure: {
    index: 9,
    name: 'Atmospheric Station Pressure (field 10)',
    missingAtOrAbove: 999999,
    unit: { unit: 'Pa', scale: 0.001, offset: 0 },
  },
  ghi: {
    index: 13,
    name: 'Global Horizontal Radiation (field 14)',
    missingAtOrAbove: 9999,
    unit: { unit: 'Wh/m² per hour', scale: 1, offset: 0 },
  },
  wind: { index: 21, name: 'Wind Speed (field 22)', missingAtOrAbove: 999, unit: siUnit('wind') },
  cloudCover: {
    index: 22,
    name: 'Total Sky Cover (field 23)',
    missingAtOrAbove: 99,
    unit: { unit: 'tenths', scale: 10, offset: 0 },
  },
  rain: {
    index: 33,
    name: 'Liquid Precipitation Depth (field 34)',
    missingAtOrAbove: 999,
    unit: siUnit('rain'),
  },
  wetBulb: { index: -1, name: 'none', missingAtOrAbove: 0, unit: siUnit('wetBulb') },
}

export interface EpwHeader {
  city: string
  region: string
  country: string
  source: string
  wmo: string
  latitudeDeg: number
  longitudeDeg: number
  utcOffsetHours: number
  elevationM: number
  recordsPerHour: number
  comments: string[]
}

/** True when the text starts like an EPW file. */
export function looksLikeEpw(text: string): boolean {
  return /^\uFEFF?\s*LOCATION\s*,/i.test(text)
}

function headerNumber(fields: string[], index: number, name: string, lo: number, hi: number): number {
  const v = Number((fields[index] ?? '').trim())
  if (fields[index] === undefined || fields[index].trim() === '' || !(v >= lo && v <= hi)) {
    throw new WeatherInputError(
      `EPW line 1 (LOCATION): ${name} '${snippet(fields[index] ?? '')}' is not a number in ${lo}…${hi}`,
      [name],
    )
  }
  return v
}

export function parseEpwHeader(lines: string[]): EpwHeader {
  const loc = lines[0].replace(/^\uFEFF/, '').split(',')
  const header: EpwHeader = {
    city: (loc[1] ?? '').trim(),
    region: (loc[2] ?? '').trim(),
    country: (loc[3] ?? '').trim(),
    source: (loc[4] ?? '').trim(),
    wmo: (loc[5] ?? '').trim(),
    latitudeDeg: headerNumber(loc, 6, 'latitude', -90, 90),
    longitudeDeg: headerNumber(loc, 7, 'longitude', -180, 180),
    utcOffsetHours: headerNumber(loc, 8, 'time zone', -12, 14),
    elevationM: headerNumber(loc, 9, 'elevation', -1000, 9999.9),
    recordsPerHour: 1,
    comments: [],
  }
  for (const line of lines.slice(1, 8)) {
    const upper = line.trim().toUpperCase()
    if (upper.startsWith('DATA PERIODS')) {
      const f = line.split(',')
      const per = Number(f[2])
      if (Number.isFinite(per) && per > 0) header.recordsPerHour = per
    } else if (upper.startsWith('COMMENTS')) header.comments.push(line.slice(line.indexOf(',') + 1).trim())
  }
  return header
}

export function readEpw(
  text: string,
  log: ProblemLog,
  warnings: string[],
): { table: RawTable; header: EpwHeader } {
  const all = text.split(/\r\n|\r|\n/)
  if (all.length < 9)
    throw new WeatherInputError(
      `EPW file has ${all.length} lines; the 8 header lines and hourly rows are needed`,
      ['rows'],
    )
  const header = parseEpwHeader(all.slice(0, 8))
  if (header.recordsPerHour !== 1) {
    throw new WeatherInputError(
      `EPW DATA PERIODS says ${header.recordsPerHour} records per hour; only hourly EPW files (1 per hour) are read`,
      ['hourly data'],
    )
  }
  const dataLines: number[] = []
  for (let k = 8; k < all.length; k++) if (all[k].trim() !== '') dataLines.push(k)
  const n = dataLines.length
  const lines = new Int32Array(n)
  const time = createTimestampColumns(n)
  const timeErrors: (string | undefined)[] = new Array(n)
  const used = (
    Object.entries(EPW_FIELDS) as [WeatherVariable, (typeof EPW_FIELDS)[WeatherVariable]][]
  ).filter(([, f]) => f.index >= 0)
  const values = used.map(() => new Float64Array(n).fill(Number.NaN))
  const missing = used.map(() => 0)
  let short = 0
  for (let i = 0; i < n; i++) {
    const k = dataLines[i]
    lines[i] = k + 1
    const f = all[k].split(',')
    if (f.length < 35) {
      short++
      if (short <= 20)
        log.add(
          k + 1,
          null,
          'short-row',
          `EPW row has ${f.length} fields, 35 expected: missing fields read as missing`,
        )
    }
    const year = Number(f[0])
    const month = Number(f[1])
    const day = Number(f[2])
    const hour = Number(f[3])
    if (
      !Number.isInteger(year) ||
      !Number.isInteger(month) ||
      !Number.isInteger(day) ||
      !Number.isInteger(hour) ||
      hour < 1 ||
      hour > 24
    ) {
      timeErrors[i] =
        `EPW year/month/day/hour '${snippet(f.slice(0, 4).join(','))}' not readable (hour must be 1–24)`
      continue
    }
    time.year[i] = year
    time.first[i] = month
    time.second[i] = day
    time.yearFirst[i] = 1
    time.minuteOfDay[i] = hour * 60
    for (let v = 0; v < used.length; v++) {
      const spec = used[v][1]
      const text = f[spec.index]
      const x = text === undefined || text.trim() === '' ? Number.NaN : Number(text)
      if (Number.isNaN(x) || x >= spec.missingAtOrAbove) missing[v]++
      else values[v][i] = x
    }
  }
  if (short > 20) warnings.push(`${short} EPW rows have fewer than 35 fields`)
  const columns: Partial<Record<WeatherVariable, RawColumn>> = {}
  used.forEach(([variable, spec], v) => {
    if (missing[v] === n) return // the whole field is missing: the variable is absent
    columns[variable] = {
      values: values[v],
      source: spec.name,
      conversion: spec.unit,
      unitSource: 'format',
      missingCount: missing[v],
      missingCodeCount: missing[v],
    }
    if (missing[v] > 0)
      warnings.push(
        `EPW ${spec.name}: ${missing[v]} values missing (at or above the code ${spec.missingAtOrAbove})`,
      )
  })
  return {
    table: {
      format: 'epw',
      rows: n,
      lines,
      time,
      timeErrors,
      columns,
      timing: { ghi: 'interval-total', rain: 'interval-total' },
      unusedColumns: [],
    },
    header,
  }
}

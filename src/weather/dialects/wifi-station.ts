/**
 * @module weather/dialects/wifi-station
 * History exports of consumer Wi-Fi weather stations (their apps and web dashboards): `Time` (or
 * `Date`) in the station's local time, then indoor and outdoor readings with the unit in brackets:
 * `Indoor Temperature(℉)`, `Outdoor Temperature(℉)`, `Outdoor Humidity(%)`, `Dew Point`, `Feels Like`,
 * `Wind(mph)`, `Gust`, `ABS Pressure(inHg)` (station pressure) and `REL Pressure` (reduced to sea level,
 * not used), `Solar Rad(w/m2)`, `UVI`, and rain counters: `Hourly Rain` (a rolling 60-minute total,
 * not used), `Event`, `Daily`, `Weekly`, `Monthly`, `Yearly Rain`. Rain is taken from the Daily Rain
 * counter, which resets at local midnight, as a running total. Readings are instantaneous. (Layout
 * of such exports, from memory; brand names kept generic.)
 */
import { readDelimited } from '../delimited.ts'
import {
  cellsOf,
  type DialectContext,
  type DialectHead,
  type DialectReading,
  stated,
  type WeatherDialect,
} from './dialect.ts'

/** Header names without the bracketed unit, lower case. */
function bareNames(line: string): string[] {
  return cellsOf(line.toLowerCase()).map((c) => {
    const b = c.search(/[([]/)
    return (b < 0 ? c : c.slice(0, b)).trim()
  })
}

export const wifiStation: WeatherDialect = {
  id: 'wifi-station',
  title: 'Consumer Wi-Fi weather-station export',
  detect(head: DialectHead): boolean {
    const names = bareNames(head.lines[0] ?? '')
    return (
      names.includes('outdoor temperature') &&
      names.some((n) => n.startsWith('indoor')) &&
      (names.some((n) => n.includes('abs') && n.includes('pressure')) || names.includes('daily rain'))
    )
  },
  read(text: string, _head: DialectHead, ctx: DialectContext): DialectReading {
    const { table, info } = readDelimited(text, ctx.mapping, ctx.log, ctx.warnings, {
      headerLine: ctx.headerLine,
      headerRow: 0,
      columns: {
        only: true,
        columns: {
          timestamp: { names: ['Time', 'Date'] },
          dryBulb: { names: ['Outdoor Temperature'] },
          relativeHumidity: { names: ['Outdoor Humidity', 'Humidity'] },
          dewPoint: { names: ['Dew Point'] },
          wind: { names: ['Wind', 'Wind Speed'] },
          pressure: { names: ['ABS Pressure', 'Absolute Pressure'] },
          ghi: { names: ['Solar Rad', 'Solar Radiation'] },
          rain: { names: ['Daily Rain'] },
        },
      },
    })
    if (table.columns.rain) table.columns.rain.timing = { kind: 'running-total' }
    table.labels = 'start'
    table.sampling = 'readings'
    table.statements = stated({ dialect: 'wifi-station', timestampsInSiteClock: true })
    ctx.notes.push(
      'Wi-Fi station export: outdoor readings only; ABS pressure is station pressure (REL is reduced to sea level, not used); ' +
        "rain from the Daily Rain counter (it resets at local midnight); the clock is the station's local time, not stated in the file",
    )
    return { table, info }
  },
}

/**
 * @module weather/dialects
 * The registry of known layouts, tried in this order before the generic reader. To add one, write
 * a module exporting a {@link WeatherDialect} and list it here (see DEVELOPERS.md).
 */

import { agNetwork } from './ag-network.ts'
import { consoleExport } from './console-export.ts'
import type { DialectHead, WeatherDialect } from './dialect.ts'
import { dwdHourly } from './dwd.ts'
import { era5 } from './era5.ts'
import { iemAsos } from './iem-asos.ts'
import { meteostat, meteostatBulk } from './meteostat.ts'
import { nasaPower } from './nasa-power.ts'
import { noaaIsd } from './noaa-isd.ts'
import { noaaLcd } from './noaa-lcd.ts'
import { nsrdbPsm } from './nsrdb-psm.ts'
import { openMeteo } from './open-meteo.ts'
import { pvgisHourly, pvgisTmy } from './pvgis.ts'
import { excelUnitsRow, spreadsheet } from './spreadsheet.ts'
import { toa5 } from './toa5.ts'
import { usbLogger } from './usb-logger.ts'
import { wifiStation } from './wifi-station.ts'

export type { DialectContext, DialectHead, DialectReading, WeatherDialect } from './dialect.ts'
export { dialectHead } from './dialect.ts'

/**
 * Tried in this order: layouts with a fixed signature first (a service's metadata block or exact
 * header), then device exports, then spreadsheets recognised by their header language or units row.
 */
export const DIALECTS: readonly WeatherDialect[] = [
  openMeteo,
  nasaPower,
  pvgisTmy,
  pvgisHourly,
  nsrdbPsm,
  noaaIsd,
  noaaLcd,
  iemAsos,
  meteostat,
  meteostatBulk,
  dwdHourly,
  era5,
  toa5,
  usbLogger,
  consoleExport,
  wifiStation,
  agNetwork,
  spreadsheet,
  excelUnitsRow,
]

/** The first dialect that recognises the head, or null (then the generic reader reads the file). */
export function detectDialect(head: DialectHead): WeatherDialect | null {
  for (const d of DIALECTS) if (d.detect(head)) return d
  return null
}

/** The dialect with this id, or null. */
export function dialectById(id: string): WeatherDialect | null {
  return DIALECTS.find((d) => d.id === id) ?? null
}

/**
 * @module weather/dialects
 * The registry of known layouts, tried in this order before the generic reader. To add one, write
 * a module exporting a {@link WeatherDialect} and list it here (see DEVELOPERS.md).
 */
import type { DialectHead, WeatherDialect } from './dialect.ts'
import { iemAsos } from './iem-asos.ts'
import { nasaPower } from './nasa-power.ts'
import { noaaIsd } from './noaa-isd.ts'
import { noaaLcd } from './noaa-lcd.ts'
import { openMeteo } from './open-meteo.ts'

export type { DialectContext, DialectHead, DialectReading, WeatherDialect } from './dialect.ts'
export { dialectHead } from './dialect.ts'

export const DIALECTS: readonly WeatherDialect[] = [openMeteo, nasaPower, noaaIsd, noaaLcd, iemAsos]

/** The first dialect that recognises the head, or null (then the generic reader reads the file). */
export function detectDialect(head: DialectHead): WeatherDialect | null {
  for (const d of DIALECTS) if (d.detect(head)) return d
  return null
}

/** The dialect with this id, or null. */
export function dialectById(id: string): WeatherDialect | null {
  return DIALECTS.find((d) => d.id === id) ?? null
}

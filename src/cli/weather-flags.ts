/**
 * @module cli/weather-flags
 * The weather options as CLI flags, for every command that reads a weather file (inspect, assess,
 * compare, energy-chart --weather): the flags, their help and their reading come from the one table in
 * `weather/option-spec.ts`.
 */
import { cliWeatherHelp, cliWeatherParseOptions } from '../weather/option-spec.ts'
import {
  checkWeatherOptions,
  WeatherOptionError,
  WeatherOptionsInvalid,
  weatherOptionsFromTexts,
} from '../weather/option-texts.ts'
import type { WeatherReadOptions } from '../weather/options.ts'
import { UsageError } from './command.ts'

/** parseArgs definitions of the weather flags. */
export const WEATHER_PARSE_OPTIONS = cliWeatherParseOptions()

/** The weather flags' help block. */
export const WEATHER_FLAGS_HELP = `Weather file (--utc-offset and --tz describe the file's time stamps; --site-tz the site's clock):
${cliWeatherHelp()}`

/** The reader options from parsed CLI values; bad values are a UsageError naming the flag. */
export function weatherOptionsFromCli(values: Record<string, unknown>): WeatherReadOptions {
  try {
    const raw = weatherOptionsFromTexts((s) => {
      const v = values[s.flag]
      if (v === undefined) return undefined
      return Array.isArray(v) ? v.map(String) : [String(v)]
    }, 'cli')
    return checkWeatherOptions(raw, 'cli')
  } catch (e) {
    if (e instanceof WeatherOptionError || e instanceof WeatherOptionsInvalid) throw new UsageError(e.message)
    throw e
  }
}

/**
 * @module weather
 * Public surface of the weather readers.
 */

export type { ColumnMapping, MappingKey, WeatherReadOptions } from './options.ts'
export { MAPPING_KEYS, parseMappingArgument, weatherReadOptionsSchema } from './options.ts'
export type { ProblemKind, WeatherProblem } from './problem-log.ts'
export {
  DEFAULT_WIND_HEIGHT_M,
  decodeWeatherBytes,
  parseWeatherOptions,
  readWeather,
  readWeatherBytes,
} from './read-weather.ts'
export type { ColumnReport, MonthCoverage, RowCounts, WeatherReadResult } from './result.ts'
export type { HourlySeries, SiteInfo, ValueTiming } from './series.ts'
export { QualityFlag } from './series.ts'
export { WeatherInputError } from './weather-input-error.ts'

/**
 * @module weather/weather-input-error
 * The error of an unusable weather file: what is missing and how to supply it.
 */

/** Unusable weather input. `message` says what is missing and how to supply it; `missing` lists the items. */
export class WeatherInputError extends Error {
  override name = 'WeatherInputError'
  /** What is missing or wrong, e.g. `['humidity', 'time zone']`. */
  readonly missing: string[]
  constructor(message: string, missing: string[] = []) {
    super(message)
    this.missing = missing
  }
}

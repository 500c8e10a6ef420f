/**
 * @module api/weather-options
 * Weather-reader options from a request: the query string (the parameters of `weather/option-spec.ts`,
 * one per CLI flag) or an `options` JSON object (the reader's own option names,
 * `weatherReadOptionsSchema`). Both end in the same validated `WeatherReadOptions`, and every message
 * names the option as the request gave it (query parameter or JSON key).
 */
import { z } from 'zod'
import { type OptionSurface, renderOptionNames, WEATHER_OPTION_SPECS } from '../weather/option-spec.ts'
import {
  checkWeatherOptions,
  WeatherOptionError,
  WeatherOptionsInvalid,
  weatherOptionsFromTexts,
} from '../weather/option-texts.ts'
import type { WeatherReadOptions } from '../weather/options.ts'
import type { WeatherReadResult } from '../weather/result.ts'
import type { WeatherInputError } from '../weather/weather-input-error.ts'
import { ApiProblem } from './problem.ts'

/** Query-string form of the weather options, one field per option of the shared table (documented in OpenAPI). */
export const weatherQueryFields = Object.fromEntries(
  WEATHER_OPTION_SPECS.map((s) => [
    s.param,
    z
      .string()
      .optional()
      .describe(
        `${s.description}${s.multiple ? '; several separated by ";"' : ''} (CLI --${s.flag} ${s.value})`,
      ),
  ]),
) as Record<string, z.ZodOptional<z.ZodString>>

export const weatherQuerySchema = z.strictObject(weatherQueryFields)

/** Weather options from query fields (already checked to be strings by {@link weatherQuerySchema} or a superset). */
export function weatherOptionsFromQuery(q: Record<string, unknown>): WeatherReadOptions {
  try {
    const raw = weatherOptionsFromTexts((s) => {
      const v = q[s.param]
      return typeof v === 'string' ? [v] : undefined
    }, 'query')
    return checkWeatherOptions(raw, 'query')
  } catch (e) {
    throw optionsProblem(e, 'query', '')
  }
}

/** Validate a weather-options object (JSON form); a 400 problem naming each bad field otherwise. */
export function validWeatherOptions(value: unknown, prefix: string): WeatherReadOptions {
  try {
    return checkWeatherOptions(value, 'json')
  } catch (e) {
    throw optionsProblem(e, 'json', prefix)
  }
}

function optionsProblem(e: unknown, surface: OptionSurface, prefix: string): unknown {
  const at = (name: string) => (prefix ? `${prefix}.${name}` : name)
  if (e instanceof WeatherOptionError) {
    const name = surface === 'json' ? e.spec.key : e.spec.param
    return new ApiProblem(400, prefix ? `${prefix}.${e.message}` : e.message, [
      { path: at(name), message: e.message },
    ])
  }
  if (e instanceof WeatherOptionsInvalid) {
    const fields = e.issues.map((i) => ({
      path: at(i.option),
      message: prefix ? `${prefix}.${i.message}` : i.message,
    }))
    return new ApiProblem(400, fields.map((f) => f.message).join('; '), fields)
  }
  return e
}

/** The surface a request's weather options came from: the JSON `options` part, or the query string. */
export function surfaceOf(jsonOptions: boolean): OptionSurface {
  return jsonOptions ? 'json' : 'query'
}

/** A weather file that cannot be used: 422, its message naming options as the request gives them. */
export function weatherInputProblem(e: WeatherInputError, surface: OptionSurface, file?: string): ApiProblem {
  const message = renderOptionNames(e.message, surface)
  return new ApiProblem(422, file ? `${file}: ${message}` : message)
}

/** A reading's messages (warnings, notes, problems) with option names as the request gives them. */
export function renderReadingMessages(r: WeatherReadResult, surface: OptionSurface): WeatherReadResult {
  if (surface === 'cli') return r
  return {
    ...r,
    warnings: r.warnings.map((w) => renderOptionNames(w, surface)),
    notes: r.notes.map((n) => renderOptionNames(n, surface)),
    problems: r.problems.map((p) => ({ ...p, message: renderOptionNames(p.message, surface) })),
  }
}

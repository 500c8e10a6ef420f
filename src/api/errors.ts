/**
 * @module api/errors
 * Every error a route can meet, mapped to a problem with a stable type. The core reports bad input with
 * RangeError (and its own error classes); the JavaScript engine also throws RangeError when a computation
 * outgrows it ("Maximum call stack size exceeded", "Invalid string length") or on a fault of ours ("Invalid
 * time value"). Those engine messages never reach a user: they become `resource-limit` or `internal`.
 */
import { HTTPException } from 'hono/http-exception'
import { AssessOptionError } from '../analysis/plan.ts'
import { WeatherInputError } from '../weather/weather-input-error.ts'
import { ApiProblem } from './problem.ts'
import { WorkStopped } from './work.ts'

/**
 * RangeError messages of V8 (Node and workerd run the same engine) when a computation needs more stack or
 * memory than it has: too many arguments spread into a call, a string or array over the engine's maximum
 * length, a buffer it cannot allocate. Observed on Node 20 (V8 11.3); `test/api/errors.test.ts` provokes each.
 */
const RUNTIME_LIMIT = [
  /^Maximum call stack size exceeded/,
  /^Invalid string length/,
  /^Invalid array length/,
  /^Invalid typed array length/,
  /^Invalid array buffer length/,
  /^Array buffer allocation failed/,
]

/**
 * RangeError messages of the engine's built-ins that mean a fault in dryhours, not in the input (a number
 * formatted with too many digits, an invalid date formatted, a bad code point or repeat count).
 */
const RUNTIME_FAULT = [
  /digits argument must be between/,
  /argument must be between \d+ and \d+$/,
  /^Invalid time value/,
  /^Invalid code point/,
  /^Invalid count value/,
  /radix must be between/,
  /^Invalid time zone specified/,
  /^Incorrect locale information/,
]

/**
 * Whether a message carries the engine's own text anywhere (an error's message wrapped in ours, such as
 * `file.csv: Maximum call stack size exceeded`): such a message is never shown.
 */
export function mentionsRuntimeText(message: string): boolean {
  return [...RUNTIME_LIMIT, ...RUNTIME_FAULT].some((r) =>
    new RegExp(r.source.replace(/^\^/, '')).test(message),
  )
}

/** The engine ran out of stack or memory for this input. */
export function isRuntimeLimit(e: unknown): boolean {
  return e instanceof RangeError && RUNTIME_LIMIT.some((r) => r.test(e.message))
}

/** A RangeError thrown by the engine's built-ins rather than by dryhours' own checks. */
export function isRuntimeFault(e: unknown): boolean {
  return e instanceof RangeError && (isRuntimeLimit(e) || RUNTIME_FAULT.some((r) => r.test(e.message)))
}

function resourceLimit(): ApiProblem {
  return new ApiProblem(
    422,
    'the input is too large for the engine to process (it ran out of memory or nesting depth); send fewer rows or a shorter period',
    undefined,
    'resource-limit',
  )
}

export interface ErrorMapping {
  /** Field path of an engine option (`deadlineDays` → `options.deadlineDays` or the query name). */
  optionPath?: (option: string) => string
  /** Status of the core's own RangeErrors (bad input): 422 for engine work, 400 for parameters. */
  rangeStatus?: 400 | 422
  /** Prefix of file messages, e.g. the file name. */
  filePrefix?: string
}

/**
 * The problem for an error, or null for an internal fault (the caller logs it and answers 500 with a
 * generic detail): no engine text is ever put in a problem.
 */
export function problemFor(e: unknown, mapping: ErrorMapping = {}): ApiProblem | null {
  if (e instanceof ApiProblem) return mentionsRuntimeText(e.message) ? resourceLimit() : e
  if (e instanceof WorkStopped) return e.problem()
  if (e instanceof HTTPException) {
    const status = e.status as ApiProblem['status']
    return new ApiProblem(status, e.message || 'request rejected')
  }
  if (isRuntimeLimit(e)) return resourceLimit()
  if (isRuntimeFault(e)) return null
  if (e instanceof Error && mentionsRuntimeText(e.message)) return resourceLimit()
  const prefix = mapping.filePrefix ? `${mapping.filePrefix}: ` : ''
  if (e instanceof WeatherInputError) return new ApiProblem(422, `${prefix}${e.message}`)
  if (e instanceof AssessOptionError) {
    const path = mapping.optionPath ? mapping.optionPath(e.option) : e.option
    return new ApiProblem(400, `${path}: ${e.message}`, [{ path, message: e.message }])
  }
  if (e instanceof RangeError) return new ApiProblem(mapping.rangeStatus ?? 422, `${prefix}${e.message}`)
  return null
}

/** Rethrow an error as its problem, or as itself when it is an internal fault (app.onError answers 500). */
export function rethrowAsProblem(e: unknown, mapping: ErrorMapping = {}): never {
  throw problemFor(e, mapping) ?? e
}

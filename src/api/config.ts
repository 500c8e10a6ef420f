/**
 * @module api/config
 * Limits of the API. Defaults are documented in the README; entry points may override them
 * (Node: environment variables read in src/node/server.ts; Workers: wrangler.toml vars).
 */
import type { DemoProvider } from '../web/demo-files.ts'

export interface ApiConfig {
  /** Largest request body accepted [bytes]; above it the answer is 413. Default 32 MiB. */
  maxBodyBytes: number
  /** Most data rows in one weather file; above it 413. Default 400,000 (45 years of hourly rows). */
  maxRows: number
  /**
   * Most fields on one line of a weather file (counted by the commonest delimiter: comma, semicolon or
   * tab); above it 413. Default 1,000 (EPW has 35 fields; station exports a few dozen). Reading cost grows
   * with the number of fields: 10 MB of commas on one line took over 20 s of one core to refuse.
   */
  maxColumns: number
  /** Most sites (files) in one comparison; above it 413. Default 8. */
  maxSites: number
  /**
   * Most simulated batch-hours per request (start dates × years × maximum batch length in hours,
   * summed over sites); above it 422 with how to split. Default 6,000,000: a 30-year file with a daily
   * 90-day season and the default 60-day batch limit needs 3.9 million.
   */
  maxBatchHours: number
  /**
   * Wall-clock budget per assessment [ms] (0 = none), checked between start dates; needs `now`.
   * Default 0 in the core; the Node server sets 60,000. On Workers the plan's CPU limit applies instead.
   */
  timeBudgetMs: number
  /** Clock for the time budget, supplied by the entry point (the core reads no clock). */
  now?: () => number
  /** Allowed CORS origins; empty = CORS off (the default). */
  corsOrigins: string[]
  /** Demo weather files for the page, from an entry point that can read them (Node); none on Workers. */
  demo?: DemoProvider
}

export const DEFAULT_API_CONFIG: ApiConfig = {
  maxBodyBytes: 32 * 1024 * 1024,
  maxRows: 400_000,
  maxColumns: 1_000,
  maxSites: 8,
  maxBatchHours: 6_000_000,
  timeBudgetMs: 0,
  corsOrigins: [],
}

/** Names of the settings, as environment variables (Node) or `[vars]` (wrangler.toml). */
export const CONFIG_VARIABLES = {
  maxBodyBytes: 'DRYHOURS_MAX_BODY_BYTES',
  maxRows: 'DRYHOURS_MAX_ROWS',
  maxColumns: 'DRYHOURS_MAX_COLUMNS',
  maxSites: 'DRYHOURS_MAX_SITES',
  maxBatchHours: 'DRYHOURS_MAX_BATCH_HOURS',
  timeBudgetMs: 'DRYHOURS_TIME_BUDGET_MS',
  corsOrigins: 'DRYHOURS_CORS_ORIGINS',
} as const

/**
 * Settings from string variables (environment or wrangler vars). A value that is not a positive number
 * is an error naming the variable: a misconfigured server should not start with a silent default.
 */
export function configFromVariables(vars: Record<string, string | undefined>): Partial<ApiConfig> {
  const out: Partial<ApiConfig> = {}
  for (const key of [
    'maxBodyBytes',
    'maxRows',
    'maxColumns',
    'maxSites',
    'maxBatchHours',
    'timeBudgetMs',
  ] as const) {
    const name = CONFIG_VARIABLES[key]
    const raw = vars[name]
    if (raw === undefined || raw.trim() === '') continue
    const n = Number(raw)
    if (!(Number.isFinite(n) && n >= 0 && (key === 'timeBudgetMs' || n > 0))) {
      throw new RangeError(`${name} must be a positive number, got '${raw}'`)
    }
    out[key] = n
  }
  const cors = vars[CONFIG_VARIABLES.corsOrigins]
  if (cors !== undefined && cors.trim() !== '') {
    out.corsOrigins = cors
      .split(',')
      .map((s) => s.trim())
      .filter((s) => s !== '')
  }
  return out
}

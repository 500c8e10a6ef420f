/**
 * @module api/config
 * Limits of the API: one set for every route that takes a file (API and page). Defaults are documented in
 * the README and listed in GET /openapi.json (`x-limits`); entry points may override them (Node:
 * environment variables read in src/node/server.ts; Workers: wrangler.toml vars).
 */
import type { DemoProvider } from '../web/demo-files.ts'

export interface ApiConfig {
  /** Largest request body accepted [bytes], also after gzip/deflate decoding; above it 413. Default 32 MiB. */
  maxBodyBytes: number
  /** Most data rows in one weather file; above it 413. Default 400,000 (45 years of hourly rows). */
  maxRows: number
  /**
   * Most fields on one line of any uploaded file (counted by the commonest delimiter: comma, semicolon or
   * tab); above it 413. Default 1,000 (EPW has 35 fields; station exports a few dozen). Reading cost grows
   * with the number of fields: 10 MB of commas on one line took over 20 s of one core to refuse.
   */
  maxColumns: number
  /**
   * Most rows (batches) in a dryer batch log (/v1/energy-chart); above it 413. Default 10,000: 27 years of
   * one batch a day. Without a limit, 200,000 batches as HTML took 35 s and 463 MB.
   */
  maxLogRows: number
  /** Most rows in a weighings file (/v1/fit); above it 413. Default 10,000: one a minute for a week (a fit of 20,000 took 3.4 s). */
  maxWeighings: number
  /** Most sites (files) in one comparison (API and page); above it 413. Default 8. */
  maxSites: number
  /**
   * Most simulated batch-hours per request (the engine's estimate, analysis/plan.ts, summed over sites);
   * above it 422 with how to split. Default 6,000,000: a 30-year file with a daily 90-day season and the
   * default 60-day batch limit needs about 5.0 million ((90 + 24) × 30 + 30 batches × 1,440 h).
   */
  maxBatchHours: number
  /**
   * Wall-clock budget per request [ms] (0 = none), from the moment it enters the app: decoding and reading
   * the files, the engine and the rendering. Needs `now`. Default 0 in the core; the Node server sets 60,000
   * (and stops a worker that overruns it). On Workers the plan's CPU limit applies instead.
   */
  timeBudgetMs: number
  /** Clock for the time budget, supplied by the entry point (the core reads no clock). */
  now?: () => number
  /** Allowed CORS origins; empty = CORS off (the default). */
  corsOrigins: string[]
  /** Demo weather files for the page, from an entry point that can read them (Node); none on Workers. */
  demo?: DemoProvider
  /** The entry point's worker pool, for the documentation of the limits (Node only). */
  pool?: { threads: number; queue: number; heapMb: number }
  /** The worker pool's state for GET /healthz (Node only). */
  workStats?: () => Record<string, number>
}

export const DEFAULT_API_CONFIG: ApiConfig = {
  maxBodyBytes: 32 * 1024 * 1024,
  maxRows: 400_000,
  maxColumns: 1_000,
  maxLogRows: 10_000,
  maxWeighings: 10_000,
  maxSites: 8,
  maxBatchHours: 6_000_000,
  timeBudgetMs: 0,
  corsOrigins: [],
}

type NumericSetting =
  | 'maxBodyBytes'
  | 'maxRows'
  | 'maxColumns'
  | 'maxLogRows'
  | 'maxWeighings'
  | 'maxSites'
  | 'maxBatchHours'
  | 'timeBudgetMs'

const NUMERIC_SETTINGS: NumericSetting[] = [
  'maxBodyBytes',
  'maxRows',
  'maxColumns',
  'maxLogRows',
  'maxWeighings',
  'maxSites',
  'maxBatchHours',
  'timeBudgetMs',
]

/** Names of the settings, as environment variables (Node) or `[vars]` (wrangler.toml). */
export const CONFIG_VARIABLES = {
  maxBodyBytes: 'DRYHOURS_MAX_BODY_BYTES',
  maxRows: 'DRYHOURS_MAX_ROWS',
  maxColumns: 'DRYHOURS_MAX_COLUMNS',
  maxLogRows: 'DRYHOURS_MAX_LOG_ROWS',
  maxWeighings: 'DRYHOURS_MAX_WEIGHINGS',
  maxSites: 'DRYHOURS_MAX_SITES',
  maxBatchHours: 'DRYHOURS_MAX_BATCH_HOURS',
  timeBudgetMs: 'DRYHOURS_TIME_BUDGET_MS',
  corsOrigins: 'DRYHOURS_CORS_ORIGINS',
} as const

/** A setting that cannot be used: the server should not start with a silent default. */
export class ConfigError extends Error {
  override name = 'ConfigError'
}

/**
 * Settings from string variables (environment or wrangler vars). A value that is not a positive number
 * is a {@link ConfigError} naming the variable.
 */
export function configFromVariables(vars: Record<string, string | undefined>): Partial<ApiConfig> {
  const out: Partial<ApiConfig> = {}
  for (const key of NUMERIC_SETTINGS) {
    const name = CONFIG_VARIABLES[key]
    const raw = vars[name]
    if (raw === undefined || raw.trim() === '') continue
    const n = Number(raw)
    if (!(Number.isFinite(n) && n >= 0 && (key === 'timeBudgetMs' || n > 0))) {
      throw new ConfigError(`${name} must be a positive number, got '${raw}'`)
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

export interface LimitEntry {
  /** Setting name in {@link ApiConfig}. */
  setting: string
  variable: string
  value: number
  unit: string
  /** Status (and problem type) of a request above it. */
  answer: string
  applies: string
}

/** The limits in force, for GET /openapi.json (`x-limits`) and the docs page. */
export function limitsTable(config: ApiConfig): LimitEntry[] {
  const entries: LimitEntry[] = [
    {
      setting: 'maxBodyBytes',
      variable: CONFIG_VARIABLES.maxBodyBytes,
      value: config.maxBodyBytes,
      unit: 'bytes',
      answer: '413 too-large',
      applies: 'every request body, also after gzip or deflate decoding',
    },
    {
      setting: 'maxRows',
      variable: CONFIG_VARIABLES.maxRows,
      value: config.maxRows,
      unit: 'rows per weather file',
      answer: '413 too-large',
      applies: '/v1/inspect, /v1/assess, /v1/compare, the weather part of /v1/energy-chart, the page',
    },
    {
      setting: 'maxColumns',
      variable: CONFIG_VARIABLES.maxColumns,
      value: config.maxColumns,
      unit: 'fields per line',
      answer: '413 too-large',
      applies: 'every uploaded file',
    },
    {
      setting: 'maxLogRows',
      variable: CONFIG_VARIABLES.maxLogRows,
      value: config.maxLogRows,
      unit: 'rows per batch log',
      answer: '413 too-large',
      applies: '/v1/energy-chart',
    },
    {
      setting: 'maxWeighings',
      variable: CONFIG_VARIABLES.maxWeighings,
      value: config.maxWeighings,
      unit: 'rows per weighings file',
      answer: '413 too-large',
      applies: '/v1/fit',
    },
    {
      setting: 'maxSites',
      variable: CONFIG_VARIABLES.maxSites,
      value: config.maxSites,
      unit: 'files per comparison',
      answer: '413 too-large',
      applies: '/v1/compare, the page',
    },
    {
      setting: 'maxBatchHours',
      variable: CONFIG_VARIABLES.maxBatchHours,
      value: config.maxBatchHours,
      unit: 'simulated batch-hours per request',
      answer: '422 too-much-work',
      applies: '/v1/assess, /v1/compare, the page',
    },
    {
      setting: 'timeBudgetMs',
      variable: CONFIG_VARIABLES.timeBudgetMs,
      value: config.timeBudgetMs,
      unit: 'ms per request (0 = none)',
      answer: '422 time-budget',
      applies: 'every route that takes a file, reading included',
    },
  ]
  if (config.pool) {
    entries.push(
      {
        setting: 'threads',
        variable: 'DRYHOURS_WORKERS',
        value: config.pool.threads,
        unit: 'worker threads (Node)',
        answer: '',
        applies: 'requests that take a file run on these threads',
      },
      {
        setting: 'queue',
        variable: 'DRYHOURS_QUEUE',
        value: config.pool.queue,
        unit: 'requests waiting for a thread (Node)',
        answer: '503 busy, with Retry-After',
        applies: 'requests that take a file',
      },
      {
        setting: 'heapMb',
        variable: 'DRYHOURS_WORKER_HEAP_MB',
        value: config.pool.heapMb,
        unit: 'MiB of heap per worker thread (Node)',
        answer: '422 resource-limit',
        applies: 'requests that take a file; a request that needs more stops only its own thread',
      },
    )
  }
  return entries
}

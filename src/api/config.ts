/**
 * @module api/config
 * Limits of the API. Defaults are documented in the README; entry points may override them
 * (Node: environment variables read in src/node/server.ts; Workers: wrangler.toml vars).
 */
export interface ApiConfig {
  /** Largest request body accepted [bytes]; above it the answer is 413. Default 32 MiB. */
  maxBodyBytes: number
  /** Allowed CORS origins; empty = CORS off (the default). */
  corsOrigins: string[]
}

export const DEFAULT_API_CONFIG: ApiConfig = {
  maxBodyBytes: 32 * 1024 * 1024,
  corsOrigins: [],
}

/**
 * Shared pieces of the hostile-input catalogue: the app, request helpers, the problem-details check,
 * and small invented weather files (generated in memory; demo data only).
 */
import { expect } from 'vitest'
import { createApp } from '../../src/api/app.ts'

export const app = createApp()

export type App = ReturnType<typeof createApp>

export function post(url: string, body: BodyInit, type?: string, on: App = app): Promise<Response> {
  return Promise.resolve(
    on.request(url, { method: 'POST', body, headers: type ? { 'content-type': type } : undefined }),
  )
}

export interface ProblemJson {
  type: string
  title: string
  status: number
  detail: string
  errors?: { path: string; message: string }[]
}

/** Stack-trace text: a frame line (` at `) together with a source-file position (`.ts:`). */
export function looksLikeStackTrace(text: string): boolean {
  return /\sat\s/.test(text) && /\.ts:\d/.test(text)
}

/**
 * Assert an RFC 9457 problem-details answer (RFC 9457 §3: type, title, status, detail) with a 4xx status
 * (one of `statuses` when given) and no stack trace; returns the body.
 */
export async function expectProblem(res: Response, statuses?: number[]): Promise<ProblemJson> {
  expect(res.status).toBeGreaterThanOrEqual(400)
  expect(res.status).toBeLessThan(500)
  if (statuses) expect(statuses).toContain(res.status)
  expect(res.headers.get('content-type')).toBe('application/problem+json')
  const text = await res.text()
  expect(looksLikeStackTrace(text)).toBe(false)
  const body = JSON.parse(text) as ProblemJson
  expect(body.status).toBe(res.status)
  expect(typeof body.detail).toBe('string')
  expect(body.detail.length).toBeGreaterThan(0)
  expect(typeof body.title).toBe('string')
  return body
}

export interface InspectJson {
  format: string
  rows: { read: number; used: number; repaired: number; rejected: number; superseded: number }
  period: { start: string; end: string }
  hours: number
  years: number[]
  columns: { variable: string; source: string; unit: string }[]
  site: { name: string; latitudeDeg: number | null; longitudeDeg: number | null; elevationM: number | null }
  coverage: { year: number; month: number; percent: number }[]
  problemCounts: Record<string, number>
  problems: { line: number | null; variable?: string; kind: string; message: string }[]
  warnings: string[]
}

/** A 200 answer of /v1/inspect with its row accounting checked (read = used + repaired + rejected). */
export async function expectInspect(res: Response): Promise<InspectJson> {
  expect(res.status).toBe(200)
  const body = (await res.json()) as InspectJson
  expect(body.rows.used + body.rows.repaired + body.rows.rejected + body.rows.superseded).toBe(body.rows.read)
  return body
}

export const THREE_HOURS = [
  '2024-07-01T10:00Z,30.1,25',
  '2024-07-01T11:00Z,31.5,22',
  '2024-07-01T12:00Z,32.8,20',
]

/** A small UTC CSV with the header `time,temp_c,rh_pct`. */
export function csvOf(rows: string[]): string {
  return `time,temp_c,rh_pct\n${rows.join('\n')}\n`
}

/**
 * `days` of invented hourly weather from 2024-07-01 UTC: a sine day with dry bulb mean `meanC`,
 * RH mean `meanRh` (RH lowest in the afternoon), sun by day and a wind that varies (so no
 * stuck-sensor check fires).
 */
export function inventedDays(days: number, meanC = 24, meanRh = 45, swingRh = 20): string {
  const rows = ['time,temp_c,rh_pct,ghi_wm2,wind_ms']
  for (let h = 0; h < 24 * days; h++) {
    const hour = h % 24
    const phase = Math.sin(((hour - 9) / 24) * 2 * Math.PI)
    const t = meanC + 10 * phase
    const rh = meanRh - swingRh * phase
    const ghi = hour >= 6 && hour <= 18 ? Math.round(900 * Math.sin(((hour - 6) / 12) * Math.PI)) : 0
    const stamp = new Date(Date.UTC(2024, 6, 1, h)).toISOString().slice(0, 16)
    rows.push(`${stamp}Z,${t.toFixed(1)},${rh.toFixed(0)},${ghi},${(2 + Math.sin(h)).toFixed(1)}`)
  }
  return `${rows.join('\n')}\n`
}

/** Coarse season options (two start dates, short batches) so an assessment stays fast. */
export const COARSE = {
  product: 'figs',
  method: 'open-air',
  seasonStart: '07-01',
  seasonEnd: '07-02',
  startStepDays: 1,
  maxDays: 10,
  deadlineDays: 10,
}

/** Coarse query string for a raw-body /v1/assess. */
export const COARSE_QUERY =
  '/v1/assess?product=figs&method=open-air&start=07-01&end=07-02&stepDays=1&maxDays=10&deadlineDays=10'

/** A multipart body: one `file` part (bytes or text, with a file name) and an `options` part. */
export function multipart(
  file: BlobPart,
  fileName: string,
  options?: unknown,
  rawOptions?: string,
): FormData {
  const form = new FormData()
  form.append('file', new Blob([file]), fileName)
  if (rawOptions !== undefined) form.append('options', rawOptions)
  else if (options !== undefined) form.append('options', JSON.stringify(options))
  return form
}

/** Encode text as UTF-16 with a byte-order mark. */
export function utf16(text: string, bigEndian: boolean): Uint8Array<ArrayBuffer> {
  const out = new Uint8Array(2 + text.length * 2)
  out[0] = bigEndian ? 0xfe : 0xff
  out[1] = bigEndian ? 0xff : 0xfe
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i)
    out[2 + 2 * i] = bigEndian ? c >> 8 : c & 0xff
    out[3 + 2 * i] = bigEndian ? c & 0xff : c >> 8
  }
  return out
}

/** Deterministic pseudo-random bytes (a 32-bit linear congruential generator, Numerical Recipes constants). */
export function garbageBytes(n: number, seed = 12345): Uint8Array<ArrayBuffer> {
  const out = new Uint8Array(n)
  let s = seed >>> 0
  for (let i = 0; i < n; i++) {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0
    out[i] = s >>> 24
  }
  return out
}

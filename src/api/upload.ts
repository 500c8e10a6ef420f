/**
 * @module api/upload
 * Reading uploaded files from a request: a raw body (`text/csv`, `text/plain`, `application/octet-stream`)
 * with options in the query string, or `multipart/form-data` with file parts and an `options` JSON part.
 * Anything else is a 415 problem that says which types are accepted. The text of each file is checked
 * against the row and column limits of its kind before any reader runs.
 */
import type { Context } from 'hono'
import { decodeWeatherBytes } from '../weather/read-weather.ts'
import { charsetOf, checkedCharset } from './body.ts'
import type { ApiConfig } from './config.ts'
import { ApiProblem } from './problem.ts'

export interface UploadedFile {
  /** Name as sent by the client (untrusted; escape before display), or a default. */
  name: string
  /** Multipart field name ('' for a raw body). */
  field: string
  bytes: Uint8Array
  /** Charset declared by the client (content type of the body or of the part), when any. */
  charset?: string
}

export interface Upload {
  files: UploadedFile[]
  /** The `options` part parsed as JSON, or the query-string options; undefined when none were sent. */
  options: unknown
  /** The `sites` part parsed as JSON (a list of sites with their own settings); undefined when not sent. */
  sites?: unknown
  /** Query-string parameters (always available; no prototype, so `__proto__` is a key like any other). */
  query: Record<string, string>
}

const RAW_TYPES = ['text/csv', 'text/plain', 'application/octet-stream', 'text/tab-separated-values']

function mediaType(c: Context): string {
  return (c.req.header('content-type') ?? '').split(';')[0].trim().toLowerCase()
}

/** Query parameters as an object without prototype (the last value wins for repeated keys). */
export function queryParams(url: string): Record<string, string> {
  const out: Record<string, string> = Object.create(null)
  for (const [k, v] of new URL(url).searchParams) out[k] = v
  return out
}

/**
 * Decode uploaded bytes to text. A byte-order mark decides first (UTF-8, UTF-16 LE/BE, as the WHATWG
 * Encoding standard's decode does); then the declared charset; then UTF-8, or ISO-8859-1 (windows-1252) when
 * the bytes are not valid UTF-8 — the same rule as the CLI (`decodeWeatherBytes`).
 */
export function decodeUploadText(bytes: Uint8Array, charset?: string): string {
  const bom =
    (bytes.length >= 2 &&
      ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff))) ||
    (bytes.length >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf)
  if (charset === undefined || bom) return decodeWeatherBytes(bytes)
  return new TextDecoder(charset).decode(bytes)
}

/** Parse a JSON options part; 400 naming the part, without the engine's parser message. */
export function parseOptionsJson(text: string, path = 'options'): unknown {
  try {
    return JSON.parse(text)
  } catch {
    throw new ApiProblem(
      400,
      `the ${path} part is not valid JSON (check quotes, commas and braces)`,
      [{ path, message: 'not valid JSON' }],
      'unreadable-body',
    )
  }
}

/** Read the request's files and options. */
export async function readUpload(c: Context, opts: { defaultName: string }): Promise<Upload> {
  const query = queryParams(c.req.url)
  const type = mediaType(c)
  if (type === 'multipart/form-data') {
    let form: FormData
    try {
      form = await c.req.formData()
    } catch {
      throw new ApiProblem(
        400,
        'the multipart body could not be parsed (check the boundary and the parts)',
        undefined,
        'unreadable-body',
      )
    }
    const files: UploadedFile[] = []
    let options: unknown
    let sites: unknown
    for (const [field, value] of form.entries()) {
      if (field === 'options') {
        const text = typeof value === 'string' ? value : await value.text()
        options = parseOptionsJson(text)
      } else if (field === 'sites') {
        const text = typeof value === 'string' ? value : await value.text()
        sites = parseOptionsJson(text, 'sites')
      } else if (typeof value !== 'string') {
        files.push({
          name: value.name || opts.defaultName,
          field,
          bytes: new Uint8Array(await value.arrayBuffer()),
          charset: checkedCharset(charsetOf(value.type), field),
        })
      } else if (field === 'file' || field.startsWith('file') || field === 'site') {
        // A file pasted as a text field.
        files.push({
          name: opts.defaultName,
          field,
          bytes: new TextEncoder().encode(value),
          charset: 'utf-8',
        })
      }
    }
    return { files, options, sites, query }
  }
  if (RAW_TYPES.includes(type)) {
    const charset = checkedCharset(charsetOf(c.req.header('content-type')), 'content-type')
    let bytes: Uint8Array
    try {
      bytes = new Uint8Array(await c.req.arrayBuffer())
    } catch (e) {
      if (e instanceof ApiProblem) throw e
      // The client went away or the body stream broke: the request, not the server, is at fault.
      throw new ApiProblem(
        400,
        'the request body could not be read completely (connection closed?)',
        undefined,
        'unreadable-body',
      )
    }
    return {
      files: [{ name: query.name ?? opts.defaultName, field: '', bytes, charset }],
      options: undefined,
      query,
    }
  }
  throw new ApiProblem(
    415,
    `content type '${type.slice(0, 60) || '(none)'}' is not accepted; send the file as text/csv, text/plain or application/octet-stream, or as multipart/form-data with a file part`,
  )
}

/** Data rows of a text, counted cheaply before parsing (line breaks). */
export function roughRowCount(text: string): number {
  let n = 0
  for (let i = text.indexOf('\n'); i !== -1; i = text.indexOf('\n', i + 1)) n++
  return n
}

/**
 * Most fields on any line: per line, the count of the commonest of comma, semicolon and tab, plus one
 * (quoted delimiters count too: an upper bound). Stops at the first line wider than `limit`.
 */
export function widestLineFields(text: string, limit = Number.POSITIVE_INFINITY): number {
  let widest = 0
  let commas = 0
  let semicolons = 0
  let tabs = 0
  for (let i = 0; i <= text.length; i++) {
    const ch = i < text.length ? text.charCodeAt(i) : 10
    if (ch === 44) commas++
    else if (ch === 59) semicolons++
    else if (ch === 9) tabs++
    else if (ch === 10 || ch === 13) {
      const fields = Math.max(commas, semicolons, tabs) + 1
      if (fields > widest) {
        widest = fields
        if (widest > limit) return widest
      }
      commas = 0
      semicolons = 0
      tabs = 0
    }
  }
  return widest
}

/** What a file holds, for its row limit and the advice when it is over. */
export type FileKind = 'weather' | 'log' | 'weighings'

const ROW_LIMIT: Record<FileKind, { setting: 'maxRows' | 'maxLogRows' | 'maxWeighings'; advice: string }> = {
  weather: { setting: 'maxRows', advice: 'split it by years and send the parts' },
  log: { setting: 'maxLogRows', advice: 'chart the batches of a few seasons at a time' },
  weighings: { setting: 'maxWeighings', advice: 'keep one weighing every few minutes' },
}

/**
 * The file's text, refused with a 413 naming the file when it has more rows or wider lines than the
 * configured limits for its kind (the header and a few comment lines are allowed beyond the row limit).
 */
export function checkedUploadText(file: UploadedFile, config: ApiConfig, kind: FileKind = 'weather'): string {
  const text = decodeUploadText(file.bytes, file.charset)
  const fields = widestLineFields(text, config.maxColumns)
  const path = file.field || 'body'
  if (fields > config.maxColumns) {
    throw new ApiProblem(
      413,
      `${file.name} has a line with ${fields} fields, more than the limit of ${config.maxColumns} columns; remove the columns you do not need${kind === 'weather' ? ' (keep time, dry bulb, humidity and any of pressure, wind, irradiance, rain)' : ''}`,
      [{ path, message: `more than ${config.maxColumns} columns` }],
    )
  }
  const rows = roughRowCount(text)
  const { setting, advice } = ROW_LIMIT[kind]
  const limit = config[setting]
  if (rows > limit + 10) {
    throw new ApiProblem(
      413,
      `${file.name} has about ${rows} rows, more than the limit of ${limit}; ${advice}`,
      [{ path, message: `more than ${limit} rows` }],
    )
  }
  return text
}

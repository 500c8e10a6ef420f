/**
 * @module api/upload
 * Reading uploaded files from a request: a raw body (`text/csv`, `text/plain`, `application/octet-stream`)
 * with options in the query string, or `multipart/form-data` with file parts and an `options` JSON part.
 * Anything else is a 415 problem that says which types are accepted.
 */
import type { Context } from 'hono'
import type { ApiConfig } from './config.ts'
import { ApiProblem } from './problem.ts'

export interface UploadedFile {
  /** Name as sent by the client (untrusted; escape before display), or a default. */
  name: string
  /** Multipart field name ('' for a raw body). */
  field: string
  bytes: Uint8Array
}

export interface Upload {
  files: UploadedFile[]
  /** The `options` part parsed as JSON, or the query-string options; undefined when none were sent. */
  options: unknown
  /** Query-string parameters (always available). */
  query: Record<string, string>
}

const RAW_TYPES = ['text/csv', 'text/plain', 'application/octet-stream', 'text/tab-separated-values']

function mediaType(c: Context): string {
  return (c.req.header('content-type') ?? '').split(';')[0].trim().toLowerCase()
}

/**
 * Decode uploaded bytes to text: UTF-8 (BOM removed), or UTF-16 LE/BE when a UTF-16 byte-order mark is
 * present. Invalid UTF-8 sequences become U+FFFD, which the readers then report on their line.
 */
export function decodeUploadText(bytes: Uint8Array): string {
  if (bytes.length >= 2 && bytes[0] === 0xff && bytes[1] === 0xfe)
    return new TextDecoder('utf-16le').decode(bytes.subarray(2))
  if (bytes.length >= 2 && bytes[0] === 0xfe && bytes[1] === 0xff)
    return new TextDecoder('utf-16be').decode(bytes.subarray(2))
  return new TextDecoder('utf-8', { ignoreBOM: false }).decode(bytes)
}

/** Read the request's files and options; `fileFields` are the multipart fields that carry files. */
export async function readUpload(c: Context, opts: { defaultName: string }): Promise<Upload> {
  const query: Record<string, string> = {}
  for (const [k, v] of new URL(c.req.url).searchParams) query[k] = v
  const type = mediaType(c)
  if (type === 'multipart/form-data') {
    let form: FormData
    try {
      form = await c.req.formData()
    } catch {
      throw new ApiProblem(400, 'the multipart body could not be parsed (check the boundary and the parts)')
    }
    const files: UploadedFile[] = []
    let options: unknown
    for (const [field, value] of form.entries()) {
      if (field === 'options') {
        const text = typeof value === 'string' ? value : await value.text()
        try {
          options = JSON.parse(text)
        } catch (e) {
          throw new ApiProblem(400, `the options part is not valid JSON: ${(e as Error).message}`, [
            { path: 'options', message: 'not valid JSON' },
          ])
        }
      } else if (typeof value !== 'string') {
        files.push({
          name: value.name || opts.defaultName,
          field,
          bytes: new Uint8Array(await value.arrayBuffer()),
        })
      } else if (field === 'file' || field.startsWith('file') || field === 'site') {
        // A file pasted as a text field.
        files.push({ name: opts.defaultName, field, bytes: new TextEncoder().encode(value) })
      }
    }
    return { files, options, query }
  }
  if (RAW_TYPES.includes(type)) {
    let bytes: Uint8Array
    try {
      bytes = new Uint8Array(await c.req.arrayBuffer())
    } catch (e) {
      if (e instanceof ApiProblem) throw e
      // The client went away or the body stream broke: the request, not the server, is at fault.
      throw new ApiProblem(400, 'the request body could not be read completely (connection closed?)')
    }
    return { files: [{ name: query.name ?? opts.defaultName, field: '', bytes }], options: undefined, query }
  }
  throw new ApiProblem(
    415,
    `content type '${type || '(none)'}' is not accepted; send the file as text/csv, text/plain or application/octet-stream, or as multipart/form-data with a file part`,
  )
}

/** Data rows of a text, counted cheaply before parsing (line breaks). */
function roughRowCount(text: string): number {
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

/** The file's text, refused with a 413 when it has more rows or wider lines than the configured limits. */
export function checkedUploadText(file: UploadedFile, config: ApiConfig): string {
  const text = decodeUploadText(file.bytes)
  const fields = widestLineFields(text, config.maxColumns)
  if (fields > config.maxColumns) {
    throw new ApiProblem(
      413,
      `${file.name} has a line with ${fields} fields, more than the limit of ${config.maxColumns} columns; remove the columns you do not need (keep time, dry bulb, humidity and any of pressure, wind, irradiance, rain)`,
    )
  }
  const rows = roughRowCount(text)
  if (rows > config.maxRows + 10) {
    throw new ApiProblem(
      413,
      `${file.name} has about ${rows} rows, more than the limit of ${config.maxRows}; split it by years and send the parts`,
    )
  }
  return text
}

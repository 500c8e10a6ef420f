/**
 * @module api/body
 * Request bodies before any route reads them: `Content-Encoding: gzip` (or `x-gzip`, `deflate`) is decoded
 * with the runtime's DecompressionStream, stopping at the byte limit (a few kilobytes of gzip can inflate to
 * gigabytes); other codings are refused with 415 and `Accept-Encoding` (RFC 9110 §15.5.16, RFC 7694 §3).
 * Charsets: a `charset` parameter is honoured when the runtime's TextDecoder knows it (the WHATWG Encoding
 * labels: utf-8, iso-8859-1/latin1, windows-1252, utf-16le …), else 415.
 */
import type { Context } from 'hono'
import { ApiProblem } from './problem.ts'

/** Content codings we decode, as DecompressionStream formats (HTTP `deflate` is the zlib format, RFC 9110 §8.4.1.2). */
const CODINGS: Record<string, 'gzip' | 'deflate'> = { gzip: 'gzip', 'x-gzip': 'gzip', deflate: 'deflate' }

export const ACCEPTED_ENCODINGS = 'gzip, deflate'

/**
 * Read a stream to bytes, refusing with 413 past `limit` bytes (reading stops there). With the expected
 * length (a Content-Length) the bytes go straight into one buffer of that size, without a second copy.
 */
export async function readLimited(
  stream: ReadableStream<Uint8Array>,
  limit: number,
  what: string,
  expected?: number,
): Promise<Uint8Array<ArrayBuffer>> {
  const reader = stream.getReader()
  const tooLarge = async () => {
    await reader.cancel().catch(() => {})
    return new ApiProblem(
      413,
      `the ${what} is larger than the limit of ${limit} bytes; split the file by years or sites`,
      undefined,
      'too-large',
    )
  }
  const known = expected !== undefined && Number.isInteger(expected) && expected >= 0 && expected <= limit
  const out = new Uint8Array(known ? expected : 0)
  /** Bytes in `out`; the rest (no length given, or more than it said) in `chunks`. */
  let inOut = 0
  const chunks: Uint8Array[] = []
  let total = 0
  for (;;) {
    const { done, value } = await reader.read()
    if (done) break
    if (total + value.byteLength > limit) throw await tooLarge()
    if (chunks.length === 0 && inOut + value.byteLength <= out.length) {
      out.set(value, inOut)
      inOut += value.byteLength
    } else chunks.push(value)
    total += value.byteLength
  }
  if (chunks.length === 0 && inOut === out.length) return out
  const joined = new Uint8Array(total)
  joined.set(out.subarray(0, inOut))
  let offset = inOut
  for (const c of chunks) {
    joined.set(c, offset)
    offset += c.byteLength
  }
  return joined
}

/**
 * Decode a gzip/deflate body in place (`c.req.raw` becomes the decoded request), within `maxBytes` of
 * output. Nothing happens without a Content-Encoding (or with `identity`).
 */
export async function decodeContentEncoding(c: Context, maxBytes: number): Promise<void> {
  const header = c.req.header('content-encoding')
  if (header === undefined) return
  const codings = header
    .split(',')
    .map((s) => s.trim().toLowerCase())
    .filter((s) => s !== '' && s !== 'identity')
  if (codings.length === 0) return
  if (codings.length > 1 || CODINGS[codings[0]] === undefined) {
    throw new ApiProblem(
      415,
      `content encoding '${header.slice(0, 40)}' is not accepted; send the body uncompressed, or compressed once with gzip or deflate`,
      [{ path: 'content-encoding', message: 'not accepted' }],
      'unsupported-media-type',
      { 'accept-encoding': ACCEPTED_ENCODINGS },
    )
  }
  const raw = c.req.raw
  if (raw.body === null) return
  let bytes: Uint8Array<ArrayBuffer>
  try {
    const decoded = raw.body.pipeThrough(
      new DecompressionStream(CODINGS[codings[0]]) as unknown as ReadableWritablePair<Uint8Array, Uint8Array>,
    )
    bytes = await readLimited(decoded, maxBytes, 'decoded request body')
  } catch (e) {
    if (e instanceof ApiProblem) throw e
    throw new ApiProblem(
      400,
      `the body is not valid ${codings[0]} data (it could not be decompressed)`,
      [{ path: 'content-encoding', message: `not valid ${codings[0]}` }],
      'unreadable-body',
    )
  }
  const headers = new Headers(raw.headers)
  headers.delete('content-encoding')
  headers.delete('content-length')
  c.req.raw = new Request(raw.url, {
    method: raw.method,
    headers,
    body: bytes,
    signal: raw.signal,
  })
}

/** The `charset` parameter of a content type, lower-cased, or undefined. */
export function charsetOf(contentType: string | null | undefined): string | undefined {
  if (!contentType) return undefined
  const m = /;\s*charset\s*=\s*"?([^";\s]+)"?/i.exec(contentType)
  return m ? m[1].toLowerCase() : undefined
}

/** A charset the runtime can decode; 415 naming the field otherwise. */
export function checkedCharset(charset: string | undefined, path: string): string | undefined {
  if (charset === undefined) return undefined
  try {
    new TextDecoder(charset)
  } catch {
    throw new ApiProblem(
      415,
      `charset '${charset.slice(0, 40)}' is not supported; send UTF-8, UTF-16 with a byte-order mark, or ISO-8859-1`,
      [{ path, message: 'charset not supported' }],
      'unsupported-media-type',
    )
  }
  return charset
}

/**
 * Clean failures (issue "no input may freeze or exhaust the server", item 3): every error is a problem with a
 * stable type and no engine text; 405 with Allow; gzip and deflate bodies decoded within the byte limit or
 * refused; declared charsets honoured; unknown keys (`__proto__` too) refused with their path; every bad
 * option a 400 naming its field; the CLI exits 2 with one line for a bad output path and a busy port.
 * Time bounds are generous (10× or more the time measured on a loaded 2-core machine): they check that the
 * refusal comes before the work, not a speed.
 */
import { spawn } from 'node:child_process'
import { mkdtempSync, readFileSync } from 'node:fs'
import { createServer, type Server } from 'node:net'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { deflateSync, gzipSync } from 'node:zlib'
import { describe, expect, it } from 'vitest'
import { createApp } from '../../src/api/app.ts'
import { problemFor } from '../../src/api/errors.ts'
import { PROBLEM_TYPE_BASE, PROBLEM_TYPES } from '../../src/api/problem.ts'
import { type CliIo, UsageError } from '../../src/cli/command.ts'
import { runCli } from '../../src/cli/main.ts'
import {
  app,
  COARSE,
  COARSE_QUERY,
  csvOf,
  expectInspect,
  expectProblem,
  inventedDays,
  multipart,
  post,
  THREE_HOURS,
} from './hostile-helpers.ts'

const GOOD = csvOf(THREE_HOURS)
const JULY = inventedDays(3)

async function timed<T>(fn: () => Promise<T>): Promise<{ value: T; ms: number }> {
  const t0 = performance.now()
  const value = await fn()
  return { value, ms: performance.now() - t0 }
}

describe('stable problem types', () => {
  it.each([
    ['a bad query number', () => app.request('/v1/air?tdb=x&rh=50'), 'invalid-parameters'],
    ['an unknown path', () => app.request('/v1/nothing'), 'not-found'],
    ['a wrong method', () => app.request('/v1/assess'), 'method-not-allowed'],
    ['a JSON body', () => post('/v1/inspect', '{}', 'application/json'), 'unsupported-media-type'],
    ['an empty file', () => post('/v1/inspect', '', 'text/csv'), 'unusable-input'],
    [
      'a broken multipart body',
      () => post('/v1/inspect', '--x\r\n', 'multipart/form-data'),
      'unreadable-body',
    ],
    [
      'too much work',
      () =>
        post(
          '/v1/assess?product=figs&method=open-air&stepDays=1',
          JULY,
          'text/csv',
          createApp({ maxBatchHours: 1000 }),
        ),
      'too-much-work',
    ],
  ])('%s: the type for it, with its status and title', async (_name, request, kind) => {
    const p = await expectProblem(await request())
    expect(p.type).toBe(`${PROBLEM_TYPE_BASE}${kind}`)
    const t = PROBLEM_TYPES[kind as keyof typeof PROBLEM_TYPES]
    expect(p.status).toBe(t.status)
    expect(p.title).toBe(t.title)
  })

  it('every type is listed in /openapi.json (x-problem-types) with its status', async () => {
    const doc = (await (await app.request('/openapi.json')).json()) as {
      'x-problem-types': { type: string; status: number }[]
    }
    expect(doc['x-problem-types'].map((t) => t.type).sort()).toEqual(
      Object.keys(PROBLEM_TYPES)
        .map((k) => PROBLEM_TYPE_BASE + k)
        .sort(),
    )
  })
})

describe('no engine text reaches a user', () => {
  // Errors the JavaScript engine itself throws, provoked here rather than quoted.
  const engineErrors: [string, () => unknown][] = [
    ['a stack overflow from spreading 300,000 numbers', () => Math.min(...new Array(300_000).fill(1))],
    ['a string over the maximum length', () => 'x'.repeat(2 ** 30)],
    ['an invalid array length', () => new Array(-1)],
  ]

  it.each(engineErrors)('%s: a resource-limit problem without the engine message', (_name, provoke) => {
    let error: unknown
    try {
      provoke()
    } catch (e) {
      error = e
    }
    expect(error).toBeInstanceOf(RangeError)
    const p = problemFor(error)
    expect(p?.type).toBe('resource-limit')
    expect(p?.status).toBe(422)
    expect(p?.message.includes((error as Error).message)).toBe(false)
  })

  it('engine faults and unexpected errors in a route: 422 resource-limit or 500 internal, never their text', async () => {
    const a = createApp()
    a.get('/boom/stack', () => {
      const f = (n: number): number => f(n + 1) + 1
      return new Response(String(f(0)))
    })
    a.get('/boom/digits', () => new Response((1).toFixed(101)))
    a.get('/boom/type', () => {
      const o = undefined as unknown as { x: { y: number } }
      return new Response(String(o.x.y))
    })
    const stack = await expectProblem(await a.request('/boom/stack'), [422])
    expect(stack.type).toMatch(/resource-limit$/)
    expect(stack.detail).not.toMatch(/call stack/)
    for (const path of ['/boom/digits', '/boom/type']) {
      const res = await a.request(path)
      expect(res.status).toBe(500)
      const body = (await res.json()) as { type: string; detail: string }
      expect(body.type).toMatch(/internal$/)
      expect(body.detail).toBe('internal error; the request was not processed (the server logged it)')
    }
  })

  it('the CLI: an engine error, even wrapped in a usage error, prints one line of our own words (exit 2)', async () => {
    for (const thrown of [
      new RangeError('Maximum call stack size exceeded'),
      new UsageError('f.csv: Invalid string length'),
    ]) {
      const err: string[] = []
      const io: CliIo = {
        stdout: () => {},
        stderr: (t) => err.push(t),
        readFile: async () => {
          throw thrown
        },
        writeFile: async () => {},
      }
      expect(await runCli(['inspect', 'f.csv'], io)).toBe(2)
      expect(err.join('')).toBe(
        'dryhours inspect: the input is too large for the engine to process (it ran out of memory or nesting depth); use a smaller file\n',
      )
    }
  })

  it('the CLI: an internal fault exits 1 with one line naming its kind, not its text', async () => {
    const err: string[] = []
    const io: CliIo = {
      stdout: () => {},
      stderr: (t) => err.push(t),
      readFile: async () => {
        throw new TypeError("Cannot read properties of undefined (reading 'x')")
      },
      writeFile: async () => {},
    }
    expect(await runCli(['inspect', 'f.csv'], io)).toBe(1)
    expect(err.join('')).toBe(
      'dryhours inspect: internal error (TypeError); please report it with the command you ran\n',
    )
  })

  it('a JSON options part that does not parse: 400 without the parser message', async () => {
    const p = await expectProblem(
      await post('/v1/assess', multipart(JULY, 'a.csv', undefined, '{"a":')),
      [400],
    )
    expect(p.type).toMatch(/unreadable-body$/)
    expect(p.detail).not.toMatch(/Unexpected|position|JSON at/)
  })
})

describe('405 with Allow for a known path and the wrong method', () => {
  it.each([
    ['DELETE', '/v1/assess', 'POST'],
    ['GET', '/v1/assess', 'POST'],
    ['PUT', '/v1/inspect', 'POST'],
    ['DELETE', '/v1/products/figs', 'GET, HEAD'],
    ['POST', '/healthz', 'GET, HEAD'],
    ['GET', '/report', 'POST'],
    ['PATCH', '/', 'GET, HEAD'],
  ])('%s %s: 405, Allow: %s', async (method, path, allow) => {
    const res = await app.request(path, { method })
    const p = await expectProblem(res, [405])
    expect(res.headers.get('allow')).toBe(allow)
    expect(p.detail).toContain(allow)
  })

  it('an unknown path stays a 404; a known path with a trailing extra segment too', async () => {
    await expectProblem(await app.request('/v1/assess/extra', { method: 'DELETE' }), [404])
    await expectProblem(await app.request('/nope'), [404])
  })
})

describe('compressed bodies', () => {
  const upland = readFileSync('climate-demo/ardentine-upland-2021-2024-utc.csv')

  function encoded(body: BodyInit, encoding: string, type = 'text/csv') {
    return { method: 'POST', body, headers: { 'content-type': type, 'content-encoding': encoding } }
  }

  it.each([
    ['gzip', gzipSync],
    ['x-gzip', gzipSync],
    ['deflate', deflateSync],
  ])('%s: decoded and read like the plain file', async (encoding, compress) => {
    const plain = await expectInspect(await post('/v1/inspect', new Uint8Array(upland), 'text/csv'))
    const packed = await expectInspect(
      await app.request('/v1/inspect', encoded(new Uint8Array(compress(upland)), encoding)),
    )
    expect(packed.rows).toEqual(plain.rows)
    expect(packed.period).toEqual(plain.period)
  })

  it('a gzip bomb (64 KiB that inflate to 64 MiB): 413 within the byte limit, quickly', async () => {
    const bomb = new Uint8Array(gzipSync(new Uint8Array(64 * 1024 * 1024)))
    expect(bomb.length).toBeLessThan(100_000)
    const { value: res, ms } = await timed(async () => app.request('/v1/inspect', encoded(bomb, 'gzip')))
    const p = await expectProblem(res, [413])
    expect(p.type).toMatch(/too-large$/)
    expect(p.detail).toMatch(/decoded request body is larger than the limit of 33554432 bytes/)
    expect(ms).toBeLessThan(20_000)
  })

  it('a multipart body sent gzipped is decoded too', async () => {
    const form = new Response(multipart(JULY, 'july.csv', COARSE))
    const type = form.headers.get('content-type') as string
    const bytes = new Uint8Array(gzipSync(new Uint8Array(await form.arrayBuffer())))
    const res = await app.request('/v1/assess', encoded(bytes, 'gzip', type))
    expect(res.status).toBe(200)
  })

  it('corrupt gzip: 400 unreadable-body; an unknown coding: 415 with Accept-Encoding', async () => {
    const corrupt = new Uint8Array(gzipSync(Buffer.from(GOOD)))
    corrupt.fill(7, 10, 30)
    const p = await expectProblem(await app.request('/v1/inspect', encoded(corrupt, 'gzip')), [400])
    expect(p.type).toMatch(/unreadable-body$/)
    for (const coding of ['br', 'zstd', 'compress', 'gzip, gzip']) {
      const res = await app.request('/v1/inspect', encoded(new TextEncoder().encode(GOOD), coding))
      const q = await expectProblem(res, [415])
      expect(res.headers.get('accept-encoding')).toBe('gzip, deflate')
      expect(q.errors?.[0]?.path).toBe('content-encoding')
    }
  })
})

describe('charsets', () => {
  // `temp (°C)` in ISO-8859-1: the degree sign is the single byte 0xB0 (ISO/IEC 8859-1 code table).
  const latin1Header = 'time,temp (\u00b0C),Humidit\u00e9 (%)'
  const latin1 = (text: string) => Uint8Array.from(text, (ch) => ch.charCodeAt(0))
  const file = `${latin1Header}\n${THREE_HOURS.join('\n')}\n`

  it('ISO-8859-1 declared in the content type keeps its accents', async () => {
    const body = await expectInspect(await post('/v1/inspect', latin1(file), 'text/csv; charset=iso-8859-1'))
    expect(body.columns.map((c) => c.source)).toContain('temp (\u00b0C)')
    expect(body.columns.map((c) => c.source)).toContain('Humidit\u00e9 (%)')
    expect(body.rows.used).toBe(3)
  })

  it('ISO-8859-1 sent without a charset is recognised (not valid UTF-8) and keeps its accents too', async () => {
    const body = await expectInspect(await post('/v1/inspect', latin1(file), 'text/csv'))
    expect(body.columns.map((c) => c.source)).toContain('Humidit\u00e9 (%)')
    expect(JSON.stringify(body).includes('\ufffd')).toBe(false)
  })

  it('a declared charset wins over guessing; a multipart part may declare its own', async () => {
    // The UTF-8 bytes of é (C3 A9) read as ISO-8859-1 are the two characters Ã©.
    const utf8Bytes = new TextEncoder().encode(file)
    const asLatin1 = await expectInspect(await post('/v1/inspect', utf8Bytes, 'text/csv; charset=latin1'))
    expect(asLatin1.columns.map((c) => c.source)).toContain('Humidit\u00c3\u00a9 (%)')
    const form = new FormData()
    form.append('file', new Blob([latin1(file)], { type: 'text/csv; charset=ISO-8859-1' }), 'l1.csv')
    const part = await expectInspect(await post('/v1/inspect', form))
    expect(part.columns.map((c) => c.source)).toContain('Humidit\u00e9 (%)')
  })

  it('an unknown charset: 415 naming it', async () => {
    const p = await expectProblem(await post('/v1/inspect', GOOD, 'text/csv; charset=klingon-8'), [415])
    expect(p.detail).toMatch(/charset 'klingon-8' is not supported/)
  })
})

describe('unknown keys, __proto__ among them, are refused with their path', () => {
  it.each([
    ['/v1/air?tdb=20&rh=50&__proto__=1', 'GET'],
    ['/v1/air?tdb=20&rh=50&constructor=1', 'GET'],
    ['/v1/equilibrium?product=figs&tdb=25&rh=50&__proto__=1', 'GET'],
    ['/v1/inspect?__proto__=1', 'POST'],
    [`${COARSE_QUERY}&__proto__=1`, 'POST'],
    ['/v1/energy-chart?__proto__=1', 'POST'],
    ['/v1/fit?dryMass=150&__proto__=1', 'POST'],
  ])('%s: 400 naming the key', async (url, method) => {
    const res =
      method === 'GET' ? await app.request(url) : await post(url, method === 'POST' ? JULY : '', 'text/csv')
    const p = await expectProblem(res, [400])
    const key = /[?&](__proto__|constructor)=/.exec(url)?.[1]
    expect(p.errors?.map((e) => e.path)).toContain(key)
  })

  it('__proto__ in the options JSON and in its nested objects: 400 naming the path', async () => {
    for (const [raw, path] of [
      [`{"product":"figs","method":"open-air","__proto__":{"maxDays":1}}`, 'options.__proto__'],
      [
        `{"product":"figs","method":"open-air","thresholds":{"__proto__":{"x":1}}}`,
        'options.thresholds.__proto__',
      ],
    ]) {
      const p = await expectProblem(await post('/v1/assess', multipart(JULY, 'a.csv', undefined, raw)), [400])
      expect(p.errors?.map((e) => e.path)).toContain(path)
    }
  })

  it('an unknown query key next to an options part: 400', async () => {
    const p = await expectProblem(
      await post('/v1/assess?colour=red', multipart(JULY, 'a.csv', COARSE)),
      [400],
    )
    expect(p.errors?.map((e) => e.path)).toContain('colour')
  })
})

describe('every bad option is a 400 naming its field, before any work', () => {
  it.each([
    ['deadlineDays=400', 'deadlineDays'],
    ['deadlineDays=30&maxDays=20', 'maxDays'],
    ['initialWb=30&targetWb=40', 'targetWb'],
    ['initialWb=0.5', 'initialWb'],
    ['thickness=2000', 'thickness'],
    ['stepDays=1.5', 'stepDays'],
    ['start=02-30', 'start'],
    ['batchKg=0', 'batchKg'],
  ])('query %s: 400 naming %s', async (param, path) => {
    const url = `/v1/assess?product=figs&method=open-air&${param}`
    const p = await expectProblem(await post(url, JULY, 'text/csv'), [400])
    expect(p.errors?.map((e) => e.path)).toContain(path)
  })

  it.each([
    [{ deadlineDays: 400 }, 'options.deadlineDays'],
    [{ deadlineDays: 30, maxDays: 20 }, 'options.maxDays'],
    [{ initialWbPct: 30, targetWbPct: 40 }, 'options.targetWbPct'],
    [{ startStepDays: 0 }, 'options.startStepDays'],
    [{ startHourLocal: 24 }, 'options.startHourLocal'],
    [{ method: { kind: 'open-air', loadingKgPerM2: -1 } }, 'options.method.loadingKgPerM2'],
  ])('JSON %j: 400 naming %s', async (extra, path) => {
    const options = { product: 'figs', method: 'open-air', ...extra }
    const p = await expectProblem(await post('/v1/assess', multipart(JULY, 'a.csv', options)), [400])
    expect(p.errors?.map((e) => e.path)).toContain(path)
  })

  it.each([
    ['baseline=3', 'baseline'],
    ['dryingTempC=150', 'dryingTempC'],
    ['elevationM=100000', 'elevationM'],
    ['utcOffsetHours=30', 'utcOffsetHours'],
  ])('energy chart %s: 400 naming %s', async (param, path) => {
    const log = readFileSync('climate-demo/energy/quillow-dryer-batches-2026.csv')
    const p = await expectProblem(
      await post(`/v1/energy-chart?${param}`, new Uint8Array(log), 'text/csv'),
      [400],
    )
    expect(p.errors?.map((e) => e.path)).toContain(path)
  })

  it('the page form: 400 naming the form field (JSON answer) or the page with the message', async () => {
    const form = new FormData()
    form.append('file', new Blob([JULY]), 'july.csv')
    form.append('product', 'figs')
    form.append('initialWbPct', '30')
    form.append('targetWbPct', '40')
    form.append('format', 'json')
    const p = await expectProblem(await post('/report', form), [400])
    expect(p.errors?.map((e) => e.path)).toContain('targetWbPct')
  })
})

function runBin(
  args: string[],
  env: Record<string, string> = {},
): Promise<{ code: number | null; out: string; err: string }> {
  return new Promise((resolve) => {
    const child = spawn('node', ['bin/dryhours.mjs', ...args], {
      env: { ...process.env, ...env },
      stdio: ['ignore', 'pipe', 'pipe'],
    })
    let out = ''
    let err = ''
    child.stdout.on('data', (d) => {
      out += String(d)
    })
    child.stderr.on('data', (d) => {
      err += String(d)
    })
    const timer = setTimeout(() => child.kill('SIGTERM'), 30_000)
    child.on('exit', (code) => {
      clearTimeout(timer)
      resolve({ code, out, err })
    })
  })
}

/** Exit 2, one line on stderr, no stack trace. */
function expectOneLine(r: { code: number | null; err: string }, pattern: RegExp): void {
  expect(r.code).toBe(2)
  expect(r.err.trimEnd().split('\n')).toHaveLength(1)
  expect(r.err).not.toMatch(/\s+at\s.+:\d+:\d+/)
  expect(r.err).toMatch(pattern)
}

describe('CLI: input faults exit 2 with one line', () => {
  const dir = mkdtempSync(join(tmpdir(), 'dryhours-cli-'))

  it('an output path in a missing folder', async () => {
    const r = await runBin([
      'energy-chart',
      'climate-demo/energy/quillow-dryer-batches-2026.csv',
      '--format',
      'html',
      '--out',
      join(dir, 'no-such-folder', 'energy.html'),
    ])
    expectOneLine(r, /cannot write '.*no-such-folder.*energy\.html': no such file or folder/)
  })

  it('an output path that is a folder, and a profile saved into a missing folder', async () => {
    const r = await runBin([
      'energy-chart',
      'climate-demo/energy/quillow-dryer-batches-2026.csv',
      '--out',
      dir,
    ])
    expectOneLine(r, /cannot write .*: it is a folder/)
    const s = await runBin([
      'fit',
      'test/fixtures/product/demo-weighings.csv',
      '--dry-mass',
      '150',
      '--product',
      'apple-slices',
      '--save',
      join(dir, 'missing', 'p.json'),
    ])
    expectOneLine(s, /cannot write/)
  })

  it('a busy port: `dryhours serve` and `npm start` exit 2 with one line', async () => {
    const blocker: Server = createServer()
    await new Promise<void>((r) => blocker.listen(0, '127.0.0.1', () => r()))
    const port = (blocker.address() as { port: number }).port
    try {
      const r = await runBin(['serve', '--port', String(port)], { DRYHOURS_WORKERS: '0' })
      expectOneLine(r, new RegExp(`127\\.0\\.0\\.1:${port} is already in use`))
      const s = await new Promise<{ code: number | null; err: string }>((resolve) => {
        const child = spawn('node', ['--import', 'tsx', 'src/node/server.ts'], {
          env: { ...process.env, PORT: String(port), DRYHOURS_WORKERS: '0' },
          stdio: ['ignore', 'ignore', 'pipe'],
        })
        let err = ''
        child.stderr.on('data', (d) => {
          err += String(d)
        })
        child.on('exit', (code) => resolve({ code, err }))
      })
      expectOneLine(s, /already in use/)
    } finally {
      blocker.close()
    }
  })

  it('a setting that cannot be used: exit 2 naming the variable', async () => {
    expectOneLine(await runBin(['serve', '--port', '0'], { DRYHOURS_WORKERS: 'lots' }), /DRYHOURS_WORKERS/)
    expectOneLine(
      await runBin(['serve', '--port', '0'], { DRYHOURS_MAX_ROWS: '-5', DRYHOURS_WORKERS: '0' }),
      /DRYHOURS_MAX_ROWS must be a positive number/,
    )
  })
})

/**
 * The hostile inputs sent in the middle of a load round (`npm run load`): one of each input that used to
 * freeze or exhaust the server, each with the status it must get now. Bodies are built before the round.
 */
import { readFileSync } from 'node:fs'
import { gzipSync } from 'node:zlib'

export interface HostileRequest {
  name: string
  /** Statuses it may get (none of them a 5xx). */
  expect: number[]
  send: (url: string) => Promise<number>
}

const fourYears = readFileSync('climate-demo/ardentine-upland-2021-2024-utc.csv')

function post(path: string, body: BodyInit, headers: Record<string, string> = {}) {
  return async (url: string) => (await fetch(url + path, { method: 'POST', body, headers })).status
}

/** A request whose client goes away after `afterMs`: its status is 0 (no answer is awaited). */
function abandoned(path: string, body: BodyInit, afterMs: number) {
  return async (url: string) => {
    const c = new AbortController()
    const pending = fetch(url + path, {
      method: 'POST',
      body,
      headers: { 'content-type': 'text/csv' },
      signal: c.signal,
    }).catch(() => null)
    await new Promise((r) => setTimeout(r, afterMs))
    c.abort()
    await pending
    return 0
  }
}

export function hostileRequests(): HostileRequest[] {
  const batchRow = '2026-09-01T08:00-06:00,4,10000,9000,1150,18,60\n'
  const bigLog = `start,duration_h,fresh_mass_kg,final_mass_kg,energy_kwh,ambient_temp_c,ambient_rh_pct\n${batchRow.repeat(200_000)}`
  const weighings = `elapsed_h,mass_g\n${Array.from({ length: 130_000 }, (_, i) => `${(i / 60).toFixed(3)},${1000 - i * 0.005}`).join('\n')}\n`
  const page = new FormData()
  page.append('file', new Blob([new Uint8Array(fourYears)]), 'upland.csv')
  for (const [k, v] of Object.entries({
    product: 'figs',
    method: 'open-air',
    seasonStart: '01-01',
    seasonEnd: '12-31',
    deadlineDays: '365',
    format: 'json',
  }))
    page.append(k, v)
  const bomb = new Uint8Array(gzipSync(new Uint8Array(64 * 1024 * 1024)))
  const latin1 = Uint8Array.from('time,temp (\u00b0C),Humidit\u00e9 (%)\n2024-07-01T10:00Z,30.1,25\n', (c) =>
    c.charCodeAt(0),
  )
  const commas = `time,a\n${'1,'.repeat(5 * 1024 * 1024)}\n`
  const garbage = new Uint8Array(65536).map((_, i) => (i * 2654435761) >>> 24)
  const heavy =
    '/v1/assess?product=shelled-corn&method=shade&stepDays=1&maxDays=366&deadlineDays=365&lat=38.3&lon=-2.6'
  return [
    {
      name: 'batch log of 200,000 batches as HTML',
      expect: [413],
      send: post('/v1/energy-chart?format=html', bigLog, { 'content-type': 'text/csv' }),
    },
    {
      name: '130,000 weighings',
      expect: [413],
      send: post('/v1/fit?dryMass=150', weighings, { 'content-type': 'text/csv' }),
    },
    { name: 'page form asking 13.9 million batch-hours', expect: [422], send: post('/report', page) },
    {
      name: 'API deadlineDays 365 without maxDays, whole year',
      expect: [422],
      send: post(
        '/v1/assess?product=figs&method=open-air&start=01-01&end=12-31&deadlineDays=365',
        fourYears,
        {
          'content-type': 'text/csv',
        },
      ),
    },
    {
      name: 'gzip bomb (64 KiB → 64 MiB)',
      expect: [413],
      send: post('/v1/inspect', bomb, { 'content-type': 'text/csv', 'content-encoding': 'gzip' }),
    },
    {
      name: 'ISO-8859-1 body',
      expect: [200],
      send: post('/v1/inspect', latin1, { 'content-type': 'text/csv; charset=iso-8859-1' }),
    },
    {
      name: 'DELETE /v1/assess',
      expect: [405],
      send: async (url) => (await fetch(`${url}/v1/assess`, { method: 'DELETE' })).status,
    },
    {
      name: '?__proto__=1',
      expect: [400],
      send: async (url) => (await fetch(`${url}/v1/air?tdb=20&rh=50&__proto__=1`)).status,
    },
    {
      name: '10 MB of commas on one line',
      expect: [413],
      send: post('/v1/inspect', commas, { 'content-type': 'text/csv' }),
    },
    {
      name: '64 KiB of binary garbage',
      expect: [422],
      send: post('/v1/inspect', garbage, { 'content-type': 'application/octet-stream' }),
    },
    ...[1, 2, 3, 4].map((n) => ({
      name: `a long assessment abandoned after 300 ms (#${n})`,
      expect: [0],
      send: abandoned(heavy, fourYears, 300),
    })),
  ]
}

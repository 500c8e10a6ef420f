import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { createApp } from '../../src/api/app.ts'
import { renderReadingMessages } from '../../src/api/weather-options.ts'
import { inspectJson } from '../../src/report/inspect-json.ts'
import { readWeather } from '../../src/weather/read-weather.ts'

const app = createApp()
const post = (url: string, body: BodyInit, type?: string) =>
  app.request(url, { method: 'POST', body, headers: type ? { 'content-type': type } : undefined })

describe('POST /v1/inspect', () => {
  const csv =
    'time,temp_c,rh_pct\n2024-07-01T10:00Z,30.1,25\n2024-07-01T11:00Z,31.5,22\n2024-07-01T12:00Z,32.8,20\n'

  it('answers the same object as the CLI (inspectJson of the reader) for a raw CSV body, options named as query parameters', async () => {
    const res = await post('/v1/inspect?lat=38.3&lon=-2.6&elevation=1050', csv, 'text/csv')
    expect(res.status).toBe(200)
    const body = await res.json()
    const read = readWeather(csv, { latitudeDeg: 38.3, longitudeDeg: -2.6, elevationM: 1050 })
    const direct = inspectJson(renderReadingMessages(read, 'query'))
    expect(body).toEqual(JSON.parse(JSON.stringify(direct)))
    // the CLI's words (--utc-offset, --site-tz) become the API's parameters (utcOffset, siteTz)
    expect(read.warnings.join(' ')).toContain('--site-tz <zone>')
    expect((body as { warnings: string[] }).warnings.join(' ')).toContain('siteTz=<zone>')
    expect(JSON.stringify(body)).not.toContain('--site-tz')
    expect(body.rows).toEqual({ read: 3, used: 3, repaired: 0, rejected: 0, superseded: 0 })
  })

  it('reads an EPW demo file sent as multipart, with the row counts adding up', async () => {
    const form = new FormData()
    form.append('file', new Blob([readFileSync('climate-demo/gullhaven-coast-2022-2024.epw')]), 'coast.epw')
    const res = await post('/v1/inspect', form)
    expect(res.status).toBe(200)
    const body = (await res.json()) as { format: string; rows: Record<string, number>; hours: number }
    expect(body.format).toBe('epw')
    expect(body.rows.used + body.rows.repaired + body.rows.rejected + body.rows.superseded).toBe(
      body.rows.read,
    )
    // 2022–2024 with the 2024 leap day: 365 + 365 + 366 days.
    expect(body.hours).toBe((365 + 365 + 366) * 24)
  })

  it('applies a mapping given in the query string', async () => {
    const res = await post(
      '/v1/inspect?map=relativeHumidity=moist:%25',
      'time,temp_c,moist\n2024-07-01T10:00Z,30,40\n2024-07-01T11:00Z,31,38\n',
      'text/csv',
    )
    const body = (await res.json()) as { columns: { variable: string; source: string }[] }
    expect(res.status).toBe(200)
    expect(body.columns.some((c) => c.source === 'moist')).toBe(true)
  })

  it('422 when the file has no humidity, naming what to supply', async () => {
    const res = await post('/v1/inspect', 'time,temp_c\n2024-07-01T10:00Z,30.1\n', 'text/csv')
    expect(res.status).toBe(422)
    const body = (await res.json()) as { detail: string }
    expect(body.detail).toMatch(/humidity/)
  })

  it('400 for bad options, 415 for JSON bodies', async () => {
    expect((await post('/v1/inspect?lat=95', csv, 'text/csv')).status).toBe(400)
    expect((await post('/v1/inspect?tz=Mars/Olympus', csv, 'text/csv')).status).toBe(400)
    expect((await post('/v1/inspect?utcOffset=2&tz=Europe/Madrid', csv, 'text/csv')).status).toBe(400)
    expect((await post('/v1/inspect', '{"a":1}', 'application/json')).status).toBe(415)
    const form = new FormData()
    form.append('file', new Blob([csv]), 'a.csv')
    form.append('options', '{not json')
    expect((await post('/v1/inspect', form)).status).toBe(400)
  })
})

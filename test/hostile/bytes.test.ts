/**
 * Hostile bytes: empty bodies, binary garbage, UTF-16, BOMs, NUL bytes, a 10 MB line, 100,000 columns,
 * unbalanced quotes and a file that claims to be EPW. Each answer is a 4xx problem or a correct result.
 */
import { describe, expect, it } from 'vitest'
import { createApp } from '../../src/api/app.ts'
import { configFromVariables } from '../../src/api/config.ts'
import {
  COARSE_QUERY,
  csvOf,
  expectInspect,
  expectProblem,
  garbageBytes,
  inventedDays,
  multipart,
  post,
  THREE_HOURS,
  utf16,
} from './hostile-helpers.ts'

const GOOD = csvOf(THREE_HOURS)

describe('hostile bytes', () => {
  it('empty body: 422 "the file is empty" on inspect and assess', async () => {
    const a = await expectProblem(await post('/v1/inspect', '', 'text/csv'), [422])
    expect(a.detail).toMatch(/empty/)
    const b = await expectProblem(await post(COARSE_QUERY, '', 'text/csv'), [422])
    expect(b.detail).toMatch(/empty/)
  })

  it('empty multipart file part and a multipart body without any file: 4xx', async () => {
    await expectProblem(await post('/v1/inspect', multipart('', 'empty.csv')), [422])
    const form = new FormData()
    form.append('options', '{}')
    const p = await expectProblem(await post('/v1/inspect', form), [400])
    expect(p.detail).toMatch(/exactly one weather file/)
  })

  it('a malformed multipart body (boundary missing) is a 400', async () => {
    await expectProblem(await post('/v1/inspect', '--x\r\nnonsense', 'multipart/form-data'), [400])
  })

  it('binary garbage (64 KiB of pseudo-random bytes): 422, the detail bounded in length', async () => {
    const p = await expectProblem(
      await post('/v1/inspect', garbageBytes(65536), 'application/octet-stream'),
      [422],
    )
    expect(p.detail.length).toBeLessThan(2000)
    await expectProblem(await post(COARSE_QUERY, garbageBytes(65536, 7), 'application/octet-stream'), [422])
  })

  it.each([
    ['little-endian', false],
    ['big-endian', true],
  ])('UTF-16 %s with a BOM is decoded and read like the UTF-8 file', async (_name, bigEndian) => {
    const plain = await expectInspect(await post('/v1/inspect', GOOD, 'text/csv'))
    const wide = await expectInspect(await post('/v1/inspect', utf16(GOOD, bigEndian), 'text/csv'))
    expect(wide.rows).toEqual({ read: 3, used: 3, repaired: 0, rejected: 0, superseded: 0 })
    expect(wide.period).toEqual(plain.period)
    expect(wide.columns).toEqual(plain.columns)
    expect(wide.hours).toBe(3)
  })

  it('UTF-16 with non-ASCII header text (°C) keeps the unit readable', async () => {
    const text =
      'time,dry bulb (°C),relative humidity (%)\n2024-07-01T10:00Z,30.1,25\n2024-07-01T11:00Z,31.5,22\n'
    const body = await expectInspect(await post('/v1/inspect', utf16(text, false), 'text/csv'))
    expect(body.rows.used).toBe(2)
    expect(body.columns.find((c) => c.variable === 'dryBulb')?.source).toBe('dry bulb (°C)')
  })

  it('UTF-16 without a BOM is not guessed: 422 (the NUL-riddled header names no columns)', async () => {
    await expectProblem(await post('/v1/inspect', utf16(GOOD, false).subarray(2), 'text/csv'), [422])
  })

  it('a UTF-8 BOM is removed: same result as without it', async () => {
    const plain = await expectInspect(await post('/v1/inspect', GOOD, 'text/csv'))
    const bom = await expectInspect(await post('/v1/inspect', `\ufeff${GOOD}`, 'text/csv'))
    expect(bom.rows).toEqual(plain.rows)
    expect(bom.columns).toEqual(plain.columns)
  })

  it('a NUL byte inside a number rejects that row only, with the row counted', async () => {
    const body = await expectInspect(await post('/v1/inspect', GOOD.replace('30.1', '30\u00001'), 'text/csv'))
    expect(body.rows).toEqual({ read: 3, used: 2, repaired: 0, rejected: 1, superseded: 0 })
  })

  it('a body of NUL bytes only: 422', async () => {
    await expectProblem(await post('/v1/inspect', new Uint8Array(1000), 'application/octet-stream'), [422])
  })

  it('a 10 MB single line without a line break: 422 with a short detail', { timeout: 60_000 }, async () => {
    const p = await expectProblem(await post('/v1/inspect', 'x'.repeat(10 * 1024 * 1024), 'text/csv'), [422])
    expect(p.detail.length).toBeLessThan(1000)
  })

  const hundredThousandColumns = () => {
    const extra = Array.from({ length: 100_000 - 3 }, (_, i) => `c${i}`).join(',')
    const filler = ',1'.repeat(100_000 - 3)
    return `time,temp_c,rh_pct,${extra}\n${THREE_HOURS.map((r) => r + filler).join('\n')}\n`
  }

  it('100,000 columns: 413 over the 1,000-column limit, saying which columns to keep', async () => {
    const p = await expectProblem(await post('/v1/inspect', hundredThousandColumns(), 'text/csv'), [413])
    expect(p.detail).toMatch(/100000 fields/)
    expect(p.detail).toMatch(/limit of 1000 columns/)
    await expectProblem(await post(COARSE_QUERY, hundredThousandColumns(), 'text/csv'), [413])
  })

  it('100,000 columns with the column limit raised: read correctly (the known columns found, the rest ignored)', {
    timeout: 60_000,
  }, async () => {
    const wide = createApp({ maxColumns: 200_000 })
    const body = await expectInspect(await post('/v1/inspect', hundredThousandColumns(), 'text/csv', wide))
    expect(body.rows).toEqual({ read: 3, used: 3, repaired: 0, rejected: 0, superseded: 0 })
    // The same columns as the three-column file: none of the 99,997 unknown columns is taken as a variable.
    const plain = await expectInspect(await post('/v1/inspect', GOOD, 'text/csv'))
    expect(body.columns).toEqual(plain.columns)
  })

  it('10 MB of commas on one line (5 million fields): 413 before the reader runs', async () => {
    const p = await expectProblem(
      await post('/v1/inspect', `time,temp_c,rh_pct\n${'1,'.repeat(5 * 1024 * 1024)}`, 'text/csv'),
      [413],
    )
    expect(p.detail).toMatch(/columns/)
  })

  it.each([
    ['json', 'application/problem+json'],
    ['page', 'text/html; charset=UTF-8'],
  ])(
    'the page form (POST /report, format=%s) refuses 10 MB of commas with a 413 too',
    async (format, type) => {
      const form = new FormData()
      for (const [k, v] of Object.entries({
        product: 'figs',
        method: 'open-air',
        utcOffsetHours: '0',
        format,
      }))
        form.set(k, v)
      form.append(
        'file',
        new File([`time,temp_c,rh_pct\n${'1,'.repeat(5 * 1024 * 1024)}`], 'w.csv', { type: 'text/csv' }),
      )
      const res = await post('/report', form)
      expect(res.status).toBe(413)
      expect(res.headers.get('content-type')).toBe(type)
      expect(await res.text()).toMatch(/limit of 1000 columns/)
    },
  )

  it('the column limit is read from DRYHOURS_MAX_COLUMNS, nonsense refused naming it', () => {
    expect(configFromVariables({ DRYHOURS_MAX_COLUMNS: '5000' })).toEqual({ maxColumns: 5000 })
    expect(() => configFromVariables({ DRYHOURS_MAX_COLUMNS: 'wide' })).toThrow(/DRYHOURS_MAX_COLUMNS/)
  })

  it('an unbalanced quote in the data: 4xx or rows rejected, never invented', async () => {
    const text =
      'time,temp_c,rh_pct\n"2024-07-01T10:00Z,30.1,25\n2024-07-01T11:00Z,31.5,22\n2024-07-01T12:00Z,32.8,20\n'
    const res = await post('/v1/inspect', text, 'text/csv')
    if (res.status === 200) {
      const body = await expectInspect(res)
      expect(body.rows.used).toBeLessThan(3)
    } else await expectProblem(res, [422])
  })

  it('an unbalanced quote in the header: 422 naming the columns it saw', async () => {
    const p = await expectProblem(await post('/v1/inspect', `"${GOOD}`, 'text/csv'), [422])
    expect(p.detail).toMatch(/timestamp/)
  })

  it('a quoted field with an embedded line break in a good file is read as one row', async () => {
    const text =
      'time,temp_c,rh_pct,note\n2024-07-01T10:00Z,30.1,25,"two\nlines"\n2024-07-01T11:00Z,31.5,22,x\n'
    const body = await expectInspect(await post('/v1/inspect', text, 'text/csv'))
    expect(body.rows.read).toBe(2)
    expect(body.rows.used).toBe(2)
  })

  it('declared EPW (LOCATION first) but garbage after: 422 naming EPW', async () => {
    const p = await expectProblem(
      await post('/v1/inspect', 'LOCATION,x,y,z\n\u0001\u0002garbage\nmore,garbage,,,\n', 'text/csv'),
      [422],
    )
    expect(p.detail).toMatch(/EPW/)
  })

  it('declared EPW with eight header lines and unreadable hourly rows: 422', async () => {
    const header = [
      'LOCATION,Here,,,src,0,38,-2,1,100',
      'DESIGN CONDITIONS,0',
      'TYPICAL/EXTREME PERIODS,0',
      'GROUND TEMPERATURES,0',
      'HOLIDAYS/DAYLIGHT SAVINGS,No,0,0,0',
      'COMMENTS 1,',
      'COMMENTS 2,',
      'DATA PERIODS,1,1,Data,Sunday,1/1,12/31',
    ]
    const text = `${header.join('\n')}\n${'2024,1,1,1,0,x,zz,qq\n'.repeat(48)}`
    await expectProblem(await post('/v1/inspect', text, 'text/csv'), [422])
    await expectProblem(await post(COARSE_QUERY, text, 'text/csv'), [422])
  })

  it('a JSON body and a body without a known type: 415 naming the accepted types', async () => {
    const p = await expectProblem(await post('/v1/inspect', '{"a":1}', 'application/json'), [415])
    expect(p.detail).toMatch(/text\/csv/)
    await expectProblem(await post(COARSE_QUERY, inventedDays(2), 'image/png'), [415])
  })

  it('a body over the size limit is a 413 before it is read', async () => {
    const small = createApp({ maxBodyBytes: 1000 })
    const p = await expectProblem(await post('/v1/inspect', inventedDays(3), 'text/csv', small), [413])
    expect(p.detail).toMatch(/1000 bytes/)
  })
})

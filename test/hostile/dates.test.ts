/**
 * Hostile timestamps: rows out of order, duplicated hours, years far in the future or before 1800,
 * and a 100-year file (built in memory from the 4-year demo file; invented data).
 */
import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { createApp } from '../../src/api/app.ts'
import { csvOf, expectInspect, expectProblem, post, THREE_HOURS } from './hostile-helpers.ts'

const [H10, H11, H12] = THREE_HOURS

describe('hostile timestamps', () => {
  it('rows out of order are put in time order: the same series as the sorted file', async () => {
    const sorted = await expectInspect(await post('/v1/inspect', csvOf([H10, H11, H12]), 'text/csv'))
    const shuffled = await expectInspect(await post('/v1/inspect', csvOf([H12, H10, H11]), 'text/csv'))
    expect(shuffled.rows).toEqual(sorted.rows)
    expect(shuffled.period).toEqual(sorted.period)
    expect(shuffled.hours).toBe(3)
    expect(shuffled.coverage).toEqual(sorted.coverage)
  })

  it('an hour given twice with the same values: the copy is rejected and counted', async () => {
    const body = await expectInspect(await post('/v1/inspect', csvOf([H10, H10, H11, H11, H12]), 'text/csv'))
    expect(body.rows).toEqual({ read: 5, used: 3, repaired: 0, rejected: 2, superseded: 0 })
    expect(body.hours).toBe(3)
  })

  it('an hour given twice with different values: not averaged or invented; every row accounted for', async () => {
    const body = await expectInspect(
      await post('/v1/inspect', csvOf([H10, '2024-07-01T10:00Z,10.0,90', H11]), 'text/csv'),
    )
    expect(body.rows.read).toBe(3)
    expect(body.rows.rejected).toBeGreaterThanOrEqual(1)
    expect(body.problems.length).toBeGreaterThan(0)
  })

  it.each(['2999', '2201', '1799', '1700'])(
    'every row in year %s: 422 naming the accepted years',
    async (year) => {
      const p = await expectProblem(
        await post('/v1/inspect', csvOf(THREE_HOURS.map((r) => r.replace('2024', year))), 'text/csv'),
        [422],
      )
      expect(p.detail).toMatch(/1800/)
      expect(p.detail).toMatch(/2200/)
    },
  )

  it('one row before 1800 among good rows: that row rejected, the period from the good rows', async () => {
    const body = await expectInspect(
      await post('/v1/inspect', csvOf(['1799-12-31T23:00Z,5,80', H10, H11]), 'text/csv'),
    )
    expect(body.rows).toEqual({ read: 3, used: 2, repaired: 0, rejected: 1, superseded: 0 })
    expect(body.period.start).toBe('2024-07-01T10:00:00.000Z')
  })

  it('one row in 2999 among good rows: answered (200) with every row accounted for', async () => {
    const body = await expectInspect(
      await post('/v1/inspect', csvOf([H10, H11, '2999-07-01T12:00Z,30,20']), 'text/csv'),
    )
    expect(body.rows.read).toBe(3)
  })

  // Bug (src/weather, typical-year detection): one row dated 2999 (or 2201, outside the 1800–2200 range
  // that is enforced when all rows carry it) among 2024 rows turns the file into a "typical year"
  // ("months come from 2 different years (2024, 2999)") and moves all rows to the nominal year 2001;
  // the 2999 row is used, nothing is rejected. Expected: the 2999 row rejected with its line, the
  // period left in 2024.
  it('one row in 2999 among 2024 rows is rejected, the period stays in 2024 (documents a reader bug)', async () => {
    const body = await expectInspect(
      await post('/v1/inspect', csvOf([H10, H11, '2999-07-01T12:00Z,30,20']), 'text/csv'),
    )
    expect(body.rows.rejected).toBe(1)
    expect(body.years).toEqual([2024])
  })

  it('an impossible date (2023-02-29) is rejected with its line', async () => {
    const body = await expectInspect(
      await post('/v1/inspect', csvOf([H10, H11, '2023-02-29T12:00Z,30,20']), 'text/csv'),
    )
    expect(body.rows.rejected).toBe(1)
    expect(body.problems.some((p) => p.line === 4)).toBe(true)
  })
})

/**
 * 100 years (1901–2000) from the 2021–2024 demo file: each 4-year block has its leap year last, like
 * 2021–2024, and 1900 (not leap) is outside the range, so relabelling the years keeps every date valid.
 */
function centuryFile(slim: boolean): Uint8Array<ArrayBuffer> {
  const lines = readFileSync('climate-demo/ardentine-upland-2021-2024-utc.csv', 'utf8').trimEnd().split('\n')
  // slim: time, dry bulb and relative humidity only (columns 1, 2 and 4), about 23 MB in all.
  const keep = (line: string) => {
    if (!slim) return line
    const f = line.split(',')
    return `${f[0]},${f[1]},${f[3]}`
  }
  const data = lines.slice(1).map(keep)
  const parts: string[] = [keep(lines[0])]
  for (let block = 0; block < 25; block++) {
    for (const line of data) {
      const year = 1901 + block * 4 + (Number(line.slice(0, 4)) - 2021)
      parts.push(`${year}${line.slice(4)}`)
    }
  }
  return new TextEncoder().encode(`${parts.join('\n')}\n`)
}

describe('a 100-year file (876,600 hourly rows)', () => {
  const full = centuryFile(false)
  const century = centuryFile(true)
  const rows = 25 * 35_064
  const coarse = '/v1/assess?product=figs&method=open-air&start=07-01&end=07-01&maxDays=10&deadlineDays=10'

  it('all eight columns (about 45 MB): 413 over the 32 MiB body limit, saying how to split', {
    timeout: 60_000,
  }, async () => {
    expect(full.length).toBeGreaterThan(32 * 1024 * 1024)
    const a = await expectProblem(await post('/v1/inspect', full, 'text/csv'), [413])
    expect(a.detail).toMatch(/split the file by years/)
  })

  it('three columns (under the body limit): 413 over the 400,000-row limit on inspect and a coarse assess', {
    timeout: 60_000,
  }, async () => {
    expect(century.length).toBeLessThan(32 * 1024 * 1024)
    const t0 = performance.now()
    const a = await expectProblem(await post('/v1/inspect', century, 'text/csv'), [413])
    expect(a.detail).toMatch(/split it by years/)
    expect(a.detail).toMatch(/400000/)
    const b = await expectProblem(await post(coarse, century, 'text/csv'), [413])
    expect(b.detail).toMatch(/split it by years/)
    console.info(`100-year file refused twice in ${(performance.now() - t0).toFixed(0)} ms`)
  })

  it('with the row limit raised to 1,000,000: inspect reads all 100 years correctly', {
    timeout: 90_000,
  }, async () => {
    const big = createApp({ maxRows: 1_000_000, maxBodyBytes: 64 * 1024 * 1024 })
    const t0 = performance.now()
    const body = await expectInspect(await post('/v1/inspect', century, 'text/csv', big))
    console.info(`100-year inspect: ${(performance.now() - t0).toFixed(0)} ms`)
    expect(body.rows.read).toBe(rows)
    expect(body.years).toHaveLength(100)
    expect(body.years[0]).toBe(1901)
    expect(body.years[99]).toBe(2000)
    // 1901–2000: 100 × 365 days + 25 leap days (1904 … 2000; 2000 is a leap year, Gregorian rule).
    expect(body.hours).toBe((100 * 365 + 25) * 24)
  })
})

/**
 * Zone offsets and transitions from `Intl` (weather/time-zone.ts): the offsets read from the formatted wall
 * clock agree with `formatToParts` at every hour, and the transitions found are the published ones.
 * Transition instants: the EU rule (Directive 2000/84/EC, art. 2 and 3: summer time from 01:00 UTC on the last
 * Sunday of March to 01:00 UTC on the last Sunday of October); the US rule (Energy Policy Act of 2005, §110:
 * 2:00 local standard time on the second Sunday of March to the first Sunday of November); Lord Howe Island's
 * half-hour daylight saving and India's single offset as in the IANA tz database (the runtime's copy).
 */
import { describe, expect, it } from 'vitest'
import { offsetAtUtc, utcCandidates, zoneOffsets } from '../../src/weather/time-zone.ts'

const HOUR = 3_600_000

/** Offset [ms] by formatToParts, the slow reference. */
function partsOffsetMs(zone: string, utcMs: number): number {
  const f = new Intl.DateTimeFormat('en-US', {
    timeZone: zone,
    hourCycle: 'h23',
    year: 'numeric',
    month: 'numeric',
    day: 'numeric',
    hour: 'numeric',
    minute: 'numeric',
  })
  const get = (type: string): number => Number(f.formatToParts(utcMs).find((p) => p.type === type)?.value)
  const wall = Date.UTC(get('year'), get('month') - 1, get('day'), get('hour') % 24, get('minute'))
  return wall - Math.floor(utcMs / 60_000) * 60_000
}

describe('zone offsets from Intl', () => {
  it('agree with formatToParts at every 7th hour over two years in five zones', () => {
    for (const zone of ['Europe/Madrid', 'America/Chicago', 'Australia/Lord_Howe', 'Asia/Kolkata', 'UTC']) {
      const start = Date.UTC(2019, 0, 1)
      const end = Date.UTC(2021, 0, 1)
      const z = zoneOffsets(zone, start, end)
      for (let t = start; t < end; t += 7 * HOUR)
        expect(offsetAtUtc(z, t), `${zone} ${t}`).toBe(partsOffsetMs(zone, t))
    }
  })

  it('finds the EU transitions of 2020 at 01:00 UTC on the last Sundays of March and October', () => {
    const z = zoneOffsets('Europe/Madrid', Date.UTC(2020, 0, 1), Date.UTC(2020, 11, 31))
    expect(z.fromUtcMs.slice(1)).toEqual([Date.UTC(2020, 2, 29, 1), Date.UTC(2020, 9, 25, 1)])
    expect(z.offsetMs).toEqual([HOUR, 2 * HOUR, HOUR])
  })

  it('finds the US transitions of 2021 at 02:00 local standard time (08:00 UTC in Chicago)', () => {
    const z = zoneOffsets('America/Chicago', Date.UTC(2021, 0, 1), Date.UTC(2021, 11, 31))
    expect(z.fromUtcMs.slice(1)).toEqual([Date.UTC(2021, 2, 14, 8), Date.UTC(2021, 10, 7, 7)])
    // the spring gap: 02:30 on 14 March does not exist; the autumn hour 01:30 on 7 November happens twice
    expect(utcCandidates(z, Date.UTC(2021, 2, 14, 2, 30))).toEqual([])
    expect(utcCandidates(z, Date.UTC(2021, 10, 7, 1, 30))).toEqual([
      Date.UTC(2021, 10, 7, 6, 30),
      Date.UTC(2021, 10, 7, 7, 30),
    ])
  })

  it('reads half-hour steps (Lord Howe Island, +10:30 / +11:00) and a zone without transitions', () => {
    const lh = zoneOffsets('Australia/Lord_Howe', Date.UTC(2020, 0, 1), Date.UTC(2020, 11, 31))
    expect(new Set(lh.offsetMs)).toEqual(new Set([10.5 * HOUR, 11 * HOUR]))
    const india = zoneOffsets('Asia/Kolkata', Date.UTC(2000, 0, 1), Date.UTC(2020, 11, 31))
    expect(india.offsetMs).toEqual([5.5 * HOUR])
  })
})

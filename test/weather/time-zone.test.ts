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

/** Offset [ms] by formatToParts, the slow reference (one formatter per zone). */
const formats = new Map<string, Intl.DateTimeFormat>()
function partsOffsetMs(zone: string, utcMs: number): number {
  let f = formats.get(zone)
  if (f === undefined) {
    f = new Intl.DateTimeFormat('en-US', {
      timeZone: zone,
      hourCycle: 'h23',
      year: 'numeric',
      month: 'numeric',
      day: 'numeric',
      hour: 'numeric',
      minute: 'numeric',
    })
    formats.set(zone, f)
  }
  const parts = f.formatToParts(utcMs)
  const get = (type: string): number => Number(parts.find((p) => p.type === type)?.value)
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

  it('finds the same transitions as reading the offset every day, in zones with unusual rules (2000–2025)', () => {
    // Weekly sampling with daily reading of a week that changed must not miss a transition. Reference: the
    // offset read every day and each change bisected to the minute (the algorithm it replaced; on this
    // machine the two agree for all 418 zones Intl knows, 1975–2030). Zones: Morocco's Ramadan breaks,
    // Egypt's suspended summer time, the Levant's Friday rules, Iran, Chile, Brazil's abolished summer time,
    // Lord Howe's half hour, Chatham's 12:45, Samoa's skipped day, Casey's changes, Pyongyang's 2015 and
    // 2018 steps.
    const zones = [
      'Africa/Casablanca',
      'Africa/Cairo',
      'Asia/Gaza',
      'Asia/Amman',
      'Asia/Tehran',
      'America/Santiago',
      'America/Sao_Paulo',
      'Australia/Lord_Howe',
      'Pacific/Chatham',
      'Pacific/Apia',
      'Antarctica/Casey',
      'Asia/Pyongyang',
    ]
    const start = Date.UTC(2000, 0, 1)
    const end = Date.UTC(2025, 0, 1)
    const DAY = 86_400_000
    for (const zone of zones) {
      const from: number[] = [Number.NEGATIVE_INFINITY]
      const t0 = Math.floor(start / DAY) * DAY - 2 * DAY
      const offsets: number[] = [partsOffsetMs(zone, t0)]
      let previous = offsets[0]
      let previousT = t0
      for (let t = t0 + DAY; t <= end + 2 * DAY; t += DAY) {
        const o = partsOffsetMs(zone, t)
        if (o !== previous) {
          let lo = previousT
          let hi = t
          while (hi - lo > 60_000) {
            const mid = lo + Math.floor((hi - lo) / 2 / 60_000) * 60_000
            if (partsOffsetMs(zone, mid) === previous) lo = mid
            else hi = mid
          }
          from.push(hi)
          offsets.push(o)
          previous = o
        }
        previousT = t
      }
      const z = zoneOffsets(zone, start, end)
      expect(z.fromUtcMs, zone).toEqual(from)
      expect(z.offsetMs, zone).toEqual(offsets)
    }
  })
})

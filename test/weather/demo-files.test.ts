// The invented demo climates in climate-demo/ (see its README: all data invented). The faulty
// logger file comes with a list of its deliberate faults (…faults.json, written by the generator);
// every fault must be found. Skipped when the demo files are absent.
import { existsSync, readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { readWeather } from '../../src/weather/read-weather.ts'
import { QualityFlag } from '../../src/weather/series.ts'

const dir = new URL('../../climate-demo/', import.meta.url)
const faultyPath = new URL('tamarel-lowland-2023-logger-faulty.csv', dir)
const faultsPath = new URL('tamarel-lowland-2023-logger-faulty.faults.json', dir)
const dstPath = new URL('quillow-valley-2021-2023-local-dst-imperial.csv', dir)
const present = existsSync(faultyPath) && existsSync(faultsPath) && existsSync(dstPath)

interface Fault {
  kind: string
  variable?: string
  times?: string[]
  lines?: number[]
  note: string
}

describe.skipIf(!present)('demo climates', () => {
  it('the faulty logger file: every listed fault is found, and the row counts add up', () => {
    const r = readWeather(readFileSync(faultyPath, 'utf8'), {
      latitudeDeg: 11.9,
      longitudeDeg: 104.6,
      elevationM: 95,
    })
    const faults: Fault[] = JSON.parse(readFileSync(faultsPath, 'utf8')).faults
    const s = r.series
    const slot = (local: string): number =>
      (Date.parse(`${local.replace(' ', 'T')}:00+07:00`) - s.startUtcMs[0]) / 3_600_000
    const problemLines = (kind: string): number[] =>
      r.problems.filter((p) => p.kind === kind).map((p) => p.line ?? -1)
    expect(r.rows.used + r.rows.repaired + r.rows.rejected + r.rows.superseded).toBe(r.rows.read)
    expect(r.timeBasis).toMatch(/UTC\+07:00/)
    for (const f of faults) {
      const where = `${f.kind}: ${f.note}`
      if (f.kind === 'missing-code') {
        const k = slot(f.times![0])
        if (f.variable === 'relativeHumidity') {
          // RH missing: taken from the hour's dew point instead, never read as -9999
          expect(s.relativeHumidityPct[k], where).toBeGreaterThan(0)
          expect(s.relativeHumidityPct[k], where).toBeLessThanOrEqual(100)
        } else {
          // a one-hour missing value is filled by interpolation (irradiance: clear-sky scaled), never read as a code
          expect(s.quality[k] & (QualityFlag.filled | QualityFlag.irradianceFilled), where).toBeTruthy()
        }
      } else if (f.kind === 'stuck-sensor') {
        for (const line of f.lines!) expect(problemLines('stuck-sensor'), where).toContain(line)
      } else if (f.kind === 'negative-irradiance') {
        expect(problemLines('negative-irradiance'), where).toContain(f.lines![0])
      } else if (f.kind === 'short-gap') {
        for (const t of f.times ?? []) expect(s.quality[slot(t)] & QualityFlag.filled, where).toBeTruthy()
      } else if (f.kind === 'long-gap') {
        for (const t of f.times ?? [])
          expect(s.quality[slot(t)] & QualityFlag.missingCore, where).toBeTruthy()
      } else if (f.kind === 'duplicate-row' || f.kind === 'duplicate-timestamp') {
        expect(problemLines('duplicate-timestamp'), where).toContain(f.lines![1])
      } else if (f.kind === 'out-of-order') {
        expect(problemLines('out-of-order'), where).toContain(f.lines![0])
      } else {
        throw new Error(`fault kind not covered by this test: ${f.kind}`)
      }
    }
  })

  it('the local-time export with daylight saving (°F, mph, inHg, in): no hour lost or doubled in UTC', () => {
    const r = readWeather(readFileSync(dstPath, 'utf8'), {
      timeZone: 'America/Chicago',
      latitudeDeg: 43.6,
      longitudeDeg: -89.4,
      elevationM: 262,
    })
    expect(r.rows.rejected).toBe(0)
    expect(r.hoursWithoutRow).toBe(0)
    expect(r.dstEvents.filter((e) => e.kind === 'spring-gap')).toHaveLength(3)
    expect(r.dstEvents.filter((e) => e.kind === 'autumn-overlap').every((e) => e.rows === 2)).toBe(true)
    expect(r.columns.find((c) => c.variable === 'dryBulb')?.unit).toBe('°F')
    expect(r.series.site.utcOffsetHours).toBe(-6)
  })
})

/**
 * @module product/fit-rate-curve
 * The drying-rate curve from weighings: rate −ΔM/Δt between consecutive weighings against the mean moisture
 * of the interval. A constant-rate period is the run of leading intervals whose rate stays within
 * `CONSTANT_RATE_TOLERANCE` of the running mean of that run; the critical moisture is the moisture at its
 * end (Geankoplis 2003, *Transport Processes and Separation Process Principles*, §9.5, for the
 * definitions; the 15 % tolerance is common practice, no source).
 */
import type { MoisturePoint } from './weighings.ts'

export const CONSTANT_RATE_TOLERANCE = 0.15

export interface RateInterval {
  startH: number
  endH: number
  meanMoistureDb: number
  /** Drying rate [kg water/(kg dry matter·h)]; negative when the tray gained water. */
  rateDbPerH: number
}

export interface RatePeriods {
  intervals: RateInterval[]
  /** Null when the rate falls from the first interval on (no constant-rate period seen). */
  constantRate: { startH: number; endH: number; rateDbPerH: number; criticalMoistureDb: number } | null
  fallingRateStartH: number
}

export function dryingRatePeriods(pts: MoisturePoint[]): RatePeriods {
  const intervals: RateInterval[] = []
  for (let i = 1; i < pts.length; i++) {
    const a = pts[i - 1]
    const b = pts[i]
    intervals.push({
      startH: a.timeH,
      endH: b.timeH,
      meanMoistureDb: (a.moistureDb + b.moistureDb) / 2,
      rateDbPerH: (a.moistureDb - b.moistureDb) / (b.timeH - a.timeH),
    })
  }
  let end = 0
  let sum = 0
  for (let i = 0; i < intervals.length; i++) {
    const r = intervals[i].rateDbPerH
    const mean = i === 0 ? r : sum / i
    if (i > 0 && Math.abs(r - mean) > CONSTANT_RATE_TOLERANCE * mean) break
    sum += r
    end = i + 1
  }
  if (end >= 2 && sum > 0) {
    const last = intervals[end - 1]
    const critical = pts[end].moistureDb
    return {
      intervals,
      constantRate: {
        startH: intervals[0].startH,
        endH: last.endH,
        rateDbPerH: sum / end,
        criticalMoistureDb: critical,
      },
      fallingRateStartH: last.endH,
    }
  }
  return { intervals, constantRate: null, fallingRateStartH: 0 }
}

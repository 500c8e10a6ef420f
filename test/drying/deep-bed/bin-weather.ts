/**
 * Invented weather for the bin tests (no place, no source): a daily cycle of temperature and humidity on top of
 * slower swings, and multi-year series built from one pattern per year.
 */

export interface TestColumns {
  dryBulbC: Float64Array
  relativeHumidityPct: Float64Array
  pressureKpa: number
}

/** `days` of a daily cycle (coolest and most humid at 05:00) around meanC and meanRhPct, with slow swings. */
export function cyclingWeather(
  days: number,
  meanC: number,
  meanRhPct: number,
  swingC = 6,
  swingRhPct = 18,
): TestColumns {
  const n = days * 24
  const dryBulbC = new Float64Array(n)
  const relativeHumidityPct = new Float64Array(n)
  for (let i = 0; i < n; i++) {
    const daily = Math.cos((2 * Math.PI * ((i % 24) - 5)) / 24) // 1 at 05:00
    const slow = Math.sin((2 * Math.PI * i) / (24 * 9.3))
    dryBulbC[i] = meanC - swingC * daily + 3 * slow
    relativeHumidityPct[i] = Math.min(98, Math.max(20, meanRhPct + swingRhPct * daily - 8 * slow))
  }
  return { dryBulbC, relativeHumidityPct, pressureKpa: 101.325 }
}

/** Constant weather. */
export function steadyWeather(days: number, dryBulbC: number, rhPct: number): TestColumns {
  return {
    dryBulbC: new Float64Array(days * 24).fill(dryBulbC),
    relativeHumidityPct: new Float64Array(days * 24).fill(rhPct),
    pressureKpa: 101.325,
  }
}

/** The same columns as hourly rows (for the reference implementation). */
export function asRows(w: TestColumns): { dryBulbC: number; rhPct: number; pressureKpa: number }[] {
  return Array.from(w.dryBulbC, (t, i) => ({
    dryBulbC: t,
    rhPct: w.relativeHumidityPct[i],
    pressureKpa: w.pressureKpa,
  }))
}

/**
 * Hourly weather for whole calendar years from `firstYear` (UTC = local time), the conditions of each hour
 * given by `at(year, month, hourOfDay)`.
 */
export function multiYearWeather(
  firstYear: number,
  years: number,
  at: (year: number, month: number, hourOfDay: number) => { tC: number; rhPct: number },
): TestColumns & { startUtcMs: Float64Array; typicalYear: boolean } {
  const t0 = Date.UTC(firstYear, 0, 1)
  const n = Math.round((Date.UTC(firstYear + years, 0, 1) - t0) / 3_600_000)
  const startUtcMs = new Float64Array(n)
  const dryBulbC = new Float64Array(n)
  const relativeHumidityPct = new Float64Array(n)
  for (let i = 0; i < n; i++) {
    const ms = t0 + i * 3_600_000
    const d = new Date(ms)
    const v = at(d.getUTCFullYear(), d.getUTCMonth() + 1, d.getUTCHours())
    startUtcMs[i] = ms
    dryBulbC[i] = v.tC
    relativeHumidityPct[i] = v.rhPct
  }
  return { startUtcMs, dryBulbC, relativeHumidityPct, pressureKpa: 101.325, typicalYear: false }
}

/**
 * Hand-built weather for engine tests: constant air, or a clear-sky diurnal cycle with a fixed dew point
 * (the vapour pressure of a dry, settled summer day stays nearly constant while T swings). Invented
 * values only; each test says where its figures come from.
 */
import { clearSkyGhiHaurwitzWm2 } from '../../src/physics/irradiance.ts'
import { saturationVaporPressureLiquidKpa } from '../../src/physics/saturation.ts'
import { sunPosition } from '../../src/physics/sun.ts'
import { createEmptySeries, type HourlySeries } from '../../src/weather/series.ts'

export interface ConstantWeather {
  dryBulbC: number
  relativeHumidityPct: number
  windMs?: number
  ghiWm2?: number
  pressureKpa?: number
  hours?: number
  latitudeDeg?: number | null
  longitudeDeg?: number | null
}

const site = (lat: number | null, lon: number | null, name = 'test site', offset = 0) => ({
  name,
  latitudeDeg: lat,
  longitudeDeg: lon,
  elevationM: 0,
  timeZone: null,
  utcOffsetHours: offset,
  windHeightM: 10,
})

export function constantSeries(w: ConstantWeather): HourlySeries {
  const hours = w.hours ?? 24 * 30
  const s = createEmptySeries(
    site(w.latitudeDeg ?? null, w.longitudeDeg ?? null),
    Date.UTC(2021, 6, 1),
    hours,
  )
  s.dryBulbC.fill(w.dryBulbC)
  s.relativeHumidityPct.fill(w.relativeHumidityPct)
  s.pressureKpa.fill(w.pressureKpa ?? 101.325)
  s.windMs.fill(w.windMs ?? 2)
  s.ghiWm2.fill(w.ghiWm2 ?? 0)
  s.rainMm.fill(0)
  return s
}

export interface DiurnalWeather {
  latitudeDeg: number
  longitudeDeg: number
  utcOffsetHours: number
  /** First local day, e.g. Date.UTC(2021, 7, 1). */
  firstDayUtcMs: number
  days: number
  tMinC: number
  tMaxC: number
  dewPointC: number
  windMs: number
  /** Multiplies the Haurwitz clear-sky irradiance (1 = clear). */
  clearness?: number
  name?: string
}

/** T(h) = mean + amplitude·cos(2π(h − 15)/24), local hour h; RH from the fixed dew point; Haurwitz GHI. */
export function diurnalSeries(w: DiurnalWeather): HourlySeries {
  const hours = w.days * 24
  const first = w.firstDayUtcMs - w.utcOffsetHours * 3_600_000
  const s = createEmptySeries(site(w.latitudeDeg, w.longitudeDeg, w.name, w.utcOffsetHours), first, hours)
  const mean = (w.tMinC + w.tMaxC) / 2
  const amp = (w.tMaxC - w.tMinC) / 2
  const pw = saturationVaporPressureLiquidKpa(w.dewPointC)
  for (let i = 0; i < hours; i++) {
    const localHour = (i % 24) + 0.5
    const t = mean + amp * Math.cos((2 * Math.PI * (localHour - 15)) / 24)
    s.dryBulbC[i] = t
    s.relativeHumidityPct[i] = Math.min(100, (100 * pw) / saturationVaporPressureLiquidKpa(t))
    s.pressureKpa[i] = 101.325
    s.windMs[i] = w.windMs
    const alt = sunPosition(s.startUtcMs[i] + 1_800_000, w.latitudeDeg, w.longitudeDeg).altitudeDeg
    s.ghiWm2[i] = (w.clearness ?? 1) * clearSkyGhiHaurwitzWm2(alt)
    s.rainMm[i] = 0
  }
  return s
}

/** A copy of `s` with every column copied (so tests can alter it). */
export function copySeries(s: HourlySeries): HourlySeries {
  return {
    ...s,
    site: { ...s.site },
    startUtcMs: s.startUtcMs.slice(),
    dryBulbC: s.dryBulbC.slice(),
    relativeHumidityPct: s.relativeHumidityPct.slice(),
    pressureKpa: s.pressureKpa.slice(),
    windMs: s.windMs.slice(),
    ghiWm2: s.ghiWm2.slice(),
    rainMm: s.rainMm.slice(),
    quality: s.quality.slice(),
  }
}

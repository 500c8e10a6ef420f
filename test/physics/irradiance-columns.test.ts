import { describe, expect, it } from 'vitest'
import { clearSkyGhiHaurwitzWm2 } from '../../src/physics/irradiance.ts'
import {
  extraterrestrialHorizontalColumnWm2,
  tiltedIrradianceColumnWm2,
} from '../../src/physics/irradiance-columns.ts'
import { sunPositionColumns } from '../../src/physics/sun.ts'

function hourStarts(startUtcMs: number, hours: number): Float64Array {
  const a = new Float64Array(hours)
  for (let i = 0; i < hours; i++) a[i] = startUtcMs + i * 3_600_000
  return a
}

describe('extraterrestrial horizontal column', () => {
  it('24 hourly means of 6 July at 50°48′N, 0° E sum to FAO-56 Example 18 Ra = 41.09 MJ m⁻² d⁻¹', () => {
    // Allen et al. (1998) Example 18 (Brussels latitude, J = 187); longitude 0 keeps the UTC day = solar day.
    const starts = hourStarts(Date.UTC(2001, 6, 6), 24)
    const out = new Float64Array(24)
    extraterrestrialHorizontalColumnWm2(starts, 50.8, 0, out)
    const sumMj = out.reduce((s, v) => s + v, 0) * 0.0036
    expect(sumMj).toBeCloseTo(41.09, 1)
    expect(out[0]).toBe(0) // 00:00–01:00 at 0° E is night in July
  })
  it('NaN start gives NaN; short output column throws', () => {
    const out = new Float64Array(1)
    extraterrestrialHorizontalColumnWm2(new Float64Array([Number.NaN]), 10, 10, out)
    expect(Number.isNaN(out[0])).toBe(true)
    expect(() => extraterrestrialHorizontalColumnWm2(new Float64Array(2), 10, 10, out)).toThrow(
      /output column/,
    )
  })
})

describe('tilted irradiance column', () => {
  const lat = 38.5
  const lon = -121.7
  const starts = hourStarts(Date.UTC(2023, 11, 21, 0), 48) // two winter days
  const n = starts.length
  const alt = new Float64Array(n)
  const az = new Float64Array(n)
  sunPositionColumns(starts, lat, lon, alt, az)
  const ext = new Float64Array(n)
  extraterrestrialHorizontalColumnWm2(starts, lat, lon, ext)
  const ghi = new Float64Array(n)
  for (let i = 0; i < n; i++) ghi[i] = clearSkyGhiHaurwitzWm2(alt[i])
  ghi[3] = Number.NaN

  it('tilt 0 returns the measured GHI hour by hour', () => {
    const out = new Float64Array(n)
    tiltedIrradianceColumnWm2(ghi, ext, alt, az, { tiltDeg: 0, azimuthDeg: 180, groundAlbedo: 0.2 }, out)
    for (let i = 0; i < n; i++) {
      if (i === 3) expect(Number.isNaN(out[i])).toBe(true)
      else expect(out[i]).toBeCloseTo(ghi[i], 9)
    }
  })
  it('winter clear noon: a south-facing 45° plane gets more than the horizontal, a north-facing one less', () => {
    // Geometry of the winter sun (low, due south at noon): Duffie & Beckman (2013) §1.8 discussion of tilt.
    const south = new Float64Array(n)
    const north = new Float64Array(n)
    tiltedIrradianceColumnWm2(ghi, ext, alt, az, { tiltDeg: 45, azimuthDeg: 180, groundAlbedo: 0.2 }, south)
    tiltedIrradianceColumnWm2(ghi, ext, alt, az, { tiltDeg: 45, azimuthDeg: 0, groundAlbedo: 0.2 }, north)
    let noon = 0
    for (let i = 0; i < 24; i++) if (alt[i] > alt[noon]) noon = i
    expect(alt[noon]).toBeGreaterThan(25)
    expect(south[noon]).toBeGreaterThan(1.3 * ghi[noon])
    expect(north[noon]).toBeLessThan(0.6 * ghi[noon])
    for (let i = 0; i < n; i++) if (ghi[i] === 0) expect(south[i]).toBe(0)
  })
  it('a bad plane fails before hour 0, naming the field', () => {
    const out = new Float64Array(n)
    expect(() =>
      tiltedIrradianceColumnWm2(ghi, ext, alt, az, { tiltDeg: 30, azimuthDeg: 180, groundAlbedo: 2 }, out),
    ).toThrow(/albedo/)
  })
})

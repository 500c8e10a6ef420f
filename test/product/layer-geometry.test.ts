import { describe, expect, it } from 'vitest'
import {
  FRESH_PRODUCT_DENSITY_KG_PER_M3,
  layerGeometry,
  singleLayerVolumeM3PerM2,
} from '../../src/product/layer-geometry.ts'

describe('layer geometry (product/layer-geometry.ts)', () => {
  it('one full layer of 17.2 mm spheres holds π·d/6 m³ per m²: 9.0 kg/m² at the density of water', () => {
    // geometry: a sphere of volume π d³/6 on a d × d square
    const v = singleLayerVolumeM3PerM2('sphere', 17.2)
    expect(v).toBeCloseTo((Math.PI * 0.0172) / 6, 12)
    const full = layerGeometry('sphere', 17.2, v * FRESH_PRODUCT_DENSITY_KG_PER_M3)
    expect(full.coverage).toBeCloseTo(1, 12)
    expect(full.layers).toBeCloseTo(1, 12)
    expect(full.exchangeAreaRatio).toBeCloseTo(Math.PI, 12) // π d² of surface over d² of tray
  })
  it('half the loading covers half the tray; more than a layer covers it all', () => {
    const v = singleLayerVolumeM3PerM2('cylinder', 10) * FRESH_PRODUCT_DENSITY_KG_PER_M3
    expect(layerGeometry('cylinder', 10, v / 2).coverage).toBeCloseTo(0.5, 12)
    const deep = layerGeometry('cylinder', 10, 3 * v)
    expect(deep.coverage).toBe(1)
    expect(deep.layers).toBeCloseTo(3, 12)
  })
  it('slices: a 15 mm slab at 10 kg/m² covers two thirds of the tray and exposes both faces', () => {
    const g = layerGeometry('slab', 15, 10)
    expect(g.coverage).toBeCloseTo(10 / 15, 12)
    expect(g.exchangeAreaRatio).toBe(2)
  })
  it("the user's exchange surface replaces the shape's", () => {
    expect(layerGeometry('slab', 15, 10, 1).exchangeAreaRatio).toBe(1)
  })
  it('refuses a size or loading out of range', () => {
    expect(() => layerGeometry('slab', 0, 10)).toThrow(RangeError)
    expect(() => layerGeometry('slab', 10, 0)).toThrow(RangeError)
  })
})

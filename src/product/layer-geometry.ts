/**
 * @module product/layer-geometry
 * How a layer of product on a tray or mat meets the air and the sun, from its shape, size and loading:
 * - one full layer of pieces packed side by side holds, per m² of tray, the volume of one piece over its
 *   footprint: a sphere of diameter d on a d × d square, π·d/6; a cylinder lying down, π·d/4; a slab of
 *   thickness t, t (geometry);
 * - its exchange surface per m² it covers: a sphere's surface π·d² over d², π; a cylinder's side π·d·L over
 *   d·L, π; a slice on a mesh, both faces, 2 (geometry; ends and contacts ignored, and in a deeper layer only
 *   the top layer is counted: the pieces below are sheltered);
 * - the share of the tray it covers: loading ÷ (density × one layer's volume), at most 1.
 * The density of fresh produce is taken as that of water, {@link FRESH_PRODUCT_DENSITY_KG_PER_M3}.
 */
import type { Shape } from './profile.ts'

/**
 * Density of fresh produce [kg/m³] for the volume of a layer: that of water (assumption: the catalogue's fresh
 * products hold 53–95 % water; fruit and vegetables are near 950–1100 kg/m³, from memory).
 */
export const FRESH_PRODUCT_DENSITY_KG_PER_M3 = 1000

export interface LayerGeometry {
  /** Share of the tray the product covers [0–1]. */
  coverage: number
  /** Layers of pieces [–]: loading over one full layer (1: one full layer; above 1, pieces lie on pieces). */
  layers: number
  /** Surface of the product that meets the air per m² it covers [m²/m²]. */
  exchangeAreaRatio: number
}

/** Exchange surface per m² covered of one layer of pieces of `shape` [m²/m²] (see the module note). */
export function singleLayerExchangeAreaRatio(shape: Shape): number {
  return shape === 'slab' ? 2 : Math.PI
}

/** Volume per m² of tray of one full layer of pieces [m³/m²] of `shape` and size `sizeMm` (diameter or thickness). */
export function singleLayerVolumeM3PerM2(shape: Shape, sizeMm: number): number {
  if (!(sizeMm > 0 && sizeMm < 1000)) {
    throw new RangeError(`size must be between 0 and 1000 mm, got ${sizeMm}`)
  }
  const d = sizeMm / 1000
  if (shape === 'sphere') return (Math.PI * d) / 6
  if (shape === 'cylinder') return (Math.PI * d) / 4
  return d
}

/**
 * The layer of `loadingKgPerM2` kg of fresh product per m² in pieces of `shape` and `sizeMm`; an
 * `exchangeAreaRatio` given by the user replaces the one of the shape.
 */
export function layerGeometry(
  shape: Shape,
  sizeMm: number,
  loadingKgPerM2: number,
  exchangeAreaRatio?: number,
): LayerGeometry {
  if (!(loadingKgPerM2 > 0 && loadingKgPerM2 < 2000)) {
    throw new RangeError(`loading must be between 0 and 2000 kg/m², got ${loadingKgPerM2}`)
  }
  const layers = loadingKgPerM2 / (FRESH_PRODUCT_DENSITY_KG_PER_M3 * singleLayerVolumeM3PerM2(shape, sizeMm))
  return {
    coverage: Math.min(1, layers),
    layers,
    exchangeAreaRatio: exchangeAreaRatio ?? singleLayerExchangeAreaRatio(shape),
  }
}

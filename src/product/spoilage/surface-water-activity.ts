/**
 * @module product/spoilage/surface-water-activity
 * The water activity at the product's SURFACE in one hour of a batch, for spoilage models that describe mould
 * (mould spores land and germinate on the surface; `SpoilageModel.waterActivityOf === 'surface'`). The piece's
 * own water activity (its isotherm at its mean moisture) is what the interior holds; a whole fig or grape is
 * near aw 0.98 for days while its skin faces dry air.
 *
 * The rule (dryhours' assembly of textbook drying theory; the pieces and their sources):
 * - Hours the product exchanges water with the air (drying, rewetting or at rest in moving air): a share `w` of
 *   the surface is taken as wet (aw 1) and the rest as in equilibrium with the air at the surface temperature,
 *   aw = ea/es(T_surface) (capped at 1: at or below the dew point the surface is wet), so
 *   aw_surface = w + (1 − w)·ea/es(T_surface), where `w` is the share of the hour's constant-rate (free-water)
 *   limit the product actually evaporated (the batch's drop / cap, 0 when it did not dry).
 *   - In the constant-rate period "the surfaces ... remain completely wetted" and the product evaporates as a free
 *     liquid surface would (Geankoplis, C.J., *Transport Processes and Unit Operations*, §9.6B, excerpt read:
 *     `transcribed`): w = 1, aw 1.
 *   - In the first falling-rate period "a part of the surface of the solid cannot be maintained water-saturated,
 *     thus the drying rate decreases"; in the second "the whole evaporating surface is unsaturated and the
 *     evaporation front moves inside the product" (Heldman, D.R. & Moraru, C.I., "Drying kinetics measurement",
 *     *Encyclopedia of Agricultural, Food, and Biological Engineering*, CRC Press; excerpt read): the share of the
 *     free-water rate is read as the wet share of the surface (assumption).
 *   - Skinned fruit dries skin-limited: "water movement within the grape is speedy in comparison to the slow
 *     transfer of water through the cuticle" (Christensen, L.P. & Peacock, W.L. 2000, "The Raisin Drying Process",
 *     ch. 27 of *Raisin Production Manual*, University of California ANR Publication 3393, p. 207; excerpt read).
 *     With the main resistance inside the skin, the outer face of the cuticle sits near the air's vapour pressure:
 *     the drying batch's small `w` gives aw near the air's RH at the skin temperature.
 *   - Mould models for surfaces are driven by the RH and temperature AT the surface: the updated VTT and the
 *     biohygrothermal mould models of building physics "require the superficial temperature and relative humidity
 *     as input" (*Advances in Civil Engineering* 2018, article 8532167, a sensitivity study of both; abstract read).
 *   - The dried part of the surface is never wetter than the interior when water flows out: in hours the product
 *     dried, aw_surface ≤ the piece's aw (assumption).
 *   - The mean over the surface is fed to the model (assumption): wet spots on a partly dried surface are more at
 *     risk than the mean says; for the skinned whole fruit `w` is small and this matters little.
 * - Rain on an exposed product: wetted, aw 1 (free water on the surface).
 * - Hours without exchange with the air (covered, fans off: the engine moves no water in them) and hours of
 *   missing weather: the surface comes to the interior's water activity, the piece's aw (assumption, the same
 *   premise as the engine's; under a close cover over wet fruit the air nears saturation).
 * Nothing here is fitted to an outcome; the rule is the same for every product and method.
 */

/** How the product's surface met the air in the hour. */
export const SurfaceExchange = {
  /** No exchange with the air (covered, fans off) or missing weather: the surface is at the piece's aw. */
  none: 0,
  /** Exchanges water with the air (drying, rewetting or at rest in moving air). */
  air: 1,
  /** Wetted by rain: free water on the surface. */
  wetted: 2,
} as const
export type SurfaceExchange = (typeof SurfaceExchange)[keyof typeof SurfaceExchange]

/**
 * Water activity (0–1) at the product's surface in one hour (see the module comment).
 * @param exchange how the surface met the air ({@link SurfaceExchange})
 * @param pieceAw the piece's water activity from its isotherm at its moisture and temperature
 * @param surfaceRh the air's vapour pressure over saturation at the surface temperature (0–1; above 1 is dew)
 * @param wetShare share of the hour's free-water (constant-rate) limit the product evaporated (0–1; 0 when it did not dry)
 */
export function surfaceWaterActivity(
  exchange: number,
  pieceAw: number,
  surfaceRh: number,
  wetShare: number,
): number {
  if (exchange === SurfaceExchange.wetted) return 1
  if (exchange !== SurfaceExchange.air || !(surfaceRh >= 0)) return pieceAw
  const rh = Math.min(surfaceRh, 1)
  const w = wetShare > 0 ? Math.min(wetShare, 1) : 0
  const aw = w + (1 - w) * rh
  // a drying product's surface is not wetter than its interior
  return w > 0 && aw > pieceAw ? pieceAw : aw
}

/** The rule in words (the assessment's `spoilage.model.waterActivity.rule`). */
export const SURFACE_WATER_ACTIVITY_RULE =
  'water activity at the product surface: in hours the product exchanges water with the air, w + (1 − w)·(air vapour pressure ÷ saturation at the surface temperature, at most 1), w the share of the hour’s free-water (constant-rate) evaporation the product achieved, and not above the piece’s water activity in hours it dried; 1 when wetted by rain or at or below the dew point; the piece’s water activity (its isotherm at its mean moisture) when covered, with fans off or without weather'

/** Where the rule's pieces come from (the assessment's `spoilage.model.waterActivity.source`). */
export const SURFACE_WATER_ACTIVITY_SOURCE =
  'constant-rate period with a wetted surface (Geankoplis, Transport Processes and Unit Operations, §9.6B); partly wetted then unsaturated surface in the falling-rate periods (Heldman & Moraru, Encyclopedia of Agricultural, Food, and Biological Engineering, "Drying kinetics measurement"); skin-limited drying of grapes (Christensen & Peacock 2000, Raisin Production Manual, UC ANR 3393, ch. 27); the wet share read from the evaporation rate, the surface mean, and the piece’s aw under cover are dryhours’ assumptions'

/**
 * @module drying/methods/solar-cabinet
 * Solar cabinet (indirect): ambient air heated by a flat-plate solar air collector, then blown through the
 * product. What it assumes:
 * - the collector takes ambient air in, so its useful gain is Hottel–Whillier–Bliss with inlet = ambient,
 *   q = FR(τα)·G_T − FR·UL·(T_in − T_a) (Duffie & Beckman 2013 ch. 6), G_T on the tilted collector from
 *   the measured global irradiance by the Erbs et al. (1982) split and the Liu–Jordan (1963) isotropic sky;
 * - the air is heated at constant humidity ratio, T = T_a + q/(ṁ·c_p) with c_p = 1.006 + 1.86·W (ASHRAE
 *   HOF 2017 ch. 1 eq 30), and the product is at that air temperature;
 * - above the product's temperature limit a damper mixes in ambient air to hold the limit (common
 *   practice, no source); the collector heat then counts only in the share used;
 * - by default the fans run only while the collector gives at least the stated irradiance, and the
 *   cabinet is closed otherwise (no drying, no rewetting);
 * - its constant-rate limit is the deficit to saturation × the air flow.
 * Energy input: the collector heat (kWh per tonne), no fuel.
 */
import { z } from 'zod'
import { collectorOutletC, collectorUsefulGainWm2 } from '../../physics/collector.ts'
import { tiltedIrradianceFromGhiWm2 } from '../../physics/irradiance.ts'
import { HourMode, type MethodHour, type MethodModel } from './method-model.ts'
import { fraction } from './parameters.ts'

/**
 * Solar cabinet parameters. Collector efficiency line defaults FR(τα) 0.60 and FR·UL 5 W m⁻² K⁻¹ are the
 * single-glazed air-heater mid-range (from memory; see physics/collector.ts for the published ranges).
 */
export const solarCabinetSchema = z.object({
  kind: z.literal('solar-cabinet'),
  /** Collector area per tonne of fresh product [m²/t]; 100 m²/t is an assumption (tunnel dryers run 100–200). */
  collectorAreaM2PerTonne: z.number().gt(0).max(10_000).default(100),
  tiltDeg: z.number().min(0).max(90).default(15),
  /** Azimuth the collector faces [degrees clockwise from north]; default faces the equator (set by latitude). */
  azimuthDeg: z.number().min(0).max(360).optional(),
  /** Dry-air flow per m² of collector [kg s⁻¹ m⁻²]; 0.02 is a typical air-heater flow (from memory, 0.01–0.05). */
  airFlowKgPerSPerM2: z.number().gt(0).max(0.5).default(0.02),
  /** FR(τα): intercept of the efficiency line. */
  frTauAlpha: fraction('frTauAlpha').default(0.6),
  /** FR·UL [W m⁻² K⁻¹]: slope of the efficiency line. */
  frUlWm2K: z.number().min(0).max(50).default(5),
  groundAlbedo: fraction('groundAlbedo').default(0.2),
  /** Fans run only while the collector gains heat; otherwise the cabinet is closed (no drying, no rewetting). */
  fansOnlyInSun: z.boolean().default(true),
})

export type SolarCabinetMethod = z.output<typeof solarCabinetSchema>

/** Default collector azimuth: facing the equator (180° in the north, 0° in the south). */
function equatorFacingAzimuthDeg(latDeg: number): number {
  return latDeg >= 0 ? 180 : 0
}

export const solarCabinet: MethodModel<typeof solarCabinetSchema> = {
  kind: 'solar-cabinet',
  label: 'solar cabinet (air heated by a solar collector)',
  title: 'Solar cabinet',
  hint: 'air warmed by a solar collector before it reaches the product',
  schema: solarCabinetSchema,
  exposure: 'forced-air',
  airFlowKgPerSPerTonne: (m) => m.collectorAreaM2PerTonne * m.airFlowKgPerSPerM2,
  heatsWithFuel: false,
  rainMatters: () => false,
  needs: { sun: true, sunAzimuth: true, coordinates: true },
  assumptions: (m) => [
    {
      name: 'collector',
      value: `${m.collectorAreaM2PerTonne} m²/t, tilt ${m.tiltDeg}°, FR(τα) ${m.frTauAlpha}, FR·UL ${m.frUlWm2K} W m⁻² K⁻¹, ${m.airFlowKgPerSPerM2} kg s⁻¹ m⁻²`,
      source:
        'Hottel–Whillier–Bliss (Duffie & Beckman 2013 ch. 6) with inlet = ambient; single-glazed air-heater mid-range (from memory)',
    },
    {
      name: 'irradiance on the collector',
      value: 'Erbs diffuse split, Liu–Jordan isotropic sky',
      source: 'Erbs, Klein & Duffie 1982; Liu & Jordan 1963',
    },
    {
      name: 'fans',
      value: m.fansOnlyInSun ? 'run only while the collector gains heat' : 'run every hour',
      source: 'method setting',
    },
  ],
  prepare(m, { series, solar, thresholds, maxProductTempC }) {
    const collectorAzimuth = m.azimuthDeg ?? equatorFacingAzimuthDeg(series.site.latitudeDeg ?? 0)
    const collector = { interceptFrTauAlpha: m.frTauAlpha, lossSlopeFrUlWm2K: m.frUlWm2K }
    const { altitudeDeg, azimuthDeg, raWm2 } = solar
    const maxT = maxProductTempC
    return (hour: MethodHour): void => {
      const i = hour.index
      const t = hour.dryBulbC
      const gTilt = hour.night
        ? 0
        : tiltedIrradianceFromGhiWm2(
            hour.ghiWm2,
            raWm2[i],
            altitudeDeg[i],
            azimuthDeg[i],
            m.tiltDeg,
            collectorAzimuth,
            m.groundAlbedo,
          )
      const fansOn = !m.fansOnlyInSun || gTilt >= thresholds.collectorOnWm2
      if (!fansOn) {
        hour.mode = HourMode.paused
        hour.pausedByNight = true
      }
      const gain = gTilt > 0 ? collectorUsefulGainWm2(collector, gTilt, t, t) : 0
      if (fansOn && gain > 0) {
        // outlet of one m² of collector at its air flow
        let tAir = collectorOutletC(t, gain, 1, m.airFlowKgPerSPerM2, hour.humidityRatio)
        let used = 1
        if (maxT !== null && tAir > maxT && t < maxT) {
          // a damper mixes in ambient air to hold the product limit (common practice, no source)
          used = (maxT - t) / (tAir - t)
          tAir = maxT
        }
        hour.airC = tAir
        hour.solarKwhPerTonne = (used * gain * m.collectorAreaM2PerTonne) / 1000
      }
      hour.productC = hour.airC
    }
  },
}

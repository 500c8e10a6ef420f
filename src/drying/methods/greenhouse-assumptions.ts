/**
 * @module drying/methods/greenhouse-assumptions
 * What the greenhouse dryer (./greenhouse.ts) states in every assessment, with the sources of its figures.
 */
import { coverTransmittance } from '../../physics/cover-transmittance.ts'
import { MIHARA_HAYASHI_1979 } from '../../physics/greenhouse-air.ts'
import type { GreenhouseMethod } from './greenhouse.ts'
import { greenhouseGeometry, REFERENCE_RISE_K, referenceVentilationKgPerS } from './greenhouse.ts'
import type { MethodAssumption } from './method-model.ts'
import { coverOf } from './tunnel.ts'

const f1 = (x: number): string => x.toFixed(1)

export function greenhouseAssumptions(m: GreenhouseMethod): MethodAssumption[] {
  const geo = greenhouseGeometry(m)
  const cover = coverOf(m)
  const loss = m.cover === 'glass' ? MIHARA_HAYASHI_1979.glass : MIHARA_HAYASHI_1979.pvcFilm
  return [
    {
      name: 'greenhouse',
      value: `floor ${m.lengthM} m × ${m.widthM} m (${f1(geo.floorM2)} m²), cover ${f1(geo.coverM2)} m², trays ${f1(geo.trayM2)} m², volume ${f1(geo.volumeM3)} m³`,
      source:
        'half-cylinder over the floor unless the cover area is given; default floor as the drying section of the CIAE solar tunnel (Singh, Ganesan & Singh, RERIC journal, abstract read), an assumption for a greenhouse dryer',
    },
    {
      name: 'cover',
      value: `${m.cover}: normal transmittance ${coverTransmittance(cover, 0).toFixed(3)}; heat loss ${m.coverLossWm2K === undefined ? `${loss.interceptWm2K} + ${loss.windSlopeWm2KPerMs}·w W m⁻² K⁻¹ (w the wind at 2 m)` : `${m.coverLossWm2K} W m⁻² K⁻¹`}`,
      source:
        'optics as the solar tunnel (Fresnel and Bouguer, Duffie & Beckman ch. 5; polyethylene from memory); overall heat loss of single covers measured by Mihara & Hayashi 1979 (J. Agric. Meteorol. 35(1):13–19, abstract read; PVC film taken for polyethylene, which lets more long-wave through)',
    },
    {
      name: 'ventilation',
      value:
        m.airChangesPerHour === undefined
          ? `natural draught through ${f1(geo.ventAreaM2)} m² of openings (half low, half high) ${f1(geo.ventHeightM)} m apart, discharge coefficient ${m.dischargeCoefficient}: ${referenceVentilationKgPerS(m).toFixed(3)} kg/s of air at ${REFERENCE_RISE_K} K above 20 °C outside`
          : `${m.airChangesPerHour} air changes an hour (stated)`,
      source:
        'stack flow C_d·A*·√(2gH·ΔT/T̄) (Kittas et al. 1997; Vanthoor et al. 2011; ASHRAE Fundamentals 1997 ch. 25 eq 37: transcribed); opening area by default 15 % of the floor low and 15 % high (ASABE recommendation for crop greenhouses, as given by Greenhouse Management 2015, transcribed); wind-driven ventilation not modelled',
    },
    {
      name: 'inside air',
      value: `heat balance Q_sun − λE = (k·A_c + ṁ·c_p)·ΔT, sun absorbed α_p ${m.productAbsorptivity} (product), α_f ${m.floorAbsorptance} (floor), ${Math.round(m.groundShare * 100)} % into the ground; humidity W_o + E/ṁ with E the first-hour water of a fresh batch`,
      source:
        'single-zone greenhouse balance, quasi-steady (no heat stored between hours); ground share FAO-56 eq 45 (daylight); the evaporation load an upper bound later in a batch (times err long)',
    },
    {
      name: 'without sun',
      value:
        m.nightPractice === 'open'
          ? 'open: ambient air inside, rewetting toward equilibrium in still air'
          : 'closed: no drying, no rewetting',
      source: 'method setting; the floor’s release of the day’s heat is not modelled',
    },
    {
      name: 'product temperature',
      value:
        'surface balance in the inside air as in the solar tunnel: absorbed sun, long-wave with the cover, convection at the air speed the ventilation gives across the enclosure, evaporative cooling',
      source:
        'physics/wet-surface.ts; hc = 2.8 + 3.0·v (Watmuff et al. 1977 via Duffie & Beckman, from memory)',
    },
  ]
}

/**
 * @module test/experiments/calibration-targets
 * Which kinetics constant each calibration run fixes. One constant per product (its rate at the reference
 * temperature); everything else about the product (isotherm, activation energy, reference size) stays as the
 * catalogue cites it, so the fit absorbs only what the experiment measures: how fast this product dried in
 * this weather with this method.
 */
import type { ProductProfile } from '../../src/product/profile.ts'

export interface CalibrationTarget {
  productId: string
  /** Path inside `kinetics.equation` (e.g. `k.kRefPerH`). */
  parameter: string
  parameterLabel: string
  /** The calibration run (test/experiments/cases.ts). */
  caseId: string
  /** Citation of the experiment, as the catalogue source names it. */
  citation: string
  /** What the weather reconstruction rests on, in a few words (for the source text). */
  weatherNote: string
  /** Bisection bracket of the constant. */
  searchRange: [number, number]
}

export const CALIBRATION_TARGETS: CalibrationTarget[] = [
  {
    productId: 'grapes-to-raisins',
    parameter: 'k.kRefPerH',
    parameterLabel: 'Lewis k at the reference temperature',
    caseId: 'doymaz-2012-grapes-open-sun/seedless',
    citation:
      'Doymaz I. 2012, Sun drying of seedless and seeded grapes, J. Food Sci. Technol. 49(2):214–220 (abstract), seedless grapes 17.2 mm in open sun',
    weatherNote:
      'Istanbul September climate, site and month assumed: the part read gives no site, date or weather',
    searchRange: [1e-3, 1],
  },
  {
    productId: 'chili-peppers',
    parameter: 'k.kRefPerH',
    parameterLabel: 'Lewis k at the reference temperature',
    caseId: 'meghwar-chilli-umerkot/open-sun',
    citation:
      "Meghwar B.L., Khan A., Lakhiar I.A., Mirani A.A., Daper M.S., Kalroo M.W., Comparison between solar tunnel, solar-cum gas dryer, and open sun drying methods for drying red chilies, Pak. J. Agric. Res. 36(1):63–70 (abstract; trials of November 2022), red 'Longi' chillies from the field (no pretreatment named: taken as unblanched) in open sun",
    weatherNote:
      'lower Sindh November climate from memory, day assumed: the abstract gives the place and month but no weather figure',
    searchRange: [1e-3, 5],
  },
  {
    productId: 'chili-peppers-blanched',
    parameter: 'k.kRefPerH',
    parameterLabel: 'Lewis k at the reference temperature',
    caseId: 'hossain-bala-2007-chilli-solar-tunnel/red-tunnel',
    citation:
      'Hossain M.A., Bala B.K. 2007, Drying of hot chilli using solar tunnel drier, Solar Energy 81:85–92 (abstract), red chilli in the solar tunnel drier (possibly blanched: the abstract credits blanching with part of the shorter drying)',
    weatherNote: 'Dhaka March climate, site and month assumed: the abstract gives no weather figure',
    searchRange: [1e-3, 5],
  },
  {
    productId: 'figs',
    parameter: 'k.kRefPerH',
    parameterLabel: 'Lewis k at the reference temperature',
    caseId: 'oksar-2017-figs-tunnel/august-open-air',
    citation:
      "Oksar R.E., Şen F., Aksoy U. 2017, Effect of drying under plastic tunnels on drying rate and quality of fig (Ficus carica L. 'Sarılop'), Acta Hortic. 1173:297–302 (abstract), figs part-dried on the tree, on trays in the open air in August",
    weatherNote:
      'Aydın August climate and the fig-region drying-season humidity, date assumed: the abstract gives no weather figure; initial moisture 40 % wb assumed from the 30–50 % of semi-dried figs',
    searchRange: [1e-3, 1],
  },
  {
    productId: 'apricot-halves',
    parameter: 'k.kRefPerH',
    parameterLabel: 'Lewis k at the reference temperature',
    caseId: 'e3s-2025-apricots-uzbekistan/open-air',
    citation:
      'Experimental study of apricot drying using direct and indirect solar dryers with natural convection, E3S Web Conf. 661:02003, 2025 (abstract; authors not shown on the copy read), apricots in open air to equilibrium moisture in 10 days',
    weatherNote:
      'Tashkent July climate from memory, site and month assumed: the abstract gives no site, date or weather; halves and the 20 % wb end point assumed',
    searchRange: [1e-3, 1],
  },
  {
    productId: 'tomato-halves',
    parameter: 'dRefM2PerS',
    parameterLabel: 'effective moisture diffusivity at the reference temperature',
    caseId: 'joel-2024-tomato-kano-parabolic/open-sun',
    citation:
      "Joel J., Alkali A.K., Ibrahim B., Ahmmad A.A., Babba F.J., Dayo O. 2024, Evaluation of NSPRI Parabolic Shaped Solar Dryer (PSSD) for Drying of Tomatoes Under Semi-arid Climate Zone, Research Square preprint, doi:10.21203/rs.3.rs-4558322/v1 (abstract), 'Eka' tomatoes sliced 15 mm in open sun at Kano",
    weatherNote:
      'Kano February climate from memory, month assumed: the abstract gives the place but no month; its open-sun 47.5 °C at 66.6 % RH is not an air state and is not used',
    searchRange: [1e-11, 1e-7],
  },
  {
    productId: 'fish-fillets',
    parameter: 'k.kRefPerH',
    parameterLabel: 'Lewis k at the reference temperature',
    caseId: 'kituu-tilapia-brining-solar-tunnel/unbrined',
    citation:
      'Kituu G.M., Shitanda D., Kanali C.L., Mailutha J.T. n.d. (no year on the page read), Effect of Brining on the Drying Rate of Tilapia in a Solar Tunnel Dryer, ACTA Press paper 34014 (abstract), unbrined tilapia pieces 9 mm thick in a solar tunnel dryer in Kenya',
    weatherNote:
      "Juja February climate from memory, site and month assumed: the abstract gives the country only and no weather figure; initial moisture from the same authors' CIGR Journal abstract",
    searchRange: [1e-3, 5],
  },
  {
    productId: 'cocoa-beans',
    parameter: 'dRefM2PerS',
    parameterLabel: 'effective moisture diffusivity at the reference temperature',
    caseId: 'puello-mendez-2017-cocoa-colombia/open-air',
    citation:
      'Puello-Mendez J., Meza-Castellar P. et al. 2017, Comparative Study of Solar Drying of Cocoa Beans: Two Methods Used in Colombian Rural Areas, Chem. Eng. Trans. 57:1711–1716 (abstract), fermented cocoa beans in open air on a farm of the Caribbean region of Colombia',
    weatherNote:
      'Cartagena January climate, mostly from memory, place and month assumed: the abstract gives no farm, date or weather',
    searchRange: [1e-12, 1e-7],
  },
  {
    productId: 'mint-leaves',
    parameter: 'k.kRefPerH',
    parameterLabel: 'Lewis k at the reference temperature',
    caseId: 'noori-mint-kabul-solar/open-sun',
    citation:
      'Noori A.W., Royen M.J., Haydary J. n.d. (no year on the page read), Effect of ambient parameters change on mint leaves solar drying, Acta Chimica Slovaca (abstract), mint leaves in the open sun for 7 h',
    weatherNote:
      'air temperature and humidity of the abstract (20–30 °C, RH 14–28.8 %), Kabul taken from its 82 kPa, September assumed, sunshine from memory',
    searchRange: [1e-3, 20],
  },
]

/** A deep copy of `profile` with `kinetics.equation.<path>` set to `value`. */
export function withParameter(profile: ProductProfile, path: string, value: number): ProductProfile {
  const copy = structuredClone(profile) as ProductProfile
  const keys = path.split('.')
  // biome-ignore lint/suspicious/noExplicitAny: a path into a discriminated union chosen by the target
  let node: any = copy.kinetics.equation
  for (let i = 0; i < keys.length - 1; i++) {
    node = node?.[keys[i]]
    if (node === undefined || node === null || typeof node !== 'object') {
      throw new RangeError(`${profile.id}: no kinetics parameter '${path}'`)
    }
  }
  const last = keys[keys.length - 1]
  if (typeof node[last] !== 'number') throw new RangeError(`${profile.id}: no kinetics parameter '${path}'`)
  node[last] = value
  return copy
}

/** The current value of `kinetics.equation.<path>`. */
export function parameterValue(profile: ProductProfile, path: string): number {
  // biome-ignore lint/suspicious/noExplicitAny: as above
  let node: any = profile.kinetics.equation
  for (const k of path.split('.')) node = node?.[k]
  if (typeof node !== 'number') throw new RangeError(`${profile.id}: no kinetics parameter '${path}'`)
  return node
}

/**
 * @module product/catalogue-fruit
 * Fruit and vegetable profiles. Only monolayer values were read for the sugar-rich fruit isotherms: their C and
 * K and any temperature term are from memory (type III sugar isotherms, C ≈ 1–6, K ≈ 0.9–1.0). Publications with
 * full temperature-dependent constants exist (Kaymak-Ertekin & Gedik 2004, LWT 37:429: grapes, apricots, apples
 * and potatoes at 30/45/60 °C, Halsey best; Tsami, Marinos-Kouris & Maroulis 1990 for raisins, figs, prunes and
 * apricots) but their tables could not be read here; see docs/product-sources.md. Kinetics marked `fitted` were
 * fitted by dryhours to one published drying time under stated assumed mean conditions.
 */

import { calibratedConstant } from './calibration.ts'
import {
  ASSUMED_EA_J_PER_MOL,
  ASSUMED_EA_SOURCE,
  arrhenius,
  gab,
  isotherm,
  kinetics,
  param,
  SAFE_AW_DRIED_FRUIT,
  SAFE_AW_MOULD,
  sourced,
} from './catalogue-helpers.ts'
import {
  ALAM_ISLAM_2015,
  BHONG_KALE_2020,
  CODEX_APRICOTS_VIA_SUMMARY,
  COSTA_FUJI_APPLE,
  DOYMAZ_2007,
  DOYMAZ_2012,
  ESMAIILI_2014,
  HOSSAIN_BALA_2007,
  MEGHWAR_PJAR,
  MORAES_2008_APPLE,
  NEWMAN_1996,
  OKSAR_2017,
  PAVKOV_2021,
  REJABOV_2024,
  SIMAL_2005,
  USDA_RAISIN_GRADES,
} from './citations.ts'
import { derivePretreatedVariant } from './pretreatment-variants.ts'
import type { KineticsSpec, ProductProfile, Sourced } from './profile.ts'

/** Kinetics with a surface (skin) resistance: the mass-transfer Biot number at the reference size. */
function withSkin(spec: KineticsSpec, biotNumber: Sourced<number>): KineticsSpec {
  return { ...spec, biotNumber }
}

/** Kinetics of a hollow product (a pod) whose wall is the drying length. */
function hollow(spec: KineticsSpec, wallThicknessMm: Sourced<number>): KineticsSpec {
  return { ...spec, wallThicknessMm }
}

const FRUIT_CAUTIONS = [
  'Reach the water-activity target before storage: moulds and osmophilic yeasts spoil under-dried fruit.',
  'Protect from dust, insects, birds, rain and dew; cover or bring in at night.',
]
const SUGAR_GAB_MEMORY =
  'C = 3, K = 1.0 and no temperature term: from memory (type III sugar-fruit isotherm; Maroulis et al. 1988, J. Food Eng. 7:63, and Tsami et al. 1990, J. Food Sci. 55:1594, not read)'

const GRAPE_K = calibratedConstant('grapes-to-raisins', 'k.kRefPerH')
const GRAPE_LEWIS_FIT = GRAPE_K.source
const GRAPE_T_REF = `reference temperature 35 °C, set by dryhours, of the k fitted through the engine to ${DOYMAZ_2012} (run ${GRAPE_K.caseId}; npm run calibrate): a choice of dryhours at which the fitted k applies, with the stated activation energy`

export const grapesToRaisins: ProductProfile = {
  id: 'grapes-to-raisins',
  name: 'Grapes to raisins (untreated, open sun)',
  category: 'fruit',
  initialMoistureWbPct: sourced(78.2, `${DOYMAZ_2012}: seedless grapes 78.2 % wb`, 'published'),
  targetMoistureWbPct: sourced(
    18,
    `${USDA_RAISIN_GRADES}: U.S. Grades A, B and C contain not more than 18 % moisture by weight`,
    'published',
  ),
  waterActivityTarget: SAFE_AW_DRIED_FRUIT,
  maxProductTempC: sourced(
    70,
    'raisin colour and sugar caramelisation above about 70 °C; from memory',
    'memory',
  ),
  isotherm: {
    desorption: isotherm(
      gab(0.082, 3, 1.0),
      `${SUGAR_GAB_MEMORY}; temperature-dependent constants for grapes exist (Kaymak-Ertekin & Gedik 2004, LWT 37:429) but were not read`,
      'memory',
      [15, 35],
      [10, 90],
      {
        xm0: param(
          `${ESMAIILI_2014}: GAB monolayer 0.082 g water/g dry product at 25 °C (adsorption isotherms at 15, 25, 35 °C, used here for drying)`,
          'published',
        ),
      },
    ),
  },
  kinetics: withSkin(
    kinetics(
      { model: 'lewis', k: arrhenius(GRAPE_K.value, 35, ASSUMED_EA_J_PER_MOL) },
      17.2,
      'sphere',
      ASSUMED_EA_SOURCE.source,
      'memory',
      {
        'k.kRefPerH': param(GRAPE_LEWIS_FIT, 'fitted'),
        'k.tRefC': param(GRAPE_T_REF, 'fitted'),
        referenceThicknessMm: param(`${DOYMAZ_2012}: seedless berry size 1.72 cm`, 'published'),
      },
    ),
    sourced(
      0.23,
      `fitted by dryhours to the two berry sizes of ${DOYMAZ_2012}: seedless 17.2 mm in 176 h and seeded 22.0 mm in 228 h to 22 % wb (time ∝ d^1.05), through the first root of the sphere's surface-evaporation condition β cot β = 1 − Bi (Crank 1975); the skin limits drying. The dipped variant keeps it (dipping lowers the skin's resistance; no value read)`,
      'fitted',
    ),
  ),
  defaultThicknessMm: sourced(17.2, `${DOYMAZ_2012}: seedless berry size 1.72 cm`, 'published'),
  defaultLoadingKgPerM2: sourced(12, 'single layer of bunches on racks or mats; from memory', 'memory'),
  cautions: [...FRUIT_CAUTIONS, 'Ochratoxin A risk in grapes dried slowly in humid weather.'],
}

export const grapesToRaisinsDipped: ProductProfile = {
  ...derivePretreatedVariant(grapesToRaisins, 'grapes-to-raisins-dipped'),
  cautions: [
    ...grapesToRaisins.cautions,
    'Use food-grade dipping oil and potassium carbonate at the stated strength.',
  ],
}

const APRICOT_K = calibratedConstant('apricot-halves', 'k.kRefPerH')

export const apricotHalves: ProductProfile = {
  id: 'apricot-halves',
  name: 'Apricot halves',
  category: 'fruit',
  initialMoistureWbPct: sourced(
    87.5,
    `the middle of the 85–90 % wb of fresh apricots in ${REJABOV_2024}`,
    'fitted',
  ),
  targetMoistureWbPct: sourced(25, `the upper end of 20–25 %, ${CODEX_APRICOTS_VIA_SUMMARY}`, 'transcribed'),
  waterActivityTarget: SAFE_AW_MOULD,
  maxProductTempC: sourced(65, 'browning and case hardening above about 65 °C; from memory', 'memory'),
  isotherm: {
    desorption: isotherm(
      gab(0.1, 3, 1.0),
      `GAB Xm0 0.10 kg/kg db from memory (range 0.08–0.17 for sugar-rich fruit); ${SUGAR_GAB_MEMORY}; Kaymak-Ertekin & Gedik 2004 (LWT 37:429) give apricot constants at 30–60 °C, not read`,
      'memory',
      [25, 45],
      [10, 90],
    ),
  },
  kinetics: kinetics(
    { model: 'lewis', k: arrhenius(APRICOT_K.value, 45, 46379) },
    15,
    'slab',
    '15 mm halves, the size at which k holds: from memory',
    'memory',
    {
      'k.kRefPerH': param(APRICOT_K.source, 'fitted'),
      'k.tRefC': param(
        `reference temperature 45 °C, set by dryhours, of the k fitted through the engine to the E3S Web Conf. 661:02003 (2025) open-air run (${APRICOT_K.caseId}; npm run calibrate)`,
        'fitted',
      ),
      'k.activationEnergyJPerMol': param(
        `${PAVKOV_2021}: hot-air drying of untreated apricot halves at 40–60 °C, activation energy 46.379–51.514 kJ/mol, greater at the greater air velocity; the value for the lower velocity (1.0 m/s) is used`,
        'published',
      ),
    },
  ),
  defaultThicknessMm: sourced(15, 'halved fruit; from memory', 'memory'),
  defaultLoadingKgPerM2: sourced(10, 'single layer, cut face up; from memory', 'memory'),
  cautions: [
    ...FRUIT_CAUTIONS,
    'Sulphuring (if used) must follow local food law; declare sulphite (allergen).',
  ],
}

const FIG_K = calibratedConstant('figs', 'k.kRefPerH')

export const figs: ProductProfile = {
  id: 'figs',
  name: 'Figs (whole)',
  category: 'fruit',
  initialMoistureWbPct: sourced(
    82,
    'about 82 % wb fresh: from memory (figs for drying are often part-dried on the tree first)',
    'memory',
  ),
  targetMoistureWbPct: sourced(
    22,
    `${OKSAR_2017}: drying was ended at ≤ 22 % moisture and/or aw ≤ 0.65`,
    'published',
  ),
  waterActivityTarget: sourced(0.65, `${OKSAR_2017}: drying ended at aw ≤ 0.65`, 'published'),
  maxProductTempC: sourced(
    65,
    'fig air-drying studies use 45–65 °C (Xanthopoulos, Yanniotis & Lambrinos 2010, J. Food Eng. 97:419, abstract); the limit itself is from memory',
    'memory',
  ),
  isotherm: {
    desorption: isotherm(
      gab(0.1164, 3, 1.0),
      `${SUGAR_GAB_MEMORY}; fig isotherms at 5, 25 and 40 °C exist (Farahnaky, Ansari & Majzoobi 2009, J. Food Eng. 93:468), constants not read`,
      'memory',
      [25, 45],
      [10, 90],
      {
        xm0: param(
          `Xm0 set by dryhours so that the isotherm gives aw 0.65 at 22 % wb and 25 °C, the end point of ${OKSAR_2017}, with C and K as given`,
          'fitted',
        ),
      },
    ),
  },
  kinetics: kinetics(
    { model: 'lewis', k: arrhenius(FIG_K.value, 40, ASSUMED_EA_J_PER_MOL) },
    40,
    'sphere',
    `whole figs of 40 mm, the size at which k holds: from memory; ${ASSUMED_EA_SOURCE.source}`,
    'memory',
    {
      'k.kRefPerH': param(FIG_K.source, 'fitted'),
      'k.tRefC': param(
        `reference temperature 40 °C, set by dryhours, of the k fitted through the engine to ${OKSAR_2017} (run ${FIG_K.caseId}; npm run calibrate)`,
        'fitted',
      ),
    },
  ),
  defaultThicknessMm: sourced(40, 'whole fig diameter; from memory', 'memory'),
  defaultLoadingKgPerM2: sourced(8, 'single layer on trays; from memory', 'memory'),
  cautions: [
    ...FRUIT_CAUTIONS,
    'Aflatoxin: figs are a high-risk product; dew and early rain during drying are the main risks (Oksar et al. 2017). Sort out fluorescent or damaged fruit.',
  ],
}

export const plumsToPrunes: ProductProfile = {
  id: 'plums-to-prunes',
  name: 'Plums to prunes',
  category: 'fruit',
  initialMoistureWbPct: sourced(80, 'typical 75–85 %; from memory', 'memory'),
  targetMoistureWbPct: sourced(
    18,
    'about 18 % "natural condition" prunes (rehydrated for sale): from memory, not re-read',
    'memory',
  ),
  waterActivityTarget: SAFE_AW_MOULD,
  maxProductTempC: sourced(75, 'prune dehydrators run at about 75–85 °C; limit from memory', 'memory'),
  isotherm: {
    desorption: isotherm(
      gab(0.1, 3, 1.0),
      `GAB Xm0 0.10 from memory; ${SUGAR_GAB_MEMORY}`,
      'memory',
      [25, 45],
      [10, 90],
    ),
  },
  kinetics: kinetics(
    { model: 'lewis', k: arrhenius(0.08, 70, 80000) },
    35,
    'sphere',
    'Lewis k = 0.08 h⁻¹ at 70 °C for 35 mm whole plums: from memory (prune dehydration takes about a day)',
    'memory',
    {
      'k.activationEnergyJPerMol': param(
        `${NEWMAN_1996}: D'Agen plums dried at 70–100 °C and 70–80 % RH followed first-order kinetics; the activation energy was about 80 kJ/mol at the lower-temperature end (non-linear Arrhenius plot)`,
        'published',
      ),
    },
  ),
  defaultThicknessMm: sourced(35, 'whole plum diameter; from memory', 'memory'),
  defaultLoadingKgPerM2: sourced(15, 'single layer on trays; from memory', 'memory'),
  cautions: FRUIT_CAUTIONS,
}

export const appleSlices: ProductProfile = {
  id: 'apple-slices',
  name: 'Apple slices',
  category: 'fruit',
  initialMoistureWbPct: sourced(85, `${COSTA_FUJI_APPLE}: Fuji apple about 85 % moisture`, 'published'),
  targetMoistureWbPct: sourced(
    20,
    'dried apples about 20–24 % (UNECE DDP-16): from memory, not read',
    'memory',
  ),
  waterActivityTarget: SAFE_AW_DRIED_FRUIT,
  maxProductTempC: sourced(70, 'browning above about 70 °C; from memory', 'memory'),
  isotherm: {
    desorption: isotherm(
      gab(0.12, 3, 0.97),
      `GAB Xm0 0.12 chosen from memory inside the 0.107–0.168 kg/kg db read for Fuji apple desorption at 50–70 °C in ${MORAES_2008_APPLE}; C = 3, K = 0.97 and no temperature term: from memory. The middle of the read range (0.1375) with these C and K would put dried apple at 21.0–23.7 % wb over aw 0.60–0.65, above the dried-fruit band of Beuchat 1981 (15–20 %, checked in the tests): C and K must be read before Xm0 is. Kaymak-Ertekin & Gedik 2004 (LWT 37:429) give apple constants at 30–60 °C, not read`,
      'memory',
      [30, 70],
      [10, 90],
    ),
  },
  kinetics: kinetics(
    { model: 'diffusion', dRefM2PerS: 4.97e-10, tRefC: 60, activationEnergyJPerMol: 34000 },
    5,
    'slab',
    'the abstract of "The thin layer drying characteristics of organic apple slices" (authors and year not shown on the copy read) gives Deff 2.27–4.97e-10 m²/s for 5 and 9 mm slices at 40–60 °C, dried in 240–460 min; pairing 4.97e-10 with 60 °C and 5 mm, and Ea 34 kJ/mol from that pairing, are from memory',
    'memory',
  ),
  defaultThicknessMm: sourced(
    5,
    'slices of 5 mm (the thinner of the two in the organic-apple study); from memory',
    'memory',
  ),
  defaultLoadingKgPerM2: sourced(8, 'single layer on mesh trays; from memory', 'memory'),
  cautions: FRUIT_CAUTIONS,
}

export const tomatoHalves: ProductProfile = {
  id: 'tomato-halves',
  name: 'Tomato halves',
  category: 'vegetable',
  initialMoistureWbPct: sourced(94.5, `${DOYMAZ_2007}: dried from 94.5 % wb`, 'published'),
  targetMoistureWbPct: sourced(
    11,
    `${DOYMAZ_2007}: dried to 11 % wb (the study's end point, not a storage standard)`,
    'published',
  ),
  waterActivityTarget: SAFE_AW_DRIED_FRUIT,
  maxProductTempC: sourced(
    70,
    'Doymaz 2007 dried at 55–70 °C; the limit itself is from memory (lycopene loss, browning)',
    'memory',
  ),
  isotherm: {
    desorption: isotherm(
      gab(0.1, 5, 0.95),
      'GAB Xm0 0.10, C 5, K 0.95 and no temperature term: from memory (GAB and Peleg fit tomato best at 30–60 °C, Ben Mariem & Ben Mabrouk 2015, not re-read)',
      'memory',
      [30, 60],
      [10, 90],
    ),
  },
  kinetics: kinetics(
    { model: 'diffusion', dRefM2PerS: 3.91e-10, tRefC: 55, activationEnergyJPerMol: 32940 },
    20,
    'slab',
    'half-tomato thickness 20 mm at which the diffusivity is applied: from memory (the abstract gives no size)',
    'memory',
    {
      dRefM2PerS: param(
        `${DOYMAZ_2007}: untreated tomatoes, Deff 3.91–6.65e-10 m²/s over 55–70 °C at 1.5 m/s; the lowest value goes with the lowest temperature`,
        'published',
      ),
      tRefC: param(`${DOYMAZ_2007}: lowest drying temperature, 55 °C`, 'published'),
      activationEnergyJPerMol: param(
        `${DOYMAZ_2007}: activation energy 17.40–32.94 kJ/mol; 32.94 matches the untreated Deff pair (R·ln(6.65/3.91)/(1/328.15 − 1/343.15) = 33.1 kJ/mol), 17.40 the dipped one`,
        'published',
      ),
    },
  ),
  defaultThicknessMm: sourced(20, 'half-tomato thickness; from memory', 'memory'),
  defaultLoadingKgPerM2: sourced(10, 'single layer, cut face up; from memory', 'memory'),
  cautions: [
    ...FRUIT_CAUTIONS,
    'Tomatoes are low-acid: hold clean, dry fast in the first day to avoid spoilage.',
  ],
}

const CHILLI_K = calibratedConstant('chili-peppers', 'k.kRefPerH')
const CHILLI_LEWIS_FIT = CHILLI_K.source

export const chiliPeppers: ProductProfile = {
  id: 'chili-peppers',
  name: 'Chili peppers (red, whole pods)',
  category: 'vegetable',
  initialMoistureWbPct: sourced(80, `${MEGHWAR_PJAR}: initial moisture taken as 80 % wb`, 'published'),
  targetMoistureWbPct: sourced(
    11,
    `the middle of the 10–12 % wb the chillies were dried to in ${MEGHWAR_PJAR}`,
    'fitted',
  ),
  waterActivityTarget: SAFE_AW_DRIED_FRUIT,
  maxProductTempC: sourced(65, 'colour (capsanthin) loss above about 65 °C; from memory', 'memory'),
  isotherm: {
    desorption: isotherm(
      gab(0.06, 6, 0.9),
      'GAB Xm0 0.06, C 6, K 0.9 and no temperature term: from memory (at three temperatures GAB fits green and Oswin fits red Mareko Fana chilli best, Getahun, Gabbiye, Delele, Fanta, Gebrehiwot & Vanierschot 2020, Heliyon 6:e04608, abstract; constants not read)',
      'memory',
      [30, 60],
      [10, 90],
    ),
  },
  kinetics: hollow(
    kinetics(
      { model: 'lewis', k: arrhenius(CHILLI_K.value, 50, 27000) },
      10,
      'cylinder',
      'pod diameter 10 mm at which k holds: from memory',
      'memory',
      {
        'k.kRefPerH': param(CHILLI_LEWIS_FIT, 'fitted'),
        'k.tRefC': param(
          `reference temperature 50 °C, set by dryhours, of the k fitted through the engine to ${HOSSAIN_BALA_2007} (run ${CHILLI_K.caseId}; npm run calibrate): a choice of dryhours at which the fitted k applies, with the published activation energy`,
          'fitted',
        ),
        'k.activationEnergyJPerMol': param(
          `${SIMAL_2005}: red pepper air-dried at 30–90 °C, the Page k followed Arrhenius with an activation energy of about 27 kJ/mol`,
          'published',
        ),
      },
    ),
    sourced(
      1.5,
      'pericarp (wall) of a red chilli pod about 1.5 mm: from memory. A pod is hollow: water leaves through the wall, so the wall is its drying length and the pod diameter only its place on the tray',
      'memory',
    ),
  ),
  defaultThicknessMm: sourced(10, 'pod diameter; from memory', 'memory'),
  defaultLoadingKgPerM2: sourced(8, 'single layer; from memory', 'memory'),
  cautions: [
    ...FRUIT_CAUTIONS,
    'Aflatoxin and ochratoxin risk in slowly dried chillies; do not dry on bare ground.',
    'The drying rate was fitted to chillies that were probably blanched (Hossain & Bala 2007); unblanched chillies dried several times slower than this profile predicts in published trials (docs/validation.md): check the moisture before storage.',
  ],
}

export const onionSlices: ProductProfile = {
  id: 'onion-slices',
  name: 'Onion slices',
  category: 'vegetable',
  initialMoistureWbPct: sourced(88, 'typical 86–90 %; from memory', 'memory'),
  targetMoistureWbPct: sourced(5, 'dehydrated onion at most 4–5 %; from memory', 'memory'),
  waterActivityTarget: SAFE_AW_DRIED_FRUIT,
  maxProductTempC: sourced(60, 'browning and pungency loss above about 60 °C; from memory', 'memory'),
  isotherm: {
    desorption: isotherm(
      gab(0.11, 4, 0.95),
      'GAB C 4, K 0.95 and no temperature term: from memory (modified Halsey fits onion shreds best at 30–50 °C and 15–85 % RH, Viswanathan, Jayas & Hulasare 2003, Biosyst. Eng. 86:465, abstract read; its constants are not in the abstract)',
      'memory',
      [30, 50],
      [15, 85],
      {
        xm0: param(
          `${ALAM_ISLAM_2015}: air-dried, untreated onion at room temperature (saturated salts, aw 0.11–0.93), GAB monolayer moisture 11.0 g/100 g dry matter (BET 9.8; vacuum-dried: GAB 8.2, BET 9.7)`,
          'published',
        ),
      },
    ),
  },
  kinetics: kinetics(
    { model: 'page', k: arrhenius(0.3, 60, 11821), n: 1.1 },
    5,
    'slab',
    'Page k = 0.3 h⁻ⁿ, n = 1.1 at 60 °C for 5 mm slices: from memory (Page fits onion slices best at 50–70 °C and 0.5–2 m/s, El-Mesery & Mwithiga 2012, Afr. J. Agric. Res. 7(30):4284, abstract; constants not read)',
    'memory',
    {
      'k.activationEnergyJPerMol': param(
        `the middle of the 10.87–12.77 kJ/mol activation energy of onion slices at 50–70 °C and 2–7.7 m/s in ${BHONG_KALE_2020}`,
        'fitted',
      ),
    },
  ),
  defaultThicknessMm: sourced(5, 'slice thickness; from memory', 'memory'),
  defaultLoadingKgPerM2: sourced(6, 'single layer; from memory', 'memory'),
  cautions: FRUIT_CAUTIONS,
}

export const FRUIT_PROFILES: ProductProfile[] = [
  grapesToRaisins,
  grapesToRaisinsDipped,
  apricotHalves,
  figs,
  plumsToPrunes,
  appleSlices,
  tomatoHalves,
  chiliPeppers,
  onionSlices,
]

/**
 * @module product/catalogue-fruit
 * Fruit profiles (vegetables: catalogue-vegetables.ts). Only monolayer values were read for the sugar-rich fruit isotherms: their C and
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
  CODEX_APRICOTS_VIA_SUMMARY,
  COSTA_FUJI_APPLE,
  DOYMAZ_2012,
  ESMAIILI_2014,
  MORAES_2008_APPLE,
  NEWMAN_1996,
  OKSAR_2017,
  PAVKOV_2021,
  REJABOV_2024,
  USDA_RAISIN_GRADES,
} from './citations.ts'
import { derivePretreatedVariant } from './pretreatment-variants.ts'
import type { KineticsSpec, ProductProfile, Sourced } from './profile.ts'

/** Kinetics with a surface (skin) resistance: the mass-transfer Biot number at the reference size. */
function withSkin(spec: KineticsSpec, biotNumber: Sourced<number>): KineticsSpec {
  return { ...spec, biotNumber }
}

export const FRUIT_CAUTIONS = [
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
      `GAB Xm0 0.10 from memory; ${SUGAR_GAB_MEMORY}; checked, not fitted: within 0.03 aw of the three pairs read in Zettler et al. 2001, Effect of Modified Atmospheres on Microflora and Respiration of California Prunes (abstract): 16, 24.6 and 38 % m.c. at aw 0.575, 0.70 and 0.858 (test/product/isotherm-points.test.ts)`,
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

export const FRUIT_PROFILES: ProductProfile[] = [
  grapesToRaisins,
  grapesToRaisinsDipped,
  apricotHalves,
  figs,
  plumsToPrunes,
  appleSlices,
]

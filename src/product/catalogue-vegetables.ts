/**
 * @module product/catalogue-vegetables
 * Vegetable profiles (tomato halves, chilli pods, onion slices): the sources and levels of their numbers as in
 * catalogue-fruit.ts, whose cautions they share.
 */

import { calibratedConstant } from './calibration.ts'
import { FRUIT_CAUTIONS } from './catalogue-fruit.ts'
import {
  arrhenius,
  gab,
  isotherm,
  kinetics,
  param,
  SAFE_AW_DRIED_FRUIT,
  sourced,
} from './catalogue-helpers.ts'
import {
  ALAM_ISLAM_2015,
  BHONG_KALE_2020,
  DOYMAZ_2007,
  HOSSAIN_BALA_2007,
  MEGHWAR_PJAR,
  SIMAL_2005,
} from './citations.ts'
import { pretreatmentVariantSpec } from './pretreatments.ts'
import type { KineticsSpec, ProductProfile, Sourced } from './profile.ts'

/** Kinetics of a hollow product (a pod) whose wall is the drying length. */
function hollow(spec: KineticsSpec, wallThicknessMm: Sourced<number>): KineticsSpec {
  return { ...spec, wallThicknessMm }
}

/** Tomato diffusivity fitted through the engine to an open-sun run (npm run calibrate). */
const TOMATO_D = calibratedConstant('tomato-halves', 'dRefM2PerS')

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
    { model: 'diffusion', dRefM2PerS: TOMATO_D.value, tRefC: 55, activationEnergyJPerMol: 32940 },
    20,
    'slab',
    'half-tomato thickness 20 mm at which the diffusivity is applied: from memory (the abstract gives no size); the fitted diffusivity does not depend on it (the fit is run at the 15 mm slices of its experiment)',
    'memory',
    {
      // Before the fit: Doymaz 2007's hot-air value for untreated tomatoes, 3.91e-10 m²/s at 55 °C (1.5 m/s),
      // which left open-sun and solar-cabinet runs 2–3× too slow through the engine.
      dRefM2PerS: param(TOMATO_D.source, 'fitted'),
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

/** Unblanched chillies' Lewis k, fitted through the engine to Meghwar et al.'s open-sun run (npm run calibrate). */
const CHILLI_K = calibratedConstant('chili-peppers', 'k.kRefPerH')

/** The caution both chilli profiles share. */
const CHILLI_MYCOTOXIN = 'Aflatoxin and ochratoxin risk in slowly dried chillies; do not dry on bare ground.'

/**
 * Chillies dried as most growers dry them: whole, without blanching. The plain id is this profile; blanched
 * chillies are the variant chili-peppers-blanched (product/pretreatments.ts), whose rate has a fit of its own.
 */
export const chiliPeppers: ProductProfile = {
  id: 'chili-peppers',
  name: 'Chili peppers (red, whole pods, unblanched)',
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
        'k.kRefPerH': param(CHILLI_K.source, 'fitted'),
        'k.tRefC': param(
          `reference temperature 50 °C, set by dryhours, of the k fitted through the engine to ${MEGHWAR_PJAR} (run ${CHILLI_K.caseId}; npm run calibrate): a choice of dryhours at which the fitted k applies, with the published activation energy`,
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
    CHILLI_MYCOTOXIN,
    "This profile is for chillies dried without blanching. Its drying rate was fitted to one open-sun trial of unblanched red chillies (Meghwar et al., Umerkot, November 2022) on a reconstruction of that month's weather; how far it carries to other dryers, varieties and places is in docs/validation.md. Chillies blanched in hot water or steam before drying dry several times faster: choose chili-peppers-blanched for them. Check the moisture before storage.",
  ],
}

const CHILLI_BLANCHED_K = calibratedConstant('chili-peppers-blanched', 'k.kRefPerH')

/**
 * Blanched chillies. No published blanching factor turns the unblanched base's rate into a blanched one
 * (product/pretreatments.ts, chili-peppers-blanched), so this variant has a Lewis k of its own, fitted through
 * the engine to the red-chilli tunnel run of Hossain & Bala 2007 (npm run calibrate); every other number is the
 * base's.
 */
export const chiliPeppersBlanched: ProductProfile = {
  ...chiliPeppers,
  id: 'chili-peppers-blanched',
  name: pretreatmentVariantSpec('chili-peppers-blanched').name,
  variantOf: chiliPeppers.id,
  kinetics: {
    ...chiliPeppers.kinetics,
    equation: { model: 'lewis', k: arrhenius(CHILLI_BLANCHED_K.value, 50, 27000) },
    parameters: {
      ...chiliPeppers.kinetics.parameters,
      'k.kRefPerH': param(CHILLI_BLANCHED_K.source, 'fitted'),
      'k.tRefC': param(
        `reference temperature 50 °C, set by dryhours as for chili-peppers, of the k fitted through the engine to ${HOSSAIN_BALA_2007} (run ${CHILLI_BLANCHED_K.caseId}; npm run calibrate)`,
        'fitted',
      ),
    },
  },
  cautions: [
    ...FRUIT_CAUTIONS,
    CHILLI_MYCOTOXIN,
    'This profile is for chillies blanched in hot water or steam before drying. Its drying rate was fitted to chillies that were probably blanched (Hossain & Bala 2007, solar tunnel drier). For chillies dried without blanching, as most growers dry them, choose chili-peppers: in published trials unblanched chillies dried several times slower than this profile predicts (docs/validation.md). Check the moisture before storage.',
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

export const VEGETABLE_PROFILES: ProductProfile[] = [
  tomatoHalves,
  chiliPeppers,
  chiliPeppersBlanched,
  onionSlices,
]

/**
 * @module product/catalogue-other
 * Herbs, fish, coffee, cocoa and hops.
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
  sourced,
} from './catalogue-helpers.ts'
import {
  ADEYEMI_2020,
  ALVES_COFFEE,
  BROWN_2013,
  DOYMAZ_2006,
  GUELPH_MOISTURE,
  ICO_2004,
  JAIN_PATHARE_2007,
  NDUKWU_2010,
  RYBKA_2021,
  SABLANI_2001,
  SANDOVAL_2020,
  WEXLER_HASEGAWA_1954,
} from './citations.ts'
import type { ProductProfile } from './profile.ts'

/** Mint drying constant fitted through the engine to an open-sun run (npm run calibrate). */
const MINT_K = calibratedConstant('mint-leaves', 'k.kRefPerH')

export const mintLeaves: ProductProfile = {
  id: 'mint-leaves',
  name: 'Mint leaves',
  category: 'herb',
  initialMoistureWbPct: sourced(82, 'typical 80–85 %; from memory', 'memory'),
  targetMoistureWbPct: sourced(10, 'herbs at most 10–12 %; from memory', 'memory'),
  waterActivityTarget: SAFE_AW_DRIED_FRUIT,
  maxProductTempC: sourced(
    40,
    'essential-oil loss above about 40 °C: from memory (common practice, no source)',
    'memory',
  ),
  isotherm: {
    desorption: isotherm(
      gab(0.08, 8, 0.85),
      'GAB Xm0 0.08, C 8, K 0.85 and no temperature term: from memory (GAB is among the best models for mint at 15–35 °C, open-access article PMC3550902, not re-read)',
      'memory',
      [15, 35],
      [10, 90],
    ),
  },
  kinetics: kinetics(
    { model: 'lewis', k: arrhenius(MINT_K.value, 35, 62960) },
    0.5,
    'slab',
    'leaves taken as 0.5 mm slabs, the size at which k holds: from memory (the calibration run gives no leaf size)',
    'memory',
    {
      // Before the fit: Lewis k = 0.35 h⁻¹ at 35 °C, from memory.
      'k.kRefPerH': param(MINT_K.source, 'fitted'),
      'k.tRefC': param(
        `reference temperature 35 °C, set by dryhours at the lowest of Doymaz 2006's cabinet runs, of the k fitted through the engine to Noori, Royen & Haydary n.d., mint leaves solar drying, Acta Chim. Slovaca (run ${MINT_K.caseId}; npm run calibrate)`,
        'fitted',
      ),
      'k.activationEnergyJPerMol': param(
        `${DOYMAZ_2006}: cabinet dryer 35–60 °C, Deff 3.067e-9 to 1.941e-8 m²/s, Arrhenius activation energy 62.96 kJ/mol (logarithmic model best)`,
        'published',
      ),
    },
  ),
  defaultThicknessMm: sourced(0.5, 'leaf thickness; from memory', 'memory'),
  defaultLoadingKgPerM2: sourced(3, 'loose layer of leaves; from memory', 'memory'),
  cautions: [
    'Dry in shade: sun bleaches colour and drives off aroma.',
    'Keep clean and away from animals; wash before drying if soiled.',
  ],
}

const FISH_CAUTIONS = [
  'Food safety: fish spoils within hours in warm weather; gut, wash and start drying at once; blowflies lay eggs on wet fish: use screens.',
  'Histamine forms in some species (tuna, mackerel, sardine) held warm before drying.',
]

/** Fish drying constant fitted through the engine to a solar-tunnel run (npm run calibrate). */
const FISH_K = calibratedConstant('fish-fillets', 'k.kRefPerH')

export const fishFillets: ProductProfile = {
  id: 'fish-fillets',
  name: 'Fish fillets (unsalted)',
  category: 'fish',
  initialMoistureWbPct: sourced(
    80,
    `${JAIN_PATHARE_2007}: fresh fish contains up to 80 % water`,
    'published',
  ),
  targetMoistureWbPct: sourced(15, 'about 15–20 % for dried fish; from memory', 'memory'),
  waterActivityTarget: sourced(0.7, GUELPH_MOISTURE, 'published'),
  maxProductTempC: sourced(
    55,
    'protein denaturation and case hardening above about 55 °C; from memory',
    'memory',
  ),
  isotherm: {
    desorption: isotherm(
      gab(0.0494, 10, 0.95),
      'GAB C 10, K 0.95 and no temperature term: from memory (sardine muscle desorption at 25, 35 and 50 °C is best fitted by Oswin: Hadrich, Boudhrioua & Kechaou 2008, Food Bioprod. Process. 86:242, abstract; constants not read)',
      'memory',
      [25, 50],
      [10, 75],
      {
        xm0: param(
          `${SABLANI_2001}: freeze-dried sardines at 25, 40 and 50 °C (isopiestic method), GAB monolayer moisture Xm 4.94 % db; net isosteric heat 12.07 to 0.86 kJ/mol from 2.76 to 37.5 % db (here without a temperature term)`,
          'published',
        ),
      },
    ),
  },
  kinetics: kinetics(
    { model: 'lewis', k: arrhenius(FISH_K.value, 40, ASSUMED_EA_J_PER_MOL) },
    10,
    'slab',
    `10 mm fillets, the size at which k holds: from memory (open-sun Deff 8.708e-11 m²/s for chelwa and 11.11e-11 for prawn, ${JAIN_PATHARE_2007}, not used: the abstract gives no thickness)`,
    'memory',
    {
      // Before the fit: Lewis k 0.08 h⁻¹ at 40 °C for 10 mm fillets, from memory.
      'k.kRefPerH': param(FISH_K.source, 'fitted'),
      'k.tRefC': param(
        `reference temperature 40 °C, set by dryhours, of the k fitted through the engine to Kituu et al. n.d. (ACTA Press paper 34014), unbrined tilapia run (${FISH_K.caseId}; npm run calibrate)`,
        'fitted',
      ),
      'k.activationEnergyJPerMol': ASSUMED_EA_SOURCE,
    },
  ),
  defaultThicknessMm: sourced(10, 'fillet thickness; from memory', 'memory'),
  defaultLoadingKgPerM2: sourced(8, 'single layer on mesh racks; from memory', 'memory'),
  cautions: FISH_CAUTIONS,
}

export const fishFilletsSalted: ProductProfile = {
  ...fishFillets,
  id: 'fish-fillets-salted',
  name: 'Fish fillets (salted)',
  variantOf: 'fish-fillets',
  initialMoistureWbPct: sourced(60, 'after dry salting; from memory', 'memory'),
  targetMoistureWbPct: sourced(35, 'salted dried fish about 35 %; from memory', 'memory'),
  waterActivityTarget: sourced(
    0.75,
    `${WEXLER_HASEGAWA_1954}: saturated sodium chloride solution holds 74.9 % RH at 0 °C, at most 75.6 % at 30 °C: salt-saturated fish stays near aw 0.75 until the salt crystallises`,
    'published',
  ),
  isotherm: {
    desorption: isotherm(
      gab(0.16454, 1.5, 1.0),
      'type III GAB, C 1.5 and K 1.0 from memory, Xm0 0.16454 set by dryhours so that aw = 0.75 at the 35 % wb target (itself from memory); the real behaviour is isohalic (Curran & Poulter 1983; Doe et al. 1983, not read): aw near 0.75 while salt-saturated',
      'memory',
      [20, 40],
      [10, 75],
    ),
  },
  cautions: [...FISH_CAUTIONS, 'Salted fish regains water fast above 75 % RH: store dry, covered.'],
}

export const coffeeParchment: ProductProfile = {
  id: 'coffee-parchment',
  name: 'Coffee in parchment (washed)',
  category: 'beverage-crop',
  initialMoistureWbPct: sourced(53, 'washed parchment about 50–55 %; from memory', 'memory'),
  targetMoistureWbPct: sourced(
    11.5,
    `11–12 % common practice: from memory, within the 8–12.5 % of ${ICO_2004}`,
    'memory',
  ),
  waterActivityTarget: sourced(
    0.68,
    'aw below 0.68 for green coffee: from memory (a green-coffee note quotes an instrument maker: moulds and yeasts need about aw 0.61, mycotoxigenic moulds 0.78)',
    'memory',
  ),
  maxProductTempC: sourced(
    40,
    'bean temperature at most about 40 °C for cup quality: from memory (common practice, no source)',
    'memory',
  ),
  isotherm: {
    desorption: isotherm(
      gab(0.06, 10, 0.85),
      'GAB Xm0 0.06, C 10, K 0.85 and no temperature term: from memory (modified Henderson and GAB describe coffee fruit, pulped and green coffee desorption: Corrêa, Goneli, Júnior, de Oliveira & Valente 2010, Int. J. Food Sci. Technol., abstract; constants not read)',
      'memory',
      [20, 50],
      [10, 90],
    ),
  },
  kinetics: kinetics(
    { model: 'lewis', k: arrhenius(0.04, 40, 52890) },
    9,
    'sphere',
    'Lewis k = 0.04 h⁻¹ at 40 °C for 9 mm beans in parchment: from memory (sun drying of parchment takes about 1–2 weeks)',
    'memory',
    {
      'k.activationEnergyJPerMol': param(
        `${ALVES_COFFEE}: natural (dry-processed) Arabica coffee fruits dried at 35, 40 and 45 °C with a 2.6 °C dew point, Deff 1.908–3.721e-11 m²/s, activation energy 52.89 kJ/mol (fruits, not washed parchment)`,
        'published',
      ),
    },
  ),
  defaultThicknessMm: sourced(9, 'bean in parchment; from memory', 'memory'),
  defaultLoadingKgPerM2: sourced(15, 'layer of 2–4 cm on raised beds; from memory', 'memory'),
  cautions: [
    'Ochratoxin A: spend no more than 4 days between aw 0.95 and 0.80 while drying (HACCP guideline quoted from the FAO/ICO mould-prevention work).',
    'Do not store fresh cherry or wet parchment; do not rewet dried coffee; never ship above 12.5 % moisture (ICO).',
  ],
}

/** Cocoa diffusivity fitted through the engine to an open-air run (npm run calibrate). */
const COCOA_D = calibratedConstant('cocoa-beans', 'dRefM2PerS')

export const cocoaBeans: ProductProfile = {
  id: 'cocoa-beans',
  name: 'Cocoa beans (fermented)',
  category: 'beverage-crop',
  initialMoistureWbPct: sourced(55, 'fermented wet beans about 55–60 %; from memory', 'memory'),
  targetMoistureWbPct: sourced(7.5, `the middle of the safe 7–8 % wb reached in ${ADEYEMI_2020}`, 'fitted'),
  waterActivityTarget: SAFE_AW_DRIED_FRUIT,
  maxProductTempC: sourced(
    60,
    'acid and flavour defects in fast hot drying; about 60 °C: from memory (common practice, no source)',
    'memory',
  ),
  isotherm: {
    desorption: isotherm(
      gab(0.036, 21.63, 0.871),
      `no temperature term: the study is at 25 °C only (the introduction of ${SANDOVAL_2020} notes that fermented-bean desorption isotherms at 30 and 40 °C coincided in an earlier study); assumed`,
      'memory',
      [25, 25],
      [10, 90],
      {
        xm0: param(
          `${SANDOVAL_2020}: peeled bean, GAB monolayer 3.60 g water/100 g dry solids at 25 °C`,
          'published',
        ),
        c0: param(`${SANDOVAL_2020}: peeled bean, GAB C 21.63 at 25 °C`, 'published'),
        k0: param(`${SANDOVAL_2020}: peeled bean, GAB K 0.871 at 25 °C`, 'published'),
      },
    ),
  },
  kinetics: kinetics(
    { model: 'diffusion', dRefM2PerS: COCOA_D.value, tRefC: 55, activationEnergyJPerMol: 39940 },
    10.5,
    'sphere',
    'bean taken as a 10.5 mm sphere for the diffusivity: from memory (neither the hot-air study nor the open-air run gives a bean size); the fitted diffusivity is fitted at this size',
    'memory',
    {
      // Before the fit: Ndukwu et al. 2010's hot-air value, 6.137e-10 m²/s at 55 °C (isothermal batch drier at
      // 55, 70 and 81 °C, Deff 6.137e-10 to 2.1855e-9 m²/s), about 3.7× the value fitted through the engine.
      dRefM2PerS: param(COCOA_D.source, 'fitted'),
      tRefC: param(`${NDUKWU_2010}: lowest drying temperature, 55 °C`, 'published'),
      activationEnergyJPerMol: param(`${NDUKWU_2010}: activation energy 39.94 kJ/mol`, 'published'),
    },
  ),
  defaultThicknessMm: sourced(10.5, 'single layer of beans about 1 cm; from memory', 'memory'),
  defaultLoadingKgPerM2: sourced(20, 'layer of a few cm on raised beds; from memory', 'memory'),
  cautions: [
    'Mould and ochratoxin risk in slow drying; smoke contamination from direct-fired dryers (PAH): prefer indirect heaters.',
  ],
}

export const hops: ProductProfile = {
  id: 'hops',
  name: 'Hop cones',
  category: 'herb',
  initialMoistureWbPct: sourced(80, `the middle of the 76–84 % at harvest given by ${BROWN_2013}`, 'fitted'),
  targetMoistureWbPct: sourced(
    9,
    `the middle of the 8–10 % given by ${BROWN_2013} (6 % or less is over-dried: cones shatter)`,
    'fitted',
  ),
  waterActivityTarget: SAFE_AW_DRIED_FRUIT,
  maxProductTempC: sourced(
    60,
    `${RYBKA_2021}: hop cones in belt and chamber dryers are exposed to drying air of 55–60 °C for 6–8 h; drying at 40 °C kept more essential oil`,
    'published',
  ),
  isotherm: {
    desorption: isotherm(
      gab(0.07, 8, 0.85),
      'no hop isotherm was found; GAB Xm0 0.07, C 8, K 0.85 and no temperature term: from memory (leafy plant material)',
      'memory',
      [20, 60],
      [10, 90],
    ),
  },
  kinetics: kinetics(
    { model: 'lewis', k: arrhenius(0.3, 55, ASSUMED_EA_J_PER_MOL) },
    25,
    'sphere',
    `Lewis k = 0.3 h⁻¹ at 55 °C for 25 mm cones: from memory (kiln drying takes about 8–10 h); ${ASSUMED_EA_SOURCE.source}`,
    'memory',
  ),
  defaultThicknessMm: sourced(25, 'cone size; from memory', 'memory'),
  defaultLoadingKgPerM2: sourced(10, 'loose layer on screens; from memory', 'memory'),
  cautions: ['Over-dried hops shatter and lose lupulin; under-dried hops heat and can self-ignite in bales.'],
}

export const OTHER_PROFILES: ProductProfile[] = [
  mintLeaves,
  fishFillets,
  fishFilletsSalted,
  coffeeParchment,
  cocoaBeans,
  hops,
]

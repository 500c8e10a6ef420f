/**
 * @module product/catalogue-other
 * Herbs, fish, coffee, cocoa and hops.
 */
import {
  ASSUMED_EA_J_PER_MOL,
  arrhenius,
  gab,
  isotherm,
  kinetics,
  SAFE_AW_DRIED_FRUIT,
  sourced,
} from './catalogue-helpers.ts'
import type { ProductProfile } from './profile.ts'

export const mintLeaves: ProductProfile = {
  id: 'mint-leaves',
  name: 'Mint leaves',
  category: 'herb',
  initialMoistureWbPct: sourced(82, 'typical 80–85 %; from memory (drying-science.md §3)', 'memory'),
  targetMoistureWbPct: sourced(10, 'herbs at most 10–12 %; from memory (drying-science.md §3)', 'memory'),
  waterActivityTarget: SAFE_AW_DRIED_FRUIT,
  maxProductTempC: sourced(40, 'essential-oil loss above about 40 °C: common practice, no source', 'memory'),
  isotherm: {
    desorption: isotherm(
      gab(0.08, 8, 0.85),
      'GAB among the best for mint (open-access article PMC3550902, 15–35 °C); Xm 0.08, C 8, K 0.85 from memory',
      'memory',
      [15, 35],
      [10, 90],
    ),
  },
  kinetics: kinetics(
    { model: 'lewis', k: arrhenius(0.35, 35, 62960) },
    0.5,
    'slab',
    'Lewis k = 0.35 h⁻¹ at 35 °C: from memory; Ea 62.96 kJ/mol from Doymaz 2006, J. Food Eng. 74:370 (mint, 35–60 °C; logarithmic model best)',
    'memory',
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

export const fishFillets: ProductProfile = {
  id: 'fish-fillets',
  name: 'Fish fillets (unsalted)',
  category: 'fish',
  initialMoistureWbPct: sourced(
    80,
    'fresh fish muscle about 80–83 % (direct solar fish dryer study, SCIRP; drying-science.md §3)',
    'published',
  ),
  targetMoistureWbPct: sourced(
    15,
    'about 15–20 % and aw < 0.7; from memory (drying-science.md §3)',
    'memory',
  ),
  waterActivityTarget: sourced(0.7, 'aw < 0.7 for dried fish; from memory (drying-science.md §3)', 'memory'),
  maxProductTempC: sourced(
    55,
    'protein denaturation and case hardening above about 55 °C; from memory',
    'memory',
  ),
  isotherm: {
    desorption: isotherm(
      gab(0.0494, 10, 0.95),
      'GAB Xm 4.94 % db, Sablani et al. 2001, Drying Technol. 19:673 (freeze-dried sardine); C 10, K 0.95 from memory',
      'memory',
      [25, 50],
      [10, 75],
    ),
  },
  kinetics: kinetics(
    { model: 'lewis', k: arrhenius(0.08, 40, ASSUMED_EA_J_PER_MOL) },
    10,
    'slab',
    'Lewis k = 0.08 h⁻¹ at 40 °C for 10 mm fillets: from memory',
    'memory',
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
    'ICAR e-course: aw held near that of saturated brine (0.75) while salt-saturated (drying-science.md §1.3)',
    'published',
  ),
  isotherm: {
    desorption: isotherm(
      gab(0.16454, 1.5, 1.0),
      'type III GAB, C 1.5 and K 1.0 from memory, Xm 0.16454 set by dryhours so that aw = 0.75 at the 35 % wb target (saturated-brine aw, ICAR e-course); the real behaviour is isohalic (Curran & Poulter 1983; Doe et al. 1983): aw near 0.75 while salt-saturated',
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
  initialMoistureWbPct: sourced(
    53,
    'washed parchment about 50–55 %; from memory (drying-science.md §3)',
    'memory',
  ),
  targetMoistureWbPct: sourced(
    11.5,
    'ICO Resolution 420: never ship above 12.5 %; 11–12 % common practice (drying-science.md §3)',
    'published',
  ),
  waterActivityTarget: sourced(
    0.68,
    'ICO good hygiene practice pages: aw < 0.68 means no fungal growth (drying-science.md §3)',
    'published',
  ),
  maxProductTempC: sourced(
    40,
    'bean temperature at most about 40 °C for cup quality: common practice, no source',
    'memory',
  ),
  isotherm: {
    desorption: isotherm(
      gab(0.06, 10, 0.85),
      'modified Henderson and GAB adequate for coffee (Corrêa et al. 2010, Int. J. Food Sci. Technol.); Xm 0.06, C 10, K 0.85 from memory',
      'memory',
      [20, 50],
      [10, 90],
    ),
  },
  kinetics: kinetics(
    { model: 'lewis', k: arrhenius(0.04, 40, ASSUMED_EA_J_PER_MOL) },
    9,
    'sphere',
    'Lewis k = 0.04 h⁻¹ at 40 °C: from memory (sun drying of parchment takes about 1–2 weeks)',
    'memory',
  ),
  defaultThicknessMm: sourced(9, 'bean in parchment; from memory', 'memory'),
  defaultLoadingKgPerM2: sourced(15, 'layer of 2–4 cm on raised beds; from memory', 'memory'),
  cautions: [
    'Ochratoxin A: spend no more than 4 days between aw 0.95 and 0.80 while drying (FAO/ICO mould-prevention guidelines; drying-science.md §5.2).',
    'Do not store fresh cherry or wet parchment; do not rewet dried coffee.',
  ],
}

export const cocoaBeans: ProductProfile = {
  id: 'cocoa-beans',
  name: 'Cocoa beans (fermented)',
  category: 'beverage-crop',
  initialMoistureWbPct: sourced(
    55,
    'fermented wet beans about 55–60 %; from memory (drying-science.md §3)',
    'memory',
  ),
  targetMoistureWbPct: sourced(
    7.5,
    'cocoa oven-drying study: 7.5 % end point (drying-science.md §3)',
    'published',
  ),
  waterActivityTarget: SAFE_AW_DRIED_FRUIT,
  maxProductTempC: sourced(
    60,
    'acid and flavour defects in fast hot drying; about 60 °C common practice, no source',
    'memory',
  ),
  isotherm: {
    desorption: isotherm(
      gab(0.036, 21.63, 0.871),
      'GAB peeled fermented Trinitario bean at 25 °C: Xm 0.036, C 21.63, K 0.871, Sandoval et al. 2020, Rev. Téc. Ing. Univ. Zulia 43(1) (drying-science.md §1.3)',
      'published',
      [25, 25],
      [10, 90],
    ),
  },
  kinetics: kinetics(
    { model: 'diffusion', dRefM2PerS: 6.14e-10, tRefC: 55, activationEnergyJPerMol: 39940 },
    10.5,
    'sphere',
    'Fick diffusion, Deff 6.14e-10 m²/s at 55 °C, Ea 39.94 kJ/mol, batch dryer at 55/70/81 °C, Chilean J. Agric. Res. 70(4):633 (drying-science.md §2.3); bean as a 10.5 mm sphere (Hii et al. 2009 layer 1.05 cm) is our assumption',
    'published',
  ),
  defaultThicknessMm: sourced(10.5, 'Hii et al. 2009 single layer 1.05 cm (drying-science.md §6)', 'memory'),
  defaultLoadingKgPerM2: sourced(20, 'layer of a few cm on raised beds; from memory', 'memory'),
  cautions: [
    'Mould and ochratoxin risk in slow drying; smoke contamination from direct-fired dryers (PAH): prefer indirect heaters.',
  ],
}

export const hops: ProductProfile = {
  id: 'hops',
  name: 'Hop cones',
  category: 'herb',
  initialMoistureWbPct: sourced(
    80,
    'MSU Extension (Brown 2013): 76–84 % at harvest (drying-science.md §3)',
    'published',
  ),
  targetMoistureWbPct: sourced(
    9,
    'MSU Extension: 8–10 %; at or below 6 % over-dried (shatters) (drying-science.md §3)',
    'published',
  ),
  waterActivityTarget: SAFE_AW_DRIED_FRUIT,
  maxProductTempC: sourced(
    60,
    'MSU Extension, UNL: keep drying air below 60 °C (140 °F) (drying-science.md §3)',
    'published',
  ),
  isotherm: {
    desorption: isotherm(
      gab(0.07, 8, 0.85),
      'no hop isotherm found (drying-science.md §1.3); GAB Xm 0.07, C 8, K 0.85 from memory (leafy plant material)',
      'memory',
      [20, 60],
      [10, 90],
    ),
  },
  kinetics: kinetics(
    { model: 'lewis', k: arrhenius(0.3, 55, ASSUMED_EA_J_PER_MOL) },
    25,
    'sphere',
    'Lewis k = 0.3 h⁻¹ at 55 °C for cones: from memory (kiln drying takes about 8–10 h)',
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

/**
 * @module product/catalogue-fruit
 * Fruit and vegetable profiles. Full GAB triplets for sugar-rich fruit were not read (reference §7 gap 2):
 * where only the monolayer value was read it is kept and C, K are from memory (type III isotherm, C ≈ 1–6,
 * K ≈ 0.9–1.0; Maroulis et al. 1988, Tsami et al. 1990), flagged `memory`. Kinetics marked `fitted` were
 * fitted by dryhours to one published drying time under stated assumed mean conditions.
 */
import {
  ASSUMED_EA_J_PER_MOL,
  arrhenius,
  gab,
  isotherm,
  kinetics,
  SAFE_AW_DRIED_FRUIT,
  SAFE_AW_MOULD,
  sourced,
} from './catalogue-helpers.ts'
import type { ProductProfile } from './profile.ts'

const FRUIT_CAUTIONS = [
  'Reach the water-activity target before storage: moulds and osmophilic yeasts spoil under-dried fruit.',
  'Protect from dust, insects, birds, rain and dew; cover or bring in at night.',
]
const SUGAR_GAB_MEMORY =
  'C = 3, K = 1.0 from memory (type III sugar-fruit isotherm, Maroulis et al. 1988 J. Food Eng. 7:63; Tsami et al. 1990 J. Food Sci. 55:1594)'

export const grapesToRaisins: ProductProfile = {
  id: 'grapes-to-raisins',
  name: 'Grapes to raisins (untreated, open sun)',
  category: 'fruit',
  initialMoistureWbPct: sourced(
    78.2,
    'Doymaz 2012, J. Food Sci. Technol. 49:214: seedless grapes 78.2 % wb (drying-science.md §6)',
    'published',
  ),
  targetMoistureWbPct: sourced(
    18,
    'US grades of processed raisins, 7 CFR 52.1858: at most 18 % (drying-science.md §3)',
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
      `GAB Xm 0.082 kg/kg db at 25 °C, Esmaiili Bazardeh & Esmaiili 2014, J. Stored Prod. Res. 59:140 (sultana raisins); ${SUGAR_GAB_MEMORY}`,
      'memory',
      [15, 35],
      [10, 90],
    ),
  },
  kinetics: kinetics(
    { model: 'lewis', k: arrhenius(0.01616, 35, ASSUMED_EA_J_PER_MOL) },
    17.2,
    'sphere',
    'Lewis k fitted by dryhours to Doymaz 2012: seedless grapes 17.2 mm, open sun, 78.2 → 22 % wb in 176 h, assuming a mean 35 °C and 35 % RH at the fruit (Me from the isotherm); Ea assumed 30 kJ/mol',
    'fitted',
  ),
  defaultThicknessMm: sourced(17.2, 'Doymaz 2012 seedless berries (drying-science.md §2.3)', 'published'),
  defaultLoadingKgPerM2: sourced(12, 'single layer of bunches on racks or mats; from memory', 'memory'),
  cautions: [...FRUIT_CAUTIONS, 'Ochratoxin A risk in grapes dried slowly in humid weather.'],
}

export const grapesToRaisinsDipped: ProductProfile = {
  ...grapesToRaisins,
  id: 'grapes-to-raisins-dipped',
  name: 'Grapes to raisins (dipped in alkaline ethyl-oleate emulsion)',
  variantOf: 'grapes-to-raisins',
  kinetics: {
    ...grapesToRaisins.kinetics,
    equation: { model: 'lewis', k: arrhenius(0.03232, 35, ASSUMED_EA_J_PER_MOL) },
    source:
      'untreated grapes k × 2: dipping in ethyl-oleate/K2CO3 emulsion roughly halves sun-drying time (from memory); the same dip raised tomato Deff by 13–45 % (Doymaz 2007)',
    confidence: 'memory',
  },
  cautions: [
    ...grapesToRaisins.cautions,
    'Use food-grade dipping oil and potassium carbonate at the stated strength.',
  ],
}

export const apricotHalves: ProductProfile = {
  id: 'apricot-halves',
  name: 'Apricot halves',
  category: 'fruit',
  initialMoistureWbPct: sourced(
    86,
    'Rejabov et al. 2024, Eng. Proc. 67:26: 85–90 % wb (drying-science.md §6)',
    'published',
  ),
  targetMoistureWbPct: sourced(
    25,
    'Codex Stan 130-1981 dried apricots: at most 25 % (via summary; drying-science.md §3)',
    'published',
  ),
  waterActivityTarget: SAFE_AW_MOULD,
  maxProductTempC: sourced(65, 'browning and case hardening above about 65 °C; from memory', 'memory'),
  isotherm: {
    desorption: isotherm(
      gab(0.1, 3, 1.0),
      `GAB Xm 0.10 from memory (range 0.08–0.17, drying-science.md §1.3); ${SUGAR_GAB_MEMORY}`,
      'memory',
      [25, 45],
      [10, 90],
    ),
  },
  kinetics: kinetics(
    { model: 'lewis', k: arrhenius(0.05, 45, ASSUMED_EA_J_PER_MOL) },
    15,
    'slab',
    'Lewis k = 0.05 h⁻¹ at 45 °C for 15 mm halves: from memory (open-air apricots take about 10 days, indirect solar 6 days: E3S Web Conf. 661:02003, drying-science.md §6)',
    'memory',
  ),
  defaultThicknessMm: sourced(15, 'halved fruit; from memory', 'memory'),
  defaultLoadingKgPerM2: sourced(10, 'single layer, cut face up; from memory', 'memory'),
  cautions: [
    ...FRUIT_CAUTIONS,
    'Sulphuring (if used) must follow local food law; declare sulphite (allergen).',
  ],
}

export const figs: ProductProfile = {
  id: 'figs',
  name: 'Figs (whole)',
  category: 'fruit',
  initialMoistureWbPct: sourced(
    82,
    'about 82 % fresh (drying-science.md §3); often part-dried on the tree',
    'memory',
  ),
  targetMoistureWbPct: sourced(
    22,
    'Oksar, Şen & Aksoy 2017, Acta Hortic. 1173:297: stop drying at ≤ 22 % and/or aw ≤ 0.65 (drying-science.md §5.2)',
    'published',
  ),
  waterActivityTarget: sourced(0.65, 'Oksar, Şen & Aksoy 2017 (drying-science.md §5.2)', 'published'),
  maxProductTempC: sourced(
    65,
    'fig dryer studies at 45–65 °C (Xanthopoulos et al. 2010); limit from memory',
    'memory',
  ),
  isotherm: {
    desorption: isotherm(
      gab(0.1164, 3, 1.0),
      `GAB with ${SUGAR_GAB_MEMORY}; Xm 0.1164 fitted by dryhours so that aw 0.65 ↔ 22 % wb (the Oksar et al. 2017 end point)`,
      'memory',
      [25, 45],
      [10, 90],
    ),
  },
  kinetics: kinetics(
    { model: 'lewis', k: arrhenius(0.03, 40, ASSUMED_EA_J_PER_MOL) },
    40,
    'sphere',
    'Lewis k = 0.03 h⁻¹ at 40 °C for whole figs: from memory (figs under a plastic tunnel reached the end point in 72–96 h; Oksar et al. 2017, drying-science.md §6)',
    'memory',
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
  initialMoistureWbPct: sourced(80, 'typical 75–85 %; from memory (drying-science.md §3)', 'memory'),
  targetMoistureWbPct: sourced(
    18,
    'prune trade information: about 18 % "natural condition" (drying-science.md §3)',
    'published',
  ),
  waterActivityTarget: SAFE_AW_MOULD,
  maxProductTempC: sourced(75, 'prune dehydrators run at about 75–85 °C; limit from memory', 'memory'),
  isotherm: {
    desorption: isotherm(
      gab(0.1, 3, 1.0),
      `GAB Xm 0.10 from memory; ${SUGAR_GAB_MEMORY}`,
      'memory',
      [25, 45],
      [10, 90],
    ),
  },
  kinetics: kinetics(
    { model: 'lewis', k: arrhenius(0.08, 70, ASSUMED_EA_J_PER_MOL) },
    35,
    'sphere',
    'Lewis k = 0.08 h⁻¹ at 70 °C for whole plums: from memory (prune dehydration takes about a day)',
    'memory',
  ),
  defaultThicknessMm: sourced(35, 'whole plum diameter; from memory', 'memory'),
  defaultLoadingKgPerM2: sourced(15, 'single layer on trays; from memory', 'memory'),
  cautions: FRUIT_CAUTIONS,
}

export const appleSlices: ProductProfile = {
  id: 'apple-slices',
  name: 'Apple slices',
  category: 'fruit',
  initialMoistureWbPct: sourced(85, 'Costa et al.: about 85 % (drying-science.md §3)', 'published'),
  targetMoistureWbPct: sourced(
    20,
    'UNECE DDP-16 dried apples about 20–24 %; from memory (drying-science.md §3)',
    'memory',
  ),
  waterActivityTarget: SAFE_AW_DRIED_FRUIT,
  maxProductTempC: sourced(70, 'browning above about 70 °C; from memory', 'memory'),
  isotherm: {
    desorption: isotherm(
      gab(0.12, 3, 0.97),
      'GAB Xm 0.12 within the 0.107–0.168 read for Fuji apple (Moraes, Rosa & Pinto, FURG); C = 3, K = 0.97 from memory',
      'memory',
      [30, 70],
      [10, 90],
    ),
  },
  kinetics: kinetics(
    { model: 'diffusion', dRefM2PerS: 4.97e-10, tRefC: 60, activationEnergyJPerMol: 34000 },
    5,
    'slab',
    'Fick diffusion, Deff 2.27e-10 (40 °C) – 4.97e-10 (60 °C) m²/s for 5–9 mm organic apple slices (drying-science.md §2.3); Ea 34 kJ/mol computed by dryhours from those two values',
    'published',
  ),
  defaultThicknessMm: sourced(5, 'slices of 5 mm (drying-science.md §2.3)', 'published'),
  defaultLoadingKgPerM2: sourced(8, 'single layer on mesh trays; from memory', 'memory'),
  cautions: FRUIT_CAUTIONS,
}

export const tomatoHalves: ProductProfile = {
  id: 'tomato-halves',
  name: 'Tomato halves',
  category: 'vegetable',
  initialMoistureWbPct: sourced(
    94.5,
    'Doymaz 2007, J. Food Eng. 78:1291 (drying-science.md §6)',
    'published',
  ),
  targetMoistureWbPct: sourced(11, 'Doymaz 2007 end point 11 % wb (drying-science.md §6)', 'published'),
  waterActivityTarget: SAFE_AW_DRIED_FRUIT,
  maxProductTempC: sourced(
    70,
    'Doymaz 2007 tested 55–70 °C; limit from memory (lycopene loss, browning)',
    'memory',
  ),
  isotherm: {
    desorption: isotherm(
      gab(0.1, 5, 0.95),
      'GAB best for tomato (Ben Mariem & Ben Mabrouk 2015); Xm 0.10, C 5, K 0.95 from memory',
      'memory',
      [30, 60],
      [10, 90],
    ),
  },
  kinetics: kinetics(
    { model: 'diffusion', dRefM2PerS: 3.91e-10, tRefC: 55, activationEnergyJPerMol: 32940 },
    20,
    'slab',
    'Fick diffusion, untreated tomato: Deff 3.91e-10 m²/s at 55 °C (6.65e-10 at 70 °C), Ea 32.94 kJ/mol, Doymaz 2007, J. Food Eng. 78:1291; half thickness 20 mm from memory',
    'published',
  ),
  defaultThicknessMm: sourced(20, 'half-tomato thickness; from memory', 'memory'),
  defaultLoadingKgPerM2: sourced(10, 'single layer, cut face up; from memory', 'memory'),
  cautions: [
    ...FRUIT_CAUTIONS,
    'Tomatoes are low-acid: hold clean, dry fast in the first day to avoid spoilage.',
  ],
}

export const chiliPeppers: ProductProfile = {
  id: 'chili-peppers',
  name: 'Chili peppers (red, whole pods)',
  category: 'vegetable',
  initialMoistureWbPct: sourced(
    80,
    'Meghwar et al., Pak. J. Agric. Res. 36(1):63: 80 % wb (drying-science.md §6)',
    'published',
  ),
  targetMoistureWbPct: sourced(11, 'Meghwar et al.: dried to 10–12 % wb (drying-science.md §6)', 'published'),
  waterActivityTarget: SAFE_AW_DRIED_FRUIT,
  maxProductTempC: sourced(65, 'colour (capsanthin) loss above about 65 °C; from memory', 'memory'),
  isotherm: {
    desorption: isotherm(
      gab(0.06, 6, 0.9),
      'GAB best for green chilli (Getahun et al. 2020, Heliyon 6:e04608); Xm 0.06, C 6, K 0.9 from memory',
      'memory',
      [30, 60],
      [10, 90],
    ),
  },
  kinetics: kinetics(
    { model: 'lewis', k: arrhenius(0.257, 50, ASSUMED_EA_J_PER_MOL) },
    10,
    'cylinder',
    'Lewis k fitted by dryhours to Hossain & Bala 2007, Solar Energy 81:85: red chilli 2.85 → 0.05 kg/kg db in 20 h in a solar tunnel dryer, assuming a mean 50 °C and 15 % RH in the tunnel; Ea assumed 30 kJ/mol',
    'fitted',
  ),
  defaultThicknessMm: sourced(10, 'pod diameter; from memory', 'memory'),
  defaultLoadingKgPerM2: sourced(8, 'single layer; from memory', 'memory'),
  cautions: [
    ...FRUIT_CAUTIONS,
    'Aflatoxin and ochratoxin risk in slowly dried chillies; do not dry on bare ground.',
  ],
}

export const onionSlices: ProductProfile = {
  id: 'onion-slices',
  name: 'Onion slices',
  category: 'vegetable',
  initialMoistureWbPct: sourced(88, 'typical 86–90 %; from memory (drying-science.md §3)', 'memory'),
  targetMoistureWbPct: sourced(
    5,
    'dehydrated onion at most 4–5 %; from memory (drying-science.md §3)',
    'memory',
  ),
  waterActivityTarget: SAFE_AW_DRIED_FRUIT,
  maxProductTempC: sourced(60, 'browning and pungency loss above about 60 °C; from memory', 'memory'),
  isotherm: {
    desorption: isotherm(
      gab(0.07, 4, 0.95),
      'modified Halsey best for onion (Viswanathan, Jayas & Hulasare 2003), constants not read; GAB Xm 0.07, C 4, K 0.95 from memory',
      'memory',
      [30, 50],
      [15, 85],
    ),
  },
  kinetics: kinetics(
    { model: 'page', k: arrhenius(0.3, 60, ASSUMED_EA_J_PER_MOL), n: 1.1 },
    5,
    'slab',
    'Page k = 0.3 h⁻ⁿ, n = 1.1 at 60 °C for 5 mm slices: from memory (Page best for onion slices, Górnicki et al.)',
    'memory',
  ),
  defaultThicknessMm: sourced(5, 'slice thickness (Górnicki et al. tested 5 and 10 mm)', 'published'),
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

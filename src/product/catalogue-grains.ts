/**
 * @module product/catalogue-grains
 * Grain and oilseed profiles. Isotherm constants are ASAE D245 forms; where the standard's table was not
 * read, the constants are either from code citing it (said so), from memory (checked against published
 * EMC tables in the tests), or fitted by dryhours to the published EMC table named.
 */
import { isotherm, kinetics, SAFE_AW_MOULD, sourced } from './catalogue-helpers.ts'
import type { ProductProfile } from './profile.ts'

const GRAIN_CAUTIONS = [
  'Mycotoxins: moulds (Aspergillus, Fusarium, Penicillium) grow in damp grain; dry promptly and keep interstitial air below 65 % RH (aw 0.65).',
  'Allowable storage time falls steeply with moisture and temperature; cool the grain after drying.',
  'Grain dust is explosive and a breathing hazard; heater and fan installation by licensed trades.',
]

const WIKI_EMC =
  'Wikipedia, "Equilibrium moisture content", grain EMC table at 1.7/10/21.1/37.8 °C and RH 25–40 % (drying-science.md §1.2)'

export const shelledCorn: ProductProfile = {
  id: 'shelled-corn',
  name: 'Shelled corn (maize), yellow dent',
  category: 'grain',
  initialMoistureWbPct: sourced(
    25,
    'NDSU maturity table; harvested at 20–30 % wb (drying-science.md §3)',
    'published',
  ),
  targetMoistureWbPct: sourced(
    13,
    'Arkansas grain drying handbook: 15.5 % to market, 12–13 % for storage over months (drying-science.md §3)',
    'published',
  ),
  waterActivityTarget: SAFE_AW_MOULD,
  maxProductTempC: null,
  isotherm: {
    desorption: isotherm(
      { model: 'modified-chung-pfost', a: 374.34, b: 0.18662, c: 31.696 },
      'Modified Chung–Pfost, Chen & Morey 1989 as listed in ASAE D245.6 (constants as copied in public code); 15.6 °C/80 % → 16.1 % wb (extension value, drying-science.md §1.2)',
      'published',
      [0, 50],
      [20, 90],
    ),
  },
  kinetics: kinetics(
    { model: 'thompson-corn' },
    8,
    'sphere',
    'Thompson, Peart & Foster 1968, Trans. ASAE 11:582: t = A·ln MR + B·(ln MR)², A = −1.706 + 0.0088·T, B = 148.7·exp(−0.059·T) (drying-science.md §2.2)',
    'memory',
  ),
  defaultThicknessMm: sourced(
    8,
    'kernel size, thin-layer equation (no thickness scaling intended); from memory',
    'memory',
  ),
  defaultLoadingKgPerM2: sourced(30, 'about a 4 cm layer at 720 kg/m³ bulk density; from memory', 'memory'),
  cautions: GRAIN_CAUTIONS,
}

export const wheat: ProductProfile = {
  id: 'wheat',
  name: 'Wheat',
  category: 'grain',
  initialMoistureWbPct: sourced(
    18,
    'typical 14–20 % at harvest; from memory (drying-science.md §3)',
    'memory',
  ),
  targetMoistureWbPct: sourced(12, `${WIKI_EMC}: about 12 % for long-term storage`, 'published'),
  waterActivityTarget: SAFE_AW_MOULD,
  maxProductTempC: sourced(
    60,
    'common practice for milling wheat (gluten damage above about 60 °C); from memory',
    'memory',
  ),
  isotherm: {
    desorption: isotherm(
      { model: 'modified-chung-pfost', a: 610.34, b: 0.15526, c: 93.213 },
      'Modified Chung–Pfost, from code citing Storage of Cereal Grains and Their Products, 5th ed., p. 272; 32.2 °C/50 % → 11.2 % wb vs 10.8 % extension value for soft red winter wheat (drying-science.md §1.2)',
      'published',
      [0, 50],
      [20, 90],
    ),
  },
  kinetics: kinetics(
    { model: 'lewis', k: { form: 'arrhenius', kRefPerH: 0.25, tRefC: 40, activationEnergyJPerMol: 30000 } },
    3.5,
    'sphere',
    'Lewis k = 0.25 h⁻¹ at 40 °C for a thin layer of wheat, Ea 30 kJ/mol: from memory, not verified',
    'memory',
  ),
  defaultThicknessMm: sourced(3.5, 'kernel size; from memory', 'memory'),
  defaultLoadingKgPerM2: sourced(30, 'about a 4 cm layer at 770 kg/m³; from memory', 'memory'),
  cautions: GRAIN_CAUTIONS,
}

export const roughRice: ProductProfile = {
  id: 'rough-rice',
  name: 'Rough rice (paddy)',
  category: 'grain',
  initialMoistureWbPct: sourced(
    24,
    'IRRI Knowledge Bank: 20–28 %, 24–26 % typical (drying-science.md §3)',
    'published',
  ),
  targetMoistureWbPct: sourced(
    14,
    'IRRI Knowledge Bank: 14 % for storage of weeks and milling; 13 % for 8–12 months (drying-science.md §3)',
    'published',
  ),
  waterActivityTarget: SAFE_AW_MOULD,
  maxProductTempC: sourced(
    50,
    'paddy sun-drying practice: cover the grain above 50 °C (42 °C for seed), fissuring (drying-science.md §5.3)',
    'published',
  ),
  isotherm: {
    desorption: isotherm(
      { model: 'modified-henderson', a: 1.9187e-5, b: 2.4451, c: 51.161 },
      'Modified Henderson constants recalled as ASAE D245 (from memory); checked within 0.1–0.3 pt of the Wikipedia long-grain rice EMC table (tests)',
      'memory',
      [0, 50],
      [20, 90],
    ),
  },
  kinetics: kinetics(
    {
      model: 'page',
      k: { form: 'linear-t-rh', k0: 0.01579, kPerC: 0.0001746, kPerRh: -0.01413, timeUnit: 'min' },
      n: { n0: 0.6545, nPerC: 0.002425, nPerRh: 0.07867 },
    },
    2.5,
    'sphere',
    'Page, Wang & Singh 1978 (ASAE paper 78-3001), t in min: k = 0.01579 + 0.0001746·T − 0.01413·RH, n = 0.6545 + 0.002425·T + 0.07867·RH (drying-science.md §2.2)',
    'memory',
  ),
  defaultThicknessMm: sourced(2.5, 'kernel thickness; from memory', 'memory'),
  defaultLoadingKgPerM2: sourced(
    17,
    'a 3 cm layer (IRRI 3–5 cm, KALRO 2–3 cm; drying-science.md §5.3) at about 580 kg/m³ (bulk density from memory)',
    'memory',
  ),
  cautions: [
    ...GRAIN_CAUTIONS,
    'Dry paddy within 24 h of harvest; stir the layer every 30 min; gather or cover at night and in rain: re-wetting fissures the grain (IRRI, KALRO; drying-science.md §5.2–5.3).',
  ],
}

export const roughRiceSeed: ProductProfile = {
  ...roughRice,
  id: 'rough-rice-seed',
  name: 'Rough rice (paddy) kept for seed',
  variantOf: 'rough-rice',
  targetMoistureWbPct: sourced(
    12,
    'IRRI Knowledge Bank: 12 % for farm seed, 9 % for seed kept over a year (drying-science.md §3)',
    'published',
  ),
  maxProductTempC: sourced(42, 'paddy practice: 42 °C limit for seed (drying-science.md §5.3)', 'published'),
  cautions: [...roughRice.cautions, 'Seed viability is lost above 42 °C grain temperature.'],
}

export const soybean: ProductProfile = {
  id: 'soybean',
  name: 'Soybean',
  category: 'oilseed',
  initialMoistureWbPct: sourced(
    18,
    'typical 13–18 % at harvest; from memory (drying-science.md §3)',
    'memory',
  ),
  targetMoistureWbPct: sourced(11, `${WIKI_EMC}: about 11 % for long-term storage`, 'published'),
  waterActivityTarget: SAFE_AW_MOULD,
  maxProductTempC: sourced(
    43,
    'seed soybean: common practice, no source (seed coat cracking above about 43 °C)',
    'memory',
  ),
  isotherm: {
    desorption: isotherm(
      { model: 'modified-halsey', a: 2.8506, b: -0.0052195, c: 1.37132 },
      `Modified Halsey fitted by dryhours (Levenberg–Marquardt, RMSE 0.03 pt wb, 17 points) to the ${WIKI_EMC} plus 21.1 °C/50 % → 8.8 % (University of Kentucky EMC chart, McNeill); D245.6 also prefers Halsey for soybean`,
      'fitted',
      [1.7, 37.8],
      [25, 50],
    ),
  },
  kinetics: kinetics(
    { model: 'lewis', k: { form: 'arrhenius', kRefPerH: 0.2, tRefC: 40, activationEnergyJPerMol: 30000 } },
    6.5,
    'sphere',
    'Lewis k = 0.2 h⁻¹ at 40 °C, Ea 30 kJ/mol: from memory, not verified',
    'memory',
  ),
  defaultThicknessMm: sourced(6.5, 'bean diameter; from memory', 'memory'),
  defaultLoadingKgPerM2: sourced(30, 'about a 4 cm layer; from memory', 'memory'),
  cautions: [...GRAIN_CAUTIONS, 'Over-dry or fast-dried soybeans split and crack.'],
}

export const sorghum: ProductProfile = {
  id: 'sorghum',
  name: 'Sorghum',
  category: 'grain',
  initialMoistureWbPct: sourced(
    20,
    'typical 14–20 % at harvest; from memory (drying-science.md §3)',
    'memory',
  ),
  targetMoistureWbPct: sourced(12, `${WIKI_EMC}: about 12 % for long-term storage`, 'published'),
  waterActivityTarget: SAFE_AW_MOULD,
  maxProductTempC: null,
  isotherm: {
    desorption: isotherm(
      { model: 'modified-chung-pfost', a: 798.996, b: 0.180647, c: 53.2537 },
      `Modified Chung–Pfost fitted by dryhours (Levenberg–Marquardt, RMSE 0.02 pt wb, 16 points) to the ${WIKI_EMC}; extrapolated above 40 % RH`,
      'fitted',
      [1.7, 37.8],
      [25, 40],
    ),
  },
  kinetics: kinetics(
    { model: 'lewis', k: { form: 'arrhenius', kRefPerH: 0.25, tRefC: 40, activationEnergyJPerMol: 30000 } },
    4,
    'sphere',
    'Lewis k = 0.25 h⁻¹ at 40 °C, Ea 30 kJ/mol: from memory, not verified',
    'memory',
  ),
  defaultThicknessMm: sourced(4, 'kernel size; from memory', 'memory'),
  defaultLoadingKgPerM2: sourced(30, 'about a 4 cm layer; from memory', 'memory'),
  cautions: GRAIN_CAUTIONS,
}

export const GRAIN_PROFILES: ProductProfile[] = [
  shelledCorn,
  wheat,
  roughRice,
  roughRiceSeed,
  soybean,
  sorghum,
]

/**
 * @module product/catalogue-grains
 * Grain and oilseed profiles. Isotherm constants are ASAE D245 forms. The standard's tables could not be read,
 * so the constants recalled for corn and wheat are graded `memory` and checked in the tests against the grain EMC
 * table of the Wikipedia article "Equilibrium moisture content" and the University of Kentucky chart; rough rice
 * uses constants read in an abstract (Muñoz & Rebufel); soybean and sorghum constants were fitted by dryhours to
 * those tables. The corn thin-layer (Thompson) constants are as transcribed in public code (`transcribed`).
 */

import { isotherm, kinetics, param, SAFE_AW_MOULD, sourced } from './catalogue-helpers.ts'
import {
  GELY_GINER_2007,
  GONELI_WHEAT,
  IRRI_DRYING,
  LOTUS_EMC_25C,
  MUNOZ_REBUFEL_RICE,
  PAMI_EMC_CHARTS,
  SIMULADOR_SECAGEM,
  UKY_EMC_2012,
  WIKIPEDIA_EMC,
} from './citations.ts'
import type { ProductProfile } from './profile.ts'

const GRAIN_CAUTIONS = [
  'Mycotoxins: moulds (Aspergillus, Fusarium, Penicillium) grow in damp grain; dry promptly and keep interstitial air below 65 % RH (aw 0.65).',
  'Allowable storage time falls steeply with moisture and temperature; cool the grain after drying.',
  'Grain dust is explosive and a breathing hazard; heater and fan installation by licensed trades.',
]

const WIKI_TABLE = `EMC table at 1.7/10/21.1/37.8 °C and RH 25–40 % (% wb) ${WIKIPEDIA_EMC}`
const WIKI_TABLE_DURUM = `EMC table at 35/50/70/100 °F and RH 25–35 % (% wb; the 40 % row is cut off in the copy read) ${WIKIPEDIA_EMC}`
const D245_NOT_READ = 'the ASAE D245.5/D245.6 tables were not read'

export const shelledCorn: ProductProfile = {
  id: 'shelled-corn',
  name: 'Shelled corn (maize), yellow dent',
  category: 'grain',
  initialMoistureWbPct: sourced(
    25,
    'harvest moisture about 25 % wb (harvested at 20–30 %): from memory, not re-read',
    'memory',
  ),
  targetMoistureWbPct: sourced(
    13,
    `13 % wb for storage over months: from memory (12 % for long-term storage, ${WIKIPEDIA_EMC})`,
    'memory',
  ),
  waterActivityTarget: SAFE_AW_MOULD,
  maxProductTempC: null,
  isotherm: {
    desorption: isotherm(
      { model: 'modified-chung-pfost', a: 374.34, b: 0.18662, c: 31.696 },
      `modified Chung–Pfost constants as commonly given for ASAE D245.6 (after Chen & Morey 1989): from memory, ${D245_NOT_READ}; checked in the tests within 0.8 pt of the Wikipedia corn EMC table. The standard's modified Henderson constants for corn were found transcribed in public code (K 8.6541e-5, N 1.8634, C 49.81) but not adopted: with them the natural-air bin test misses the published drying time (see docs/product-sources.md)`,
      'memory',
      [0, 50],
      [20, 90],
    ),
  },
  kinetics: kinetics(
    { model: 'thompson-corn' },
    8,
    'sphere',
    'kernel size 8 mm: from memory (the Thompson equation is a thin-layer equation for the kernel bed; the size is not used to scale it)',
    'memory',
    {
      thompson: param(
        `Thompson, Peart & Foster 1968, Mathematical simulation of corn drying — a new model, Trans. ASAE 11 (title and authors read; constants not): t = A·ln MR + B·(ln MR)², A = −1.706 + 0.0088·T, B = 148.7·exp(−0.059·T), T in °C, t in h, as given in ${SIMULADOR_SECAGEM}; the same four constants are in a second public Thompson-model code (core.py, thompson_AB, "milho", whose repository the search index does not name) and with the values dryhours used before this was read`,
        'transcribed',
      ),
    },
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
  initialMoistureWbPct: sourced(18, 'typical 14–20 % at harvest; from memory', 'memory'),
  targetMoistureWbPct: sourced(12, `about 12 % for long-term storage, ${WIKIPEDIA_EMC}`, 'transcribed'),
  waterActivityTarget: SAFE_AW_MOULD,
  maxProductTempC: sourced(
    60,
    'milling wheat: gluten damage above about 60 °C; from memory (common practice, no source)',
    'memory',
  ),
  isotherm: {
    desorption: isotherm(
      { model: 'modified-oswin', a: 13.1053, b: -0.0485494, c: 3.03634 },
      `modified Oswin fitted by dryhours (least squares on % wb, RMSE 0.14 pt, largest residual 0.35 pt, 19 points; npm run isotherms:fit) to the durum wheat ${WIKI_TABLE_DURUM} and the wheat row at RH 30–90 % of ${LOTUS_EMC_25C}; the form ASABE D245.5 gives durum per ${PAMI_EMC_CHARTS}. Soft red winter wheat 10.8 % wb at 32.2 °C/50 % (extension text, not in the fit): 0.45 pt off. Replaces recalled Chung–Pfost constants (610.34, 0.15526, 93.213)`,
      'fitted',
      [1.7, 37.8],
      [25, 90],
    ),
  },
  kinetics: kinetics(
    { model: 'lewis', k: { form: 'arrhenius', kRefPerH: 0.25, tRefC: 40, activationEnergyJPerMol: 42000 } },
    3.5,
    'sphere',
    'Lewis k = 0.25 h⁻¹ at 40 °C for a thin layer of wheat, kernel 3.5 mm: from memory, not verified',
    'memory',
    {
      'k.activationEnergyJPerMol': param(
        `${GONELI_WHEAT}: wheat from 0.32 db dried at 25–55 °C and 55 % RH, liquid-diffusion coefficient 8.6775e-11 to 42.8743e-11 m²/s (41.0977e-11 in the English abstract), Arrhenius activation energy 42.00 kJ/mol (the English abstract says "rough rice" where the Portuguese says wheat)`,
        'published',
      ),
    },
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
    `24 % wb at harvest: from memory (${IRRI_DRYING}: "up to 25 % moisture" when harvested)`,
    'memory',
  ),
  targetMoistureWbPct: sourced(
    14,
    `${IRRI_DRYING}: 14 % or less for storage of weeks to a few months (13 % for 8–12 months)`,
    'published',
  ),
  waterActivityTarget: SAFE_AW_MOULD,
  maxProductTempC: sourced(
    50,
    'paddy sun-drying practice: cover the grain above 50 °C (fissuring); from memory, not re-read',
    'memory',
  ),
  isotherm: {
    desorption: isotherm(
      { model: 'modified-henderson', a: 2.712e-5, b: 2.32574, c: 40.32191 },
      `${MUNOZ_REBUFEL_RICE}: static method with saturated salt solutions at 10, 25 and 40 °C; fitted modified Henderson H = 1/100·[ln(1 − HR)/(−2.712e-5·(T + 40.32191))]^(1/2.32574) (mean difference 5.13 %); read as % dry basis, the usual basis of this form (the abstract does not say), which the tests support: within 0.6 pt of the Wikipedia long-grain rice table read as dry basis, 1.9 pt off read as wet basis. The RH range of the data is not given in the abstract`,
      'published',
      [10, 40],
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
    'Page, after Wang & Singh 1978 (ASAE paper 78-3001), t in min: k = 0.01579 + 0.0001746·T − 0.01413·RH, n = 0.6545 + 0.002425·T + 0.07867·RH: from memory, the paper was not read; kernel 2.5 mm from memory',
    'memory',
  ),
  defaultThicknessMm: sourced(2.5, 'kernel thickness; from memory', 'memory'),
  defaultLoadingKgPerM2: sourced(
    17,
    'a 3 cm layer at about 580 kg/m³: layer depth and bulk density from memory',
    'memory',
  ),
  cautions: [
    ...GRAIN_CAUTIONS,
    'Dry paddy within 24 h of harvest (IRRI Rice Knowledge Bank); stir the layer often; gather or cover at night and in rain: re-wetting fissures the grain.',
  ],
}

export const roughRiceSeed: ProductProfile = {
  ...roughRice,
  id: 'rough-rice-seed',
  name: 'Rough rice (paddy) kept for seed',
  variantOf: 'rough-rice',
  targetMoistureWbPct: sourced(
    12,
    `${IRRI_DRYING}: 12 % or less for farmers' seed (9 % or less for longer keeping)`,
    'published',
  ),
  maxProductTempC: sourced(
    42,
    'paddy practice: 42 °C grain-temperature limit for seed; from memory, not re-read',
    'memory',
  ),
  cautions: [...roughRice.cautions, 'Seed viability is lost above about 42 °C grain temperature.'],
}

export const soybean: ProductProfile = {
  id: 'soybean',
  name: 'Soybean',
  category: 'oilseed',
  initialMoistureWbPct: sourced(18, 'typical 13–18 % at harvest; from memory', 'memory'),
  targetMoistureWbPct: sourced(11, `about 11 % for long-term storage, ${WIKIPEDIA_EMC}`, 'transcribed'),
  waterActivityTarget: SAFE_AW_MOULD,
  maxProductTempC: sourced(
    43,
    'seed soybean: seed-coat cracking above about 43 °C; from memory (common practice, no source)',
    'memory',
  ),
  isotherm: {
    desorption: isotherm(
      { model: 'modified-halsey', a: 2.8506, b: -0.0052195, c: 1.37132 },
      `modified Halsey fitted by dryhours (Levenberg–Marquardt, RMSE 0.03 pt wb, 17 points) to the soybean ${WIKI_TABLE}, plus 21.1 °C/50 % → 8.8 % from ${UKY_EMC_2012}`,
      'fitted',
      [1.7, 37.8],
      [25, 50],
    ),
  },
  kinetics: kinetics(
    { model: 'lewis', k: { form: 'arrhenius', kRefPerH: 0.2, tRefC: 40, activationEnergyJPerMol: 16600 } },
    6.5,
    'sphere',
    'Lewis k = 0.2 h⁻¹ at 40 °C, bean 6.5 mm: from memory, not verified',
    'memory',
    {
      'k.activationEnergyJPerMol': param(
        `${GELY_GINER_2007}: thin-layer drying of cv. Nidera A6381 at 19–75 °C, diffusivity 1.78e-11 m²/s at 19 °C to 7.28e-11 at 75 °C, activation energy 16.6 kJ/mol below 50 °C and 28.8 kJ/mol above (printed without decimal points as "166" and "288" in the copy read; the readings with decimals agree with the two diffusivities, R·ln(7.28/1.78)/(1/292.15 − 1/348.15) = 21.3 kJ/mol over the whole range)`,
        'published',
      ),
    },
  ),
  defaultThicknessMm: sourced(6.5, 'bean diameter; from memory', 'memory'),
  defaultLoadingKgPerM2: sourced(30, 'about a 4 cm layer; from memory', 'memory'),
  cautions: [...GRAIN_CAUTIONS, 'Over-dry or fast-dried soybeans split and crack.'],
}

export const sorghum: ProductProfile = {
  id: 'sorghum',
  name: 'Sorghum',
  category: 'grain',
  initialMoistureWbPct: sourced(20, 'typical 14–20 % at harvest; from memory', 'memory'),
  targetMoistureWbPct: sourced(12, `about 12 % for long-term storage, ${WIKIPEDIA_EMC}`, 'transcribed'),
  waterActivityTarget: SAFE_AW_MOULD,
  maxProductTempC: null,
  isotherm: {
    desorption: isotherm(
      { model: 'modified-chung-pfost', a: 798.996, b: 0.180647, c: 53.2537 },
      `modified Chung–Pfost fitted by dryhours (Levenberg–Marquardt, RMSE 0.02 pt wb, 16 points) to the sorghum ${WIKI_TABLE}; extrapolated above 40 % RH`,
      'fitted',
      [1.7, 37.8],
      [25, 40],
    ),
  },
  kinetics: kinetics(
    { model: 'lewis', k: { form: 'arrhenius', kRefPerH: 0.25, tRefC: 40, activationEnergyJPerMol: 30000 } },
    4,
    'sphere',
    'Lewis k = 0.25 h⁻¹ at 40 °C, Ea 30 kJ/mol, kernel 4 mm: from memory, not verified',
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

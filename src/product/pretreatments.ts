/**
 * @module product/pretreatments
 * Pretreatments as data: dipping, sulphuring, blanching, peeling, osmotic pre-drying and salting, each with the
 * published effect read in its source (a factor on a named quantity of the untreated product, or none where the
 * part read gives none), and the catalogue's pretreated variants derived from a base profile by those factors.
 *
 * Never counted twice: each variant states what the base's rate was measured on. A rate fitted on untreated
 * product is multiplied by the published factor; a rate fitted on product that already had the treatment IS the
 * treated variant, and the untreated one is derived only by a published factor, or is declared not derivable
 * ({@link PRETREATMENT_VARIANTS} `derivable: false`, with the reason); such a variant is offered only when it
 * has a rate of its own fitted through the engine to a published run of product in that state (`fittedTo`).
 * Moved here from test/fixtures/pretreatments.json (now removed) so that the catalogue (core, no file reads)
 * can use it.
 */

export interface PretreatmentEffect {
  id: string
  treatment: string
  product: string
  catalogueIds: string[]
  effect: {
    /** The quantity the factor multiplies (of the untreated product). */
    quantity: string
    statement: string
    factor: { min: number; max: number } | null
    factorNote: string
  }
  conditions: string
  citation: string
  partRead: string
  level: 'published' | 'transcribed' | 'memory'
}

export const PRETREATMENTS: readonly PretreatmentEffect[] = [
  {
    id: 'dip-ethyl-oleate-sweet-cherry',
    treatment: 'dipping in alkaline emulsion of ethyl oleate',
    product: 'sweet cherry (no catalogue product; the nearest evidence for dipped grapes)',
    catalogueIds: ['grapes-to-raisins-dipped'],
    effect: {
      quantity: 'drying time',
      statement: 'drying times of pre-treated samples 19.5–22.6 % shorter than control',
      factor: {
        min: 0.774,
        max: 0.805,
      },
      factorNote: 'time factor 1 − 0.226 … 1 − 0.195, arithmetic by dryhours on the published percentages',
    },
    conditions: 'hot air 60, 70 and 75 °C at 2.0 m/s',
    citation:
      'Doymaz I., Ismail O. 2011, Drying characteristics of sweet cherry, Food Bioprod. Process. 89:31–38',
    partRead: 'abstract',
    level: 'published',
  },
  {
    id: 'dip-ethyl-oleate-tomato',
    treatment: 'dipping in 2 % ethyl oleate + 4 % potassium carbonate',
    product: 'tomato',
    catalogueIds: ['tomato-halves'],
    effect: {
      quantity: 'effective diffusivity',
      statement: 'Deff 5.65–7.53e-10 m²/s pre-treated against 3.91–6.65e-10 untreated over 55–70 °C',
      factor: {
        min: 1.13,
        max: 1.45,
      },
      factorNote:
        "ratio of the ends of the two ranges (5.65/3.91 at the lower end, 7.53/6.65 at the upper end), pairing the ends with 55 and 70 °C is dryhours' reading",
    },
    conditions: 'hot air 55–70 °C, 1.5 m/s',
    citation: 'Doymaz I. 2007, Air-drying characteristics of tomatoes, J. Food Eng. 78:1291–1297',
    partRead: 'abstract',
    level: 'published',
  },
  {
    id: 'dip-grapes-qualitative',
    treatment: 'dipping grapes in ethyl-oleate or olive-oil emulsions with potassium carbonate',
    product: 'grapes',
    catalogueIds: ['grapes-to-raisins-dipped'],
    effect: {
      quantity: 'drying rate',
      statement:
        'dipped grapes dried faster than untreated (Doymaz & Pala 2002: ethyl-oleate dip shorter drying than untreated or potassium carbonate alone; Mahmutoglu et al. 1996: 5 % K2CO3 + 1.5 % olive oil and 4 % K2CO3 + 2 % ethyl oleate accelerated drying about equally; raising K2CO3 from 4 to 7 % dried faster; SO2 gas faster still)',
      factor: null,
      factorNote: 'no factor in the abstracts read',
    },
    conditions: 'hot air (Doymaz & Pala); sun and solar drying (Mahmutoglu et al.)',
    citation:
      'Doymaz I., Pala M. 2002, J. Food Eng. 52:413–417; Mahmutoglu T., Emir F., Saygi Y.B. 1996, J. Food Eng. 29:289–300',
    partRead: 'abstracts',
    level: 'published',
  },
  {
    id: 'peeling-figs',
    treatment: 'peeling',
    product: 'figs',
    catalogueIds: ['figs'],
    effect: {
      quantity: 'relaxation time (1/k)',
      statement: 'ratio of peeled to unpeeled relaxation times 0.54 ± 0.16',
      factor: {
        min: 0.38,
        max: 0.7,
      },
      factorNote: '0.54 ± 0.16 as published',
    },
    conditions: 'air drying 45, 55 and 65 °C, figs var. Tsapela',
    citation:
      'Xanthopoulos G., Yanniotis S., Lambrinos Gr. 2010, Study of the drying behaviour in peeled and unpeeled whole figs, J. Food Eng. 97:419–424',
    partRead: 'abstract',
    level: 'published',
  },
  {
    id: 'blanching-chilli',
    treatment: 'blanching (water or steam)',
    product: 'chilli',
    catalogueIds: ['chili-peppers-blanched'],
    effect: {
      quantity: 'drying time',
      statement:
        'blanching with the solar tunnel drier led to a considerable reduction in drying time (Hossain & Bala 2007); water- and steam-blanched chilli dried faster than untreated in sun and solar drying (Tunde-Akintunde 2011)',
      factor: null,
      factorNote:
        "no factor in the abstracts read; the blanched chilli rate (chili-peppers-blanched) was fitted to Hossain & Bala's tunnel run, taken as blanched, and the unblanched one (chili-peppers) to Meghwar et al.'s open-sun run",
    },
    conditions: 'solar tunnel (Bangladesh); sun and solar dryer (Nigeria)',
    citation:
      'Hossain M.A., Bala B.K. 2007, Solar Energy 81:85–92; Tunde-Akintunde T.Y. 2011, Renewable Energy 36:2139–2145',
    partRead: 'abstracts',
    level: 'published',
  },
  {
    id: 'osmotic-apple-cubes',
    treatment: 'osmotic pre-drying in sucrose (70 °Brix, 50 °C, 30–180 min)',
    product: 'apple cubes',
    catalogueIds: ['apple-slices'],
    effect: {
      quantity: 'effective diffusivity',
      statement: 'Deff in the following air drying decreased by 38–64 %',
      factor: {
        min: 0.36,
        max: 0.62,
      },
      factorNote: '1 − 0.64 … 1 − 0.38, arithmetic by dryhours on the published percentages',
    },
    conditions: 'air drying of fresh and osmotically pre-dried apple cubes',
    citation:
      'Simal S., Deyà E. (name garbled in the copy read), Frau M., Rosselló C. 1997, Simple modelling of air drying curves of fresh and osmotically pre-dehydrated apple cubes, J. Food Eng. 33:139–150',
    partRead: 'abstract',
    level: 'published',
  },
  {
    id: 'osmotic-apricot-halves',
    treatment: 'osmotic dehydration in sucrose (40 and 60 °C, 50 and 65 %)',
    product: 'apricot halves',
    catalogueIds: ['apricot-halves'],
    effect: {
      quantity: 'activation energy of the following hot-air drying',
      statement:
        '46.379–51.514 kJ/mol untreated, 35.216–46.469 kJ/mol after osmotic pre-treatment; osmotic dehydration reduced the effective diffusivity of water in hot-air drying',
      factor: null,
      factorNote: 'no rate factor in the abstract',
    },
    conditions: 'hot air 40–60 °C, 1.0 and 1.5 m/s',
    citation: 'Pavkov I. et al. 2021, Processes 9(2):202',
    partRead: 'abstract',
    level: 'published',
  },
  {
    id: 'sulphuring-apricots',
    treatment: 'sulphuring (burning sulphur, SO2 gas) or sulphiting (metabisulphite dip)',
    product: 'apricots',
    catalogueIds: ['apricot-halves'],
    effect: {
      quantity: 'drying rate',
      statement:
        'no published rate factor was found; sulphuring is reported to keep colour and soften tissue, sulphiting wets the fruit (trade pages)',
      factor: null,
      factorNote: 'none read',
    },
    conditions:
      'sun drying (Malatya practice: 8–12 h in a sulphur room, 2–3 kg sulphur per tonne; trade page)',
    citation:
      "Golden Apricots trade page 'Apricot harvest and drying' (2015); Iran dried-fruit trade page (n.d.)",
    partRead: 'pages',
    level: 'memory',
  },
  {
    id: 'salting-fish-brine-aw',
    treatment: 'dry salting to saturation',
    product: 'fish',
    catalogueIds: ['fish-fillets-salted'],
    effect: {
      quantity: 'water activity held while salt-saturated',
      statement: 'saturated NaCl solution: 74.9 % RH at 0 °C, at most 75.6 % at 30 °C',
      factor: null,
      factorNote: 'an equilibrium limit, not a rate factor',
    },
    conditions: '0–50 °C',
    citation: 'Wexler A., Hasegawa S. 1954, J. Res. Natl. Bur. Stand. 53(1), RP2512',
    partRead: 'abstract',
    level: 'published',
  },
]

/** A pretreated variant of a catalogue profile, and what its base's rate was measured on. */
export interface PretreatmentVariantSpec {
  variantId: string
  baseId: string
  name: string
  pretreatmentId: string
  /** What the base profile's rate constant was fitted or read on. */
  baseMeasuredOn: 'untreated' | 'treated'
  baseNote: string
  /** False when no published factor allows the derivation (then the variant is not derived). */
  derivable: boolean
  /**
   * Set when a variant that cannot be derived has a rate of its own instead, fitted through the engine to one
   * published run of product in that state (the calibration run, test/experiments/cases.ts): then it is in the
   * catalogue although not derivable.
   */
  fittedTo?: string
  note: string
}

export const PRETREATMENT_VARIANTS: readonly PretreatmentVariantSpec[] = [
  {
    variantId: 'grapes-to-raisins-dipped',
    baseId: 'grapes-to-raisins',
    name: 'Grapes to raisins (dipped in alkaline ethyl-oleate emulsion)',
    pretreatmentId: 'dip-ethyl-oleate-sweet-cherry',
    baseMeasuredOn: 'untreated',
    baseNote:
      'the base rate was fitted to Doymaz 2012, whose abstract names no pretreatment; taken as untreated (assumption: 176 h of drying, about 14 days of sun, is the undipped range)',
    derivable: true,
    note: 'no factor for grapes was read (Doymaz & Pala 2002 and Mahmutoglu et al. 1996 give none in their abstracts): the sweet-cherry factor of the same dip is the nearest published evidence',
  },
  {
    variantId: 'figs-peeled',
    baseId: 'figs',
    name: 'Figs (whole, peeled)',
    pretreatmentId: 'peeling-figs',
    baseMeasuredOn: 'untreated',
    baseNote:
      "the base rate was fitted to Oksar et al. 2017, whole 'Sarılop' figs part-dried on the tree (unpeeled)",
    derivable: true,
    note: 'peeled to unpeeled relaxation time of whole figs in air drying (Xanthopoulos et al. 2010)',
  },
  {
    variantId: 'tomato-halves-dipped',
    baseId: 'tomato-halves',
    name: 'Tomato halves (dipped in ethyl-oleate and potassium carbonate)',
    pretreatmentId: 'dip-ethyl-oleate-tomato',
    baseMeasuredOn: 'untreated',
    baseNote: 'the base diffusivity is the untreated one of Doymaz 2007',
    derivable: true,
    note: 'ratio of the dipped to the untreated diffusivity in the same study (Doymaz 2007)',
  },
  {
    variantId: 'apple-slices-osmotic',
    baseId: 'apple-slices',
    name: 'Apple slices (osmotically pre-dried in sucrose)',
    pretreatmentId: 'osmotic-apple-cubes',
    baseMeasuredOn: 'untreated',
    baseNote: 'the base diffusivity is for fresh (untreated) apple',
    derivable: true,
    note: 'drop of the diffusivity of the following air drying after osmotic pre-drying of apple cubes (Simal et al. 1997)',
  },
  {
    variantId: 'chili-peppers-blanched',
    baseId: 'chili-peppers',
    name: 'Chili peppers (red, whole pods, blanched)',
    pretreatmentId: 'blanching-chilli',
    baseMeasuredOn: 'untreated',
    baseNote:
      "the base rate was fitted to the open-sun run of Meghwar et al. (fresh red 'Longi' pods from the field, no pretreatment named in the abstract: taken as unblanched), as most growers dry chillies",
    derivable: false,
    fittedTo: 'hossain-bala-2007-chilli-solar-tunnel/red-tunnel',
    note: "no published blanching factor was read, so the blanched rate is not derived from the unblanched base: the variant has a rate of its own, fitted through the engine to the red-chilli tunnel run of Hossain & Bala 2007, whose abstract credits blanching of the samples with part of the shorter drying (taken as blanched); their green-chilli and sun runs validate it, and the other unblanched runs (Meghwar et al.'s tunnel, Fadhel et al., the ghost-chilli study) validate the base (docs/validation.md)",
  },
  {
    variantId: 'apricot-halves-sulphured',
    baseId: 'apricot-halves',
    name: 'Apricot halves (sulphured)',
    pretreatmentId: 'sulphuring-apricots',
    baseMeasuredOn: 'untreated',
    baseNote: 'the base rate is untreated apricot',
    derivable: false,
    note: 'no published rate factor for sulphuring was found',
  },
  {
    variantId: 'apricot-halves-osmotic',
    baseId: 'apricot-halves',
    name: 'Apricot halves (osmotically pre-dried)',
    pretreatmentId: 'osmotic-apricot-halves',
    baseMeasuredOn: 'untreated',
    baseNote: 'the base rate is untreated apricot',
    derivable: false,
    note: 'the abstract read gives the activation energies and says the diffusivity fell, but no factor',
  },
]

/**
 * The factor on the drying RATE (rate constant or diffusivity) implied by a published effect, at the middle of
 * its range: a time factor f gives 1/f (first-order and diffusion times scale as 1/k), a diffusivity factor
 * gives itself (k ∝ D), a relaxation-time factor r gives 1/r. Null when the effect is not a rate factor or has
 * no published factor.
 */
export function rateFactor(effect: PretreatmentEffect['effect']): { value: number; text: string } | null {
  const f = effect.factor
  if (f === null) return null
  const mid = (f.min + f.max) / 2
  const range = f.min === f.max ? `${f.min}` : `${f.min}–${f.max}, middle ${mid.toFixed(3)}`
  switch (effect.quantity) {
    case 'drying time':
      return { value: 1 / mid, text: `1 ÷ the drying-time factor (${range})` }
    case 'effective diffusivity':
      return { value: mid, text: `the diffusivity factor (${range})` }
    case 'relaxation time (1/k)':
      return { value: 1 / mid, text: `1 ÷ the relaxation-time factor (${range})` }
    default:
      return null
  }
}

export function pretreatmentById(id: string): PretreatmentEffect {
  const p = PRETREATMENTS.find((x) => x.id === id)
  if (!p) throw new RangeError(`unknown pretreatment '${id}'`)
  return p
}

export function pretreatmentVariantSpec(variantId: string): PretreatmentVariantSpec {
  const v = PRETREATMENT_VARIANTS.find((x) => x.variantId === variantId)
  if (!v) throw new RangeError(`unknown pretreatment variant '${variantId}'`)
  return v
}

/**
 * @module test/experiments/cases
 * Every published experiment run that can be put through the engine (roles as in
 * test/fixtures/experiments/*.json: `calibration` runs may be fitted, `validation` runs never are), with what
 * the engine needs that the paper's part read does not give, each stated:
 * - the weather: a reconstruction (test/fixtures/experiments/weather/reconstructions.ts) and the start hour;
 * - the product profile (and its pretreatment variant), size, initial moisture and end point;
 * - the method with its parameters and night practice, the nearest method the engine has where it lacks the
 *   paper's: the solar tunnel method where the abstract shows a tunnel of its kind (a Hohenheim-type tunnel, a
 *   collector in series with the drying tunnel and PV fans; or, without a collector section, a plastic tunnel
 *   or greenhouse over the trays), the solar cabinet for natural-convection or indirect dryers;
 * - whether the published time is elapsed clock time or active drying time, decided where the part read
 *   does not say by one rule: a time given in hours by a solar-drying study is taken as active drying
 *   (daylight) hours, because such studies join the drying days end to end; a time given in days, sampled
 *   every 24 h or stated to include nights is elapsed.
 *
 * `expect` is what the validation test requires: `within` the target band, or `outside` with the reason
 * (a miss is reported, never tuned away: the test fails when an `outside` case comes inside, so the table
 * and this file are updated together).
 */
import type { DryingMethodInput } from '../../src/drying/method.ts'
import { productById } from '../../src/product/catalogue.ts'
import type { ProductProfile } from '../../src/product/profile.ts'

export interface NumberWithSource {
  value: number
  source: string
}

export interface EngineCase {
  experimentId: string
  runId: string
  role: 'calibration' | 'validation'
  /** Weather reconstruction id (test/fixtures/experiments/weather/<id>.csv). */
  weather: string
  /** Start: day index in the file (day 0 = its first local date) and local hour. */
  start: { day: number; localHour: number; source: string }
  productId: string
  /** Berry, pod or fruit size [mm] when it differs from the profile's default. */
  sizeMm?: NumberWithSource
  initialWbPct: NumberWithSource
  /** The published end point as moisture [% wb]. */
  endWbPct: NumberWithSource
  method: DryingMethodInput
  methodNote: string
  published: {
    timeH: number
    kind: 'elapsed' | 'active'
    kindReason: string
    /** The paper sampled every this many hours: its time is the first sample at which the end point was met. */
    sampledEveryH?: number
  }
  /** True when the paper itself reports the trial's weather (then the tighter 0.8–1.25 band applies). */
  weatherReported: boolean
  expect: 'within' | 'outside'
  /** Why a case is expected outside the band, or a remark on the result. */
  remark?: string
}

const wb = (db: number): number => (100 * db) / (1 + db)

/** Lower and upper ratio bounds of the validation target (issue: 0.75–1.33, 0.8–1.25 with reported weather). */
export function band(c: EngineCase): [number, number] {
  return c.weatherReported ? [0.8, 1.25] : [0.75, 1.33]
}

const ACTIVE_RULE =
  'the part read does not say; taken as active drying (daylight) hours by the rule of test/experiments/cases.ts (hours from a solar-drying study)'
const COVERED_AT_NIGHT =
  'open air with the engine defaults: covered at night and in rain (the part read does not give the night practice; assumption)'
/** A Hohenheim-type solar tunnel: collector section in series with the drying tunnel, PV-driven fans. */
const HOHENHEIM_TUNNEL =
  "the engine's solar tunnel (drying/methods/tunnel.ts): collector section in series with the drying section, fans driven by a PV module (flow follows the sun), shut when they stop; its dimensions, cover, air flow and collector constants are the method's defaults (the abstract gives none)"
/** A plastic tunnel or greenhouse over the trays: no collector section, ventilated. */
const PLASTIC_TUNNEL =
  "the engine's solar tunnel without a collector section (collectorLengthM 0): the product under the plastic cover gets the sun through it and ambient air; the natural ventilation stands as the method's default air flow day and night (fans constant: a tunnel is not closed at night; assumption), cover and air flow the method's defaults"
const PLASTIC_TUNNEL_METHOD: DryingMethodInput = { kind: 'tunnel', collectorLengthM: 0, fans: 'constant' }
const TUNNEL_AS_CABINET =
  'run as the solar cabinet (air heated by a collector, fans only in sun), the nearest method: a tunnel method is used only where the abstract shows a tunnel of its kind; collector defaults unless stated'

/** Unblanched chillies (Meghwar et al., Fadhel et al., the ghost-chilli study: no pretreatment named). */
const UNBLANCHED = 'chili-peppers-unblanched'

/** Hossain & Bala 2007: plastic-covered flat-plate collector in series with the tunnel, two PV-driven fans. */
const HOSSAIN_BALA_TUNNEL: DryingMethodInput = { kind: 'tunnel', loadingKgPerM2: 5 }
const HOSSAIN_BALA_TUNNEL_NOTE = `mixed-mode forced-convection solar tunnel drier, a collector in series with the tunnel and two PV-driven fans (abstract): ${HOHENHEIM_TUNNEL}; loading 5 kg/m², the drier's 80 kg capacity (abstract) on the default 16 m² drying floor`

const DOYMAZ_START = {
  day: 1,
  localHour: 9,
  source: 'assumption: spread at 09:00 on the second day of the file',
}

function allCases(): EngineCase[] {
  return [
    {
      experimentId: 'doymaz-2012-grapes-open-sun',
      runId: 'seedless',
      role: 'calibration',
      weather: 'istanbul-september-2009',
      start: DOYMAZ_START,
      productId: 'grapes-to-raisins',
      sizeMm: { value: 17.2, source: 'Doymaz 2012 abstract: berry size 1.72 cm' },
      initialWbPct: { value: 78.2, source: 'Doymaz 2012 abstract' },
      endWbPct: { value: 22, source: 'Doymaz 2012 abstract: around 22 % wb' },
      method: { kind: 'open-air' },
      methodNote: COVERED_AT_NIGHT,
      published: { timeH: 176, kind: 'active', kindReason: ACTIVE_RULE },
      weatherReported: false,
      expect: 'within',
    },
    {
      experimentId: 'doymaz-2012-grapes-open-sun',
      runId: 'seeded',
      role: 'validation',
      weather: 'istanbul-september-2009',
      start: DOYMAZ_START,
      productId: 'grapes-to-raisins',
      sizeMm: { value: 22, source: 'Doymaz 2012 abstract: berry size 2.20 cm' },
      initialWbPct: { value: 79.5, source: 'Doymaz 2012 abstract' },
      endWbPct: { value: 22, source: 'Doymaz 2012 abstract: around 22 % wb' },
      method: { kind: 'open-air' },
      methodNote: COVERED_AT_NIGHT,
      published: { timeH: 228, kind: 'active', kindReason: ACTIVE_RULE },
      weatherReported: false,
      expect: 'within',
    },
    {
      experimentId: 'hossain-bala-2007-chilli-solar-tunnel',
      runId: 'red-tunnel',
      role: 'calibration',
      weather: 'gazipur-march-2003',
      start: { day: 1, localHour: 8, source: 'assumption: loaded at 08:00 on the second day of the file' },
      productId: 'chili-peppers',
      initialWbPct: { value: wb(2.85), source: 'Hossain & Bala 2007 abstract: 2.85 kg/kg db' },
      endWbPct: { value: wb(0.05), source: 'Hossain & Bala 2007 abstract: 0.05 kg/kg db' },
      // Through the solar tunnel method this run is limited by the method's assumed air flow, not by the chilli
      // (at 0.1 kg/s it ends at 19.6 h for any k above about 1.5 h⁻¹, and the fit lands at 0.86 h⁻¹ on a step
      // 13 % above the published time): it could not fix the chilli rate, so it stays on the cabinet stand-in.
      method: { kind: 'solar-cabinet', collectorAreaM2PerTonne: 250 },
      methodNote: `${TUNNEL_AS_CABINET}; collector 250 m² per tonne: a tunnel drier of about 20 m² of collector for its 80 kg capacity (collector size from memory, capacity from the abstract). The drier is a Hohenheim-type tunnel, but through the engine's tunnel method (default air flow 0.1 kg/s, 80 kg on 16 m²) this run is limited by the air flow: it ends at 19.6 active hours for any k above about 1.5 h⁻¹, so it cannot fix the chilli rate there`,
      published: { timeH: 20, kind: 'active', kindReason: ACTIVE_RULE },
      weatherReported: false,
      expect: 'within',
    },

    ...hossainBalaValidation(),
    ...oksarRuns(),
    ...e3sRuns(),
    ...meghwarRuns(),
    ...fadhelRuns(),
    ...ghostChilliRuns(),
    ...arunRuns(),
    ...joelRuns(),
    ...muazuRuns(),
    owusuRun(),
  ]
}

function arunRuns(): EngineCase[] {
  const base = {
    experimentId: 'arun-2014-grapes-solar-tunnel',
    role: 'validation' as const,
    weather: 'pollachi-april-2014',
    start: { day: 1, localHour: 9, source: 'assumption: spread at 09:00 (day 1 of the file)' },
    productId: 'grapes-to-raisins',
    initialWbPct: { value: 80, source: 'Arun et al. 2014 abstract: 80 %' },
    endWbPct: { value: 10, source: 'Arun et al. 2014 abstract: 10 % (wet basis presumed)' },
    weatherReported: false,
    expect: 'within' as const,
  }
  return [
    {
      ...base,
      runId: 'tunnel',
      method: PLASTIC_TUNNEL_METHOD,
      methodNote: `natural-convection solar tunnel greenhouse (abstract): ${PLASTIC_TUNNEL}`,
      published: { timeH: 55, kind: 'active', kindReason: ACTIVE_RULE },
    },
    {
      ...base,
      runId: 'open-sun',
      method: { kind: 'open-air' },
      methodNote: COVERED_AT_NIGHT,
      published: { timeH: 149, kind: 'active', kindReason: ACTIVE_RULE },
    },
  ]
}

/** Joel et al. 2024: tomato slices at NSPRI Kano, open sun and a parabolic shaped (greenhouse-type) dryer. */
function joelRuns(): EngineCase[] {
  const base = {
    experimentId: 'joel-2024-tomato-kano-parabolic',
    weather: 'kano-february-2023',
    start: { day: 1, localHour: 9, source: 'assumption: spread at 09:00 (day 1 of the file)' },
    productId: 'tomato-halves',
    sizeMm: { value: 15, source: 'Joel et al. 2024 abstract: sliced into 15 mm thickness' },
    initialWbPct: { value: 89.12, source: 'Joel et al. 2024 abstract: initial moisture 89.12 %' },
    // The abstract's open-sun 47.5 °C at 66.6 % RH cannot be outdoor air (dew point near 40 °C): tray readings.
    weatherReported: false,
    expect: 'within' as const,
  }
  const days = {
    timeH: 144,
    kind: 'elapsed' as const,
    kindReason:
      "elapsed: the abstract gives 'after six days of drying'; whole days are taken as a daily check (assumption), so the end point is the first day's end at which it was met",
    sampledEveryH: 24,
  }
  return [
    {
      ...base,
      runId: 'open-sun',
      role: 'calibration',
      endWbPct: { value: 17.8, source: 'Joel et al. 2024 abstract: 17.8 % for open sun drying' },
      method: { kind: 'open-air' },
      methodNote: COVERED_AT_NIGHT,
      published: days,
    },
    {
      ...base,
      runId: 'parabolic-dryer',
      role: 'validation',
      endWbPct: { value: 14.5, source: 'Joel et al. 2024 abstract: 14.5 % in the dryer' },
      method: PLASTIC_TUNNEL_METHOD,
      methodNote: `parabolic shaped solar dryer, a greenhouse-type cover over the trays (abstract; no collector named): ${PLASTIC_TUNNEL}`,
      published: days,
    },
  ]
}

function muazuRuns(): EngineCase[] {
  const base = {
    experimentId: 'muazu-2019-tomato-active-solar',
    role: 'validation' as const,
    weather: 'zaria-february-2019',
    start: { day: 1, localHour: 8, source: 'the abstract: drying from 8 am (day 1 of the file)' },
    productId: 'tomato-halves',
    sizeMm: { value: 10, source: "Mu'azu et al. 2019 abstract: slices of about 1 cm" },
    initialWbPct: { value: 92, source: "Mu'azu et al. 2019 abstract: 92 % wb" },
    endWbPct: { value: 12.65, source: "Mu'azu et al. 2019 abstract: 12–13.3 % wb (the middle)" },
    method: { kind: 'solar-cabinet' } as DryingMethodInput,
    methodNote:
      'active (fan) solar cabinet dryer: the solar cabinet with its defaults (the collector size is not in the abstract); the plywood and glass cabinets run alike',
    weatherReported: false,
    expect: 'within' as const,
  }
  const active = 'active: the abstract gives hours of drying between 8 am and 6 pm over two days'
  return [
    { ...base, runId: 'plywood-cabinet', published: { timeH: 18, kind: 'active', kindReason: active } },
    { ...base, runId: 'glass-cabinet', published: { timeH: 15.5, kind: 'active', kindReason: active } },
  ]
}

function owusuRun(): EngineCase {
  return {
    experimentId: 'owusu-sekyere-2021-maize-aflastop',
    runId: 'aflastop',
    role: 'validation',
    weather: 'kumasi-august-2020',
    start: { day: 1, localHour: 9, source: 'assumption: loaded at 09:00 (day 1 of the file)' },
    productId: 'shelled-corn',
    initialWbPct: { value: 17.5, source: 'Owusu-Sekyere et al. 2021 abstract: 17.5 % wb' },
    endWbPct: { value: 11.5, source: 'Owusu-Sekyere et al. 2021 abstract: 11.5 % wb' },
    method: { kind: 'heated', setPointC: 50 },
    methodNote:
      'heated forced air at the published 50 °C set point; the air flow per tonne is the engine default (the abstract gives 2.5 m/s but not the bed area and depth)',
    published: { timeH: 3, kind: 'active', kindReason: 'active: a heated batch (abstract: 3 h)' },
    weatherReported: false,
    expect: 'within',
  }
}

function hossainBalaValidation(): EngineCase[] {
  const base = {
    experimentId: 'hossain-bala-2007-chilli-solar-tunnel',
    role: 'validation' as const,
    weather: 'gazipur-march-2003',
    start: { day: 1, localHour: 8, source: 'assumption: loaded at 08:00 on the second day of the file' },
    productId: 'chili-peppers',
    weatherReported: false,
    expect: 'within' as const,
  }
  const red = { value: wb(2.85), source: 'Hossain & Bala 2007 abstract: 2.85 kg/kg db' }
  const green = { value: wb(7.6), source: 'Hossain & Bala 2007 abstract: 7.6 kg/kg db' }
  const sun = {
    method: { kind: 'open-air' } as DryingMethodInput,
    methodNote: `${COVERED_AT_NIGHT}; 'improved' and 'conventional' sun drying are not defined in the abstract and run alike`,
  }
  const end = (db: number, what: string) => ({
    value: wb(db),
    source: `Hossain & Bala 2007 abstract: ${db} kg/kg db ${what}`,
  })
  return [
    {
      ...base,
      runId: 'green-tunnel',
      initialWbPct: green,
      endWbPct: end(0.06, 'in 22 h'),
      method: HOSSAIN_BALA_TUNNEL,
      methodNote: `${HOSSAIN_BALA_TUNNEL_NOTE} (the red run of the same drier, which fixes the chilli rate, stays on the solar cabinet: see it)`,
      published: { timeH: 22, kind: 'active', kindReason: ACTIVE_RULE },
    },
    {
      ...base,
      ...sun,
      runId: 'red-improved-sun',
      initialWbPct: red,
      endWbPct: end(0.09, 'reached after 32 h'),
      published: { timeH: 32, kind: 'active', kindReason: ACTIVE_RULE },
    },
    {
      ...base,
      ...sun,
      runId: 'red-conventional-sun',
      initialWbPct: red,
      endWbPct: end(0.4, 'reached after 32 h'),
      published: { timeH: 32, kind: 'active', kindReason: ACTIVE_RULE },
    },
    {
      ...base,
      ...sun,
      runId: 'green-improved-sun',
      initialWbPct: green,
      endWbPct: end(0.1, 'reached after 35 h'),
      published: { timeH: 35, kind: 'active', kindReason: ACTIVE_RULE },
    },
    {
      ...base,
      ...sun,
      runId: 'green-conventional-sun',
      initialWbPct: green,
      endWbPct: end(0.7, 'reached after 35 h'),
      published: { timeH: 35, kind: 'active', kindReason: ACTIVE_RULE },
    },
  ]
}

const FIG_INITIAL = {
  value: 40,
  source:
    'the figs were part-dried on the tree (abstract); semi-dried figs at this stage hold 30–50 % moisture (Aksoy 1997, as given in Siddiq M. (ed.) 2012, Tropical and Subtropical Fruits: Postharvest Physiology, Processing and Packaging, Wiley, ch. on dried figs): the middle, 40 % wb, taken',
}
const FIG_END = { value: 22, source: 'Oksar et al. 2017 abstract: drying ended at ≤ 22 % moisture' }
const OKSAR_START = { day: 1, localHour: 9, source: 'assumption: trays set out at 09:00 (day 1 of the file)' }
const OKSAR_ELAPSED =
  'elapsed: samples every 24 h from placing on the trays (abstract); the end point is the sample at which it was met'
function oksarRuns(): EngineCase[] {
  const base = {
    experimentId: 'oksar-2017-figs-tunnel',
    start: OKSAR_START,
    productId: 'figs',
    initialWbPct: FIG_INITIAL,
    endWbPct: FIG_END,
    weatherReported: false,
    expect: 'within' as const,
  }
  const open = { method: { kind: 'open-air' } as DryingMethodInput, methodNote: COVERED_AT_NIGHT }
  const tunnel = {
    method: PLASTIC_TUNNEL_METHOD,
    methodNote: `trays under a plastic tunnel (abstract): ${PLASTIC_TUNNEL}`,
  }
  return [
    {
      ...base,
      ...open,
      runId: 'august-open-air',
      role: 'calibration',
      weather: 'aydin-august-2015',
      published: { timeH: 96, kind: 'elapsed', kindReason: OKSAR_ELAPSED, sampledEveryH: 24 },
    },
    {
      ...base,
      ...tunnel,
      runId: 'august-tunnel',
      role: 'validation',
      weather: 'aydin-august-2015',
      published: { timeH: 72, kind: 'elapsed', kindReason: OKSAR_ELAPSED, sampledEveryH: 24 },
    },
    {
      ...base,
      ...open,
      runId: 'september-open-air',
      role: 'validation',
      weather: 'aydin-september-2015',
      published: { timeH: 120, kind: 'elapsed', kindReason: OKSAR_ELAPSED, sampledEveryH: 24 },
    },
    {
      ...base,
      ...tunnel,
      runId: 'september-tunnel',
      role: 'validation',
      weather: 'aydin-september-2015',
      published: { timeH: 96, kind: 'elapsed', kindReason: OKSAR_ELAPSED, sampledEveryH: 24 },
    },
  ]
}

function e3sRuns(): EngineCase[] {
  const base = {
    experimentId: 'e3s-2025-apricots-uzbekistan',
    role: 'validation' as const,
    weather: 'tashkent-july-2024',
    start: { day: 1, localHour: 9, source: 'assumption: spread at 09:00 (day 1 of the file)' },
    productId: 'apricot-halves',
    initialWbPct: {
      value: 86,
      source:
        'not in the abstract: the catalogue value, inside the 85–90 % wb of Uzbek apricots (Rejabov et al. 2024)',
    },
    endWbPct: {
      value: 20,
      source:
        "'equilibrium moisture content' (abstract) without a figure: 20 % wb taken, inside the Codex 20–25 % for dried apricots (assumption)",
    },
    weatherReported: false,
    expect: 'within' as const,
  }
  const elapsed = 'elapsed: the abstract gives whole days'
  const cabinet = {
    method: { kind: 'solar-cabinet' } as DryingMethodInput,
    methodNote:
      'natural-convection solar dryer run as the solar cabinet (forced air, fans in sun), the nearest method the engine has: direct and indirect dryers run alike',
  }
  return [
    {
      ...base,
      runId: 'open-air',
      role: 'calibration',
      method: { kind: 'open-air' },
      methodNote: COVERED_AT_NIGHT,
      published: { timeH: 240, kind: 'elapsed', kindReason: elapsed },
    },
    { ...base, ...cabinet, runId: 'direct', published: { timeH: 192, kind: 'elapsed', kindReason: elapsed } },
    {
      ...base,
      ...cabinet,
      runId: 'indirect',
      published: { timeH: 144, kind: 'elapsed', kindReason: elapsed },
    },
  ]
}

function meghwarRuns(): EngineCase[] {
  const base = {
    experimentId: 'meghwar-chilli-umerkot',
    weather: 'umerkot-november-2022',
    start: { day: 1, localHour: 9, source: 'assumption: spread at 09:00 (day 1 of the file)' },
    productId: UNBLANCHED,
    initialWbPct: { value: 80, source: 'Meghwar et al. abstract: initial moisture taken as 80 % wb' },
    endWbPct: { value: 11, source: 'Meghwar et al. abstract: about 10–12 % wb (the middle)' },
    weatherReported: false,
    expect: 'within' as const,
  }
  return [
    {
      ...base,
      runId: 'tunnel',
      role: 'validation',
      method: { kind: 'solar-cabinet' },
      methodNote: `small natural-convection solar tunnel dryer (abstract; whether a collector section or a greenhouse over the racks, and how it is ventilated, is not said): ${TUNNEL_AS_CABINET}`,
      published: { timeH: 63, kind: 'active', kindReason: ACTIVE_RULE },
    },
    {
      // The calibration run of chili-peppers-unblanched: of the unblanched runs it is the one the engine models
      // most directly (open air needs no collector, air flow or cover the abstract does not give), on the
      // paper's own place and month, with both moistures in the abstract, of the red C. annuum chilli the
      // catalogue profile describes (Fadhel et al.'s Baklouti is a large mild pepper; the ghost chilli another
      // species, at a place and season the part read does not give).
      ...base,
      runId: 'open-sun',
      role: 'calibration',
      method: { kind: 'open-air' },
      methodNote: COVERED_AT_NIGHT,
      published: { timeH: 81, kind: 'active', kindReason: ACTIVE_RULE },
    },
  ]
}

function fadhelRuns(): EngineCase[] {
  const base = {
    experimentId: 'fadhel-2014-red-pepper-tunisia',
    role: 'validation' as const,
    weather: 'hammam-lif-september-2012',
    start: { day: 1, localHour: 9, source: 'assumption: spread at 09:00 (day 1 of the file)' },
    productId: UNBLANCHED,
    initialWbPct: {
      value: 80,
      source: 'not in the abstract: the catalogue value for red chilli (80 % wb, Meghwar et al.)',
    },
    endWbPct: {
      value: 11,
      source: 'not in the abstract: the catalogue target (10–12 % wb of Meghwar et al.)',
    },
    weatherReported: false,
    expect: 'within' as const,
  }
  const elapsed = 'elapsed: the abstract states the times include nights'
  return [
    {
      ...base,
      runId: 'solar-drier',
      method: { kind: 'solar-cabinet' },
      methodNote:
        'natural-convection solar drier run as the solar cabinet (forced air, fans in sun), the nearest method',
      published: { timeH: 73, kind: 'elapsed', kindReason: elapsed },
    },
    {
      ...base,
      runId: 'greenhouse',
      method: PLASTIC_TUNNEL_METHOD,
      methodNote: `agricultural tunnel greenhouse (abstract): ${PLASTIC_TUNNEL}`,
      published: { timeH: 79, kind: 'elapsed', kindReason: elapsed },
    },
    {
      ...base,
      runId: 'open-sun',
      method: { kind: 'open-air' },
      methodNote: COVERED_AT_NIGHT,
      published: { timeH: 118, kind: 'elapsed', kindReason: elapsed },
    },
  ]
}

function ghostChilliRuns(): EngineCase[] {
  const base = {
    experimentId: 'renewable-energy-2017-ghost-chilli',
    role: 'validation' as const,
    weather: 'guwahati-october-2015',
    start: { day: 1, localHour: 9, source: 'assumption: spread at 09:00 (day 1 of the file)' },
    productId: UNBLANCHED,
    initialWbPct: { value: wb(5.896), source: 'abstract: 589.6 % db' },
    endWbPct: { value: wb(0.12), source: 'abstract: 12 % db' },
    weatherReported: false,
    expect: 'within' as const,
  }
  return [
    {
      ...base,
      runId: 'tunnel',
      method: { kind: 'solar-cabinet' },
      methodNote: `indirect forced-convection solar tunnel: two double-pass air heaters, a blower and the chillies on trays out of the sun (abstract), closer to the solar cabinet than to a tunnel whose product lies in the sun: ${TUNNEL_AS_CABINET}`,
      published: { timeH: 123, kind: 'active', kindReason: ACTIVE_RULE },
    },
    {
      ...base,
      runId: 'open-sun',
      method: { kind: 'open-air' },
      methodNote: COVERED_AT_NIGHT,
      published: { timeH: 193, kind: 'active', kindReason: ACTIVE_RULE },
    },
  ]
}

/** The catalogue profile of a case (a pretreatment variant when the case names one). */
export function caseProfile(c: EngineCase): ProductProfile {
  return productById(c.productId)
}

export function caseId(c: EngineCase): string {
  return `${c.experimentId}/${c.runId}`
}

const UNBLANCHED_FIT =
  "the unblanched rate (chili-peppers-unblanched) is fitted to Meghwar et al.'s open-sun run of red 'Longi' chillies at Umerkot, on a November reconstruction from memory, with its 81 h read as active (daylight) hours by this file's rule (the abstract does not say); read as elapsed hours the fit would be 0.176 h⁻¹ instead of 0.0919 (measured once, not used)"
const PLASTIC_TUNNEL_MISS =
  "the greenhouse runs as the engine's tunnel without a collector section: the product gets the sun through the cover, but the air reaches it at ambient temperature (the method puts the drying floor's sun into the product, not the air) at the method's default 0.1 kg/s, an assumption standing for natural ventilation, and the forced-air limit of that flow caps the drying"
const IMPROVED_CONVENTIONAL =
  "'improved' and 'conventional' sun drying are not defined in the abstract and run alike in the engine; in the same 32–35 h the conventional runs ended far wetter (0.40 and 0.70 against 0.09 and 0.10 kg/kg db), which one open-air model cannot give both"
const MUAZU_MISS =
  "the tomato diffusivity is fitted to Joel et al.'s open-sun run at Kano (15 mm slices, a February reconstruction from memory) and scaled by thickness² to these 10 mm slices; the cabinet's collector size and air flow are not in the abstract (engine defaults, 100 m² per tonne); with Doymaz's hot-air diffusivity before the fit the runs came out at 2.72 (plywood) and 3.16 (glass); not investigated further"
/** Runs expected outside their band, with the reason (as measured on the engine of this commit). */
const OUTSIDE: Record<string, string> = {
  'arun-2014-grapes-solar-tunnel/tunnel': `${PLASTIC_TUNNEL_MISS}; for fresh grapes (80 → 10 % wb) that capacity sets the time; its fans run day and night, so every hour counts as active against the paper's daylight hours. Measured once, not adopted: with the default collector section the run comes out at 1.18, as the solar cabinet at 1.83; the open-sun run of the same trial, on the same weather, is within its band`,
  'muazu-2019-tomato-active-solar/plywood-cabinet': MUAZU_MISS,
  'muazu-2019-tomato-active-solar/glass-cabinet': `${MUAZU_MISS}; the glass and plywood cabinets run alike`,
  'owusu-sekyere-2021-maize-aflastop/aflastop':
    'the air flow per tonne is the engine default (0.5 kg/s per tonne): the published 2.5 m/s through the bed cannot be turned into a flow per tonne without the bed area and depth, which the abstract does not give',
  'hossain-bala-2007-chilli-solar-tunnel/red-conventional-sun': IMPROVED_CONVENTIONAL,
  'hossain-bala-2007-chilli-solar-tunnel/green-conventional-sun': IMPROVED_CONVENTIONAL,
  'fadhel-2014-red-pepper-tunisia/solar-drier': `${UNBLANCHED_FIT}; Baklouti is a large mild pepper, not a hot chilli, and the abstract gives neither its moistures (the catalogue's 80 → 11 % wb taken) nor whether it was cut; the natural-convection drier runs as the forced-air cabinet with fans only in sun, so it dries by day only while the published time includes nights`,
  'fadhel-2014-red-pepper-tunisia/greenhouse': `${PLASTIC_TUNNEL_MISS}; for fresh peppers (80 → 11 % wb) that capacity sets the time. Measured once, not adopted: as the solar cabinet ventilated day and night the run came out at 1.04, as a tunnel with the default collector section at 1.25. Also: ${UNBLANCHED_FIT}`,
  'fadhel-2014-red-pepper-tunisia/open-sun': `${UNBLANCHED_FIT}; Baklouti is a large mild pepper, not a hot chilli, and the abstract gives neither its moistures (the catalogue's 80 → 11 % wb taken) nor whether it was cut; the engine covers open-sun product at night (left out, it dries slower still in this reconstruction: it takes up water at night), while the published time includes nights`,
  'renewable-energy-2017-ghost-chilli/tunnel': `${UNBLANCHED_FIT}; ghost chilli (Capsicum chinense) is another species with a thicker, waxier pod and wetter at the start (589.6 % db), and its site and season are not in the part read (the weakest reconstruction of the set); the forced-convection tunnel runs as the solar cabinet`,
  'renewable-energy-2017-ghost-chilli/open-sun': `${UNBLANCHED_FIT}; ghost chilli (Capsicum chinense) is another species with a thicker, waxier pod and wetter at the start (589.6 % db), and its site and season are not in the part read (the weakest reconstruction of the set)`,
}

function withExpectations(cases: EngineCase[]): EngineCase[] {
  return cases.map((c) => {
    const remark = OUTSIDE[caseId(c)]
    return remark === undefined ? c : { ...c, expect: 'outside', remark }
  })
}

/** Every run put through the engine, calibration and validation. */
export const ENGINE_CASES: EngineCase[] = withExpectations(allCases())

/** Published calibration or validation runs that are not put through the engine, and why. */
export const NOT_RUN: { id: string; role: 'calibration' | 'validation'; reason: string }[] = [
  {
    id: 'adeyemi-2020-cocoa-mixed-mode/mixed-mode',
    role: 'validation',
    reason:
      'not run: the abstract gives neither the initial moisture nor the intermittent schedule (hours of drying a day) of the mixed-mode dryer, nor the season of each run (the time is an average over the wet and dry seasons); the cocoa kinetics are from memory with no calibration run',
  },
]

/**
 * The golden assessments: every demo site (climate-demo/) with the products its catalogue entry is
 * about, by every drying method, with the options the README and the demo use. Their JSON is committed
 * under test/fixtures/golden/ and `golden.test.ts` requires the engine to give it again byte for byte,
 * so a change that is meant to leave results alone (a refactor, a speed-up) proves it does.
 *
 * A change that is MEANT to alter results (new product constants, a corrected formula) regenerates the
 * files with `npm run golden:update` and says in its commit message why the numbers moved.
 * The weather is invented (demo sites); these are regression fixtures, not a check against the world.
 */
import type { AssessOptions } from '../../src/analysis/assess.ts'
import type { DryingMethodInput } from '../../src/drying/method.ts'
import { productById } from '../../src/product/catalogue.ts'
import { DEMO, type DemoKey } from '../drying/demo-weather.ts'

export interface GoldenCase {
  /** File name stem under test/fixtures/golden/. */
  id: string
  site: DemoKey
  options: AssessOptions
  /** Also keep the rendered CSV tables and the HTML summary (rendered with the series, as the API does). */
  rendered?: boolean
}

type Opts = Omit<AssessOptions, 'product' | 'method'>

/** The four methods as the README and the demo run them, with fuel and price for the heated one. */
function methods(heated: DryingMethodInput): { name: string; method: DryingMethodInput }[] {
  return [
    { name: 'open-air', method: { kind: 'open-air' } },
    { name: 'shade', method: { kind: 'shade' } },
    { name: 'solar-cabinet', method: { kind: 'solar-cabinet' } },
    { name: 'heated', method: heated },
  ]
}

function site(
  key: DemoKey,
  stem: string,
  products: { id: string; options: Opts; heated: DryingMethodInput }[],
  renderedMethods: string[] = [],
): GoldenCase[] {
  const out: GoldenCase[] = []
  for (const p of products) {
    for (const m of methods(p.heated)) {
      out.push({
        id: `${stem}--${p.id}--${m.name}`,
        site: key,
        options: { product: productById(p.id), method: m.method, ...p.options },
        rendered: renderedMethods.includes(`${p.id}/${m.name}`),
      })
    }
  }
  return out
}

export const GOLDEN_CASES: GoldenCase[] = [
  // Dry upland, 2021–2024 UTC CSV: the README's raisins (08-01..09-30) and apricots (07-01..08-15).
  ...site(
    'dryUpland',
    'ardentine',
    [
      {
        id: 'grapes-to-raisins',
        options: { seasonStart: '08-01', seasonEnd: '09-30', startStepDays: 3 },
        heated: { kind: 'heated', setPointC: 60, fuel: 'propane' },
      },
      {
        id: 'apricot-halves',
        options: {
          seasonStart: '07-01',
          seasonEnd: '08-15',
          startStepDays: 3,
          fuelPrices: { electricity: 0.2 },
        },
        heated: { kind: 'heated', targetRhPct: 30, fuel: 'electricity', heaterEfficiency: 1 },
      },
    ],
    ['grapes-to-raisins/open-air', 'apricot-halves/solar-cabinet'],
  ),
  // The same site's typical-year EPW: one year, no spread across years.
  ...site('typicalUpland', 'ardentine-typical-year', [
    {
      id: 'apricot-halves',
      options: { seasonStart: '07-01', seasonEnd: '08-31', startStepDays: 7 },
      heated: { kind: 'heated', setPointC: 55, fuel: 'natural-gas' },
    },
  ]),
  // Humid lake valley, local clock with DST, °F: grain, natural air against heated air with propane.
  ...site(
    'humidValley',
    'quillow',
    [
      {
        id: 'shelled-corn',
        options: {
          seasonStart: '09-15',
          seasonEnd: '11-15',
          startStepDays: 7,
          thresholds: { minProductTempC: 0 },
          fuelPrices: { propane: 0.9 },
        },
        heated: { kind: 'heated', targetRhPct: 45, fuel: 'propane', heaterEfficiency: 0.92 },
      },
    ],
    ['shelled-corn/heated'],
  ),
  // Cool maritime coast, multi-year EPW: fish.
  ...site('coolCoast', 'gullhaven', [
    {
      id: 'fish-fillets',
      options: { seasonStart: '05-01', seasonEnd: '09-30', startStepDays: 7, deadlineDays: 7, maxDays: 30 },
      heated: { kind: 'heated', setPointC: 45, fuel: 'heating-oil' },
    },
  ]),
  // Tropical wet/dry lowland: coffee in the dry season (across the new year), cocoa as in the README.
  ...site(
    'tropical',
    'tamarel',
    [
      {
        id: 'coffee-parchment',
        options: { seasonStart: '11-15', seasonEnd: '02-15', startStepDays: 7 },
        heated: { kind: 'heated', setPointC: 45, fuel: 'wood-pellets' },
      },
      {
        id: 'cocoa-beans',
        options: {
          seasonStart: '08-01',
          seasonEnd: '08-31',
          startStepDays: 5,
          fuelPrices: { 'wood-pellets': 0.3 },
        },
        heated: { kind: 'heated', setPointC: 55, fuel: 'wood-pellets' },
      },
    ],
    ['cocoa-beans/heated'],
  ),
  // Method options off their defaults: uncovered raisins (night dew, rain), a steep west-facing collector.
  {
    id: 'ardentine--grapes-to-raisins--open-air-uncovered',
    site: 'dryUpland',
    options: {
      product: productById('grapes-to-raisins'),
      method: { kind: 'open-air', coveredAtNight: false, coveredInRain: false, absorptivity: 0.8 },
      seasonStart: '08-01',
      seasonEnd: '09-30',
      startStepDays: 5,
      thresholds: { nightSurfaceCoolingK: 3 },
      backupHeater: { setPointC: 50, fuel: 'natural-gas' },
    },
  },
  {
    id: 'tamarel--coffee-parchment--solar-cabinet-west',
    site: 'tropical',
    options: {
      product: productById('coffee-parchment'),
      method: {
        kind: 'solar-cabinet',
        tiltDeg: 40,
        azimuthDeg: 270,
        collectorAreaM2PerTonne: 150,
        fansOnlyInSun: false,
      },
      seasonStart: '05-01',
      seasonEnd: '06-30',
      startStepDays: 10,
    },
  },
  // The solar tunnel: the README's apricots with the defaults (PV fans, closed at night), and (unblanched) chillies in the
  // tropical lowland with constant fans, an open tunnel when they stop and a glass cover.
  {
    id: 'ardentine--apricot-halves--tunnel',
    site: 'dryUpland',
    rendered: true,
    options: {
      product: productById('apricot-halves'),
      method: { kind: 'tunnel' },
      seasonStart: '07-01',
      seasonEnd: '08-15',
      startStepDays: 3,
    },
  },
  {
    id: 'tamarel--chili-peppers--tunnel-constant-open-glass',
    site: 'tropical',
    options: {
      product: productById('chili-peppers'),
      method: { kind: 'tunnel', fans: 'constant', nightPractice: 'open', cover: 'glass', loadingKgPerM2: 5 },
      seasonStart: '01-01',
      seasonEnd: '03-31',
      startStepDays: 7,
    },
  },
  // The greenhouse dryer: the README's apricots in the tropical lowland with the defaults (shut at night), and
  // grapes in the dry upland in a glass house with stated air changes, trays on part of the floor, open nights.
  {
    id: 'tamarel--apricot-halves--greenhouse',
    site: 'tropical',
    options: {
      product: productById('apricot-halves'),
      method: { kind: 'greenhouse' },
      seasonStart: '06-01',
      seasonEnd: '09-30',
      startStepDays: 10,
    },
  },
  {
    id: 'ardentine--grapes-to-raisins--greenhouse-glass-air-changes',
    site: 'dryUpland',
    options: {
      product: productById('grapes-to-raisins'),
      method: {
        kind: 'greenhouse',
        cover: 'glass',
        airChangesPerHour: 30,
        trayAreaM2: 10,
        nightPractice: 'closed',
      },
      seasonStart: '08-15',
      seasonEnd: '09-30',
      startStepDays: 7,
    },
  },
  // Natural-air bin drying of corn harvested into a bin in the humid valley: three airflows compared (the
  // report's bin section, its CSV tables); and wheat in the dry upland with a heater, a humidistat and a
  // given floor area (method options off their defaults).
  {
    id: 'quillow--shelled-corn--natural-air-bin',
    site: 'humidValley',
    rendered: true,
    options: {
      product: productById('shelled-corn'),
      method: { kind: 'natural-air-bin', airflowsM3PerMinPerTonne: [1, 2, 3] },
      initialWbPct: 20,
      targetWbPct: 15.5,
      seasonStart: '09-15',
      seasonEnd: '10-15',
      thresholds: { minProductTempC: 0 },
    },
  },
  {
    id: 'ardentine--wheat--natural-air-bin-heater-humidistat',
    site: 'dryUpland',
    options: {
      product: productById('wheat'),
      method: {
        kind: 'natural-air-bin',
        airflowsM3PerMinPerTonne: [0.75, 1.5],
        depthM: 3,
        floorAreaM2: 40,
        heatRiseK: 3,
        heaterOnAboveRhPct: 70,
        fanControl: 'rh-below',
        fanMaxRhPct: 80,
      },
      initialWbPct: 18,
      targetWbPct: 13,
      seasonStart: '07-01',
      seasonEnd: '07-29',
      maxDays: 40,
    },
  },
  // The faulty logger year: gaps, stuck sensor, doubled rows (the assessment's coverage and warnings).
  {
    id: 'tamarel-faulty-logger--coffee-parchment--open-air',
    site: 'faultyLogger',
    options: {
      product: productById('coffee-parchment'),
      method: { kind: 'open-air' },
      seasonStart: '01-01',
      seasonEnd: '03-31',
      startStepDays: 7,
    },
  },
]

/** The README's comparison: apricots in the open air at the dry upland and the tropical lowland. */
export const GOLDEN_COMPARISON: { id: string; sites: DemoKey[]; options: AssessOptions } = {
  id: 'compare--ardentine-tamarel--apricot-halves--open-air',
  sites: ['dryUpland', 'tropical'],
  options: {
    product: productById('apricot-halves'),
    method: { kind: 'open-air' },
    seasonStart: '07-01',
    seasonEnd: '08-15',
    startStepDays: 7,
  },
}

export const GOLDEN_DIR = 'test/fixtures/golden'

/** The demo files the cases read (for the update script's message). */
export const GOLDEN_FILES = [...new Set(GOLDEN_CASES.map((c) => DEMO[c.site].file))]

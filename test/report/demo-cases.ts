/**
 * The demo sites of climate-demo/ (invented climates) read and assessed once per test file, each with a
 * product and method that suits what the site is meant to show (climate-demo/README.md).
 */
import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { assess } from '../../src/analysis/assess.ts'
import type { Assessment } from '../../src/analysis/assessment.ts'
import { productById } from '../../src/product/catalogue.ts'
import type { ProductProfile } from '../../src/product/profile.ts'
import { readWeather } from '../../src/weather/read-weather.ts'
import type { HourlySeries } from '../../src/weather/series.ts'
import { type DemoCatalogue, demoFilesFromCatalogue } from '../../src/web/demo-files.ts'

export const DEMO_DIR = join(import.meta.dirname, '../../climate-demo')

export interface DemoCase {
  file: string
  product: ProductProfile
  method: string
  series: HourlySeries
  assessment: Assessment
}

const PLAN: { file: string; product: string; method: string; season: [string, string] }[] = [
  {
    file: 'ardentine-upland-2021-2024-utc.csv',
    product: 'grapes-to-raisins',
    method: 'open-air',
    season: ['06-15', '09-15'],
  },
  {
    file: 'ardentine-upland-typical-year.epw',
    product: 'apricot-halves',
    method: 'open-air',
    season: ['06-15', '09-15'],
  },
  {
    file: 'quillow-valley-2021-2023-local-dst-imperial.csv',
    product: 'shelled-corn',
    method: 'heated',
    season: ['09-15', '11-15'],
  },
  {
    file: 'gullhaven-coast-2022-2024.epw',
    product: 'fish-fillets-salted',
    method: 'shade',
    season: ['05-01', '08-31'],
  },
  {
    file: 'tamarel-lowland-2021-2023-utc.csv',
    product: 'coffee-parchment',
    method: 'solar-cabinet',
    season: ['11-01', '03-31'],
  },
]

export function demoCatalogue(): DemoCatalogue {
  return JSON.parse(readFileSync(join(DEMO_DIR, 'sites.json'), 'utf8')) as DemoCatalogue
}

export function loadDemoCases(files?: string[]): DemoCase[] {
  const demo = demoFilesFromCatalogue(demoCatalogue())
  return PLAN.filter((p) => !files || files.includes(p.file)).map((p) => {
    const entry = demo.find((d) => d.file === p.file)
    if (!entry) throw new Error(`${p.file} is not in climate-demo/sites.json`)
    const series = readWeather(readFileSync(join(DEMO_DIR, p.file), 'utf8'), entry.readOptions).series
    const product = productById(p.product)
    const assessment = assess(series, {
      product,
      method: { kind: p.method } as never,
      seasonStart: p.season[0],
      seasonEnd: p.season[1],
      startStepDays: 5,
    })
    return { file: p.file, product, method: p.method, series, assessment }
  })
}

/**
 * Write the invented demo batch logs: `npx tsx climate-demo/energy/generate-batch-log.ts`.
 * Output (same seeds, same bytes):
 * - climate-demo/energy/quillow-dryer-batches-2026.csv (batch-log-model.ts);
 * - climate-demo/energy/tessaby-wheat-2026.csv (drifting-season-model.ts, seed 1: a season that moves
 *   past the baseline's weather, +7 % fuel per kg of water from batch 29).
 */
import { writeFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { buildDemoBatchLog } from './batch-log-model.ts'
import { buildDriftingSeasonLog, TESSABY_DEMO_SEED } from './drifting-season-model.ts'

for (const [name, csv] of [
  ['quillow-dryer-batches-2026.csv', buildDemoBatchLog().csv],
  ['tessaby-wheat-2026.csv', buildDriftingSeasonLog({ seed: TESSABY_DEMO_SEED }).csv],
] as const) {
  const out = fileURLToPath(new URL(`./${name}`, import.meta.url))
  writeFileSync(out, csv)
  console.log(`wrote ${out}`)
}

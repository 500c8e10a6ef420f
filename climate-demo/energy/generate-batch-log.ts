/**
 * Write the invented demo batch log: `npx tsx climate-demo/energy/generate-batch-log.ts`.
 * Output: climate-demo/energy/quillow-dryer-batches-2026.csv (same seed, same bytes).
 */
import { writeFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { buildDemoBatchLog } from './batch-log-model.ts'

const out = fileURLToPath(new URL('./quillow-dryer-batches-2026.csv', import.meta.url))
writeFileSync(out, buildDemoBatchLog().csv)
console.log(`wrote ${out}`)

/**
 * Demo-climate generator (script; may touch the file system). Writes the invented demo files into this
 * folder, or one long benchmark file on demand.
 *
 *   npm run demo:generate                         # all demo files, seed DEMO_SEED
 *   tsx climate-demo/generate.ts --seed 7         # same files from another seed
 *   tsx climate-demo/generate.ts --long out.csv   # 30-year hourly UTC CSV (1991–2020) for benchmarks only
 */
import { writeFileSync } from 'node:fs'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { buildDemoFiles, DEMO_SEED, longUtcCsv } from './demo-files.ts'

function parseArgs(argv: string[]): { seed: number; long: string | null } {
  let seed = DEMO_SEED
  let long: string | null = null
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]
    if (arg === '--seed') {
      const value = Number(argv[++i])
      if (!Number.isInteger(value) || value < 0 || value > 0xffffffff) {
        throw new RangeError(`--seed must be an integer from 0 to 4294967295, got ${argv[i]}`)
      }
      seed = value
    } else if (arg === '--long') {
      long = argv[++i] ?? null
      if (!long) throw new RangeError('--long needs an output file path, e.g. --long /tmp/upland-30y.csv')
    } else {
      throw new RangeError(`unknown argument ${arg}; accepted: --seed <n>, --long <out.csv>`)
    }
  }
  return { seed, long }
}

function main(): void {
  const { seed, long } = parseArgs(process.argv.slice(2))
  if (long) {
    const text = longUtcCsv(seed)
    writeFileSync(long, text)
    console.log(`wrote ${long} (${(text.length / 1e6).toFixed(1)} MB, seed ${seed})`)
    return
  }
  const folder = dirname(fileURLToPath(import.meta.url))
  for (const file of buildDemoFiles(seed)) {
    writeFileSync(join(folder, file.path), file.text)
    console.log(`wrote climate-demo/${file.path} (${(Buffer.byteLength(file.text) / 1e6).toFixed(2)} MB)`)
  }
}

try {
  main()
} catch (error) {
  console.error(error instanceof Error ? error.message : String(error))
  process.exitCode = 2
}

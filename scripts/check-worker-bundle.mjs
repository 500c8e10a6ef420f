// Fails (exit 1) when the worker bundle imports any node:* module: the core must run on Workers unchanged.
import { readFileSync } from 'node:fs'

const path = process.argv[2] ?? 'dist/worker.js'
const text = readFileSync(path, 'utf8')
const found = [...text.matchAll(/(?:from\s*|import\s*\(\s*|require\s*\(\s*)["'](node:[a-z_/]+)["']/g)].map((m) => m[1])
if (found.length > 0) {
  console.error(`worker bundle ${path} imports Node modules: ${[...new Set(found)].join(', ')}`)
  process.exit(1)
}
console.log(`worker bundle ${path}: ${(text.length / 1024).toFixed(0)} KiB, no node:* imports`)

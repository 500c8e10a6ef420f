/**
 * `npm run golden:update`: rewrite test/fixtures/golden/ from the engine as it is now. Only for a change
 * that is MEANT to alter results (new product constants, a corrected formula): say in the commit why the
 * numbers moved. A refactor must leave `npx vitest run test/golden` passing without this.
 */
import { mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { GOLDEN_DIR } from './cases.ts'
import { allGoldenFiles } from './golden-files.ts'

mkdirSync(GOLDEN_DIR, { recursive: true })
const files = allGoldenFiles()
const names = new Set(files.map((f) => f.name))
let changed = 0
for (const f of files) {
  const path = join(GOLDEN_DIR, f.name)
  let old: string | null = null
  try {
    old = readFileSync(path, 'utf8')
  } catch {
    old = null
  }
  if (old !== f.text) {
    writeFileSync(path, f.text)
    changed++
    console.log(`${old === null ? 'new' : 'changed'}: ${path}`)
  }
}
for (const name of readdirSync(GOLDEN_DIR)) {
  if (!names.has(name)) {
    rmSync(join(GOLDEN_DIR, name))
    console.log(`removed: ${join(GOLDEN_DIR, name)}`)
  }
}
console.log(`${files.length} golden files, ${changed} written`)

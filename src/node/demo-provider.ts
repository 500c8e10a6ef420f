/**
 * @module node/demo-provider
 * The page's demo sites on Node: the files listed in climate-demo/sites.json, read from disk on request.
 * Only listed names are ever read, so a form value cannot reach any other file.
 */
import { readFileSync } from 'node:fs'
import { readFile } from 'node:fs/promises'
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { type DemoCatalogue, type DemoProvider, demoFilesFromCatalogue } from '../web/demo-files.ts'

export function climateDemoProvider(
  dir = fileURLToPath(new URL('../../climate-demo/', import.meta.url)),
): DemoProvider | undefined {
  let catalogue: DemoCatalogue
  try {
    catalogue = JSON.parse(readFileSync(join(dir, 'sites.json'), 'utf8')) as DemoCatalogue
  } catch {
    return undefined
  }
  const files = demoFilesFromCatalogue(catalogue)
  return {
    list: () => files,
    read: async (file) =>
      files.some((d) => d.file === file) ? new Uint8Array(await readFile(join(dir, file))) : null,
  }
}

#!/usr/bin/env node
// Entry for the `dryhours` command: runs the TypeScript CLI through tsx's loader (no build step).
import { dirname, join } from 'node:path'
import { fileURLToPath, pathToFileURL } from 'node:url'
import { register } from 'tsx/esm/api'

register()
const here = dirname(fileURLToPath(import.meta.url))
const { main } = await import(pathToFileURL(join(here, '..', 'src', 'node', 'cli.ts')).href)
process.exitCode = await main(process.argv.slice(2))

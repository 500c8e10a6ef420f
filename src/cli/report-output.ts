/**
 * @module cli/report-output
 * The output options of `assess` and `compare`: `--format text|json|html|csv`, `--units si|us`,
 * `--table <id>` (one CSV table), `--out <file>` (instead of stdout), `--out-dir <folder>` (one file per
 * site and an index, with `--sites`) and `--force` (replace files that exist; without it nothing is
 * overwritten). The HTML and CSV are the report's renderings (src/report/), the same as the API's
 * `format=html|csv`.
 */
import { join } from 'node:path'
import type { UnitSystem } from '../report/display-units.ts'
import { type CliIo, UsageError } from './command.ts'

export const REPORT_OUTPUT_OPTIONS = {
  format: { type: 'string' },
  out: { type: 'string' },
  'out-dir': { type: 'string' },
  force: { type: 'boolean' },
  units: { type: 'string' },
  table: { type: 'string' },
} as const

export const REPORT_OUTPUT_HELP = `Output:
  --json                the full result as JSON (same as --format json)
  --format <f>          text (default), json, html (the printable summary) or csv (its tables)
  --table <id>          with csv: one table only (its ids are listed when a wrong one is given)
  --units <si|us>       display units of the text, html and csv (default si)
  --out <file>          write to the file instead of stdout
  --out-dir <folder>    with --sites: one file per site plus an index (index.html, .csv, .json or .txt)
  --force               replace files that exist (without it, an existing file is never overwritten)`

export type OutputFormat = 'text' | 'json' | 'html' | 'csv'

export interface ReportOutputChoice {
  format: OutputFormat
  units: UnitSystem
  table?: string
  out?: string
  outDir?: string
  force: boolean
}

/** The file extension of a format. */
export const FORMAT_EXTENSION: Record<OutputFormat, string> = {
  text: 'txt',
  json: 'json',
  html: 'html',
  csv: 'csv',
}

/** The output options of `values`, checked (`formats`: those the command offers). */
export function reportOutputChoice(
  values: Record<string, unknown>,
  formats: readonly OutputFormat[],
): ReportOutputChoice {
  const format = values.json === true ? 'json' : ((values.format as string | undefined) ?? 'text')
  if (!(formats as readonly string[]).includes(format)) {
    throw new UsageError(`--format must be one of ${formats.join(', ')}, got '${format}'`)
  }
  const units = (values.units as string | undefined) ?? 'si'
  if (units !== 'si' && units !== 'us') throw new UsageError(`--units must be si or us, got '${units}'`)
  const table = values.table as string | undefined
  if (table !== undefined && format !== 'csv') throw new UsageError('--table goes with --format csv')
  const out = values.out as string | undefined
  const outDir = values['out-dir'] as string | undefined
  if (out !== undefined && outDir !== undefined)
    throw new UsageError('give --out <file> or --out-dir <folder>, not both')
  if (out === '' || outDir === '') throw new UsageError('--out and --out-dir need a name')
  return {
    format: format as OutputFormat,
    units,
    table,
    out,
    outDir,
    force: values.force === true,
  }
}

/** Refuse an existing `--out` file before any work (the write refuses it too; this saves the wait). */
export async function checkOutFree(io: CliIo, choice: ReportOutputChoice): Promise<void> {
  if (choice.out !== undefined && !choice.force && (await io.exists?.(choice.out)))
    throw new UsageError(`'${choice.out}' already exists: give --force to replace it, or another name`)
}

/** Write `text` to `--out` (saying so on stderr) or to stdout. */
export async function writeReportOutput(io: CliIo, choice: ReportOutputChoice, text: string): Promise<void> {
  if (choice.out !== undefined) {
    await io.writeFile(choice.out, text, { overwrite: choice.force })
    io.stderr(`wrote ${choice.out}\n`)
  } else io.stdout(text)
}

/** A file name from a site name: lower-case letters, digits and dashes, at most 60 characters. */
export function fileStem(name: string): string {
  let out = ''
  let dash = false
  for (const ch of name.normalize('NFKD').toLowerCase()) {
    const c = ch.charCodeAt(0)
    const keep = (c >= 97 && c <= 122) || (c >= 48 && c <= 57)
    if (keep) {
      if (dash && out !== '') out += '-'
      out += ch
      dash = false
    } else if (c < 0x300 || c > 0x36f) dash = true // combining accents are dropped, not dashed
    if (out.length >= 60) break
  }
  return out === '' ? 'site' : out
}

/** Distinct file stems for `names` (a second "North farm" becomes `north-farm-2`). */
export function distinctStems(names: string[]): string[] {
  const used = new Set<string>()
  return names.map((n) => {
    const stem = fileStem(n)
    let s = stem
    for (let k = 2; used.has(s) || s === 'index'; k++) s = `${stem}-${k}`
    used.add(s)
    return s
  })
}

/**
 * Write several files into `folder` (created when missing). Every target is checked first: when any
 * exists and `force` is not given, nothing is written and the error names them all.
 */
export async function writeFilesInto(
  io: CliIo,
  folder: string,
  files: { name: string; text: string }[],
  force: boolean,
): Promise<string[]> {
  const paths = files.map((f) => join(folder, f.name))
  if (!force && io.exists) {
    const existing: string[] = []
    for (const p of paths) if (await io.exists(p)) existing.push(p)
    if (existing.length > 0) {
      throw new UsageError(
        `${existing.length === 1 ? `'${existing[0]}' already exists` : `${existing.length} files already exist (${existing.slice(0, 3).join(', ')}${existing.length > 3 ? ', …' : ''})`}: give --force to replace them, or another --out-dir`,
      )
    }
  }
  await io.makeDir?.(folder)
  for (let i = 0; i < files.length; i++) await io.writeFile(paths[i], files[i].text, { overwrite: force })
  io.stderr(`wrote ${files.length} files into ${folder}\n`)
  return paths
}

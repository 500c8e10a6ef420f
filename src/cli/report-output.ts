/**
 * @module cli/report-output
 * The output options of `assess` and `compare`: `--format text|json|html|csv`, `--units si|us`,
 * `--table <id>` (one CSV table) and `--out <file>` (instead of stdout). The HTML and CSV are the
 * report's renderings of the assessment (src/report/), the same as the API's `format=html|csv`.
 */
import type { UnitSystem } from '../report/display-units.ts'
import { type CliIo, UsageError } from './command.ts'

export const REPORT_OUTPUT_OPTIONS = {
  format: { type: 'string' },
  out: { type: 'string' },
  units: { type: 'string' },
  table: { type: 'string' },
} as const

export const REPORT_OUTPUT_HELP = `Output:
  --json                the full result as JSON (same as --format json)
  --format <f>          text (default), json, html (the printable summary) or csv (its tables)
  --table <id>          with csv: one table only (its ids are listed when a wrong one is given)
  --units <si|us>       display units of the text, html and csv (default si)
  --out <file>          write to the file instead of stdout`

export interface ReportOutputChoice {
  format: 'text' | 'json' | 'html' | 'csv'
  units: UnitSystem
  table?: string
  out?: string
}

/** The output options of `values`, checked (`formats`: those the command offers). */
export function reportOutputChoice(
  values: Record<string, unknown>,
  formats: readonly ReportOutputChoice['format'][],
): ReportOutputChoice {
  const format = values.json === true ? 'json' : ((values.format as string | undefined) ?? 'text')
  if (!(formats as readonly string[]).includes(format)) {
    throw new UsageError(`--format must be one of ${formats.join(', ')}, got '${format}'`)
  }
  const units = (values.units as string | undefined) ?? 'si'
  if (units !== 'si' && units !== 'us') throw new UsageError(`--units must be si or us, got '${units}'`)
  const table = values.table as string | undefined
  if (table !== undefined && format !== 'csv') throw new UsageError('--table goes with --format csv')
  return {
    format: format as ReportOutputChoice['format'],
    units,
    table,
    out: values.out as string | undefined,
  }
}

/** Write `text` to `--out` (saying so on stderr) or to stdout. */
export async function writeReportOutput(io: CliIo, choice: ReportOutputChoice, text: string): Promise<void> {
  if (choice.out !== undefined) {
    await io.writeFile(choice.out, text)
    io.stderr(`wrote ${choice.out}\n`)
  } else io.stdout(text)
}

/**
 * @module report/assessment-view
 * What the report renders: the `Assessment` of analysis/ (JSON-safe, so the JSON of
 * `dryhours assess --json` or of `POST /v1/assess` renders the same), plus what the assessment does not
 * carry about the input: the uploaded file name and a line on where the data come from.
 */
import type { Assessment } from '../analysis/assessment.ts'

export type { Assessment }

export interface ReportInputInfo {
  /** Uploaded file name (untrusted: escaped on output). */
  fileName?: string
  /** What the data are, e.g. "CSV, 35 064 rows; dry bulb from column T_air" (untrusted). */
  dataSource?: string
  /** What the weather reader warned about the file (untrusted), shown with the assessment's warnings. */
  readerWarnings?: string[]
  /** How the weather reader understood the file (untrusted): notes, shown apart from the warnings. */
  readerNotes?: string[]
}

/** Display name of the site: the assessment's, else the file name, else "unnamed site". */
export function siteDisplayName(a: Assessment, info: ReportInputInfo = {}): string {
  const name = a.site.name.trim()
  if (name) return name
  if (info.fileName?.trim()) return info.fileName.trim()
  return 'unnamed site'
}

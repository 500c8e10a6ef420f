/**
 * @module report/handout-fit
 * How much the two-page handout can hold. The report is plain HTML printed by a browser, so its length is
 * only known after layout; this module estimates the printed height of each handout block from its text
 * (lines of about `CHARS_PER_LINE` characters at the print size of report-css.ts) and decides how many
 * start dates the table shows, how many warnings are listed before "more in the appendix", and whether the
 * start-date chart fits as well. The budget is two US Letter pages (the shorter paper: 249 mm of text height
 * with 15 mm margins, against 267 mm on A4) less a margin for page breaks; the browser tests print the
 * handout on A4 and Letter and count the pages.
 */
import type { Assessment } from './assessment-view.ts'
import { GENERAL_CAUTIONS } from './sections/cautions.ts'
import type { SectionContext } from './sections/context.ts'
import { answerSentences, headerRows, warningList } from './sections/summary.ts'

/** Text height of one US Letter page at 15 mm margins [mm] (279.4 − 30). */
export const LETTER_TEXT_HEIGHT_MM = 249
/** What the two pages may hold by estimate [mm]: two Letter pages less room for where pages break. */
export const HANDOUT_BUDGET_MM = 2 * LETTER_TEXT_HEIGHT_MM - 34

// Print metrics of report-css.ts (9 pt text, line height 1.3; 180 mm text width on A4, 186 mm on Letter).
const LINE_MM = 4.15
const SMALL_LINE_MM = 3.8
const CHARS_PER_LINE = 100
const H2_MM = 10.5
const TABLE_ROW_MM = 4.8
const TABLE_HEAD_MM = 12
const CALENDAR_CELLS_PER_LINE = 14
const CALENDAR_LINE_MM = 8.6
const START_FIGURE_MM = 66
const MIN_START_ROWS = 8
const MAX_START_ROWS = 40

const lines = (text: string, perLine = CHARS_PER_LINE): number =>
  Math.max(1, Math.ceil(text.length / perLine))

export interface HandoutPlan {
  /** Most start dates the handout's table shows (the table thins to every n-th row above it). */
  startRows: number
  /** Whether the start-date chart fits under the table. */
  startFigure: boolean
  /** Warnings listed in the answer before "n more in the appendix". */
  maxWarnings: number
  /** The estimated height of the chosen content [mm]. */
  estimateMm: number
}

function headerMm(a: Assessment, ctx: SectionContext): number {
  const rows = headerRows(a, ctx)
  let facts = 4
  for (let i = 0; i < rows.length; i += 2) {
    const pair = rows.slice(i, i + 2).map(([, v]) => lines(v, 46))
    facts += Math.max(...pair) * SMALL_LINE_MM + 0.6
  }
  const title = 7.2 * lines(`Can ${ctx.siteName} dry ${a.product.name}?`, 58)
  return 5 + title + 3 + facts
}

function answerMm(a: Assessment, ctx: SectionContext, maxWarnings: number): number {
  let mm = H2_MM
  for (const s of answerSentences(a, ctx)) mm += lines(s, CHARS_PER_LINE - 5) * LINE_MM + 1.2
  const warnings = warningList(a, ctx)
  if (warnings.length > 0) {
    mm += 10
    for (const w of warnings.slice(0, maxWarnings)) mm += lines(w, CHARS_PER_LINE - 8) * LINE_MM + 0.6
    if (warnings.length > maxWarnings) mm += LINE_MM
  }
  return mm
}

function calendarMm(a: Assessment): number {
  const cells = a.seasonCalendar?.cells.length ?? 0
  if (cells === 0) return H2_MM + LINE_MM
  const rows = Math.ceil(cells / CALENDAR_CELLS_PER_LINE)
  const words = a.seasonCalendar.cells.length * 14 + 40
  return H2_MM + rows * CALENDAR_LINE_MM + 6 + lines('x'.repeat(words)) * SMALL_LINE_MM + 3 * SMALL_LINE_MM
}

function cautionsMm(a: Assessment): number {
  let mm = H2_MM + 8
  for (const c of [...new Set([...(a.bin?.cautions ?? []), ...a.product.cautions]), ...GENERAL_CAUTIONS])
    mm += lines(c, CHARS_PER_LINE - 12) * LINE_MM + 1.2
  return mm
}

function tableMm(rows: number, thinned: boolean): number {
  return H2_MM + TABLE_HEAD_MM + rows * TABLE_ROW_MM + (thinned ? LINE_MM + 1 : 0)
}

/** Shown rows of a table of `total` rows thinned to at most `maxRows`. */
export function shownRows(total: number, maxRows: number): number {
  const step = Math.max(1, Math.ceil(total / Math.max(1, maxRows)))
  return Math.ceil(total / step)
}

/** The estimated heights of the handout's fixed blocks [mm] (for tests and tuning). */
export function handoutBlocks(a: Assessment, ctx: SectionContext, maxWarnings = 6): Record<string, number> {
  return {
    header: headerMm(a, ctx),
    answer: answerMm(a, ctx, maxWarnings),
    calendar: calendarMm(a),
    cautions: cautionsMm(a),
    row: TABLE_ROW_MM,
  }
}

/** A bin's handout tables: the minimum airflow per start month and the fan at each airflow. */
function binTablesMm(bin: NonNullable<Assessment['bin']>): number {
  return (
    H2_MM +
    2 * (TABLE_HEAD_MM + LINE_MM) +
    (bin.minimumAirflowByMonth.length + bin.airflows.length) * TABLE_ROW_MM
  )
}

/** A bin's handout: no start-date table or calendar; as many warnings as fit beside its two tables. */
function binHandoutPlan(
  a: Assessment,
  bin: NonNullable<Assessment['bin']>,
  ctx: SectionContext,
): HandoutPlan {
  let estimateMm = 0
  for (const maxWarnings of [6, 3, 1]) {
    estimateMm = headerMm(a, ctx) + answerMm(a, ctx, maxWarnings) + binTablesMm(bin) + cautionsMm(a)
    if (estimateMm <= HANDOUT_BUDGET_MM || maxWarnings === 1)
      return { startRows: 0, startFigure: false, maxWarnings, estimateMm }
  }
  return { startRows: 0, startFigure: false, maxWarnings: 1, estimateMm }
}

/** What the handout of `a` holds within {@link HANDOUT_BUDGET_MM}. */
export function handoutPlan(a: Assessment, ctx: SectionContext): HandoutPlan {
  if (a.bin) return binHandoutPlan(a, a.bin, ctx)
  const total = a.startDates.length
  for (const maxWarnings of [6, 3, 1]) {
    const fixed = headerMm(a, ctx) + answerMm(a, ctx, maxWarnings) + calendarMm(a) + cautionsMm(a)
    const room = HANDOUT_BUDGET_MM - fixed
    const fit = Math.floor((room - tableMm(0, true)) / TABLE_ROW_MM)
    if (fit < MIN_START_ROWS && maxWarnings > 1) continue
    const startRows = Math.max(MIN_START_ROWS, Math.min(MAX_START_ROWS, fit))
    const shown = shownRows(total, startRows)
    const table = tableMm(shown, shown < total)
    const startFigure = total > 1 && room - table >= START_FIGURE_MM + 6
    return {
      startRows,
      startFigure,
      maxWarnings,
      estimateMm: fixed + table + (startFigure ? START_FIGURE_MM : 0),
    }
  }
  // unreachable: the last pass always returns
  return { startRows: MIN_START_ROWS, startFigure: false, maxWarnings: 1, estimateMm: 0 }
}

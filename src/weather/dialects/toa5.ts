/**
 * @module weather/dialects/toa5
 * Datalogger TOA5 tables (ASCII table files of common research dataloggers): line 1 `"TOA5",station,
 * logger model, serial number, OS, program, signature, table name`; line 2 the field names
 * (`TIMESTAMP`, `RECORD`, …); line 3 their units (`TS`, `RN`, `Deg C`, `%`, `meters/second`,
 * `W/m^2`, `mm`, `mbar`); line 4 the processing (`Avg`, `Tot`, `Smp`, `Min`, `Max`). TIMESTAMP is the
 * END of the table's interval: averages and totals cover the interval before it, samples are taken
 * at it. The logger clock's zone is not in the file. (TOA5 layout as written by the loggers' support
 * software, from memory.)
 */
import { readDelimited } from '../delimited.ts'
import {
  type DialectContext,
  type DialectHead,
  type DialectReading,
  quotedCells,
  stated,
  type WeatherDialect,
} from './dialect.ts'

export const toa5: WeatherDialect = {
  id: 'toa5',
  title: 'Datalogger TOA5 table',
  detect(head: DialectHead): boolean {
    return (head.lower[0] ?? '').startsWith('"toa5"') || (head.lower[0] ?? '').startsWith('toa5,')
  },
  read(text: string, head: DialectHead, ctx: DialectContext): DialectReading {
    const environment = quotedCells(head.lines[0] ?? '')
    const names = quotedCells(head.lines[1] ?? '')
    const units = quotedCells(head.lines[2] ?? '')
    const processing = quotedCells(head.lines[3] ?? '').map((p) => p.trim().toLowerCase())
    const { table, info } = readDelimited(text, ctx.mapping, ctx.log, ctx.warnings, {
      headerLine: ctx.headerLine,
      headerRow: 1,
      unitsRow: units,
      skipAfterHeader: 2,
    })
    for (const col of Object.values(table.columns)) {
      if (!col) continue
      const p = processing[names.indexOf(col.source)] ?? ''
      if (p === 'avg' || p === 'wvc') col.timing = { kind: 'interval-mean', label: 'end' }
      else if (p === 'tot') col.timing = { kind: 'interval-total', label: 'end' }
      else if (p === 'smp') col.timing = { kind: 'instant', label: 'start' }
    }
    table.labels = 'start'
    table.sampling = 'readings'
    table.statements = stated({ siteName: environment[1]?.trim(), dialect: 'toa5' })
    ctx.notes.push(
      `TOA5 table '${environment[7] ?? ''}' from station '${environment[1] ?? ''}': TIMESTAMP ends each interval (Avg and Tot cover the interval before it, Smp is taken at it); the logger clock's zone is not in the file`,
    )
    return { table, info }
  },
}

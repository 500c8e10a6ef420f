/**
 * @module weather/dialects/usb-logger
 * Exports of common USB temperature/humidity loggers' desktop software: an optional title line
 * (`"Plot Title: …"`), then `"#","Date Time, GMT-05:00","Temp, °F (LGR S/N: …)","RH, % (LGR S/N: …)",
 * <event columns>`: the clock's fixed offset is in the time header, the unit after the comma, the
 * serial numbers in brackets; dates as the computer writes them (often `MM/DD/YY hh:mm:ss AM`);
 * event columns (coupler attached or detached, host connected, end of file) mark rows that carry no
 * reading. Readings are instantaneous samples. (Layout of such exports, from memory; device names
 * kept generic.)
 */
import { readDelimited } from '../delimited.ts'
import {
  type DialectContext,
  type DialectHead,
  type DialectReading,
  findLine,
  stated,
  type WeatherDialect,
} from './dialect.ts'

export const usbLogger: WeatherDialect = {
  id: 'usb-logger',
  title: 'USB temperature/humidity logger export',
  detect(head: DialectHead): boolean {
    return findLine(head, (l) => l.includes('date time') && l.includes('lgr s/n')) >= 0
  },
  read(text: string, head: DialectHead, ctx: DialectContext): DialectReading {
    const headerIndex = findLine(head, (l) => l.includes('date time') && l.includes('lgr s/n'))
    const title = head.lines[0]?.toLowerCase().includes('plot title')
      ? head.lines[0].replaceAll('"', '').split(':').slice(1).join(':').trim()
      : ''
    const { table, info } = readDelimited(text, ctx.mapping, ctx.log, ctx.warnings, {
      headerLine: ctx.headerLine,
      headerRow: headerIndex,
    })
    table.labels = 'start'
    table.sampling = 'readings'
    table.statements = stated({ siteName: title || undefined, dialect: 'usb-logger' })
    ctx.notes.push(
      'logger export: instantaneous samples; event columns (coupler, host, end of file) ignored; rows without readings are skipped',
    )
    return { table, info }
  },
}

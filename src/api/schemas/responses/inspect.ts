/**
 * @module api/schemas/responses/inspect
 * The answer of POST /v1/inspect (and `dryhours inspect --json`, report/inspect-json.ts): how a weather file
 * was understood, with the unit of every field.
 */
import { z } from 'zod'
import { count, num, numOrNull, once, text, texts } from './common.ts'

/** How a column was read. */
const columnSchema = once(() =>
  z.strictObject({
    variable: text('the variable (dryBulb, relativeHumidity, …)'),
    source: text('the column header, EPW field, or what supplied it'),
    unit: text('the unit as read, before conversion to SI'),
    unitFrom: z
      .enum(['header', 'mapping', 'format', 'detected', 'assumed', 'supplied'])
      .describe('where the unit came from'),
    timing: z.enum(['instant', 'interval-mean', 'interval-total']).describe('what a value stands for'),
    missing: count('values read as missing'),
  }),
)

/** The site and its clock. */
const siteSchema = once(() =>
  z
    .strictObject({
      name: text('site name'),
      latitudeDeg: numOrNull('latitude [° N]'),
      longitudeDeg: numOrNull('longitude [° E, west negative]'),
      elevationM: numOrNull('elevation [m]'),
      timeZone: z.string().nullable().describe("IANA zone of the site's clock, when known"),
      utcOffsetHours: numOrNull("offset of the site's standard time from UTC [h]"),
      utcOffsetSource: z
        .enum(['option', 'file', 'timestamps', 'longitude'])
        .nullable()
        .optional()
        .describe("where the site's clock came from"),
      windHeightM: num('height of the wind measurement [m]'),
    })
    .describe('the site and its clock'),
)

/** How rows became hours. */
const hourlySchema = once(() =>
  z
    .strictObject({
      sampling: z
        .enum(['readings', 'reports'])
        .describe('readings averaged and summed, or one report per hour'),
      stepMinutes: num('most common spacing of the rows [min]'),
      reportMinute: numOrNull('minute after the hour most reports carry [min]'),
      alignedReports: count('reports moved to the nearest hour'),
      hoursFromSeveralRows: count('hours built from more than one row'),
      partialHours: count('hours kept with some readings missing'),
      hoursBelowCoverage: z
        .record(z.string(), count('hours left missing'))
        .describe('per variable, hours whose readings covered too little of the hour [count]'),
      supersededRows: count('reports not used'),
      rule: text('the rule applied, with its source'),
    })
    .describe('how rows became hours'),
)

/** How a weather file was understood. */
export const inspectResponseSchema = once(() =>
  z
    .strictObject({
      format: z.enum(['csv', 'epw']).describe('file format'),
      dialect: z
        .strictObject({ id: text('layout id'), title: text('layout in words') })
        .nullable()
        .describe('the known export layout recognised; null: the generic reader'),
      rows: z
        .strictObject({
          read: count('data rows in the file'),
          used: count('rows placed as read'),
          repaired: count('rows placed with a value rejected, clamped or filled'),
          rejected: count('rows not usable'),
          superseded: count('reports not used because a better one stood for the hour'),
        })
        .describe('row accounting: read = used + repaired + rejected + superseded'),
      period: z.strictObject({
        start: text('first hour [ISO 8601, UTC]'),
        end: text('last hour [ISO 8601, UTC]'),
      }),
      hours: count('hours of the series'),
      years: z.array(num('calendar year [year]')).describe('years covered, site standard time'),
      typicalYear: z.boolean().describe('read as a typical year'),
      sourceYears: z.array(num('calendar year [year]')).describe('source years of a typical year'),
      timeBasis: text('how the time stamps became UTC'),
      dstEvents: z
        .array(
          z.strictObject({
            kind: z.enum(['spring-gap', 'autumn-overlap']).describe('the daylight-saving change'),
            atUtc: text('instant of the change [ISO 8601, UTC]'),
            rows: count('rows in the missing or doubled hour'),
          }),
        )
        .describe('daylight-saving changes met'),
      columns: z.array(columnSchema()),
      site: siteSchema(),
      hourly: hourlySchema(),
      variables: z.array(
        z.strictObject({
          variable: text('the variable'),
          unit: text('its SI unit, the unit of mean, min and max'),
          hours: count('hours with a value'),
          mean: numOrNull('mean [the unit given in unit]'),
          min: numOrNull('minimum [the unit given in unit]'),
          max: numOrNull('maximum [the unit given in unit]'),
        }),
      ),
      coverage: z.array(
        z.strictObject({
          year: num('calendar year [year]'),
          month: num('month [1–12]'),
          percent: num('hours of the month with dry bulb and humidity [%]'),
        }),
      ),
      hoursWithoutRow: count('hours of the series with no row in the file'),
      hoursMissingCore: count('hours without dry bulb or humidity after filling'),
      problemCounts: z
        .record(z.string(), count('problems of the kind'))
        .describe('problems per kind [count]'),
      rejectedRows: z
        .array(
          z.strictObject({ line: count('line of the file'), kind: text('the problem that rejected it') }),
        )
        .describe('every rejected row'),
      problems: z
        .array(
          z.strictObject({
            line: z
              .number()
              .int()
              .nullable()
              .describe('line of the file [count]; null for an hour with no row'),
            variable: z.string().nullable().describe('the variable; null for the whole row'),
            kind: text('kind of problem'),
            message: text('the problem in words'),
          }),
        )
        .describe('the first problems'),
      problemsListed: count('problems listed'),
      problemsTotal: count('problems in all'),
      warnings: texts('what limits the use of the file'),
      notes: texts('what was supplied rather than read'),
    })
    .describe('how the weather file was understood'),
)

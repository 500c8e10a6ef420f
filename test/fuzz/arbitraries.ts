/**
 * Generators of hostile-but-plausible input: CSV-ish weather text (random headers, delimiters,
 * timestamps and numbers), demo-file snippets with mutations, and option values of every JSON type.
 */
import { readFileSync } from 'node:fs'
import fc from 'fast-check'

/** Header names the reader knows, mixed with strangers. */
const HEADER_WORDS = [
  'time',
  'timestamp',
  'date',
  'hour',
  'year',
  'month',
  'day',
  'temp_c',
  'temperature (°F)',
  'dry bulb (°C)',
  'rh_pct',
  'relative humidity (%)',
  'dew point (°C)',
  'wet bulb',
  'pressure_kpa',
  'station pressure (inHg)',
  'wind_ms',
  'wind speed (mph)',
  'ghi_wm2',
  'rain_mm',
  'cloud',
  'Temp',
  'RH',
]

const headerName = fc.oneof(
  { weight: 4, arbitrary: fc.constantFrom(...HEADER_WORDS) },
  { weight: 1, arbitrary: fc.string({ maxLength: 12 }) },
)

/** A header that names a time, a dry bulb and a humidity column first, then anything. */
const plausibleHeader = fc
  .tuple(
    fc.constantFrom('time', 'timestamp', 'Date Time (UTC)'),
    fc.constantFrom('temp_c', 'dry bulb (°C)', 'Temp', 'temperature (°F)'),
    fc.constantFrom('rh_pct', 'relative humidity (%)', 'RH', 'dew point (°C)'),
    fc.array(headerName, { maxLength: 4 }),
  )
  .map(([t, d, h, rest]) => [t, d, h, ...rest])

/** Numbers as a logger, a spreadsheet or an attacker writes them. */
export const numberText = fc.oneof(
  { weight: 5, arbitrary: fc.double({ min: -60, max: 120, noNaN: true }).map((x) => x.toFixed(1)) },
  { weight: 2, arbitrary: fc.integer({ min: -100, max: 1000 }).map(String) },
  {
    weight: 2,
    arbitrary: fc.constantFrom(
      '1e309',
      '-1e309',
      'NaN',
      'Infinity',
      '-0',
      '0x10',
      '',
      'NA',
      '---',
      '1,5',
      ' 7 ',
      '25%',
      '1e-400',
    ),
  },
  { weight: 1, arbitrary: fc.double().map(String) },
  { weight: 1, arbitrary: fc.string({ maxLength: 6 }) },
)

const pad = (n: number) => String(n).padStart(2, '0')

/** A timestamp in one of several layouts, or something that only looks like one. */
export const timestampText = fc
  .record({
    year: fc.oneof(fc.integer({ min: 2019, max: 2025 }), fc.integer({ min: 1, max: 9999 })),
    month: fc.integer({ min: 0, max: 13 }),
    day: fc.integer({ min: 0, max: 32 }),
    hour: fc.integer({ min: 0, max: 25 }),
    layout: fc.integer({ min: 0, max: 5 }),
  })
  .chain(({ year, month, day, hour, layout }) => {
    const iso = `${year}-${pad(month)}-${pad(day)}`
    switch (layout) {
      case 0:
        return fc.constant(`${iso}T${pad(hour)}:00Z`)
      case 1:
        return fc.constant(`${iso} ${pad(hour)}:00`)
      case 2:
        return fc.constant(`${pad(month)}/${pad(day)}/${year} ${hour}:00`)
      case 3:
        return fc.constant(`${iso}T${pad(hour)}:00+05:30`)
      case 4:
        return fc.constant(`${iso}`)
      default:
        return fc.string({ maxLength: 20 })
    }
  })

/** An hourly run of ISO UTC timestamps (a plausible file), from a random start, possibly shuffled. */
const hourlyRun = fc
  .record({
    startMs: fc.integer({ min: Date.UTC(2019, 0, 1), max: Date.UTC(2025, 0, 1) }),
    n: fc.integer({ min: 1, max: 60 }),
  })
  .map(({ startMs, n }) =>
    Array.from(
      { length: n },
      (_, i) => `${new Date(startMs - (startMs % 3_600_000) + i * 3_600_000).toISOString().slice(0, 16)}Z`,
    ),
  )

/** CSV-ish weather text: a header line and rows with random timestamps and numbers. */
export const csvishText = fc
  .record({
    delimiter: fc.constantFrom(',', ';', '\t', '|'),
    header: fc.oneof(
      { weight: 3, arbitrary: plausibleHeader },
      { weight: 1, arbitrary: fc.array(headerName, { minLength: 1, maxLength: 8 }) },
    ),
    stamps: fc.oneof(hourlyRun, fc.array(timestampText, { minLength: 0, maxLength: 40 })),
    cells: fc.oneof(
      fc.array(numberText, { minLength: 20, maxLength: 400 }),
      // Mostly plain readings, so that some files are usable.
      fc.array(fc.integer({ min: 5, max: 95 }).map(String), { minLength: 20, maxLength: 400 }),
    ),
    newline: fc.constantFrom('\n', '\r\n', '\r'),
    bom: fc.boolean(),
    quoteSome: fc.boolean(),
  })
  .map(({ delimiter, header, stamps, cells, newline, bom, quoteSome }) => {
    const width = header.length
    const lines = [header.join(delimiter)]
    stamps.forEach((stamp, r) => {
      const row = [stamp]
      for (let c = 1; c < width; c++) row.push(cells[(r * width + c) % cells.length])
      lines.push(row.map((v, i) => (quoteSome && i % 2 === 1 ? `"${v}"` : v)).join(delimiter))
    })
    return `${bom ? '\ufeff' : ''}${lines.join(newline)}${newline}`
  })

/** The first lines of each demo file (invented data), as the seeds of the mutations. */
function demoSnippets(): string[] {
  const files = [
    'climate-demo/ardentine-upland-2021-2024-utc.csv',
    'climate-demo/quillow-valley-2021-2023-local-dst-imperial.csv',
    'climate-demo/tamarel-lowland-2023-logger-faulty.csv',
    'climate-demo/gullhaven-coast-2022-2024.epw',
  ]
  return files.map((f) => readFileSync(f, 'utf8').split('\n').slice(0, 80).join('\n'))
}
const SNIPPETS = demoSnippets()

type Mutation = (text: string) => string

const mutation: fc.Arbitrary<Mutation> = fc.oneof(
  // Delete a range of characters.
  fc.tuple(fc.nat(), fc.integer({ min: 1, max: 200 })).map(
    ([at, n]): Mutation =>
      (t) => {
        const i = at % Math.max(1, t.length)
        return t.slice(0, i) + t.slice(i + n)
      },
  ),
  // Insert random text (including quotes, delimiters, NULs and line breaks).
  fc
    .tuple(
      fc.nat(),
      fc.oneof(
        fc.string({ maxLength: 20 }),
        fc.constantFrom('"', '\u0000', '\n', ',,,', '\r', '\ufeff', '1e309'),
      ),
    )
    .map(
      ([at, s]): Mutation =>
        (t) => {
          const i = at % Math.max(1, t.length)
          return t.slice(0, i) + s + t.slice(i)
        },
    ),
  // Duplicate, drop or swap whole lines.
  fc.tuple(fc.nat(), fc.nat(), fc.constantFrom('dup', 'drop', 'swap')).map(
    ([a, b, op]): Mutation =>
      (t) => {
        const lines = t.split('\n')
        const i = a % lines.length
        const j = b % lines.length
        if (op === 'dup') lines.splice(i, 0, lines[i])
        else if (op === 'drop') lines.splice(i, 1)
        else [lines[i], lines[j]] = [lines[j], lines[i]]
        return lines.join('\n')
      },
  ),
  // Replace every occurrence of one character by another.
  fc.tuple(fc.constantFrom(',', '-', ':', '.', '\n', 'T'), fc.constantFrom(';', '/', ' ', ',', '')).map(
    ([from, to]): Mutation =>
      (t) =>
        t.split(from).join(to),
  ),
  // Truncate.
  fc.nat().map(
    (n): Mutation =>
      (t) =>
        t.slice(0, n % (t.length + 1)),
  ),
)

/** A demo snippet with 1–6 mutations applied. */
export const mutatedDemoText = fc
  .tuple(fc.constantFrom(...SNIPPETS.keys()), fc.array(mutation, { minLength: 1, maxLength: 6 }))
  .map(([k, ms]) => ms.reduce((t, m) => m(t), SNIPPETS[k]))

/** Random bytes, sometimes behind a UTF-8 or UTF-16 byte-order mark. */
export const randomBytes = fc
  .tuple(
    fc.constantFrom([], [0xef, 0xbb, 0xbf], [0xff, 0xfe], [0xfe, 0xff]),
    fc.uint8Array({ maxLength: 3000 }),
  )
  .map(([bom, body]) => {
    const out = new Uint8Array(bom.length + body.length)
    out.set(bom)
    out.set(body, bom.length)
    return out
  })

/** A JSON value of any type, with the awkward numbers JSON can carry. */
export const anyJson = fc.oneof(
  fc.constantFrom(null, true, false, 0, -1, 1e308, -1e-308, 1.5, '', 'x', '07-01', 'figs', 'open-air'),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  fc.string({ maxLength: 10 }),
  fc.array(fc.integer(), { maxLength: 3 }),
  fc.dictionary(fc.string({ maxLength: 6 }), fc.integer(), { maxKeys: 3 }),
)

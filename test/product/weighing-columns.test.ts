import { describe, expect, it } from 'vitest'
import { fitWeighings } from '../../src/product/fit-weighings.ts'
import { describeColumns, recogniseColumns } from '../../src/product/weighing-columns.ts'
import { parseWeighingsCsv } from '../../src/product/weighings.ts'

// Hand-made logs in the layouts people keep (spreadsheet exports in several languages). The same tray is written
// in each: 0, 1.5, 3, 6 h; 1000, 900, 820, 700 g.
const HOURS = [0, 1.5, 3, 6]
const GRAMS = [1000, 900, 820, 700]

function rowsOf(text: string) {
  return parseWeighingsCsv(text).rows
}

describe('header words and units as people write them', () => {
  it.each([
    ['time_h,mass_g', HOURS.map((t, i) => `${t},${GRAMS[i]}`)],
    ['t (h),m (g)', HOURS.map((t, i) => `${t},${GRAMS[i]}`)],
    ['Hours,Weight (g)', HOURS.map((t, i) => `${t},${GRAMS[i]}`)],
    ['elapsed,weight', HOURS.map((t, i) => `${t},${GRAMS[i]}`)],
    ['Time (min),Weight (kg)', HOURS.map((t, i) => `${t * 60},${GRAMS[i] / 1000}`)],
    ['minutes,kg', HOURS.map((t, i) => `${t * 60},${GRAMS[i] / 1000}`)],
    ['tiempo (h);peso (g)', HOURS.map((t, i) => `${String(t).replace('.', ',')};${GRAMS[i]}`)],
    ['temps (min);masse (kg)', HOURS.map((t, i) => `${t * 60};${String(GRAMS[i] / 1000).replace('.', ',')}`)],
    ['Zeit [h]\tGewicht [g]', HOURS.map((t, i) => `${String(t).replace('.', ',')}\t${GRAMS[i]}`)],
    ['tempo (minutos);massa (g)', HOURS.map((t, i) => `${t * 60};${GRAMS[i]}`)],
    [
      'tempo (ore);peso (kg)',
      HOURS.map((t, i) => `${String(t).replace('.', ',')};${String(GRAMS[i] / 1000).replace('.', ',')}`),
    ],
  ])('%s', (header, data) => {
    const rows = rowsOf(`${header}\n${data.join('\n')}\n`)
    expect(rows.map((r) => r.timeH)).toEqual(HOURS.map((t) => expect.closeTo(t, 9)))
    expect(rows.map((r) => r.massG)).toEqual(GRAMS.map((g) => expect.closeTo(g, 9)))
  })

  it('pounds and ounces by their exact definitions (1 lb = 453.59237 g, 1 oz = 28.349523125 g; NIST SP 811 App. B.8)', () => {
    const lb = rowsOf('hours,weight (lb)\n0,2\n1,1.5\n')
    expect(lb[0].massG).toBeCloseTo(907.18474, 9)
    const oz = rowsOf('hours,oz\n0,32\n1,30\n')
    expect(oz[0].massG).toBeCloseTo(907.18474, 9)
  })

  it('days, and date-times in a date column', () => {
    expect(rowsOf('day,mass_g\n0,1000\n0.5,900\n')[1].timeH).toBe(12)
    expect(rowsOf('date,mass_g\n2026-07-01 08:00,1000\n2026-07-02 08:00,900\n')[1].timeH).toBe(24)
  })

  it('air temperature in °F and relative humidity as HR (%) (French/Spanish) are converted and taken', () => {
    const rows = rowsOf('temps (h);poids (g);T (°F);HR (%)\n0;1000;86;40\n1;950;95;35\n')
    expect(rows[0].airTempC).toBeCloseTo(30, 9)
    expect(rows[1].airTempC).toBeCloseTo(35, 9)
    expect(rows[1].rhPct).toBe(35)
  })

  it('a bare HR next to a time column is the relative humidity, a bare hr alone is hours', () => {
    const c = recogniseColumns(['tiempo (h)', 'peso (g)', 'HR'], 1)
    expect(c.time.header).toBe('tiempo (h)')
    expect(c.rh?.header).toBe('HR')
    expect(recogniseColumns(['hr', 'g'], 1).time.unit).toBe('h')
  })

  it('a product moisture column in % is not mistaken for air humidity', () => {
    const c = recogniseColumns(['hours', 'weight (g)', 'moisture (%)'], 1)
    expect(c.rh).toBeNull()
  })

  it('says which column it took, in which unit, and which it did not read', () => {
    const c = recogniseColumns(['Datum', 'Gewicht brutto (kg)', 'Gewicht netto (kg)', 'Temperatur (°C)'], 1)
    const s = describeColumns(c)
    expect(s).toMatch(/time from column 1 'Datum' \(date-times\)/)
    expect(s).toMatch(/mass from column 2 'Gewicht brutto \(kg\)' in kg/)
    expect(s).toMatch(/not read: 'Gewicht netto \(kg\)' as mass/)
    expect(s).toMatch(/air temperature from column 4 'Temperatur \(°C\)' in °C/)
  })

  it('a unit that had to be assumed is said so', () => {
    const s = describeColumns(recogniseColumns(['elapsed', 'weight'], 1))
    expect(s).toMatch(/in h, assumed: no unit in the header/)
    expect(s).toMatch(/in g, assumed: no unit in the header/)
  })

  it('missing columns are named with examples', () => {
    expect(() => parseWeighingsCsv('hours,notes\n0,a\n')).toThrow(
      /no mass column found among 'hours', 'notes'/,
    )
    expect(() => parseWeighingsCsv('weight (g),notes\n100,a\n')).toThrow(/no time column found/)
  })

  it('the fit reports the columns it read (CLI and API carry `columnsRead`)', () => {
    const text = `Time (min);Weight (kg);Temp (°C);RH (%)\n${[0, 30, 60, 90, 120, 180, 240, 360]
      .map((m) => `${m};${(0.2 + 0.8 * Math.exp(-0.4 * (m / 60))).toFixed(4).replace('.', ',')};40;30`)
      .join('\n')}\n`
    const f = fitWeighings(parseWeighingsCsv(text), { reference: { dryMassG: 180 } })
    expect(f.columnsRead).toMatch(
      /time from column 1 'Time \(min\)' in min; mass from column 2 'Weight \(kg\)' in kg/,
    )
    expect(f.meanAirTempC).toBe(40)
  })
})

// Conventions of single dialects that the fixtures do not exercise fully: encoded ISD groups and
// their quality codes (NOAA NCEI ISD format document, mandatory and additional data sections), LCD
// value suffixes, and ERA5-Land accumulations since 00 UTC (ECMWF documentation, from memory).
import { describe, expect, it } from 'vitest'
import { isdField, isdHourlyPrecipitation, isdSkyCover } from '../../src/weather/dialects/noaa-isd.ts'
import { lcdSkyCover, lcdValue } from '../../src/weather/dialects/noaa-lcd.ts'
import { readWeather } from '../../src/weather/read-weather.ts'

describe('ISD encoded groups', () => {
  it('TMP/DEW: tenths of °C with a sign; +9999 missing; quality 2, 3, 6, 7 rejected', () => {
    expect(isdField('+0126,1', 0, 1, 9999, 10)).toBeCloseTo(12.6, 12)
    expect(isdField('-0035,5', 0, 1, 9999, 10)).toBeCloseTo(-3.5, 12)
    expect(isdField('+9999,9', 0, 1, 9999, 10)).toBeNaN()
    for (const q of ['2', '3', '6', '7']) expect(isdField(`+0126,${q}`, 0, 1, 9999, 10)).toBeNaN()
    for (const q of ['0', '4', '5', '9', 'A', 'C', 'I', 'M', 'P', 'R', 'U'])
      expect(isdField(`+0126,${q}`, 0, 1, 9999, 10)).toBeCloseTo(12.6, 12)
  })

  it('WND speed (4th part, m/s × 10) and MA1 station pressure (3rd part, hPa × 10)', () => {
    expect(isdField('230,1,N,0026,1', 3, 4, 9999, 10)).toBeCloseTo(2.6, 12)
    expect(isdField('999,9,C,0000,1', 3, 4, 9999, 10)).toBe(0) // calm
    expect(isdField('230,1,N,9999,9', 3, 4, 9999, 10)).toBeNaN()
    expect(isdField('10034,1,09988,1', 2, 3, 99999, 10)).toBeCloseTo(998.8, 10)
    expect(isdField('10034,1,99999,9', 2, 3, 99999, 10)).toBeNaN()
  })

  it('AA1 is read only over one hour; GF1 total cover in oktas, obscured or missing is no value', () => {
    expect(isdHourlyPrecipitation('01,0025,9,5')).toBeCloseTo(2.5, 12)
    expect(isdHourlyPrecipitation('06,0025,9,5')).toBeNaN()
    expect(isdHourlyPrecipitation('01,0000,2,5')).toBe(0) // a trace
    expect(isdSkyCover('06,99,1,99,9,99,9,99999,9,99,9,99,9')).toBe(6)
    expect(isdSkyCover('09,99,1')).toBeNaN()
    expect(isdSkyCover('99,99,9')).toBeNaN()
  })
})

describe('LCD values', () => {
  it('suffixes s (suspect) and * are dropped, M is missing, T is a trace (0 for precipitation only)', () => {
    expect(lcdValue('45s')).toBe(45)
    expect(lcdValue('29.48*')).toBe(29.48)
    expect(lcdValue('M')).toBeNaN()
    expect(lcdValue('T', true)).toBe(0)
    expect(lcdValue('T')).toBeNaN()
    expect(lcdSkyCover('FEW:01 40 BKN:06 120')).toBe(6)
    expect(lcdSkyCover('CLR:00')).toBe(0)
    expect(lcdSkyCover('')).toBeNaN()
  })
})

describe('ERA5-Land accumulations since 00 UTC', () => {
  it('are recognised (an hour above what the sun can give) and differenced back to hourly means', () => {
    // Invented: 400 W/m² in each of the 6 hours 14–20 UTC (around local noon at 68° W), accumulated from 00 UTC.
    const lines = ['valid_time,t2m,d2m,sp,u10,v10,ssrd,tp,latitude,longitude']
    let acc = 0
    for (let h = 0; h < 48; h++) {
      const hour = h % 24
      if (hour === 1) acc = 0 // ERA5-Land: the 01 UTC value is the first hour of the day's accumulation
      if (hour >= 15 && hour <= 20) acc += 400 * 3600 // the hour ending at the stamp
      const stamp = new Date(Date.UTC(2024, 0, 15, h)).toISOString().replace('T', ' ').slice(0, 19)
      const t = 293.15 + 5 * Math.sin(h / 3.8)
      const u = 1.5 + 0.3 * (h % 2)
      lines.push(
        `${stamp},${t.toFixed(2)},${(t - 9 - (h % 3)).toFixed(2)},${93000 + 10 * (h % 4)},${u},-2.0,${acc},0.0,-33.0,-68.25`,
      )
    }
    const r = readWeather(lines.join('\n'))
    expect(r.dialect?.id).toBe('era5')
    expect(r.notes.some((w) => w.includes('ERA5-Land'))).toBe(true)
    const noon = r.series.startUtcMs.indexOf(Date.UTC(2024, 0, 15, 16))
    expect(r.series.ghiWm2[noon]).toBeCloseTo(400, 6)
    const night = r.series.startUtcMs.indexOf(Date.UTC(2024, 0, 15, 23))
    expect(r.series.ghiWm2[night]).toBeCloseTo(0, 6)
    expect(r.series.windMs[noon]).toBeCloseTo(2.5, 12) // √(1.5² + 2²) at an even hour
  })
})

describe('files without a header row', () => {
  it("a Meteostat bulk file says it has no header row (not 'header on line 0')", () => {
    // Meteostat bulk hourly rows: date,hour,temp,dwpt,rhum,prcp,snow,wdir,wspd,wpgt,pres,tsun,coco
    const rows = Array.from(
      { length: 24 },
      (_, h) =>
        `2023-07-10,${h},${(15 + (h % 12)).toFixed(1)},${(8 + (h % 5) / 2).toFixed(1)},,0.0,,200,${(5 + (h % 7)).toFixed(1)},,1015.0,,2`,
    )
    const r = readWeather(rows.join('\n'), { latitudeDeg: 51.8, longitudeDeg: 9.6, elevationM: 310 })
    expect(r.dialect?.id).toBe('meteostat-bulk')
    expect(r.notes[0]).toMatch(/comma-separated, no header row/)
    expect(r.notes.join('\n')).not.toMatch(/header on line 0/)
  })
})

import { describe, expect, it } from 'vitest'
import { BatchLogError, parseBatchStart, readBatchLog } from '../../../src/analysis/energy/batch-log.ts'
import { FUELS } from '../../../src/drying/fuels.ts'

const HEADER = 'batch_id,start,duration_h,fresh_mass_kg,final_mass_kg,energy_kwh'

describe('batch log reader', () => {
  it('reads rows, converts kWh to MJ (1 kWh = 3.6 MJ, definition) and accounts for every line', () => {
    const text = [
      '# a comment line',
      HEADER,
      'A1,2026-09-01T08:00,5,10000,9000,1200',
      '',
      'A2,2026-09-02 08:30,5,10000,abc,1200',
      'A3,2026-09-03T08:00,5,10000,9100,1000',
      'A4,2026-09-04T08:00,-1,10000,9100,1000',
    ].join('\n')
    const log = readBatchLog(text)
    expect(log.batches.map((b) => b.batchId)).toEqual(['A1', 'A3'])
    expect(log.batches[0].energyMj).toBeCloseTo(4320, 9)
    expect(log.accounting).toEqual({
      rowsRead: 4,
      rowsUsed: 2,
      rowsRejected: 2,
      linesSkipped: 1,
      ignoredColumns: [],
    })
    expect(log.rejections).toEqual([
      {
        line: 5,
        field: 'final_mass_kg',
        value: 'abc',
        message: "line 5: final_mass_kg must be a number, got 'abc'",
      },
      {
        line: 7,
        field: 'duration_h',
        value: '-1',
        message: 'line 7: duration_h must be > 0 and ≤ 720 h, got -1',
      },
    ])
  })
  it('converts fuel quantities with the fuels table (US EIA: 91,333 Btu per US gallon of propane)', () => {
    const text = [
      'start,duration_h,fresh_mass_kg,final_mass_kg,fuel_amount,fuel_unit,fuel',
      '2026-09-01T08:00,5,10000,9000,100,gal,propane',
      '2026-09-01T18:00,5,10000,9000,100,L,propane',
      '2026-09-02T08:00,5,10000,9000,100,ft3,natural-gas',
      '2026-09-02T18:00,5,10000,9000,100,m3,propane',
    ].join('\n')
    const log = readBatchLog(text)
    // 100 gal × 91,333 Btu × 1055.056 J/Btu = 9636.16 MJ (EIA factor; 1 Btu = 1055.056 J, NIST SP 811).
    expect(log.batches[0].energyMj).toBeCloseTo(9636.16, 1)
    expect(log.batches[1].energyMj).toBeCloseTo(100 * FUELS.propane.heatingValueMjPerUnit, 9)
    // 100 ft³ × 1,025 Btu/ft³ (EIA) = 102,500 Btu = 108.14 MJ.
    expect(log.batches[2].energyMj).toBeCloseTo(108.143, 2)
    expect(log.batches[3].energyMj).toBeCloseTo(100_000 * FUELS.propane.heatingValueMjPerUnit, 6)
  })
  it('rejects a fuel unit of the wrong kind, an unknown fuel and a missing energy, each with its line', () => {
    const text = [
      'start,duration_h,fresh_mass_kg,final_mass_kg,fuel_amount,fuel_unit,fuel',
      '2026-09-01T08:00,5,10000,9000,100,kg,propane',
      '2026-09-02T08:00,5,10000,9000,100,L,coal',
      '2026-09-03T08:00,5,10000,9000,,,',
      '2026-09-04T08:00,5,10000,9000,100,L,',
    ].join('\n')
    expect(() => readBatchLog(text)).toThrow(BatchLogError)
    try {
      readBatchLog(text)
    } catch (e) {
      const r = (e as BatchLogError).rejections
      expect(r.map((x) => [x.line, x.field])).toEqual([
        [2, 'fuel_unit'],
        [3, 'fuel'],
        [4, 'energy_kwh'],
        [5, 'fuel'],
      ])
      expect(r[0].message).toMatch(/propane \(LPG\) is measured by volume \(L\), got 'kg'/)
    }
    // The --fuel option fills a missing fuel column.
    const withOption = readBatchLog(
      text.split('\n').slice(0, 1).concat('2026-09-04T08:00,5,10000,9000,100,L,').join('\n'),
      {
        fuel: 'propane',
      },
    )
    expect(withOption.batches).toHaveLength(1)
  })
  it('takes moistures when there is no final weighing: water = m·(w0 − w1)/(1 − w1)', () => {
    const log = readBatchLog(
      'start,duration_h,fresh_mass_kg,initial_moisture_wb_pct,final_moisture_wb_pct,energy_kwh\n2026-09-01T08:00,5,1000,25,15,100\n2026-09-01T08:00,5,1000,15,25,100\n',
    )
    expect(log.batches[0].initialMoistureWbPct).toBe(25)
    expect(log.rejections[0].message).toMatch(
      /line 3: final_moisture_wb_pct must be below initial_moisture_wb_pct \(15\), got 25/,
    )
  })
  it('reads semicolon files with decimal commas', () => {
    const log = readBatchLog(
      'start;duration_h;fresh_mass_kg;final_mass_kg;energy_kwh\n2026-09-01 08:00;5,5;1000;900,5;100,25\n',
    )
    expect(log.batches[0].durationH).toBe(5.5)
    expect(log.batches[0].finalMassKg).toBe(900.5)
    expect(log.batches[0].energyMj).toBeCloseTo(360.9, 9)
  })
  it('names the missing columns of an unusable header', () => {
    expect(() => readBatchLog('start,fresh_mass_kg\n2026-09-01T08:00,10\n')).toThrow(
      /line 1: the header lacks duration_h/,
    )
    expect(() => readBatchLog('start,duration_h,fresh_mass_kg,final_mass_kg\n')).toThrow(
      /energy_kwh or fuel_amount/,
    )
    expect(() => readBatchLog('\n\n')).toThrow(/empty/)
    expect(() => readBatchLog(`${HEADER}\n`)).toThrow(/no batch rows/)
  })
  it('parses ISO 8601 starts, with and without an offset, and refuses impossible dates', () => {
    expect(parseBatchStart('2026-09-01T08:30')).toEqual({
      localMs: Date.UTC(2026, 8, 1, 8, 30),
      offsetHours: null,
    })
    expect(parseBatchStart('2026-09-01T08:30Z')?.offsetHours).toBe(0)
    expect(parseBatchStart('2026-09-01T08:30-05:30')?.offsetHours).toBe(-5.5)
    expect(parseBatchStart('2026-02-30T08:00')).toBeNull()
    expect(parseBatchStart('01/09/2026 08:00')).toBeNull()
  })
})

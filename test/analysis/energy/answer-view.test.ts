import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import {
  buildDriftingSeasonLog,
  TESSABY_DEMO_SEED,
  TESSABY_ELEVATION_M,
} from '../../../climate-demo/energy/drifting-season-model.ts'
import { analyzeEnergyLog } from '../../../src/analysis/energy/energy-chart.ts'
import { chooseAnswerView, PHYSICS_ERROR_TOLERANCE } from '../../../src/analysis/energy/view-choice.ts'
import { signalWithoutOutside } from '../../../src/analysis/energy/weather-range.ts'

describe('which view the answer uses', () => {
  it('physics unless its cross-validated error is more than 1.5 times the regression’s', () => {
    expect(PHYSICS_ERROR_TOLERANCE).toBe(1.5)
    const p = (e: number) => ({ crossValidatedError: e })
    expect(chooseAnswerView(p(0.1), p(0.1), 0, 20).view).toBe('physics')
    expect(chooseAnswerView(p(0.149), p(0.1), 0, 20).view).toBe('physics')
    const reg = chooseAnswerView(p(0.16), p(0.1), 12, 20)
    expect(reg.view).toBe('regression')
    expect(reg.reason).toMatch(
      /markedly worse .*0\.160 against 0\.100 MJ\/kg water.*12 of 20 monitored batches lie outside/,
    )
    expect(chooseAnswerView(null, p(0.1), 0, 20).view).toBe('regression')
    expect(chooseAnswerView(p(0.1), null, 0, 20).view).toBe('physics')
    expect(chooseAnswerView(null, null, 0, 20).view).toBe('raw')
  })
})

describe('a season that moves past the baseline’s weather (invented log, climate-demo/energy/drifting-season-model.ts)', () => {
  // Seed 1 of the study's layout: 20 cool, humid baseline batches, then warmer and drier, +7 % from batch 29.
  const { csv, truth } = buildDriftingSeasonLog({ seed: TESSABY_DEMO_SEED })
  const a = analyzeEnergyLog(csv, { elevationM: TESSABY_ELEVATION_M })
  it('is the committed demo log climate-demo/energy/tessaby-wheat-2026.csv, byte for byte', () => {
    const committed = readFileSync(
      new URL('../../../climate-demo/energy/tessaby-wheat-2026.csv', import.meta.url),
      'utf8',
    )
    expect(committed).toBe(csv)
  })
  it('marks the monitored batches whose weather the baseline never saw', () => {
    const outside = a.outsideBaselineWeather
    expect(outside.slice(0, 20).every((o) => !o)).toBe(true)
    const range = a.baselineWeather!
    a.batches.forEach((b, i) => {
      if (i < 20) return
      const t = b.ambient!.dryBulbC
      const w = b.ambient!.humidityRatioGPerKg
      const beyond =
        t < range.tempC[0] ||
        t > range.tempC[1] ||
        w < range.humidityRatioGPerKg[0] ||
        w > range.humidityRatioGPerKg[1]
      expect(outside[i]).toBe(beyond)
    })
    // Measured on this log: 17 of the 20 monitored batches (23, 24 and every one from 26 on).
    expect(outside.filter(Boolean).length).toBe(17)
    expect(outside.slice(25).every(Boolean)).toBe(true)
    expect(truth[39].outsideTempC).toBeGreaterThan(range.tempC[1])
  })
  it('the answer uses the physics view and its first line names the first faulty batch', () => {
    expect(a.answer.view).toBe('physics')
    expect(a.summary[0]).toMatch(
      /^Answer: the dryer uses more energy per kg of water than expected from batch W26-029 /,
    )
    expect(a.summary[0]).toMatch(/\d+ % likely the first such batch|over 99 % likely the first such batch/)
    expect(a.physics!.finding.changePoint!.batchId).toBe('W26-029')
  })
  it('says whether the signal stands without the batches outside the baseline’s weather', () => {
    expect(a.summary[1]).toMatch(/monitored batches ran in weather the baseline never saw/)
    const r = signalWithoutOutside(a.physics!, a.batches, a.outsideBaselineWeather)
    expect(r).toEqual(a.answer.robustness)
    expect(['stands', 'does-not-stand', 'cannot-check']).toContain(r.verdict)
  })
  it('re-checks the signal without those batches: in a season that stays cool the signal stands', () => {
    // The same seed without the warm drift (every batch cool and humid).
    const cool = buildDriftingSeasonLog({ seed: 1, coolBatches: 40, batches: 40 })
    const b = analyzeEnergyLog(cool.csv, { elevationM: TESSABY_ELEVATION_M, baselineCount: 20 })
    // Measured: 1 monitored batch lies outside; without it the CUSUM still signals, one batch later.
    expect(b.answer.robustness).toMatchObject({
      outside: 1,
      verdict: 'stands',
      firstSignalBatchId: 'W26-031',
    })
    expect(b.summary[1]).toMatch(
      /^1 of 20 monitored batches ran in weather .*the rise signal stands without them/,
    )
  })
  it('warns when the physics view has to assume the drying-air temperature', () => {
    expect(a.warnings.some((w) => /takes the drying-air temperature/.test(w))).toBe(false)
    const withoutTemp = csv
      .split('\n')
      .map((l) =>
        l.startsWith('#') || l === ''
          ? l
          : l
              .split(',')
              .filter((_, j) => j !== 8)
              .join(','),
      )
      .join('\n')
    const b = analyzeEnergyLog(withoutTemp, { elevationM: TESSABY_ELEVATION_M })
    expect(b.warnings).toContain(
      'the physics view takes the drying-air temperature as 60 °C (the default) for 40 batches: the expected heat depends on it, so give drying_temp_c in the log or --drying-temp',
    )
  })
})

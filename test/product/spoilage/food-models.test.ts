import { describe, expect, it } from 'vitest'
import { productById } from '../../../src/product/catalogue.ts'
import {
  COCOA_OTA_WINDOW,
  COFFEE_OTA_WINDOW,
  FISH_EXPOSURE_MAX_C,
  FISH_PATHOGEN_EXPOSURE,
  FISH_PATHOGEN_MIN_AW,
  grainDryMatterLossModel,
  initialSpoilageState,
  isSpoiled,
  mouldFreeDays,
  mouldFreeTimeModel,
  runSpoilage,
  type SpoilageStepInput,
  spoilageHourStepper,
  spoilageModelFor,
  spoilageModels,
} from '../../../src/product/spoilage/index.ts'

const hours = (n: number, input: Omit<SpoilageStepInput, 'hours'>): SpoilageStepInput[] =>
  Array.from({ length: n }, () => ({ ...input, hours: 1 }))

describe('coffee mould and ochratoxin window', () => {
  // FAO 2006 guidelines as quoted (Kornman 2016): at most four days between aw 0.95 and 0.80.
  it('spoils after 96 hours between aw 0.95 and 0.80, not at 95', () => {
    const inWindow = { productTempC: 28, moistureWbPct: 35, waterActivity: 0.9 }
    expect(runSpoilage(COFFEE_OTA_WINDOW, hours(95, inWindow)).spoiledAfterHours).toBeNull()
    expect(runSpoilage(COFFEE_OTA_WINDOW, hours(96, inWindow)).spoiledAfterHours).toBe(96)
  })

  it('does not count hours above 0.95 or below 0.80', () => {
    const wet = hours(200, { productTempC: 28, moistureWbPct: 55, waterActivity: 0.97 })
    const dry = hours(200, { productTempC: 28, moistureWbPct: 11, waterActivity: 0.6 })
    const { state } = runSpoilage(COFFEE_OTA_WINDOW, [...wet, ...dry])
    expect(state.measure).toBe(0)
    expect(state.hours).toBe(400)
  })

  it('counts the window edges (0.80 and 0.95) in', () => {
    const s1 = COFFEE_OTA_WINDOW.step(initialSpoilageState(), {
      productTempC: 25,
      moistureWbPct: 20,
      waterActivity: 0.8,
      hours: 2,
    })
    const s2 = COFFEE_OTA_WINDOW.step(s1, {
      productTempC: 25,
      moistureWbPct: 40,
      waterActivity: 0.95,
      hours: 3,
    })
    expect(s2.measure).toBe(5)
  })

  it('marks the cocoa window as an analogy, not a published cocoa limit', () => {
    expect(COCOA_OTA_WINDOW.source.confidence).toBe('memory')
    expect(COCOA_OTA_WINDOW.spoiledAtSource).toMatch(/analogy/)
  })
})

describe('mould-free time (Seiler; Cauvain & Seiler)', () => {
  it('gives the 27 °C equation of Adams & Moss eq. 3.34: log10 MFSL = 6.42 − 0.0647·ERH', () => {
    for (const erh of [74, 80, 85, 90]) {
      expect(mouldFreeDays(27, erh / 100).days).toBeCloseTo(10 ** (6.42 - 0.0647 * erh), 6)
    }
  })

  it('gives the 21 °C line as reproduced with its table (74 % → 82 d, 80 % → 27 d, 81 % → 22 d)', () => {
    expect(Math.round(mouldFreeDays(21, 0.74).days)).toBe(82)
    expect(Math.round(mouldFreeDays(21, 0.8).days)).toBe(27)
    expect(Math.round(mouldFreeDays(21, 0.81).days)).toBe(22)
  })

  it('agrees within 15 % with quoted madeira-cake mould-free times (aw 0.81: 14 d at 27 °C, 24 d at 21 °C; aw 0.85: 8 d and 12 d)', () => {
    // Dr. Wernecke Feuchtemesstechnik, application note "Water activity of food" (quoted values).
    const cases: [number, number, number][] = [
      [27, 0.81, 14],
      [21, 0.81, 24],
      [27, 0.85, 8],
      [21, 0.85, 12],
    ]
    for (const [t, aw, days] of cases) {
      expect(Math.abs(mouldFreeDays(t, aw).days - days) / days).toBeLessThan(0.15)
    }
  })

  it('interpolates between 21 and 27 °C, holds the 21 °C value below and stops at aw 0.90', () => {
    const d21 = mouldFreeDays(21, 0.85).days
    const d27 = mouldFreeDays(27, 0.85).days
    const d24 = mouldFreeDays(24, 0.85).days
    expect(d24).toBeLessThan(d21)
    expect(d24).toBeGreaterThan(d27)
    expect(mouldFreeDays(10, 0.85).days).toBe(d21)
    expect(mouldFreeDays(27, 0.99).days).toBe(mouldFreeDays(27, 0.9).days)
    expect(mouldFreeDays(27, 0.99).clamped).toBe(true)
    expect(mouldFreeDays(27, 0.55).days).toBe(Number.POSITIVE_INFINITY)
  })

  it('spoils fruit held at aw 0.90 and 27 °C after about four days, hour by hour', () => {
    const model = mouldFreeTimeModel()
    const expectedH = 24 * 10 ** (6.42 - 0.0647 * 90)
    const { spoiledAfterHours } = runSpoilage(
      model,
      hours(200, { productTempC: 27, moistureWbPct: 60, waterActivity: 0.9 }),
    )
    expect(spoiledAfterHours).toBe(Math.ceil(expectedH))
  })

  it('adds fractions: half the mould-free time wet then half at a drier state spoils', () => {
    const model = mouldFreeTimeModel()
    const a = 24 * mouldFreeDays(27, 0.88).days
    const b = 24 * mouldFreeDays(27, 0.78).days
    let s = model.step(initialSpoilageState(), {
      productTempC: 27,
      moistureWbPct: 50,
      waterActivity: 0.88,
      hours: a / 2,
    })
    expect(isSpoiled(model, s)).toBe(false)
    s = model.step(s, { productTempC: 27, moistureWbPct: 30, waterActivity: 0.78, hours: b / 2 })
    expect(s.measure).toBeCloseTo(1, 9)
  })
})

describe('fish: cumulative exposure to pathogen growth (FDA seafood HACCP guidance, App. 4, Table A-2)', () => {
  const model = FISH_PATHOGEN_EXPOSURE
  const at = (productTempC: number, waterActivity: number) => ({
    productTempC,
    moistureWbPct: 75,
    waterActivity,
  })
  const hoursToLimit = (input: Omit<SpoilageStepInput, 'hours'>, n = 200) =>
    runSpoilage(model, hours(n, input)).spoiledAfterHours

  it('names the FDA appendix and the copy it was read in (`transcribed`)', () => {
    expect(model.source.confidence).toBe('transcribed')
    expect(model.source.citation).toMatch(/Fish and Fishery Products Hazards and Controls Guidance/)
    expect(model.source.citation).toMatch(/Appendix 4/)
    expect(model.source.citation).toMatch(/as given in/)
    expect(model.cautions.join(' ')).toMatch(/local food regulations and HACCP/)
  })

  it('reaches the limit after exactly the published hours in each band', () => {
    // FDA 2020, Appendix 4, summary of Table A-2 (raw, ready-to-eat): 2 h when above 21.1 °C (70 °F)
    expect(hoursToLimit(at(25, 0.97))).toBe(2)
    expect(hoursToLimit(at(40, 0.99))).toBe(2)
    expect(hoursToLimit(at(21.2, 0.97))).toBe(2)
    // ibid.: 4 h above 10 °C (50 °F) in all (the summary's own limit for fish never above 21.1 °C, 5 h, is from
    // memory and not used: 4 h is the stricter read limit)
    expect(hoursToLimit(at(15, 0.97))).toBe(4)
    expect(hoursToLimit(at(21.1, 0.97))).toBe(4)
    // 24 h above 4.4 °C (40 °F) for fish never above 10 °C: from memory of the same summary
    expect(hoursToLimit(at(8, 0.97))).toBe(24)
    expect(hoursToLimit(at(10, 0.97))).toBe(24)
  })

  it('counts nothing at or above 57.2 °C (135 °F), at or below 4.4 °C, or below aw 0.83', () => {
    // FDA 2020, App. 4: exposure time is time above 10 °C "but below 135ºF (57.2ºC)"; S. aureus grows down to
    // aw 0.83 (ICMSF 1996, as tabulated by the USDA ARS Pathogen Modeling Program)
    expect(FISH_EXPOSURE_MAX_C).toBe(57.2)
    expect(FISH_PATHOGEN_MIN_AW).toBe(0.83)
    for (const input of [
      at(57.2, 0.99),
      at(65, 0.99),
      at(4.4, 0.99),
      at(0, 0.99),
      at(30, 0.829),
      at(45, 0.7),
    ]) {
      const { state, spoiledAfterHours } = runSpoilage(model, hours(500, input))
      expect(state.measure, JSON.stringify(input)).toBe(0)
      expect(state.hoursAtRisk).toBe(0)
      expect(spoiledAfterHours).toBeNull()
    }
    expect(hoursToLimit(at(57.1, 0.99))).toBe(2)
    expect(hoursToLimit(at(30, 0.83))).toBe(2)
  })

  it('never allows more than the FDA summary: at most 2 h above 21.1 °C and 4 h above 10 °C in all', () => {
    // every sequence of up to 6 hours, each at 25 °C (hot), 15 °C (warm) or 3 °C (cold)
    const temps = [25, 15, 3]
    for (let code = 0; code < 3 ** 6; code++) {
      let c = code
      const seq: SpoilageStepInput[] = []
      for (let i = 0; i < 6; i++) {
        seq.push({ ...at(temps[c % 3] as number, 0.97), hours: 1 })
        c = Math.floor(c / 3)
      }
      let hot = 0
      let warm = 0
      let state = initialSpoilageState()
      for (const input of seq) {
        state = model.step(state, input)
        if (input.productTempC > 21.1) hot++
        else if (input.productTempC > 10) warm++
        const beyondFda = hot > 2 || hot + warm > 4
        if (beyondFda) expect(isSpoiled(model, state), JSON.stringify(seq)).toBe(true)
      }
    }
    // stricter than the summary inside it: 1 h above 21.1 °C and 2 h at 10–21.1 °C (the summary allows up to 4 h)
    expect(runSpoilage(model, [...hours(1, at(25, 0.97)), ...hours(2, at(15, 0.97))]).spoiledAfterHours).toBe(
      3,
    )
  })

  it('adds fractional steps as whole hours do', () => {
    let s = initialSpoilageState()
    for (let i = 0; i < 4; i++) s = model.step(s, { ...at(30, 0.95), hours: 0.5 })
    expect(s.measure).toBe(model.spoiledAt)
    expect(s.hoursAtRisk).toBe(2)
  })
})

describe('model choice per product', () => {
  it('gives each catalogue family its model', () => {
    expect(spoilageModelFor(productById('shelled-corn')).id).toBe('grain-dry-matter-loss')
    expect(spoilageModelFor(productById('rough-rice')).id).toBe('grain-dry-matter-loss')
    expect(spoilageModelFor(productById('soybean')).id).toBe('grain-dry-matter-loss')
    expect(spoilageModelFor(productById('coffee-parchment')).id).toBe('coffee-ota-window')
    expect(spoilageModelFor(productById('cocoa-beans')).id).toBe('cocoa-ota-window')
    expect(spoilageModelFor(productById('apricot-halves')).id).toBe('mould-free-time')
    expect(spoilageModelFor(productById('mint-leaves')).id).toBe('mould-free-time')
    expect(spoilageModelFor(productById('fish-fillets')).id).toBe('fish-pathogen-exposure')
    expect(spoilageModelFor(productById('fish-fillets-salted')).id).toBe('mould-free-time')
  })

  it('lists every model with a source, a threshold and cautions', () => {
    for (const m of spoilageModels()) {
      expect(m.source.citation.length).toBeGreaterThan(10)
      expect(m.spoiledAt).toBeGreaterThan(0)
      expect(m.cautions.length).toBeGreaterThan(0)
    }
  })
})

describe("hour steppers (the batch loop's and the bin's fast path)", () => {
  it('hour steppers (inputs as fields) give the same state as step for every model', () => {
    for (const model of [...spoilageModels(), grainDryMatterLossModel({ damagePct: 12 })]) {
      expect(model.hourStepper, model.id).toBeDefined()
      const fast = spoilageHourStepper(model)
      let state = initialSpoilageState()
      for (let h = 0; h < 300; h++) {
        // 14 … 46 °C across the 42.5 °C cut and the 21–27 °C range; grain 10 … 30 °C (its `step` inverts the DML
        // curve every hour, which overflows once the loss is astronomically past the limit)
        const tC =
          model.id === 'grain-dry-matter-loss' ? 20 + 10 * Math.sin(h / 6) : 30 + 16 * Math.sin(h / 6)
        const m = 30 - h / 25 // 30 → 10 % wb: through the grain model's range and below it
        const aw = 0.99 - h / 600
        state = model.step(state, { productTempC: tC, moistureWbPct: m, waterActivity: aw, hours: 1 })
        fast.productTempC = tC
        fast.moistureWbPct = m
        fast.waterActivity = aw
        fast.stepHour()
      }
      const s = fast.state()
      expect(s.measure / (state.measure || 1), model.id).toBeCloseTo(state.measure === 0 ? 0 : 1, 9)
      expect(s.hoursAtRisk, model.id).toBe(state.hoursAtRisk)
      expect(s.hoursOutsideRange, model.id).toBe(state.hoursOutsideRange)
      expect(s.hours).toBe(300)
      fast.waterActivity = 1.2
      expect(() => fast.stepHour()).toThrow(/waterActivity/)
    }
  })

  it('name their source in short for the start-date table', () => {
    for (const model of spoilageModels()) expect(model.source.short, model.id).toBeTruthy()
  })
})

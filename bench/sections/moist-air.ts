/**
 * @module bench/sections/moist-air
 * Column form of the moist-air state (src/physics/air-columns.ts: W, vapour pressure, dew point, wet
 * bulb, enthalpy, density) against psychrolib 1.1.1's `CalcPsychrometricsFromRelHum` (W, wet bulb, dew
 * point, vapour pressure, enthalpy, volume, degree of saturation) on the same 262,800 generated hours
 * (30 years × 8760 h), measured in the same process.
 *
 * Timing: one warm-up run of each, then {@link REPEATS} timed runs alternating the two; the figures are
 * the median of the timed runs, by wall clock and by process CPU time (the best wall-clock run is
 * printed too). The differences are taken from the last run.
 *
 * Ice convention: our RH is over liquid water at every temperature; psychrolib's is over ice below
 * 0.01 °C. psychrolib is given RH_ice = pw / pws,ice for those hours, and generated sub-zero hours keep
 * pw ≤ pws,ice (psychrolib rejects RH above 1). Below 0.01 °C psychrolib's "dew point" is a frost point:
 * it is compared with our frost point, computed outside the timing.
 */
import psychrolib from 'psychrolib'
import { fillAirStateColumns } from '../../src/physics/air-columns.ts'
import { frostPointFromVaporPressureC, standardPressureKpaAtElevation } from '../../src/physics/moist-air.ts'
import {
  saturationVaporPressureIceKpa,
  saturationVaporPressureLiquidKpa,
  TRIPLE_POINT_C,
} from '../../src/physics/saturation.ts'
import { type BenchFigure, type BenchSection, median, seededRandom } from '../section.ts'

psychrolib.SetUnitSystem(psychrolib.SI)

/** 30 years of hours. */
export const HOURS = 30 * 8760
const REPEATS = 5
const SEED = 20260501

export interface GeneratedHours {
  dryBulbC: Float64Array
  /** RH over liquid water [%] (our convention). */
  relativeHumidityPct: Float64Array
  pressureKpa: Float64Array
  /** The same humidity as psychrolib wants it: fraction, over ice below 0.01 °C. */
  psychrolibRelHum: Float64Array
  pressurePa: Float64Array
}

/**
 * Invented hourly weather, seeded: each year at a different elevation (0–3000 m, so 70–101 kPa by
 * ASHRAE eq 3, ± 1.5 kPa of weather), an annual and a daily temperature cycle with noise (about −15 to
 * 45 °C), and RH falling as the air warms (3–100 %).
 */
export function generateHours(n: number, seed: number): GeneratedHours {
  const rnd = seededRandom(seed)
  const h: GeneratedHours = {
    dryBulbC: new Float64Array(n),
    relativeHumidityPct: new Float64Array(n),
    pressureKpa: new Float64Array(n),
    psychrolibRelHum: new Float64Array(n),
    pressurePa: new Float64Array(n),
  }
  let siteKpa = 101.325
  let meanC = 15
  for (let i = 0; i < n; i++) {
    if (i % 8760 === 0) {
      siteKpa = standardPressureKpaAtElevation(3000 * rnd())
      meanC = 8 + 16 * rnd()
    }
    const day = (i / 24) % 365
    const hour = i % 24
    const t =
      meanC -
      11 * Math.cos((2 * Math.PI * (day - 15)) / 365) -
      6 * Math.cos((2 * Math.PI * (hour - 3)) / 24) +
      6 * (rnd() - 0.5)
    let rh = 62 - 2.2 * (t - meanC) + 40 * (rnd() - 0.5)
    rh = Math.min(100, Math.max(3, rh))
    if (t < TRIPLE_POINT_C) {
      const iceRatio = saturationVaporPressureIceKpa(t) / saturationVaporPressureLiquidKpa(t)
      rh = Math.min(rh, 100 * iceRatio)
    }
    const p = siteKpa + 3 * (rnd() - 0.5)
    h.dryBulbC[i] = t
    h.relativeHumidityPct[i] = rh
    h.pressureKpa[i] = p
    h.pressurePa[i] = p * 1000
    h.psychrolibRelHum[i] =
      t < TRIPLE_POINT_C
        ? Math.min(1, ((rh / 100) * saturationVaporPressureLiquidKpa(t)) / saturationVaporPressureIceKpa(t))
        : rh / 100
  }
  return h
}

function makeOutputs(n: number) {
  return {
    humidityRatioKgPerKg: new Float64Array(n),
    vaporPressureKpa: new Float64Array(n),
    dewPointC: new Float64Array(n),
    wetBulbC: new Float64Array(n),
    enthalpyKjPerKg: new Float64Array(n),
    densityKgPerM3: new Float64Array(n),
  }
}

function runPsychrolib(h: GeneratedHours, out: Float64Array[]): void {
  const [w, twb, tdp, pw, hh, v] = out
  const n = h.dryBulbC.length
  for (let i = 0; i < n; i++) {
    const r = psychrolib.CalcPsychrometricsFromRelHum(h.dryBulbC[i], h.psychrolibRelHum[i], h.pressurePa[i])
    w[i] = r[0]
    twb[i] = r[1]
    tdp[i] = r[2]
    pw[i] = r[3]
    hh[i] = r[4]
    v[i] = r[5]
  }
}

/**
 * Wet bulb by bisection to 1e-9 °C on psychrolib's own `GetHumRatioFromTWetBulb` (eqs 33/35), liquid
 * root first (our documented choice in the two-root band): the exact root both codes approximate.
 */
function exactWetBulbC(t: number, w: number, pPa: number, lowC: number): number {
  let lo = lowC - 1
  let hi = t
  if (t > 0 && psychrolib.GetHumRatioFromTWetBulb(t, 0, pPa) <= w) lo = 0
  else if (t > 0) hi = -1e-12
  for (let k = 0; k < 80 && hi - lo > 1e-9; k++) {
    const m = 0.5 * (lo + hi)
    if (psychrolib.GetHumRatioFromTWetBulb(t, m, pPa) > w) hi = m
    else lo = m
  }
  return 0.5 * (lo + hi)
}

export const section: BenchSection = {
  id: 'moist-air',
  title: `column form vs psychrolib CalcPsychrometricsFromRelHum, ${HOURS.toLocaleString('en-US')} generated hours`,
  run() {
    const h = generateHours(HOURS, SEED)
    const n = HOURS
    const ours = makeOutputs(n)
    const theirs = Array.from({ length: 6 }, () => new Float64Array(n))
    const input = {
      dryBulbC: h.dryBulbC,
      relativeHumidityPct: h.relativeHumidityPct,
      pressureKpa: h.pressureKpa,
    }
    // Warm-up (JIT) of both.
    let invalid = fillAirStateColumns(input, ours)
    runPsychrolib(h, theirs)
    // Wall-clock and process CPU time of each run: on a shared machine other processes stretch the wall
    // clock, while the CPU time counts only what this process ran.
    const oursS: number[] = []
    const theirsS: number[] = []
    const oursCpuS: number[] = []
    const theirsCpuS: number[] = []
    const cpuSeconds = (u: NodeJS.CpuUsage) => (u.user + u.system) / 1e6
    for (let r = 0; r < REPEATS; r++) {
      let c0 = process.cpuUsage()
      let t0 = performance.now()
      invalid = fillAirStateColumns(input, ours)
      oursS.push((performance.now() - t0) / 1000)
      oursCpuS.push(cpuSeconds(process.cpuUsage(c0)))
      c0 = process.cpuUsage()
      t0 = performance.now()
      runPsychrolib(h, theirs)
      theirsS.push((performance.now() - t0) / 1000)
      theirsCpuS.push(cpuSeconds(process.cpuUsage(c0)))
    }
    const oursRate = n / median(oursS)
    const theirsRate = n / median(theirsS)
    const oursCpuRate = n / median(oursCpuS)
    const theirsCpuRate = n / median(theirsCpuS)

    // Differences, from the last run.
    const [pW, pTwb, pTdp, , pH, pV] = theirs
    let wRel = 0
    let hAbs = 0
    let rhoRel = 0
    let dewC = 0
    let frostC = 0
    let frostHours = 0
    let twbC = 0
    let twbBandC = 0
    let bandHours = 0
    const band = new Uint8Array(n)
    for (let i = 0; i < n; i++) {
      const t = h.dryBulbC[i]
      const pPa = h.pressurePa[i]
      const w = ours.humidityRatioKgPerKg[i]
      wRel = Math.max(wRel, Math.abs(w / pW[i] - 1))
      hAbs = Math.max(hAbs, Math.abs(ours.enthalpyKjPerKg[i] - pH[i] / 1000))
      rhoRel = Math.max(rhoRel, Math.abs(ours.densityKgPerM3[i] / ((1 + pW[i]) / pV[i]) - 1))
      if (ours.vaporPressureKpa[i] < saturationVaporPressureLiquidKpa(TRIPLE_POINT_C)) {
        frostHours++
        frostC = Math.max(frostC, Math.abs(frostPointFromVaporPressureC(ours.vaporPressureKpa[i]) - pTdp[i]))
      } else {
        dewC = Math.max(dewC, Math.abs(ours.dewPointC[i] - pTdp[i]))
      }
      const inBand =
        t > 0 &&
        pW[i] >= psychrolib.GetHumRatioFromTWetBulb(t, 0, pPa) &&
        pW[i] <= psychrolib.GetHumRatioFromTWetBulb(t, -1e-9, pPa)
      const d = Math.abs(ours.wetBulbC[i] - pTwb[i])
      if (inBand) {
        band[i] = 1
        bandHours++
        twbBandC = Math.max(twbBandC, d)
      } else {
        twbC = Math.max(twbC, d)
      }
    }
    // Both wet bulbs against the exact root, on every 13th hour outside the two-root band.
    let oursExact = 0
    let theirsExact = 0
    for (let i = 0; i < n; i += 13) {
      const t = h.dryBulbC[i]
      const pPa = h.pressurePa[i]
      if (band[i]) continue
      const exact = exactWetBulbC(t, pW[i], pPa, pTdp[i])
      oursExact = Math.max(oursExact, Math.abs(ours.wetBulbC[i] - exact))
      theirsExact = Math.max(theirsExact, Math.abs(pTwb[i] - exact))
    }
    const note = `median of ${REPEATS} runs after one warm-up`
    const figures: BenchFigure[] = [
      { name: 'hours', value: n, unit: '', note: `seed ${SEED}; ${invalid} invalid` },
      { name: 'column form throughput', value: oursRate, unit: 'states/s', note },
      { name: 'psychrolib throughput', value: theirsRate, unit: 'states/s', note },
      {
        name: 'ratio column / psychrolib',
        value: oursRate / theirsRate,
        unit: 'x',
        note: 'wall clock; target ≥ 20',
      },
      { name: 'column form, CPU time', value: oursCpuRate, unit: 'states/s', note: `${note}, process CPU` },
      { name: 'psychrolib, CPU time', value: theirsCpuRate, unit: 'states/s', note: `${note}, process CPU` },
      { name: 'ratio by CPU time', value: oursCpuRate / theirsCpuRate, unit: 'x', note: 'target ≥ 20' },
      {
        name: 'column form best run',
        value: n / Math.min(...oursS),
        unit: 'states/s',
        note: `best of ${REPEATS}`,
      },
      {
        name: 'psychrolib best run',
        value: n / Math.min(...theirsS),
        unit: 'states/s',
        note: `best of ${REPEATS}`,
      },
      { name: 'max |W rel diff|', value: wRel, unit: '', note: 'all hours' },
      { name: 'max |enthalpy diff|', value: hAbs, unit: 'kJ/kg', note: 'all hours' },
      { name: 'max |density rel diff|', value: rhoRel, unit: '', note: 'psychrolib (1 + W)/v' },
      { name: 'max |dew point diff|', value: dewC, unit: '°C', note: 'hours with dew point ≥ 0.01 °C' },
      {
        name: 'max |frost point diff|',
        value: frostC,
        unit: '°C',
        note: `${frostHours} hours below 0.01 °C`,
      },
      { name: 'max |wet bulb diff|', value: twbC, unit: '°C', note: 'outside the two-root band' },
      {
        name: 'hours in two-root band',
        value: bandHours,
        unit: '',
        note: 'psychrolib may return the ice root',
      },
      {
        name: 'max |wet bulb diff| in band',
        value: twbBandC,
        unit: '°C',
        note: 'our root is the liquid one',
      },
      {
        name: 'column wet bulb vs exact root',
        value: oursExact,
        unit: '°C',
        note: 'every 13th hour, bisection 1e-9',
      },
      { name: 'psychrolib wet bulb vs exact root', value: theirsExact, unit: '°C', note: 'same hours' },
    ]
    return figures
  },
}

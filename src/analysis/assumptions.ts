/**
 * @module analysis/assumptions
 * Every threshold, default and model choice behind an assessment, stated with its source, so that a
 * reader can see (and change) what the figures rest on.
 */

import { methodModel } from '../drying/methods/index.ts'
import { HOUR_STATUS_MEANINGS, HOUR_STATUS_WORDS, type HourStatusName } from '../drying/usable-hour.ts'
import type { ResolvedAssessOptions } from './assess-options.ts'
import type { Assumption } from './assessment.ts'
import { MONTH_COVERAGE_REQUIRED } from './monthly-tables.ts'
import { GOOD_START_PROBABILITY } from './start-dates.ts'
import { PERCENTILE_CONVENTION } from './statistics.ts'

export function assessmentAssumptions(run: ResolvedAssessOptions): Assumption[] {
  const { method, backupMethod: heater, thresholds: t, profile, loadingKgPerM2 } = run
  const thicknessMm = run.product.thicknessMm
  const list: Assumption[] = [
    { name: 'percentiles', value: PERCENTILE_CONVENTION, source: 'Hyndman & Fan 1996, Am. Stat. 50:361' },
    {
      name: 'usable drying hour',
      value:
        'the air at the product (at the product temperature) has an equilibrium moisture below the target, a humidity-ratio deficit to the equilibrium RH at target of at least the threshold, no rain on an exposed product, and the product temperature within its limits',
      source: 'dryhours model, docs/model.md §6',
    },
    ...(Object.entries(HOUR_STATUS_MEANINGS) as [HourStatusName, string][]).map(([name, meaning]) => ({
      name: `hour ${name === 'usable' ? 'that dries' : `not drying: ${HOUR_STATUS_WORDS[name]}`}`,
      value: meaning,
      source: 'definition',
    })),
    {
      name: 'minimum product temperature',
      value: `${t.minProductTempC} °C`,
      source: 'common practice, no source',
    },
    { name: 'minimum deficit', value: `${t.minDeficitGPerKg} g/kg`, source: 'assumption, no source' },
    { name: 'rain threshold', value: `${t.rainMm} mm/h`, source: 'tipping-bucket resolution (from memory)' },
    {
      name: 'night sky cooling of exposed surfaces',
      value: `${t.nightSurfaceCoolingK} K`,
      source: 'common practice, no source',
    },
    { name: 'night', value: `sun altitude below ${t.nightSunAltitudeDeg}°`, source: 'suncalc 2 convention' },
    {
      name: 'month coverage',
      value: `a month-year enters the statistics with at least ${MONTH_COVERAGE_REQUIRED * 100} % of its hours`,
      source: 'assumption',
    },
    {
      name: 'isotherm',
      value: `${profile.isotherm.desorption.equation.model} (desorption)${profile.isotherm.adsorption ? `, ${profile.isotherm.adsorption.equation.model} (adsorption)` : ', same constants for rewetting'}`,
      source: profile.isotherm.desorption.source,
    },
    {
      name: 'kinetics',
      value: `${profile.kinetics.equation.model}, stepped by equivalent time, at ${thicknessMm} mm`,
      source: profile.kinetics.source,
    },
    {
      name: 'rewetting',
      value: `first order toward the adsorption equilibrium at ${profile.kinetics.rewettingRateFactor.value} × the drying rate`,
      source: profile.kinetics.rewettingRateFactor.source,
    },
    {
      name: 'constant-rate limit',
      value:
        'water removed per hour ≤ wet-surface evaporation per m² ÷ dry matter per m² (exposed) or ≤ deficit to saturation × air mass (forced air)',
      source: 'docs/model.md §5, §7',
    },
    { name: 'loading', value: `${loadingKgPerM2} kg fresh per m²`, source: 'method or product default' },
    {
      name: 'supplemental heat',
      value: `a forced-air dryer at ${heater.airFlowKgPerSPerTonne} kg dry air s⁻¹ t⁻¹ heated ${heater.setPointC !== undefined ? `to ${heater.setPointC} °C` : `to ${heater.targetRhPct.toFixed(0)} % RH, never below ${heater.minAirC} °C`} (capped at the product limit), used in every hour the method's own air does not dry; if that misses the deadline, heated every hour`,
      source: 'docs/model.md §8; defaults of the heated method (assumptions)',
    },
    {
      name: 'heater efficiency',
      value: `${heater.heaterEfficiency} of the fuel's higher heating value reaches the air`,
      source: 'indirect-fired heater mid-range (from memory)',
    },
    {
      name: 'best start windows',
      value: `runs of start dates finishing within the deadline in ≥ ${GOOD_START_PROBABILITY * 100} % of years`,
      source: 'assumption',
    },
    {
      name: 'fuel prices',
      value: 'examples only unless given; not market data',
      source: 'user input',
    },
  ]
  const product = { id: profile.id, name: profile.name, category: profile.category }
  return [...list, ...methodModel(method.kind).assumptions(method, product)]
}

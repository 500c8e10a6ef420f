/**
 * @module api/schemas/responses/bin
 * `assessment.bin` (grain in a natural-air bin, analysis/assessment-bin.ts) and a bin's figures among the
 * methods side by side (analysis/compare-methods-bin.ts), with the unit of every field. Built on first use.
 */
import { z } from 'zod'
import type { BinAssessment } from '../../../analysis/assessment-bin.ts'
import type { MethodBinFigures } from '../../../analysis/compare-methods-bin.ts'
import { count, medianP90, num, numOrNull, once, text, texts } from './common.ts'

/** One start date at one airflow, across years. */
const binStartSchema = once(() =>
  z.strictObject({
    startDate: text("filling (start) date, local standard time ['MM-DD']"),
    month: z.number().int().min(1).max(12).describe('month of the start date [1–12]'),
    airflowM3PerMinPerTonne: num('airflow [m³/min per tonne of grain as loaded]'),
    airflowCfmPerBushel: num('the same airflow [cfm per bushel]'),
    years: count('years with a run'),
    yearsTopLayerDryWithinSeason: count('years the top layer dried within the season'),
    yearsDryMatterLossLimitExceeded: count("years the top layer's dry-matter loss passed the limit"),
    yearsSafe: count('years dry within the season and below the limit'),
    shareOfYearsSafe: num('share of the years that are safe [0–1]'),
    meetsRequiredShare: z.boolean().describe('safe in at least the required share of years'),
    daysUntilTopLayerDry: medianP90('days', 'across years').describe(
      'days until the top layer is dry [days]; null: not within the season',
    ),
    topLayerDryMatterLossPct: medianP90('%', 'across years').describe("the top layer's dry-matter loss [%]"),
    passesDryMatterLossLimitP90: z
      .boolean()
      .describe("the top layer's P90 dry-matter loss is below the limit"),
    fanEnergyKwhPerTonne: medianP90('kWh per tonne', 'across years').describe(
      'fan electricity [kWh per tonne]',
    ),
    heaterEnergyKwhPerTonne: medianP90('kWh per tonne', 'across years').describe(
      "the heater's heat into the air [kWh per tonne]",
    ),
    waterRemovedKgPerTonne: medianP90('kg per tonne', 'across years').describe(
      'water removed from the whole bin by the time the top layer is dry or the season ends [kg per tonne]',
    ),
    byYear: z.array(
      z.strictObject({
        year: num('calendar year [year]'),
        daysUntilTopLayerDry: numOrNull(
          'days until the top layer was dry [days]; null: not within the season',
        ),
        topLayerDryMatterLossPct: num("the top layer's dry-matter loss [%]"),
        passesDryMatterLossLimit: z.boolean().describe('the top layer stayed below the limit'),
        fanEnergyKwhPerTonne: num('fan electricity [kWh per tonne]'),
        heaterEnergyKwhPerTonne: num("the heater's heat into the air [kWh per tonne]"),
        safe: z.boolean().describe('dry within the season and below the limit'),
      }),
    ),
  }),
)

/** The bin, its grain and its spoilage model. */
const binSetupSchemas = once(() => ({
  model: z.strictObject({
    id: z.literal('equilibrium-deep-bed').describe('the deep-bed model'),
    description: text('the model in words'),
    source: text('its sources'),
    limits: texts('what the model leaves out'),
  }),
  grain: z.strictObject({
    bulkDensityKgPerM3: num('bulk density as loaded [kg/m³]'),
    bushelKg: num('US standard bushel weight of this grain [kg]'),
    airflowResistanceSource: text('source of the airflow resistance'),
  }),
  bin: z.strictObject({
    depthM: num('grain depth [m]'),
    floorAreaM2: num('floor area [m²]'),
    diameterM: numOrNull('diameter [m]; null when a floor area was given'),
    grainTonnes: num('grain in the bin [t]'),
    bushels: num('grain in the bin [bushels]'),
    layers: count('layers of the model'),
    fanEfficiency: num('fan and motor efficiency [0–1]'),
    fanHeatToAir: z.boolean().describe('fan and motor heat warms the air'),
    heatRiseK: num('temperature rise from the heater [K]'),
    heaterOnAboveRhPct: numOrNull('the heater runs above this RH [%]; null: in every fan hour'),
    fanControl: text('when the fan runs, in words'),
  }),
  spoilage: z.strictObject({
    modelId: text('spoilage model id'),
    model: text('the model in words'),
    source: text('its source'),
    dryMatterLossLimitPct: num("the top layer's dry-matter loss limit [%]"),
    limitSource: text('source of the limit'),
    validity: text('where the model holds'),
  }),
}))

/** `assessment.bin`: grain in a natural-air bin. */
export const binAssessmentSchema = once(() => {
  const setup = binSetupSchemas()
  return z
    .strictObject({
      ...setup,
      seasonDays: num('longest run from a start date [days]'),
      requiredShareOfYears: num('share of years that must be safe [0–1]'),
      rule: text('the rule that decides "safe" and the minimum airflow'),
      typicalYear: z.boolean().describe('the file is a typical year'),
      years: z.array(num('calendar year [year]')),
      airflows: z.array(
        z.strictObject({
          airflowM3PerMinPerTonne: num('airflow [m³/min per tonne as loaded]'),
          airflowCfmPerBushel: num('the same [cfm per bushel]'),
          airflowM3PerMin: num('air through the whole bin [m³/min]'),
          staticPressurePa: num('static pressure [Pa]'),
          staticPressureInchesWater: num('static pressure [inches of water]'),
          fanPowerKw: num('fan power [kW]'),
          fanPowerKwPerTonne: num('fan power [kW per tonne]'),
        }),
      ),
      startDates: z.array(binStartSchema()).describe('per start date and airflow'),
      minimumAirflowByMonth: z.array(
        z.strictObject({
          month: z.number().int().min(1).max(12).describe('start month [1–12]'),
          startDates: z.array(text("start date ['MM-DD']")),
          minimumAirflowM3PerMinPerTonne: numOrNull(
            'smallest airflow safe often enough at every start date of the month [m³/min per t]; null: none',
          ),
          minimumAirflowCfmPerBushel: numOrNull('the same [cfm per bushel]'),
          shareOfYearsSafe: num('share of safe years at that airflow [0–1]'),
          years: count('years'),
        }),
      ),
      runs: count('runs of the deep-bed model'),
      runsLeftOut: count('runs left out (season past the end of the file, or no weather on the first day)'),
      cautions: texts('cautions that go with every bin answer'),
    })
    .optional()
    .describe('grain in a natural-air bin; absent for batch methods')
})

/** A bin among the methods side by side. */
export const methodBinFiguresSchema = once(() =>
  z
    .strictObject({
      airflowM3PerMinPerTonne: num('the airflow of the figures [m³/min per tonne as loaded]'),
      airflowCfmPerBushel: num('the same [cfm per bushel]'),
      airflowRule: text('how that airflow was chosen'),
      fanEnergyKwhPerTonne: numOrNull('fan electricity, median over the start dates [kWh per tonne]'),
      fanCostPerTonne: numOrNull("that electricity's cost, part of the method's cost [currency per tonne]"),
      electricityPricePerKwh: num('electricity price [currency per kWh]'),
      electricityPriceIsExample: z.boolean().describe('the electricity price is an example'),
      meaning: text('what "finishes in time" and "spoils first" mean for a bin'),
    })
    .nullable()
    .describe('grain in a bin: the airflow of the figures and its fan; null for batch methods'),
)

/** Compile-time checks that the schemas describe the analysis types (see assessment.ts). */
type Describes<T, S extends T> = S
export type BinDescribed = Describes<
  BinAssessment,
  NonNullable<z.output<ReturnType<typeof binAssessmentSchema>>>
>
export type MethodBinDescribed = Describes<
  MethodBinFigures,
  NonNullable<z.output<ReturnType<typeof methodBinFiguresSchema>>>
>

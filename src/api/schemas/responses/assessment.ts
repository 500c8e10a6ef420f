/**
 * @module api/schemas/responses/assessment
 * The answers of POST /v1/assess (one method: the assessment; several: the methods side by side) and
 * POST /v1/compare, with the unit of every field. The same objects as `dryhours assess --json` and
 * `dryhours compare --json` (analysis/assessment.ts, analysis/compare-methods.ts, analysis/compare.ts).
 */
import { z } from 'zod'
import type { Assessment } from '../../../analysis/assessment.ts'
import type { Comparison } from '../../../analysis/compare.ts'
import { COMPARE_CRITERIA } from '../../../analysis/compare.ts'
import { CALENDAR_STATES, type MethodComparison } from '../../../analysis/compare-methods.ts'
import { FUEL_IDS } from '../../../drying/fuels.ts'
import { DRYING_METHOD_KINDS, type DryingMethodKind } from '../../../drying/method.ts'
import { METHOD_MODELS } from '../../../drying/methods/index.ts'
import { HOUR_STATUS_NAMES, type HourStatusName } from '../../../drying/usable-hour.ts'
import {
  count,
  medianP90,
  monthDay,
  num,
  numOrNull,
  once,
  parametersSchema,
  spreadSchema,
  text,
  texts,
} from './common.ts'

function buildAssessmentSchemas() {
  const kindSchema = z
    .enum(DRYING_METHOD_KINDS as unknown as [DryingMethodKind, ...DryingMethodKind[]])
    .describe('drying method kind')

  const share = (what: string) => numOrNull(`${what} [0–1]`)

  const assessmentSiteSchema = z
    .strictObject({
      name: text('site name (from the options, the file, or the file name)'),
      latitudeDeg: numOrNull('latitude [° N]'),
      longitudeDeg: numOrNull('longitude [° E, west negative]'),
      elevationM: numOrNull('elevation [m]'),
      utcOffsetHours: num("offset of the site's local standard time from UTC [h]"),
      utcOffsetSource: z
        .enum(['option', 'file', 'timestamps', 'longitude', 'assumed-utc'])
        .describe("where the site's clock came from"),
      typicalYear: z.boolean().describe('the file is a typical year (one constructed year)'),
    })
    .describe('the site')

  const assessmentProductSchema = z.strictObject({
    id: text('product id'),
    name: text('product name'),
    initialMoistureWbPct: num('initial moisture, wet basis [%]'),
    targetMoistureWbPct: num('target moisture, wet basis [%]'),
    targetErhPctAt25C: num('equilibrium relative humidity at the target moisture, 25 °C, desorption [%]'),
    maxProductTempC: numOrNull('highest product temperature allowed [°C]; null: no limit'),
    thicknessMm: num('product thickness [mm]'),
    loadingKgPerM2: num('product loading [kg fresh per m²]'),
    cautions: texts('food-safety and handling cautions of the product'),
  })

  /** The method as applied: its kind and every parameter with the unit its name carries. */
  const methodResponseSchema = z
    .discriminatedUnion(
      'kind',
      METHOD_MODELS.map((m) => parametersSchema(m.schema.shape, m.kind)) as unknown as [
        z.ZodObject<{ kind: z.ZodLiteral<string> }>,
        ...z.ZodObject<{ kind: z.ZodLiteral<string> }>[],
      ],
    )
    .describe('the drying method and its parameters as applied (defaults filled in; docs/model.md §4)')

  const reasonsSchema = (unit: string) =>
    z
      .strictObject(
        Object.fromEntries(HOUR_STATUS_NAMES.map((r) => [r, num(`hours ${r} [${unit}]`)])) as Record<
          HourStatusName,
          z.ZodNumber
        >,
      )
      .describe(`hours per verdict (usable, or the reason an hour is not usable) [${unit}]`)

  const monthlyRowSchema = z.strictObject({
    month: z.number().int().min(1).max(12).describe('month of the year [1–12]'),
    usableHours: z
      .strictObject({
        median: numOrNull('median across years [h]'),
        p10: numOrNull('10th percentile across years [h]'),
        p90: numOrNull('90th percentile across years [h]'),
        byYear: z
          .array(z.strictObject({ year: num('calendar year [year]'), hours: num('usable drying hours [h]') }))
          .describe('usable hours of the month in each year with enough data'),
      })
      .describe('usable drying hours in the month [h]'),
    usableFraction: share("usable share of the month's hours with data, all years pooled"),
    medianHoursByReason: reasonsSchema('h, median across years'),
    meanDaytimeDeficitToTargetGPerKg: numOrNull(
      "mean humidity-ratio deficit to the product's equilibrium RH at target, daylight hours [g/kg dry air]",
    ),
    meanEvaporationKgPerM2Day: numOrNull(
      'wet-surface evaporation per day while exposed (exposed methods) [kg m⁻² d⁻¹]',
    ),
    supplementalHeatKwhPerTonne: spreadSchema('kWh per tonne fresh', 'across years').describe(
      'heat to reach the target by the deadline, batches from the 1st and 16th [kWh per tonne fresh]',
    ),
    medianDaysToTarget: numOrNull('median days to target of those batches [days]'),
    yearsWithData: count('years with enough data in the month'),
  })

  const startDateRowSchema = z.strictObject({
    start: monthDay('start date, local'),
    years: count('years with a complete batch from this start'),
    daysToTarget: medianP90('days', 'across years').describe(
      'days to target by the method alone [days]; null: not within the maximum duration',
    ),
    probabilityWithinDeadline: num('share of years finishing within the deadline by the method alone [0–1]'),
    probabilityWithinMaxDuration: num('share of years finishing within the maximum duration [0–1]'),
    rewettingHours: medianP90('h', 'across years').describe('hours in which the product gained water [h]'),
    rainExposureHours: medianP90('h', 'across years').describe('hours exposed to rain [h]'),
    supplementalHeat: z.strictObject({
      medianKwhPerTonne: numOrNull(
        'median heat into the air to finish by the deadline [kWh per tonne fresh]',
      ),
      p90KwhPerTonne: numOrNull('90th percentile of that heat [kWh per tonne fresh]'),
      yearsNeedingHeat: count('years that needed heat'),
    }),
    yearsNotReachable: count('years in which even heating every hour missed the deadline'),
    solarHeatKwhPerTonne: medianP90('kWh per tonne fresh', 'across years').describe(
      'solar collector heat used by the method alone [kWh per tonne fresh]',
    ),
  })

  const fuelFigureSchema = z.strictObject({
    fuel: z.enum(FUEL_IDS).describe('fuel id'),
    name: text('the fuel in words'),
    unit: text('the unit the fuel is sold in (L, m³, kg, kWh)'),
    quantityPerTonne: numOrNull('fuel at the median heat [fuel unit per tonne fresh]'),
    quantityPerBatch: numOrNull('fuel at the median heat [fuel unit per batch]'),
    costPerTonne: numOrNull('fuel cost at the median heat [currency per tonne fresh]'),
    costPerBatch: numOrNull('fuel cost at the median heat [currency per batch]'),
    pricePerUnit: num('price [currency per fuel unit]'),
    priceIsExample: z.boolean().describe('the price is an example, not given by the user'),
    heatingValueMjPerUnit: num('higher heating value [MJ per fuel unit]'),
    heatingValueSource: text('source of the heating value'),
  })

  const heatSummarySchema = z.strictObject({
    heaterEfficiency: num('heater efficiency, higher heating value basis [0–1]'),
    airFlowKgPerSPerTonne: num('air flow of the heater [kg of air per second per tonne fresh]'),
    targetRhPct: numOrNull('relative humidity the heater heats the air to [%]; null with a set point'),
    setPointC: numOrNull('heated air temperature [°C]; null when heating to a target RH'),
    batchKgFresh: num('batch size [kg fresh]'),
    heatToAirKwhPerTonne: spreadSchema('kWh per tonne fresh', "across the season's batches"),
    heatToAirKwhPerBatch: spreadSchema('kWh per batch', "across the season's batches"),
    fuelHeatKwhPerTonne: spreadSchema('kWh of fuel heat per tonne fresh', "across the season's batches"),
    fuels: z.array(fuelFigureSchema).describe('quantity and cost of every fuel at the median heat'),
    selectedFuel: z.enum(FUEL_IDS).describe('the fuel of the heater'),
    currency: z
      .string()
      .nullable()
      .describe('the currency of prices and costs as named by the user; null: not named'),
    crossCheck: z.strictObject({
      waterToRemoveKgPerTonne: num('water to remove [kg per tonne fresh]'),
      heatOfEvaporationKjPerKg: num('latent heat plus net heat of sorption at the target [kJ per kg water]'),
      heatOfEvaporationMethod: text('how the heat of evaporation was obtained'),
      evaporationHeatFuelKwhPerTonne: num('water × heat of evaporation ÷ efficiency [kWh per tonne fresh]'),
      ratioHeatedEveryHour: numOrNull('fuel heat of batches heated every hour ÷ the figure above [ratio]'),
      note: text('what the ratio means'),
    }),
  })

  const psychrometricSchema = z.strictObject({
    binDryBulbC: num('width of a dry-bulb bin [K]'),
    binHumidityRatioGPerKg: num('height of a humidity-ratio bin [g/kg dry air]'),
    dryBulbRangeC: z
      .tuple([num('lowest bin edge [°C]'), num('highest bin edge [°C]')])
      .describe('plotted dry-bulb range [°C]'),
    humidityRatioMaxGPerKg: num('top of the humidity-ratio axis [g/kg dry air]'),
    cells: z
      .array(
        z.strictObject({
          dryBulbC: num('lower edge of the dry-bulb bin [°C]'),
          humidityRatioGPerKg: num('lower edge of the humidity-ratio bin [g/kg dry air]'),
          hours: num('hours in the cell [h]'),
        }),
      )
      .describe("the site's hours binned by dry bulb and humidity ratio"),
    hoursCounted: num('hours binned [h]'),
    pressureKpa: num('median station pressure of those hours [kPa]'),
    region: z
      .array(
        z.strictObject({
          dryBulbC: num('dry bulb [°C]'),
          humidityRatioGPerKg: num('humidity ratio [g/kg dry air]'),
        }),
      )
      .describe('boundary of the air that dries the product to its target'),
    shareOfHoursInRegion: share('share of binned hours under that boundary'),
    rhCurveDryBulbC: z.array(num('dry bulb [°C]')).describe('dry bulbs of the RH curves [°C]'),
    rhCurves: z.array(
      z.strictObject({
        rhPct: num('relative humidity of the curve [%]'),
        humidityRatioGPerKg: z.array(num('humidity ratio [g/kg dry air]')),
      }),
    ),
  })

  const coverageSchema = z.strictObject({
    firstHourUtc: text('first hour of the series [ISO 8601, UTC]'),
    lastHourUtc: text('last hour of the series [ISO 8601, UTC]'),
    hours: count('hours in the series'),
    missingHours: count('hours without dry bulb or humidity'),
    years: z.array(num('calendar year [year]')).describe('years with enough data'),
    monthCoverageRequired: num("share of a month's hours a month-year needs to enter the statistics [0–1]"),
    assumedIrradianceHours: count('daylight hours whose irradiance was taken as 0'),
    estimatedIrradianceHours: count('daylight hours whose irradiance the reader estimated'),
    assumedWindHours: count('hours with an assumed wind speed'),
    hasRainData: z.boolean().describe('the file has rain'),
    startDateBatchesRun: count('batches run for the start-date table'),
    startDateBatchesSkippedForData: count('batches skipped for missing data'),
  })

  const assessmentResponseSchema = z
    .strictObject({
      schema: z.literal('dryhours.assessment/1').describe('the shape of this object'),
      site: assessmentSiteSchema,
      product: assessmentProductSchema,
      method: methodResponseSchema,
      methodLabel: text('the method in plain words'),
      season: z.strictObject({
        start: monthDay('first start date'),
        end: monthDay('last start date'),
        stepDays: num('days between start dates [days]'),
        startHourLocal: num('local hour at which batches start [h, 0–23]'),
      }),
      deadlineDays: num('the window to reach the target [days]'),
      maxDays: num('a batch counts as failed after this long [days]'),
      monthly: z.array(monthlyRowSchema).describe('one row per month'),
      hourOfDay: z.strictObject({
        hours: z.array(num('local hour, start of the hour [h, 0–23]')),
        months: z.array(num('month [1–12]')),
        usableFraction: z
          .array(z.array(numOrNull('usable share [0–1]')))
          .describe('usable share by month (rows) and hour (columns) [0–1]'),
      }),
      hoursByReason: reasonsSchema('h, whole file'),
      startDates: z.array(startDateRowSchema).describe('one row per start date of the season'),
      bestStartWindows: z.array(
        z.strictObject({
          from: monthDay('first start date of the window'),
          to: monthDay('last start date of the window'),
          days: count('start dates in the window'),
          minProbabilityWithinDeadline: num('lowest share of years finishing within the deadline [0–1]'),
          medianDaysToTarget: numOrNull('median days to target in the window [days]'),
        }),
      ),
      bestStartWindowCriterion: text('how the windows were chosen'),
      heat: heatSummarySchema,
      psychrometric: psychrometricSchema,
      assumptions: z.array(
        z.strictObject({
          name: text('what is assumed'),
          value: text('the value, with its unit'),
          source: text('its source'),
        }),
      ),
      warnings: texts('what limits the answer, in words'),
      coverage: coverageSchema,
    })
    .describe('the seasonal assessment of one site, one product and one method')

  const methodFiguresSchema = z.strictObject({
    kind: kindSchema,
    label: text('the method in plain words'),
    daysToTarget: medianP90('days', "over the season's start dates").describe(
      "days to target by the method alone: median of the start dates' medians and of their P90s [days]",
    ),
    probabilityWithinDeadline: share(
      "share of years finishing within the deadline, mean over the season's start dates",
    ),
    spoilageProbability: share(
      'share of years spoiling before dry, mean over the start dates; null: not assessed',
    ),
    heatToAirKwhPerTonne: spreadSchema('kWh per tonne fresh', "across the season's batches"),
    fuelHeatKwhPerTonne: numOrNull('fuel heat at the median [kWh per tonne fresh]'),
    fuel: z.strictObject({
      id: text('fuel id'),
      name: text('the fuel in words'),
      unit: text('the unit the fuel is sold in'),
      quantityPerTonne: numOrNull('fuel at the median heat [fuel unit per tonne fresh]'),
      pricePerUnit: num('price [currency per fuel unit]'),
      priceIsExample: z.boolean().describe('the price is an example'),
    }),
    costPerTonneFresh: numOrNull('fuel cost at the median heat [currency per tonne fresh]'),
    costPerKgDried: numOrNull('fuel cost at the median heat [currency per kg of dried product]'),
  })

  const methodComparisonResponseSchema = z
    .strictObject({
      schema: z.literal('dryhours.method-comparison/1').describe('the shape of this object'),
      site: assessmentSiteSchema,
      product: assessmentProductSchema,
      season: z.strictObject({
        start: monthDay('first start date'),
        end: monthDay('last start date'),
        stepDays: num('days between start dates [days]'),
        startHourLocal: num('local hour at which batches start [h, 0–23]'),
      }),
      deadlineDays: num('the window to reach the target [days]'),
      maxDays: num('a batch counts as failed after this long [days]'),
      driedKgPerTonneFresh: num('dried product from one tonne of fresh product [kg]'),
      currency: z
        .string()
        .nullable()
        .describe('the currency of the costs as named by the user; null: not named'),
      costNote: text('what the costs include'),
      spoilageAssessed: z.boolean().describe('whether any method carries a spoilage model'),
      methods: z.array(methodFiguresSchema).describe('one entry per method, in the order asked'),
      notAssessed: z
        .array(z.strictObject({ kind: kindSchema, reason: text('why the file cannot serve it') }))
        .describe('methods of "all" this file cannot serve'),
      calendar: z.strictObject({
        weekStarts: z.array(monthDay('first start date of the week')),
        rows: z.array(
          z.strictObject({
            kind: kindSchema,
            label: text('the method in plain words'),
            cells: z.array(z.enum(CALENDAR_STATES)).describe('the state of each week'),
            probabilityWithinDeadline: z
              .array(numOrNull('share of years finishing within the deadline, mean over the week [0–1]'))
              .describe('per week [0–1]'),
            spoilageProbability: z
              .array(numOrNull('share of years spoiling first, mean over the week [0–1]'))
              .describe('per week [0–1]; null: not assessed or no data'),
          }),
        ),
        rules: z.array(
          z.strictObject({
            state: z.enum(CALENDAR_STATES).describe('calendar state'),
            rule: text('the rule of the state'),
          }),
        ),
      }),
      recommendation: z.strictObject({
        kind: kindSchema.nullable().describe('the recommended method; null when none meets the criterion'),
        text: text('the recommendation in one line'),
        criterion: text('the criterion, in words'),
      }),
      assessments: z
        .array(assessmentResponseSchema)
        .describe("every method's full assessment, in the order of methods"),
    })
    .describe('several methods on one site side by side')

  const comparisonResponseSchema = z
    .strictObject({
      schema: z.literal('dryhours.comparison/1').describe('the shape of this object'),
      criterion: z.enum(COMPARE_CRITERIA).describe('the ranking criterion'),
      criterionDescription: text('the criterion in words'),
      tieBreak: text('how ties are broken'),
      caveats: texts('cautions on the ranking (typical years against multi-year files)'),
      product: assessmentProductSchema,
      method: methodResponseSchema,
      season: z.strictObject({
        start: monthDay('first start date'),
        end: monthDay('last start date'),
        stepDays: num('days between start dates [days]'),
        startHourLocal: num('local hour at which batches start [h, 0–23]'),
      }),
      deadlineDays: num('the window to reach the target [days]'),
      sites: z
        .array(
          z.strictObject({
            rank: count('rank, 1 = best'),
            site: text("the site's label (its name, or its file's name)"),
            file: z.string().nullable().describe('its weather file'),
            given: count('position in the order given, from 0'),
            typicalYear: z.boolean().describe('the file is a typical year'),
            years: count('years with data'),
            decidedBy: z
              .enum([...COMPARE_CRITERIA, 'order-given'])
              .nullable()
              .describe('the criterion that placed this site below the one above; null for the first'),
            usableHoursInSeasonP10: numOrNull('usable hours in the season, P10 across years [h]'),
            usableHoursInSeasonMedian: numOrNull('usable hours in the season, median across years [h]'),
            meanProbabilityWithinDeadline: share(
              'share of years finishing within the deadline, mean over start dates',
            ),
            medianHeatKwhPerTonne: numOrNull('median supplemental heat [kWh per tonne fresh]'),
            bestStartWindow: z.string().nullable().describe("the best start window, 'MM-DD to MM-DD'"),
            warnings: texts("the site's warnings"),
          }),
        )
        .describe('the sites, best first'),
      assessments: z
        .array(assessmentResponseSchema)
        .describe("each site's assessment, in the order of sites"),
    })
    .describe('several sites ranked by a stated criterion')

  return { assessmentResponseSchema, methodComparisonResponseSchema, comparisonResponseSchema }
}

/** The schemas, built on first use (GET /openapi.json, GET /docs, tests) and kept. */
export const assessmentSchemas = once(buildAssessmentSchemas)

/**
 * Compile-time check that the schemas describe the analysis types: a field added to an analysis type and
 * not documented here fails the type check (a field documented here but absent from the answers fails the
 * response test). The method is checked per kind by its own schema.
 */
type Describes<T, S extends T> = S
export type AssessmentDescribed = Describes<
  Omit<Assessment, 'method'>,
  z.output<ReturnType<typeof assessmentSchemas>['assessmentResponseSchema']>
>
export type MethodComparisonDescribed = Describes<
  Omit<MethodComparison, 'assessments'>,
  z.output<ReturnType<typeof assessmentSchemas>['methodComparisonResponseSchema']>
>
export type ComparisonDescribed = Describes<
  Omit<Comparison, 'assessments' | 'method'>,
  z.output<ReturnType<typeof assessmentSchemas>['comparisonResponseSchema']>
>

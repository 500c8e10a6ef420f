/**
 * @module api/schemas/responses/assessment
 * The answer of POST /v1/assess for one method (the assessment), with the unit of every field, and the
 * parts the comparisons share with it (responses/comparison.ts). The same object as `dryhours assess
 * --json` (analysis/assessment.ts). Each part is built on first use (GET /openapi.json, GET /docs, tests)
 * and kept: building them at import cost a worker thread about 2.8 MiB of its heap.
 */
import { z } from 'zod'
import type { Assessment } from '../../../analysis/assessment.ts'
import { FUEL_IDS } from '../../../drying/fuels.ts'
import { DRYING_METHOD_KINDS, type DryingMethodKind } from '../../../drying/method.ts'
import { METHOD_MODELS } from '../../../drying/methods/index.ts'
import { HOUR_STATUS_NAMES, type HourStatusName } from '../../../drying/usable-hour.ts'
import { NUMBER_GROUPS } from '../../../product/profile-numbers.ts'
import { binAssessmentSchema } from './bin.ts'
import {
  count,
  medianP90,
  monthDay,
  num,
  numOrNull,
  once,
  parametersSchema,
  share,
  spreadSchema,
  text,
  texts,
} from './common.ts'
import { seasonCalendarSchema } from './season-calendar.ts'
import { assessmentSpoilageSchema, spoilageSummarySchema } from './spoilage.ts'

/** What an assessment shares with the comparisons: the method kind, the site, the product, the method, the season. */
export const assessmentParts = once(() => {
  const kindSchema = z
    .enum(DRYING_METHOD_KINDS as unknown as [DryingMethodKind, ...DryingMethodKind[]])
    .describe('drying method kind')
  const assessmentSiteSchema = z
    .strictObject({
      name: text('site name (from the options, the file, or the file name)'),
      latitudeDeg: numOrNull('latitude [° N]'),
      longitudeDeg: numOrNull('longitude [° E, west negative]'),
      elevationM: numOrNull('elevation [m]'),
      utcOffsetHours: num("offset of the site's local standard time from UTC [h]"),
      timeZone: z
        .string()
        .nullable()
        .describe(
          "IANA zone of the site's clock when known (daylight saving followed); null: standard time all year",
        ),
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
    dryTarget: z
      .strictObject({
        basis: z
          .enum(['water-activity', 'profile-moisture', 'user'])
          .describe(
            "what set the target: the product's safe water activity, the profile's own moisture, or the user",
          ),
        safeWaterActivity: num('water activity at or below which the dried product is safe [0–1]'),
        safeWaterActivitySource: text('its source'),
        storageTempC: num('temperature of the store at which the water activity is judged [°C]'),
        waterActivityAtTarget: numOrNull(
          'water activity at the target moisture and storage temperature [0–1]; null: the isotherm gives none',
        ),
        moistureAtSafeWaterActivityWbPct: numOrNull(
          'moisture at the safe water activity and storage temperature, wet basis [%]; null: the isotherm gives none',
        ),
        profileMoistureWbPct: num("the profile's own target moisture, wet basis [%]"),
        waterActivityAtProfileMoisture: numOrNull('water activity at that moisture [0–1]'),
        sentence: text('what "dry" means here, in one sentence'),
      })
      .describe('what "dry" means for this assessment'),
    figuresFromMemory: z
      .array(
        z.strictObject({
          name: text('the figure in plain words, as `dryhours products <id>` lists it'),
          shortName: text('a short name for a one-line summary'),
          value: num('the figure [in the unit named by `unit`]'),
          unit: text('its unit'),
          kind: z.enum(NUMBER_GROUPS).describe('which kind of product figure it is'),
          path: text('where it sits in the product profile'),
        }),
      )
      .describe('product figures this answer uses that rest on memory (recalled, not read in a publication)'),
    figureCounts: z
      .record(
        z.enum(NUMBER_GROUPS),
        z.strictObject({
          figures: count('figures of this kind the answer uses'),
          fromMemory: count('of them, resting on memory'),
        }),
      )
      .describe('per kind of product figure: how many the answer uses and how many rest on memory'),
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
  const seasonSchema = z.strictObject({
    start: monthDay('first start date'),
    end: monthDay('last start date'),
    stepDays: num('days between start dates [days]'),
    startHourLocal: num('local hour at which batches start [h, 0–23]'),
  })
  return {
    kindSchema,
    siteSchema: assessmentSiteSchema,
    productSchema: assessmentProductSchema,
    methodResponseSchema,
    seasonSchema,
  }
})

const reasonsSchema = (unit: string) =>
  z
    .strictObject(
      Object.fromEntries(HOUR_STATUS_NAMES.map((r) => [r, num(`hours ${r} [${unit}]`)])) as Record<
        HourStatusName,
        z.ZodNumber
      >,
    )
    .describe(`hours per verdict (usable, or the reason an hour is not usable) [${unit}]`)

/** The season's tables: one row per month, one row per start date. */
const seasonTableSchemas = once(() => {
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
    usableFraction: share(
      "usable share of ALL the month's hours with data (day and night), all years pooled",
    ),
    usableDaylightFraction: share("usable share of the month's daylight hours with data, all years pooled"),
    usableNightHoursShare: share("share of the month's usable hours that fall at night"),
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
    spoilage: spoilageSummarySchema(),
    yearsWithData: count('years with enough data in the month'),
  })

  const startDateRowSchema = z.strictObject({
    start: monthDay('start date, local'),
    years: count('years with a complete batch from this start whose outcome is known'),
    yearsUnknown: count('years whose batch ran into hours without weather: outcome unknown, left out'),
    missingWeatherHours: num('hours without weather those batches ran into, summed [h]'),
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
    spoilage: spoilageSummarySchema(),
  })
  return { monthlyRowSchema, startDateRowSchema }
})

/** Heat and fuel of the heated-air figures, with the cross-check against the heat of evaporation. */
const heatSchema = once(() => {
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

  return z.strictObject({
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
})

/** The site's hours on the psychrometric chart and the region that dries the product. */
const psychrometricSchema = once(() => {
  return z.strictObject({
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
})

/** What the series covered and what was estimated or skipped. */
const coverageSchema = once(() => {
  return z.strictObject({
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
    batchesWithUnknownOutcome: count(
      'batches that ran into hours without weather: outcome unknown, left out of the figures',
    ),
    missingWeatherHoursInBatches: num('hours without weather those batches missed [h]'),
  })
})

/** The seasonal assessment of one site, one product and one method. */
export const assessmentResponseSchema = once(() => {
  const { siteSchema, productSchema, methodResponseSchema, seasonSchema } = assessmentParts()
  const { monthlyRowSchema, startDateRowSchema } = seasonTableSchemas()
  return z
    .strictObject({
      schema: z.literal('dryhours.assessment/1').describe('the shape of this object'),
      site: siteSchema,
      product: productSchema,
      method: methodResponseSchema,
      methodLabel: text('the method in plain words'),
      season: seasonSchema,
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
      heat: heatSchema(),
      psychrometric: psychrometricSchema(),
      assumptions: z.array(
        z.strictObject({
          name: text('what is assumed'),
          value: text('the value, with its unit'),
          source: text('its source'),
        }),
      ),
      warnings: texts('what limits the answer, in words'),
      coverage: coverageSchema(),
      spoilage: assessmentSpoilageSchema(),
      seasonCalendar: seasonCalendarSchema(),
      bin: binAssessmentSchema(),
    })
    .describe('the seasonal assessment of one site, one product and one method')
})

/**
 * Compile-time check that the schema describes the analysis type: a field added to the type and not
 * documented here fails the type check (a field documented here but absent from the answers fails the
 * response test). The method is checked per kind by its own schema.
 */
type Describes<T, S extends T> = S
export type AssessmentDescribed = Describes<
  Omit<Assessment, 'method'>,
  z.output<ReturnType<typeof assessmentResponseSchema>>
>

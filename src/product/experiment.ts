/**
 * @module product/experiment
 * A published drying experiment as recorded in `test/fixtures/experiments/<id>.json`: the citation and the part
 * of it that was read, the product and its preparation, the site and the weather the paper reports, and one or
 * more runs (method, night practice, loading, size, moisture from → to, the published time and whether it is
 * elapsed or active drying time, curve points when given). Each run is proposed for `calibration` (a fit may use
 * it), `validation` (no fit may use it) or `context` (too little was read to run it through the engine).
 *
 * Only what was read is recorded: a field the part read does not give is `null` with a note, never a guess.
 */
import { z } from 'zod'

const range = z
  .object({ min: z.number(), max: z.number() })
  .refine((r) => r.min <= r.max, 'min must not exceed max')
const numberOrRange = z.union([z.number(), range])
const moisture = z.object({ value: numberOrRange, basis: z.enum(['wb', 'db']) })

export const experimentRunSchema = z.object({
  id: z.string().regex(/^[a-z0-9]+(-[a-z0-9]+)*$/),
  method: z.enum([
    'open-sun',
    'shade',
    'solar-tunnel',
    'solar-cabinet',
    'greenhouse',
    'mixed-mode-solar',
    'hot-air',
    'heated-batch',
  ]),
  methodDetails: z.string(),
  pretreatment: z.string(),
  nightPractice: z.string(),
  /** Berry, pod, slice or bean size [mm] and what it measures; null when not given in the part read. */
  sizeMm: numberOrRange.nullable(),
  sizeKind: z.string().nullable(),
  loading: z.string().nullable(),
  initialMoisture: moisture.nullable(),
  finalMoisture: moisture.nullable(),
  /** The published drying time [h] (days × 24 where the paper gives days); null when not given. */
  timeH: numberOrRange.nullable(),
  /** `elapsed`: clock time including nights; `active`: hours of drying only; `unknown`: the part read does not say. */
  timeKind: z.enum(['elapsed', 'active', 'unknown']),
  timeNote: z.string(),
  /** Published curve points (time [h], moisture on `curveBasis`), when the part read gives them. */
  curve: z.array(z.object({ tH: z.number(), moisture: z.number() })),
  curveBasis: z.enum(['wb', 'db']).nullable(),
  role: z.enum(['calibration', 'validation', 'context']),
  roleReason: z.string(),
})

export const experimentSchema = z.object({
  id: z.string().regex(/^[a-z0-9]+(-[a-z0-9]+)*$/),
  citation: z.object({
    /** Authors as printed; null when the copy read does not show them. */
    authors: z.array(z.string()).nullable(),
    year: z.number().int().nullable(),
    title: z.string(),
    publishedIn: z.string(),
    doi: z.string().nullable(),
    partRead: z.string(),
    readFrom: z.string(),
  }),
  product: z.object({ catalogueId: z.string().nullable(), description: z.string() }),
  site: z.object({
    place: z.string().nullable(),
    latitudeDeg: z.number().min(-90).max(90).nullable(),
    longitudeDeg: z.number().min(-180).max(180).nullable(),
    period: z.string().nullable(),
  }),
  weather: z.object({
    /** Whether the part read gives any weather figure. */
    reportedInPartRead: z.boolean(),
    airTempC: range.nullable(),
    rhPct: range.nullable(),
    solarIrradianceWm2: z.number().nullable(),
    windMs: z.number().nullable(),
    notes: z.string(),
  }),
  runs: z.array(experimentRunSchema).min(1),
})

export type Experiment = z.infer<typeof experimentSchema>
export type ExperimentRun = z.infer<typeof experimentRunSchema>

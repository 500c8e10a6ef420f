/**
 * @module drying/methods/parameters
 * Parameter forms shared by the method schemas.
 */
import { z } from 'zod'

/** A number from 0 to 1 named in the error message. */
export const fraction = (name: string) =>
  z
    .number({ error: `${name} must be a number` })
    .min(0, `${name} must be between 0 and 1`)
    .max(1, `${name} must be between 0 and 1`)

/** Product on the drying surface [kg fresh per m²]; when absent, the product profile's default loading. */
export const loadingSchema = z.number().gt(0).max(200).optional()

/** Zod pieces the kinds' output schemas share (what the web reads from `outputs`). */
import { z } from 'zod'

/** The library's CoverageInterval: absolute bounds of the named quantity in its own unit. */
export const coverageIntervalSchema = z.object({ quantity: z.string(), low: z.number(), high: z.number(), basis: z.string() })

export const methodRefSchema = z.object({ id: z.string(), source: z.string() })

/** The library's GUM budget: each contribution with its standard uncertainty and its share of u_c². */
export const uncertaintyBudgetSchema = z.object({
  rows: z.array(
    z.object({
      name: z.string(),
      value: z.number().optional(),
      unit: z.string().optional(),
      distribution: z.string(),
      divisor: z.number(),
      standardUncertainty: z.number(),
      sensitivity: z.number(),
      contribution: z.number(),
      varianceShare: z.number(),
    }),
  ),
  combinedStandardUncertainty: z.number(),
  coverageFactor: z.number(),
  expandedUncertainty: z.number(),
  method: methodRefSchema,
})

export const lowHighDbm = z.object({ lowDbm: z.number(), highDbm: z.number() })

import type { z } from 'zod'
import { badRequest } from './errors'
import { zodDetails } from './error-handler'

/** Parses a request part with a shared zod schema; a failure is a 400 listing every field error. */
export function parseWith<S extends z.ZodType>(schema: S, input: unknown): z.infer<S> {
  const r = schema.safeParse(input ?? {})
  if (!r.success) throw badRequest('validation_failed', 'Some fields need attention.', zodDetails(r.error))
  return r.data
}

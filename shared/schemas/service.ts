/** Answers about the service itself: whether it is up, and its API document. */
import { z } from 'zod'

/** GET /api/health: up, and the database answers (else 503 database_unavailable). */
export const healthResponseSchema = z.object({ ok: z.literal(true) })
export type HealthResponse = z.infer<typeof healthResponseSchema>

/** GET /api/openapi.json: an OpenAPI 3.1 document (its full shape is the OpenAPI specification's). */
export const apiDocumentResponseSchema = z.looseObject({
  openapi: z.string().regex(/^3\.1\./),
  info: z.looseObject({ title: z.string(), version: z.string() }),
  paths: z.record(z.string(), z.unknown()),
})

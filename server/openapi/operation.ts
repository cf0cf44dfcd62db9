/**
 * One API operation as the document describes it: its route (written as Express writes it),
 * who may call it, and the zod schemas of what it takes and answers. Each module lists its own
 * operations beside its routes (`<module>.api.ts`); server/openapi/document.ts gathers them into
 * the OpenAPI 3.1 document. Nothing about a shape is written here by hand: every shape is a zod
 * schema from shared/schemas.
 */
import type { z } from 'zod'

export type Caller = 'anonymous' | 'complainant' | 'investigator' | 'supervisor' | 'admin'

/** Anyone, signed in or not. */
export const EVERYONE: readonly Caller[] = ['anonymous', 'complainant', 'investigator', 'supervisor', 'admin']
/** Office staff and administrators (the routes' `requireRole('investigator', 'supervisor', 'admin')`). */
export const STAFF: readonly Caller[] = ['investigator', 'supervisor', 'admin']

/** A non-JSON answer (a file, a CSV, a redirect) or an empty one. */
export interface RawAnswer {
  /** e.g. 'application/pdf', 'text/csv', 'application/zip', 'application/octet-stream'; none: an empty body. */
  contentType?: string
  description: string
}

/** A JSON answer sent with a content type of its own (e.g. 'application/geo+json'). */
export interface TypedJsonAnswer {
  contentType: string
  schema: z.ZodType
}

/** Error statuses an operation may answer besides those the document derives (see server/openapi/document.ts). */
export type ErrorStatus = 400 | 401 | 403 | 404 | 409 | 410 | 413 | 415 | 422 | 429 | 503

export interface ApiOperation {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete'
  /** Express path under /api, e.g. '/api/cases/:id/triage'. */
  path: string
  /** One line, in the product's words. */
  summary: string
  /** The group the reference page files it under (e.g. 'Cases', 'Evidence'). */
  tag: string
  /** Who may call it and get an answer other than 401/403 (policy may still refuse a given case). */
  callers: readonly Caller[]
  params?: z.ZodObject
  query?: z.ZodObject
  /** A JSON body, or a multipart upload (its text fields as a zod object; files named in `files`). */
  body?: z.ZodType | { multipart: z.ZodObject; files: readonly string[] }
  /** Successful answers by status: a zod schema for JSON, or a raw answer. Errors share one shape, added by the document. */
  responses: Partial<Record<200 | 201 | 202 | 204 | 302 | 303, z.ZodType | RawAnswer | TypedJsonAnswer>>
  /**
   * Error statuses to name beyond the derived ones (400 when it takes input, 401/403 from
   * `callers`, 404 when its path has a parameter), e.g. 409 for a move the state forbids.
   */
  errors?: readonly ErrorStatus[]
  /** Extra words for the reference page (limits, side effects). */
  description?: string
}

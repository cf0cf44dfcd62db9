/** The one error body every API error uses (its schema is the API document's `ApiError`). */
import { z } from 'zod'

export const apiErrorSchema = z
  .object({
    error: z.object({
      /** Stable snake_case code, e.g. 'invalid_credentials', 'case_not_found'. */
      code: z.string().meta({ description: "Stable snake_case code, e.g. 'invalid_credentials', 'case_not_found'." }),
      message: z.string(),
      /** Field errors for validation failures: { path: 'email', message: '…' }[]. */
      details: z.array(z.object({ path: z.string(), message: z.string() })).optional(),
      requestId: z.string(),
    }),
  })
  .meta({ id: 'ApiError', description: 'The one error body: a stable code, words for people, field errors for a 400, the request id to quote.' })

export type ApiErrorBody = z.infer<typeof apiErrorSchema>

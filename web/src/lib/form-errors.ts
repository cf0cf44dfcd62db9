/** Puts the server's field errors (400 validation_failed, details[].path) beside the form's fields. */
import type { FieldValues, Path, UseFormSetError } from 'react-hook-form'
import { isApiError } from './api-client'

/**
 * Returns true when at least one server issue landed on a known field; issues on other paths
 * are left for the caller's form-level alert.
 */
export function applyFieldErrors<T extends FieldValues>(options: {
  error: unknown
  setError: UseFormSetError<T>
  fields: readonly Path<T>[]
}): boolean {
  const { error, setError, fields } = options
  if (!isApiError(error) || error.details.length === 0) return false
  let placed = false
  for (const issue of error.details) {
    const field = fields.find((f) => f === issue.path)
    if (field) {
      setError(field, { type: 'server', message: issue.message }, { shouldFocus: !placed })
      placed = true
    }
  }
  return placed
}

export interface FormProblem {
  message: string
  requestId: string | null
}

/**
 * The form-level message for a failed submit: a fixed text for known statuses or codes,
 * else the server's own words (or, when it could not be reached, a plain "try again").
 */
export function formProblem(
  error: unknown,
  overrides: { byStatus?: Record<number, string>; byCode?: Record<string, string> } = {},
): FormProblem {
  if (!isApiError(error)) return { message: 'Something went wrong in the page. Reload and try again.', requestId: null }
  const fixed = overrides.byCode?.[error.code] ?? overrides.byStatus?.[error.status]
  return { message: fixed ?? error.message, requestId: error.status >= 500 ? error.requestId : null }
}

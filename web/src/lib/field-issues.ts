/**
 * The server's field errors (400 validation_failed, `details[].path`) as a map from a field's
 * path to its message, for forms that keep their own state (nested and listed fields:
 * `measurement.reading.value`, `item.antennaFactorTable.2.freqHz`). The first message of a
 * path wins; `prefix` (with its dot) is taken off.
 */
import { isApiError } from './api-client'

export function fieldIssues(error: unknown, prefix = ''): Record<string, string> {
  if (!isApiError(error)) return {}
  const out: Record<string, string> = {}
  for (const d of error.details) {
    const path = prefix && d.path.startsWith(`${prefix}.`) ? d.path.slice(prefix.length + 1) : d.path === prefix ? '' : d.path
    out[path] ??= d.message
  }
  return out
}

/** The issues no field of the form shows (said in the form's alert instead). */
export function unplacedIssues(issues: Record<string, string>, placed: readonly string[]): string[] {
  return Object.entries(issues)
    .filter(([path]) => !placed.some((p) => path === p || path.startsWith(`${p}.`)))
    .map(([path, message]) => (path ? `${path}: ${message}` : message))
}

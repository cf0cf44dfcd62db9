/**
 * Stored against recomputed: every number of the outputs side by side with its relative
 * difference, and every other value (a verdict, a method id) compared as it is.
 *
 * Relative difference |a − b| / max(|a|, |b|) (0 when both are 0). Under the library version a
 * record was made with, any difference above RECOMPUTE_RELATIVE_TOLERANCE is a fault: the same
 * inputs through the same library must give the same numbers.
 */
import type { Json } from './kinds'

export const RECOMPUTE_RELATIVE_TOLERANCE = 1e-9

export interface OutputDifference {
  /** Where in the outputs, e.g. `value.eirpDbm` or `interval.low`. */
  path: string
  stored: Json | undefined
  now: Json | undefined
  /** For two numbers: |stored − now| / max(|stored|, |now|); null when either side is not a number. */
  relativeDifference: number | null
  /** Beyond the tolerance (numbers), or a changed, added or removed value (anything else). */
  differs: boolean
}

export function relativeDifference(a: number, b: number): number {
  if (a === b) return 0
  return Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b))
}

function leaves(x: unknown, path: string, out: Map<string, Json | undefined>): void {
  if (x !== null && typeof x === 'object') {
    const entries = Array.isArray(x) ? x.map((v, i) => [String(i), v] as const) : Object.entries(x)
    if (entries.length === 0) out.set(path, x as Json)
    for (const [k, v] of entries) leaves(v, path ? `${path}.${k}` : k, out)
    return
  }
  out.set(path, x as Json | undefined)
}

/** Every leaf of either side, in the stored order then any new ones. */
/** JSON values (a record's outputs) compared leaf by leaf. */
export function compareOutputs(stored: unknown, now: unknown, tolerance = RECOMPUTE_RELATIVE_TOLERANCE): OutputDifference[] {
  const a = new Map<string, Json | undefined>()
  const b = new Map<string, Json | undefined>()
  leaves(stored, '', a)
  leaves(now, '', b)
  const paths = [...a.keys(), ...[...b.keys()].filter((k) => !a.has(k))]
  return paths.map((path) => {
    const s = a.get(path)
    const n = b.get(path)
    if (typeof s === 'number' && typeof n === 'number') {
      const rel = relativeDifference(s, n)
      return { path, stored: s, now: n, relativeDifference: rel, differs: !(rel <= tolerance) }
    }
    return { path, stored: s, now: n, relativeDifference: null, differs: JSON.stringify(s) !== JSON.stringify(n) || a.has(path) !== b.has(path) }
  })
}

/**
 * A stored record against the current library: run again from its stored inputs and its own
 * reference copies, every output value compared. Used by the API and by
 * ops/recompute-calculations.ts, so both judge a record the same way.
 */
import { compareOutputs, RECOMPUTE_RELATIVE_TOLERANCE } from '../../../shared/calculations/compare'
import { CalculationRefused, rerunStored, type CalculationKind, type Json } from '../../../shared/calculations/kinds'
import { RADIO_LIBRARY_VERSION } from '../../../shared/radio'
import type { RecomputeView } from '../../../shared/schemas/views'

export interface StoredCalculation {
  id: string
  kind: CalculationKind
  inputs: Record<string, Json>
  outputs: { value: Json; interval?: unknown }
  referenceCopies: Record<string, Json>
  libraryVersion: string
}

export function recomputeStored(r: StoredCalculation, currentVersion = RADIO_LIBRARY_VERSION): RecomputeView {
  const base = {
    calculationId: r.id,
    kind: r.kind,
    storedLibraryVersion: r.libraryVersion,
    currentLibraryVersion: currentVersion,
    sameLibraryVersion: r.libraryVersion === currentVersion,
    tolerance: RECOMPUTE_RELATIVE_TOLERANCE,
  }
  let run
  try {
    run = rerunStored({ kind: r.kind, inputs: r.inputs, references: r.referenceCopies })
  } catch (e) {
    if (!(e instanceof CalculationRefused)) throw e
    return { ...base, differences: [], largestRelativeDifference: 0, differs: true, warningsNow: [], methodsNow: [], refused: e.message }
  }
  const differences = compareOutputs(r.outputs, run.outputs)
  return {
    ...base,
    differences,
    largestRelativeDifference: Math.max(0, ...differences.map((d) => d.relativeDifference ?? 0)),
    differs: differences.some((d) => d.differs),
    warningsNow: run.warnings,
    methodsNow: run.methods,
    refused: null,
  }
}

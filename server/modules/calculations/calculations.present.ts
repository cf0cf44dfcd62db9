/** Calculation records as the API answers them (shared/schemas/views.ts). */
import { CALCULATION_KIND_LABELS } from '../../../shared/calculations/kinds'
import type { CalculationView } from '../../../shared/schemas/views'
import type { CalculationWithAuthor } from './calculations.repo'

export function presentCalculation(r: CalculationWithAuthor): CalculationView {
  return {
    id: r.id,
    caseId: r.caseId,
    kind: r.kind,
    kindLabel: CALCULATION_KIND_LABELS[r.kind],
    inputs: r.inputs,
    outputs: r.outputs,
    warnings: r.warnings,
    methods: r.methods,
    libraryVersion: r.libraryVersion,
    author: { id: r.authorUserId, name: r.authorName },
    at: r.at.toISOString(),
    references: r.referenceCopies,
    measurementIds: r.measurementIds,
    evidenceIds: r.evidenceIds,
  }
}

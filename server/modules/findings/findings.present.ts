/** Findings as the API answers them (shared/schemas/findings.ts). */
import { RECOMMENDED_ACTION_LABELS } from '../../../shared/domain/findings'
import type { FindingEvidence, FindingReview, FindingView } from '../../../shared/schemas/findings'
import type { CalculationView } from '../../../shared/schemas/views'
import type { FindingWithAuthor } from './findings.repo'

export function presentFinding(
  r: FindingWithAuthor,
  calculations: ReadonlyMap<string, CalculationView>,
  evidence: ReadonlyMap<string, FindingEvidence>,
  review: FindingReview | null,
): FindingView {
  return {
    id: r.id,
    caseId: r.caseId,
    author: { id: r.authorUserId, name: r.authorName },
    at: r.at.toISOString(),
    sourceDescription: r.sourceDescription,
    sourcePosition: r.sourceLatDeg !== null && r.sourceLonDeg !== null ? { latDeg: r.sourceLatDeg, lonDeg: r.sourceLonDeg } : null,
    operator: r.operator,
    authorisedStationId: r.authorisedStationId,
    recommendedAction: r.recommendedAction,
    recommendedActionLabel: RECOMMENDED_ACTION_LABELS[r.recommendedAction],
    complianceDeadline: r.complianceDeadline,
    summary: r.summary,
    // in the order the investigator linked them; a record is never removed, so every id resolves
    calculations: r.calculationIds.flatMap((id) => calculations.get(id) ?? []),
    evidenceIds: r.evidenceIds,
    // the case's files, removed ones included (an evidence row is never deleted), in the order linked
    evidence: r.evidenceIds.flatMap((id) => evidence.get(id) ?? []),
    review,
  }
}

/** What the browser receives about a case: staff detail, list rows, and the complainant's view. */
import { COMPLAINANT_STEP_LABELS, COMPLAINANT_STEP_OF_STATE, CASE_STATE_LABELS, RESOLUTION_LABELS } from '../../../shared/domain/case-lifecycle'
import type { caseEvents, CaseRow } from '../../db/schema'
import type { CaseAbilities, CaseDetail, ComplainantReport, TimelineEvent } from '../../../shared/schemas/views'
import { isOverdue } from './due'


export function presentCaseDetail(
  c: CaseRow,
  extra: { officeName: string; investigatorName: string | null; mergedIntoReference: string | null; abilities: CaseAbilities; timeline: TimelineEvent[] },
  now: Date,
): CaseDetail {
  return {
    id: c.id,
    reference: c.reference,
    version: c.version,
    status: c.status,
    statusLabel: CASE_STATE_LABELS[c.status],
    priority: c.priority,
    suggestedPriority: c.suggestedPriority,
    service: c.service,
    licenceRef: c.licenceRef,
    freqLowHz: c.freqLowHz,
    freqHighHz: c.freqHighHz,
    address: c.address,
    latDeg: c.latDeg,
    lonDeg: c.lonDeg,
    sinceDate: c.sinceDate,
    pattern: c.pattern,
    patternDetail: c.patternDetail,
    experience: c.experience,
    description: c.description,
    complainant: { name: c.complainantName, email: c.complainantEmail, phone: c.complainantPhone, organisation: c.complainantOrganisation, hasAccount: c.complainantUserId !== null },
    officeId: c.officeId,
    officeName: extra.officeName,
    investigatorId: c.investigatorId,
    investigatorName: extra.investigatorName,
    mergedIntoCaseId: c.mergedIntoCaseId,
    mergedIntoReference: extra.mergedIntoReference,
    resolution: c.resolution,
    resolutionLabel: c.resolution ? RESOLUTION_LABELS[c.resolution] : null,
    closingSummary: c.closingSummary,
    receivedAt: c.receivedAt.toISOString(),
    dueAt: c.dueAt.toISOString(),
    closedAt: c.closedAt?.toISOString() ?? null,
    overdue: isOverdue('resolution', c, now),
    firstResponseDueAt: c.firstResponseDueAt.toISOString(),
    firstRespondedAt: c.firstRespondedAt?.toISOString() ?? null,
    firstResponseOverdue: isOverdue('firstResponse', { status: c.status, dueAt: c.firstResponseDueAt, stoppedAt: c.firstRespondedAt }, now),
    abilities: extra.abilities,
    timeline: extra.timeline,
  }
}

/**
 * The complainant's view: their report, the status in plain steps, the messages meant for
 * them and their own additions. Internal notes and staff names never appear.
 */
export function presentComplainantView(c: CaseRow, events: TimelineEvent[], abilities: { withdraw: boolean; addInformation: boolean }): ComplainantReport {
  const entries = events.flatMap((e) => {
    if (e.visibility === 'complainant') {
      if (e.kind === 'received') return [{ at: e.at, from: 'office' as const, kind: 'status', text: 'We received your report.' }]
      return [{ at: e.at, from: e.kind === 'complainant_information' ? ('you' as const) : ('office' as const), kind: e.kind, text: e.body ?? '' }]
    }
    // the reopening reason is e-mailed to the complainant, so their page shows it too
    if (e.kind === 'reopen') return [{ at: e.at, from: 'office' as const, kind: 'status', text: `Your report is open again: ${e.body ?? ''}`.trim() }]
    if (e.toState && e.toState !== e.fromState && e.kind !== 'transfer') {
      const step = COMPLAINANT_STEP_OF_STATE[e.toState]
      const prev = e.fromState ? COMPLAINANT_STEP_OF_STATE[e.fromState] : null
      if (step !== prev) return [{ at: e.at, from: 'office' as const, kind: 'status', text: `Status: ${COMPLAINANT_STEP_LABELS[step]}` }]
    }
    return []
  })
  return {
    reference: c.reference,
    step: COMPLAINANT_STEP_OF_STATE[c.status],
    statusLabel: COMPLAINANT_STEP_LABELS[COMPLAINANT_STEP_OF_STATE[c.status]],
    service: c.service,
    freqLowHz: c.freqLowHz,
    freqHighHz: c.freqHighHz,
    address: c.address,
    description: c.description,
    receivedAt: c.receivedAt.toISOString(),
    closedAt: c.closedAt?.toISOString() ?? null,
    resolution: c.resolution,
    resolutionLabel: c.resolution ? RESOLUTION_LABELS[c.resolution] : null,
    closingSummary: c.closingSummary,
    entries,
    abilities,
  }
}

type CaseEventRow = typeof caseEvents.$inferSelect

export function toTimelineEvent(e: Pick<CaseEventRow, 'id' | 'at' | 'actorLabel' | 'kind' | 'fromState' | 'toState' | 'body' | 'visibility' | 'data'>): TimelineEvent {
  return {
    id: e.id,
    at: e.at.toISOString(),
    actor: e.actorLabel,
    kind: e.kind,
    fromState: e.fromState,
    toState: e.toState,
    body: e.body,
    visibility: e.visibility,
    data: e.data ?? null,
  }
}

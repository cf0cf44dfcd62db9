/**
 * How a timeline event reads, in one line with the facts stored in its data: the case page's
 * timeline and the case file (PDF) both show these titles.
 */
import { CASE_STATE_LABELS, RESOLUTION_LABELS, type CaseState, type Resolution } from './case-lifecycle'
import { RECOMMENDED_ACTION_LABELS, RECOMMENDED_ACTIONS, type RecommendedAction } from './findings'
import { ENFORCEMENT_EVENT_TITLES } from './follow-ups'
import { PRIORITIES, PRIORITY_LABELS, type Priority } from './services'

/** The timeline event written when a signed case file (PDF) is issued; its data holds the file's SHA-256. */
export const CASE_FILE_ISSUED_KIND = 'case_file_issued'

const isPriority = (v: number): v is Priority => (PRIORITIES as readonly number[]).includes(v)

export interface TimelineEventTitled {
  kind: string
  toState: string | null
  data: Record<string, unknown> | null
}

const str = (v: unknown): string | null => (typeof v === 'string' && v ? v : null)

/** A short title for the event, with the facts stored in its data. */
export function eventTitle(e: TimelineEventTitled): string {
  const d = e.data ?? {}
  switch (e.kind) {
    case 'received':
      return 'Report received'
    case 'routed':
      return d.basis === 'inside_area' ? 'Routed to the office whose area holds the place' : d.basis === 'inside_overlap' ? 'Routed to the nearest office of overlapping areas' : 'Routed to the nearest office'
    case 'triage':
      return typeof d.priority === 'number' && isPriority(d.priority) ? `Harm class set: ${PRIORITY_LABELS[d.priority].short}` : 'Harm class set'
    case 'assign':
      return str(d.investigatorName) ? `Assigned to ${str(d.investigatorName)}` : 'Investigator assigned'
    case 'transfer':
      return str(d.toOfficeName) ? `Transferred to ${str(d.toOfficeName)}` : 'Transferred to another office'
    case 'merge':
      return str(d.intoReference) ? `Merged into ${str(d.intoReference)}` : 'Merged into another case'
    case 'merged_in':
      return str(d.fromReference) ? `${str(d.fromReference)} merged into this case` : 'Another report merged in'
    case 'merge_followed':
      return str(d.intoReference) ? `Now part of ${str(d.intoReference)}` : 'Followed its case into another'
    case 'far_from_offices':
      return 'Check the location: far from every office'
    case 'outside_office_areas':
      return 'Check the location: outside every office area'
    case 'dismiss':
      return `Closed at triage${resolutionSuffix(d.resolution)}`
    case 'startFieldWork':
      return 'Field work started'
    case 'proposeFinding':
      return (RECOMMENDED_ACTIONS as readonly unknown[]).includes(d.recommendedAction)
        ? `Finding proposed: ${RECOMMENDED_ACTION_LABELS[d.recommendedAction as RecommendedAction]}`
        : 'Finding proposed'
    case 'returnFinding':
      return 'Sent back for more work'
    case 'close':
      return `Approved and closed${resolutionSuffix(d.resolution)}`
    case 'reopen':
      return 'Reopened'
    case 'withdraw':
      return 'Withdrawn by the complainant'
    case 'returned_to_triage':
      return str(d.previousInvestigatorName) ? `Back to triage: ${str(d.previousInvestigatorName)} moved to another office or role` : 'Back to triage: the investigator moved'
    case 'tracking_links_revoked':
      return typeof d.revokedCount === 'number' ? `Tracking links closed (${d.revokedCount})` : 'Tracking links closed'
    case 'note':
      return 'Internal note'
    case 'message':
      return 'Message to the complainant'
    case 'information_requested':
      return 'Information requested from the complainant'
    case 'complainant_information':
      return 'Information added by the complainant'
    case 'calculation_stored':
      // the event's text carries the result; the title only says what kind of entry it is
      return 'Calculation stored'
    case 'measurement_recorded':
      return 'Measurement recorded'
    case 'measurement_corrected':
      return 'Measurement corrected'
    case 'evidence_added':
      return 'Evidence file added'
    case 'evidence_removed':
      return 'Evidence file removed'
    case 'evidence_shared':
      return 'Evidence file shared with the complainant'
    case 'evidence_unshared':
      return 'Evidence file no longer shared with the complainant'
    case 'evidence_integrity_failed':
      return 'Evidence file failed its integrity check'
    case 'legal_hold_set':
      return str(d.until) ? `Legal hold set until ${str(d.until)}` : 'Legal hold set until lifted'
    case 'legal_hold_lifted':
      return 'Legal hold lifted'
    case 'personal_data_erased':
      return 'Complainant’s personal data erased (retention period ended)'
    case 'evidence_disposed':
      return 'Evidence files deleted from the store (retention period ended)'
    case CASE_FILE_ISSUED_KIND:
      return str(d.fileReference) ? `Case file ${str(d.fileReference)} issued` : 'Case file issued'
    default:
      // the enforcement records' entries (responsible party, notices, replies, follow-ups)
      if (e.kind in ENFORCEMENT_EVENT_TITLES) return ENFORCEMENT_EVENT_TITLES[e.kind]!
      return e.toState ? `Now: ${CASE_STATE_LABELS[e.toState as CaseState] ?? e.toState}` : e.kind
  }
}

function resolutionSuffix(resolution: unknown): string {
  const label = RESOLUTION_LABELS[resolution as Resolution]
  return label ? `: ${label}` : ''
}

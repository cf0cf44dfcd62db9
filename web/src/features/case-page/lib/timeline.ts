/**
 * How a timeline event reads on the case page: its lane (internal to staff, sent to the
 * complainant, or from the complainant) and a one-line title. Pure, so it is tested alone.
 */
import { CASE_STATE_LABELS, RESOLUTION_LABELS, type CaseState, type Resolution } from '@shared/domain/case-lifecycle'
import { RECOMMENDED_ACTION_LABELS, RECOMMENDED_ACTIONS, type RecommendedAction } from '@shared/domain/findings'

export interface TimelineEventLike {
  kind: string
  visibility: 'internal' | 'complainant'
  toState: string | null
  data: Record<string, unknown> | null
}

export type TimelineLane = 'internal' | 'to_complainant' | 'from_complainant'

export const LANE_LABELS: Record<TimelineLane, string> = {
  internal: 'Internal',
  to_complainant: 'Sent to complainant',
  from_complainant: 'From complainant',
}

const SENT_WITH_MOVE = ['close', 'dismiss', 'reopen']

/** Who can read the event: staff only, or the complainant too (and who wrote it). */
export function laneOf(e: TimelineEventLike): TimelineLane {
  if (e.kind === 'received' || e.kind === 'complainant_information' || e.kind === 'withdraw') return 'from_complainant'
  if (e.visibility === 'complainant') return 'to_complainant'
  // Closing and reopening store the very words e-mailed to the complainant.
  if (SENT_WITH_MOVE.includes(e.kind)) return 'to_complainant'
  return 'internal'
}

const str = (v: unknown): string | null => (typeof v === 'string' && v ? v : null)

/** A short title for the event, with the facts stored in its data. */
export function eventTitle(e: TimelineEventLike): string {
  const d = e.data ?? {}
  switch (e.kind) {
    case 'received':
      return 'Report received'
    case 'routed':
      return 'Routed to the nearest office'
    case 'triage':
      return typeof d.priority === 'number' ? `Priority set to P${d.priority}` : 'Priority set'
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
    default:
      return e.toState ? `Now: ${CASE_STATE_LABELS[e.toState as CaseState] ?? e.toState}` : e.kind
  }
}

function resolutionSuffix(resolution: unknown): string {
  const label = RESOLUTION_LABELS[resolution as Resolution]
  return label ? `: ${label}` : ''
}

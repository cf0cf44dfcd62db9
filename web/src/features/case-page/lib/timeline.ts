/**
 * How a timeline event reads on the case page: its lane (internal to staff, sent to the
 * complainant, or from the complainant) and a one-line title. Pure, so it is tested alone.
 */
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

/** A short title for the event, with the facts stored in its data (one wording with the case file: shared/domain/timeline-titles.ts). */
export { eventTitle } from '@shared/domain/timeline-titles'

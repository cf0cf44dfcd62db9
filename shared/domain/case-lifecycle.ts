/**
 * The life of a case as data: its states, the moves between them, who may make each move,
 * and the resolutions a closed case carries. The server enforces these through services
 * and policies; the web reads them for labels.
 */

export const CASE_STATES = ['received', 'triaged', 'assigned', 'field_work', 'finding_proposed', 'returned', 'closed'] as const
export type CaseState = (typeof CASE_STATES)[number]

export const CASE_STATE_LABELS: Record<CaseState, string> = {
  received: 'New report',
  triaged: 'Triaged, awaiting investigator',
  assigned: 'With investigator',
  field_work: 'Field work under way',
  finding_proposed: 'Finding awaiting review',
  returned: 'Sent back for more work',
  closed: 'Closed',
}

/**
 * What the complainant sees: fewer, plainer steps. The office's internal states (a finding
 * under review, a finding sent back) never reach the complainant, not even in the API.
 */
export const COMPLAINANT_STEPS = ['received', 'accepted', 'engineer_assigned', 'under_investigation', 'closed'] as const
export type ComplainantStep = (typeof COMPLAINANT_STEPS)[number]

export const COMPLAINANT_STEP_OF_STATE: Record<CaseState, ComplainantStep> = {
  received: 'received',
  triaged: 'accepted',
  assigned: 'engineer_assigned',
  field_work: 'under_investigation',
  finding_proposed: 'under_investigation',
  returned: 'under_investigation',
  closed: 'closed',
}

export const COMPLAINANT_STEP_LABELS: Record<ComplainantStep, string> = {
  received: 'Received — waiting to be looked at',
  accepted: 'Accepted — waiting for an engineer',
  engineer_assigned: 'An engineer is on your case',
  under_investigation: 'Under investigation',
  closed: 'Closed',
}

export const OPEN_STATES: readonly CaseState[] = CASE_STATES.filter((s) => s !== 'closed')

export const RESOLUTIONS = [
  'source_corrected',
  'enforcement_action',
  'no_interference_found',
  'referred',
  'withdrawn',
  'duplicate',
] as const
export type Resolution = (typeof RESOLUTIONS)[number]

export const RESOLUTION_LABELS: Record<Resolution, string> = {
  source_corrected: 'Source found and corrected',
  enforcement_action: 'Enforcement action taken',
  no_interference_found: 'No interference found',
  referred: 'Referred to another authority',
  withdrawn: 'Withdrawn by the complainant',
  duplicate: 'Duplicate of another case',
}

/** Who sees a timeline entry: the office's staff only, or the complainant too. */
export const TIMELINE_VISIBILITIES = ['internal', 'complainant'] as const
export type TimelineVisibility = (typeof TIMELINE_VISIBILITIES)[number]

/** Who makes a move, relative to the case. */
export type Mover =
  | 'office_supervisor' // a supervisor of the case's office
  | 'assigned_investigator' // the investigator the case is assigned to
  | 'complainant' // the person who reported it (tracking link or their account)

export interface CaseMove {
  from: readonly CaseState[]
  /** The state after the move. */
  to: CaseState
  by: readonly Mover[]
  /** The move needs a written reason (stored on the timeline). */
  needsReason: boolean
}

export const CASE_MOVES = {
  triage: { from: ['received', 'triaged'], to: 'triaged', by: ['office_supervisor'], needsReason: false },
  assign: { from: ['received', 'triaged', 'assigned', 'field_work', 'returned'], to: 'assigned', by: ['office_supervisor'], needsReason: false },
  transfer: { from: ['received', 'triaged'], to: 'received', by: ['office_supervisor'], needsReason: true },
  merge: { from: ['received', 'triaged'], to: 'closed', by: ['office_supervisor'], needsReason: false },
  dismiss: { from: ['received', 'triaged'], to: 'closed', by: ['office_supervisor'], needsReason: true },
  startFieldWork: { from: ['assigned', 'returned'], to: 'field_work', by: ['assigned_investigator'], needsReason: false },
  proposeFinding: { from: ['assigned', 'field_work', 'returned'], to: 'finding_proposed', by: ['assigned_investigator'], needsReason: true },
  returnFinding: { from: ['finding_proposed'], to: 'returned', by: ['office_supervisor'], needsReason: true },
  close: { from: ['finding_proposed'], to: 'closed', by: ['office_supervisor'], needsReason: true },
  reopen: { from: ['closed'], to: 'assigned', by: ['office_supervisor'], needsReason: true },
  withdraw: { from: ['received', 'triaged', 'assigned', 'field_work', 'finding_proposed', 'returned'], to: 'closed', by: ['complainant'], needsReason: false },
} as const satisfies Record<string, CaseMove>

export type CaseMoveName = keyof typeof CASE_MOVES

export const CASE_MOVE_LABELS: Record<CaseMoveName, string> = {
  triage: 'Set priority',
  assign: 'Assign investigator',
  transfer: 'Transfer to another office',
  merge: 'Merge into an open case',
  dismiss: 'Close at triage',
  startFieldWork: 'Start field work',
  proposeFinding: 'Propose finding',
  returnFinding: 'Send back for more work',
  close: 'Approve and close',
  reopen: 'Reopen',
  withdraw: 'Withdraw report',
}

/** Resolutions a supervisor may choose when closing at triage (before any field work). */
export const DISMISS_RESOLUTIONS: readonly Resolution[] = ['no_interference_found', 'referred']
/** Resolutions a supervisor may choose when approving a finding. */
export const CLOSE_RESOLUTIONS: readonly Resolution[] = ['source_corrected', 'enforcement_action', 'no_interference_found', 'referred']

/**
 * Merged reports. A report merged into a case is closed as its duplicate and points at it.
 * - A merge follows the chain: merging into a case that has itself been merged lands on the
 *   open case at the end of the chain; a chain that ends in a case closed otherwise is refused.
 * - Merged reports follow their case: when a case holding merged reports is merged in turn,
 *   they are re-pointed to the new case.
 * - A case holding merged reports cannot be closed at triage (dismiss): their complainants
 *   were told it is being worked on. It is closed with a finding, or merged in turn.
 */
export const MOVES_REFUSED_WHILE_HOLDING_MERGED_REPORTS: readonly CaseMoveName[] = ['dismiss']

export function moveAllowedFrom(move: CaseMoveName, state: CaseState): boolean {
  return (CASE_MOVES[move].from as readonly CaseState[]).includes(state)
}

/** The state after a move; a reopened case without an investigator goes back to triage. */
export function stateAfter(move: CaseMoveName, hasInvestigator: boolean): CaseState {
  if (move === 'reopen' && !hasInvestigator) return 'triaged'
  return CASE_MOVES[move].to
}

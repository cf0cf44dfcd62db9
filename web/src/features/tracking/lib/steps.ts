/** The complainant's plain steps and where a case stands among them. */
import type { CaseState } from '../../../../../shared/domain/case-lifecycle'

export const COMPLAINANT_STEPS = ['Received', 'Accepted', 'Engineer on it', 'Under investigation', 'Closed'] as const

const STEP_OF_STATE: Record<CaseState, number> = {
  received: 0,
  triaged: 1,
  assigned: 2,
  field_work: 3,
  finding_proposed: 3,
  returned: 3,
  closed: 4,
}

/** Index of the current step (0 = received … 4 = closed); unknown states read as received. */
export function stepIndexFor(status: string): number {
  return STEP_OF_STATE[status as CaseState] ?? 0
}

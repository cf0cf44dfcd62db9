/** The complainant's plain steps (the server sends which one a report is at) and their short names. */
import { COMPLAINANT_STEPS as STEP_KEYS, type ComplainantStep } from '@shared/domain/case-lifecycle'

const SHORT_NAMES: Record<ComplainantStep, string> = {
  received: 'Received',
  accepted: 'Accepted',
  engineer_assigned: 'Engineer on it',
  under_investigation: 'Under investigation',
  closed: 'Closed',
}

/** The five steps' names, in order. */
export const COMPLAINANT_STEPS = STEP_KEYS.map((k) => SHORT_NAMES[k])

/** Index of a step (0 = received … 4 = closed); an unknown value reads as received. */
export function stepIndexFor(step: string): number {
  return Math.max(0, (STEP_KEYS as readonly string[]).indexOf(step))
}

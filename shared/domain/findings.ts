/**
 * A finding as the investigator proposes it: what they recommend the office does about the
 * source. The list is data, so the form, the review panel, the database CHECK and the API
 * contract all read the same values and labels.
 */

export const RECOMMENDED_ACTIONS = ['no_action', 'advise_operator', 'formal_warning', 'stop_transmitting', 'refer_to_licensing'] as const
export type RecommendedAction = (typeof RECOMMENDED_ACTIONS)[number]

export const RECOMMENDED_ACTION_LABELS: Record<RecommendedAction, string> = {
  no_action: 'Nothing further to do',
  advise_operator: 'Give the operator advice',
  formal_warning: 'Send a formal warning',
  stop_transmitting: 'Order the transmitter switched off',
  refer_to_licensing: 'Pass to the licensing team',
}

/**
 * How far before today's UTC date a compliance deadline may lie [days]: the investigator's
 * calendar may run up to 12 hours behind UTC, so "today" where they are can be yesterday in UTC.
 */
export const DEADLINE_PAST_TOLERANCE_DAYS = 1
/** How far ahead a compliance deadline may lie [days] (a guard against typing errors: ten years). */
export const DEADLINE_MAX_AHEAD_DAYS = 3653

/** The most calculations one finding may link. */
export const MAX_FINDING_CALCULATIONS = 50

/**
 * The moves a synthetic case has made, walked through the case lifecycle
 * (shared/domain/case-lifecycle.ts, CASE_MOVES) rather than restated here: each step is a
 * named move, allowed from the state the case is in, and lands where CASE_MOVES says. If the
 * lifecycle changes so that a usual route no longer works, the walk throws instead of
 * writing impossible timelines.
 */
import { CASE_MOVES, moveAllowedFrom, stateAfter, type CaseMoveName, type CaseState, type Mover, type Resolution } from '../../shared/domain/case-lifecycle'

/** The usual forward route of a case, in order; a case stops where its drawn state is. */
export const USUAL_ROUTE: readonly CaseMoveName[] = ['triage', 'assign', 'startFieldWork', 'proposeFinding', 'returnFinding']

/** The move that closes a case with this resolution. */
export const CLOSING_MOVE: Record<Resolution, CaseMoveName> = {
  source_corrected: 'close',
  enforcement_action: 'close',
  no_interference_found: 'close',
  referred: 'dismiss',
  withdrawn: 'withdraw',
  duplicate: 'merge',
}

/**
 * How far along the usual route a case gets before its closing move: referred reports are
 * closed at triage without being triaged, withdrawn and merged ones once triaged, the
 * others once a finding has been proposed.
 */
export const CLOSED_FROM: Partial<Record<CaseMoveName, CaseState>> = {
  dismiss: 'received',
  withdraw: 'triaged',
  merge: 'triaged',
  close: 'finding_proposed',
}

export interface Step {
  move: CaseMoveName
  from: CaseState
  to: CaseState
  /** Who makes the move (the first mover CASE_MOVES allows). */
  by: Mover
}

/**
 * The moves from 'received' to `state` (with `resolution` when closed). `hasInvestigator`
 * is passed to the lifecycle's `stateAfter` (a reopened case without one goes to triage).
 */
export function walkTo(state: CaseState, resolution: Resolution | null, hasInvestigator = true): Step[] {
  if ((state === 'closed') !== (resolution !== null)) throw new RangeError(`a ${state} case ${resolution ? 'has no' : 'needs a'} resolution`)
  const closing = resolution ? CLOSING_MOVE[resolution] : null
  const stopAt = closing ? CLOSED_FROM[closing] : state
  if (!stopAt) throw new RangeError(`no route ends with ${closing}`)
  const steps: Step[] = []
  let at: CaseState = 'received'
  const take = (move: CaseMoveName) => {
    if (!moveAllowedFrom(move, at)) throw new Error(`the case lifecycle no longer allows ${move} from ${at}`)
    const to = stateAfter(move, hasInvestigator)
    steps.push({ move, from: at, to, by: CASE_MOVES[move].by[0] })
    at = to
  }
  for (const move of USUAL_ROUTE) {
    if (at === stopAt) break
    take(move)
  }
  if (at !== stopAt) throw new Error(`the usual route does not reach ${stopAt}`)
  if (closing) take(closing)
  return steps
}

import { FOLLOW_UP_STATE_LABELS, followUpStanding } from '../../../shared/domain/follow-ups'
import type { FollowUpView } from '../../../shared/schemas/follow-ups'
import type { FollowUpRow } from '../../db/schema'
import { followUpAbilities } from '../../policy/follow-up-policy'
import type { CaseAccess, CaseActor } from '../../policy/case-policy'

/** A follow-up as the API answers it; `today` is the office's calendar day. */
export function presentFollowUp(r: FollowUpRow, actor: CaseActor, c: CaseAccess, today: string): FollowUpView {
  return {
    id: r.id,
    caseId: r.caseId,
    dueOn: r.dueOn,
    expected: r.expected,
    source: r.source,
    state: r.state,
    stateLabel: FOLLOW_UP_STATE_LABELS[r.state],
    standing: followUpStanding(r, today),
    version: r.version,
    lastNote: r.lastNote,
    changedAt: r.changedAt?.toISOString() ?? null,
    createdAt: r.createdAt.toISOString(),
    abilities: followUpAbilities(actor, c, r),
  }
}

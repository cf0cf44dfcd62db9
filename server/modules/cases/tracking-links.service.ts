/**
 * Closing a case's private tracking links: every link ever e-mailed for the case stops working
 * (it answers 404 like an unknown one), with a timeline entry and an audit entry in the same
 * transaction. The complainant's account, if they have one, still shows the report; e-mails
 * sent to the complainant afterwards carry a fresh link to their address.
 */
import { withTransaction } from '../../db/client'
import type { ServiceContext } from '../../context'
import { forbidden } from '../../http/errors'
import { mayRevokeTrackingLinks, type CaseActor } from '../../policy/case-policy'
import type { RevokeTrackingLinksInput } from '../../../shared/schemas/people'
import { recordAudit } from '../audit/audit.repo'
import { findUserById } from '../users/users.repo'
import { loadVisibleCase } from './case-access'
import { appendEvent, revokeTrackingTokensOfCase } from './cases.repo'

/** The timeline kind of the entry. */
export const TRACKING_LINKS_REVOKED_KIND = 'tracking_links_revoked'

export function revokeTrackingLinks(ctx: ServiceContext, actor: CaseActor, caseId: string, input: RevokeTrackingLinksInput): Promise<{ revokedCount: number }> {
  return withTransaction(ctx.pool, async ({ db }) => {
    const c = await loadVisibleCase(db, actor, caseId)
    if (actor.role === 'tracking_link' || !mayRevokeTrackingLinks(actor, c)) throw forbidden('Only a supervisor of the case’s office can close its tracking links.')
    const revokedCount = await revokeTrackingTokensOfCase(db, c.id)
    const actorName = (await findUserById(db, actor.id))?.name ?? 'Unknown user'
    await appendEvent(db, {
      caseId: c.id,
      at: ctx.now(),
      actorUserId: actor.id,
      actorLabel: actorName,
      kind: TRACKING_LINKS_REVOKED_KIND,
      body: input.reason,
      visibility: 'internal',
      data: { revokedCount },
    })
    await recordAudit(db, { actorUserId: actor.id, action: 'tracking_links.revoked', targetType: 'case', targetId: c.id, officeId: c.officeId, details: { reference: c.reference, revokedCount } })
    return { revokedCount }
  })
}

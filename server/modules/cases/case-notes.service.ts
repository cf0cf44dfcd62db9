/** Notes and messages on a case's timeline; they never change its state. */
import type { ServiceContext } from '../../context'
import { withTransaction } from '../../db/client'
import { forbidden } from '../../http/errors'
import { queueMail } from '../../jobs/boss'
import { informationRequestedMail, messageToComplainantMail } from '../../mail/case-templates'
import { mayAddComplainantInformation, mayAddInternalNote, mayMessageComplainant, type CaseActor } from '../../policy/case-policy'
import type { CaseState } from '../../../shared/domain/case-lifecycle'
import { appendEvent, userName } from './cases.repo'
import { loadVisibleCase } from './case-moves.service'
import { issueTrackingLink } from './tracking-tokens'

/** An internal note (staff only) or a message to the complainant (shown and e-mailed). */
export async function addCaseNote(
  ctx: ServiceContext,
  actor: CaseActor,
  caseId: string,
  input: { body: string; visibility: 'internal' | 'complainant'; requestsInformation?: boolean },
): Promise<void> {
  await withTransaction(ctx.pool, async ({ db, client }) => {
    const c = await loadVisibleCase(db, actor, caseId)
    const access = { ...c, status: c.status as CaseState }
    const allowed = input.visibility === 'internal' ? mayAddInternalNote(actor, access) : mayMessageComplainant(actor, access)
    if (!allowed || actor.role === 'tracking_link') throw forbidden(input.visibility === 'internal' ? 'Only staff of this office can add notes.' : 'Only the supervisor or the assigned investigator can write to the complainant while the case is open.')
    const name = (await userName(db, actor.id))?.name ?? 'Unknown user'
    const kind = input.visibility === 'internal' ? 'note' : input.requestsInformation ? 'information_requested' : 'message'
    await appendEvent(db, { caseId: c.id, at: ctx.now(), actorUserId: actor.id, actorLabel: name, kind, body: input.body, visibility: input.visibility })
    if (input.visibility === 'complainant') {
      const link = await issueTrackingLink(db, ctx.publicUrl, c.id)
      const mail = input.requestsInformation ? informationRequestedMail(c, input.body, link) : messageToComplainantMail(c, input.body, link)
      await queueMail(ctx.boss, client, mail, ctx.mailQueue)
    }
  })
}

/** The complainant adds information to their report (through the tracking link or their account). */
export async function addComplainantInformation(ctx: ServiceContext, actor: CaseActor, caseId: string, body: string): Promise<void> {
  await withTransaction(ctx.pool, async ({ db }) => {
    const c = await loadVisibleCase(db, actor, caseId)
    if (!mayAddComplainantInformation(actor, { ...c, status: c.status as CaseState })) throw forbidden()
    await appendEvent(db, {
      caseId: c.id,
      at: ctx.now(),
      actorUserId: actor.role === 'complainant' ? actor.id : null,
      actorLabel: 'Complainant',
      kind: 'complainant_information',
      body,
      visibility: 'complainant',
    })
  })
}

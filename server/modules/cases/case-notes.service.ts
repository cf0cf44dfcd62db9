/** Notes and messages on a case's timeline; they never change its state. */
import type { ServiceContext } from '../../context'
import { withTransaction } from '../../db/client'
import { forbidden, HttpError } from '../../http/errors'
import { queueMail } from '../../jobs/boss'
import { informationRequestedMail, messageToComplainantMail } from '../../mail/case-templates'
import { mayAddComplainantInformation, mayAddInternalNote, mayMessageComplainant, type CaseActor } from '../../policy/case-policy'
import { activeStaffOf, findUserById } from '../users/users.repo'
import { complainantAddedInformationMail } from '../../mail/notification-templates'
import { loadVisibleCase } from './case-access'
import { appendEvent, countEventsSince, lockCase, recordFirstResponse } from './cases.repo'
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
    const allowed = input.visibility === 'internal' ? mayAddInternalNote(actor, c) : mayMessageComplainant(actor, c)
    if (!allowed || actor.role === 'tracking_link') throw forbidden(input.visibility === 'internal' ? 'Only staff of this office can add notes.' : 'Only the supervisor or the assigned investigator can write to the complainant while the case is open.')
    const name = (await findUserById(db, actor.id))?.name ?? 'Unknown user'
    const kind = input.visibility === 'internal' ? 'note' : input.requestsInformation ? 'information_requested' : 'message'
    const at = ctx.now()
    await appendEvent(db, { caseId: c.id, at, actorUserId: actor.id, actorLabel: name, kind, body: input.body, visibility: input.visibility })
    if (input.visibility === 'complainant') {
      // a first message to the complainant is the case's first response (case-clocks.ts)
      await recordFirstResponse(db, c.id, at)
      const link = await issueTrackingLink(db, ctx.publicUrl, c.id)
      const mail = input.requestsInformation ? informationRequestedMail(c, input.body, link) : messageToComplainantMail(c, input.body, link)
      await queueMail(ctx.boss, client, mail, ctx.mailQueue)
    }
  })
}

/** Additions by the complainant per case per hour (abuse limit; common practice, no source). */
export const ADDITIONS_PER_HOUR_PER_CASE = 10

/**
 * The complainant adds information to their report (through the tracking link or their
 * account). At most ADDITIONS_PER_HOUR_PER_CASE an hour, counted in PostgreSQL under the
 * case's row lock, so the limit holds across app processes and parallel requests.
 */
export async function addComplainantInformation(ctx: ServiceContext, actor: CaseActor, caseId: string, body: string): Promise<void> {
  await withTransaction(ctx.pool, async ({ db, client }) => {
    const c = await loadVisibleCase(db, actor, caseId)
    if (!mayAddComplainantInformation(actor, c)) throw forbidden()
    await lockCase(db, c.id)
    const hourAgo = new Date(ctx.now().getTime() - 60 * 60 * 1000)
    if ((await countEventsSince(db, c.id, 'complainant_information', hourAgo)) >= ADDITIONS_PER_HOUR_PER_CASE) {
      throw new HttpError(
        429,
        'too_many_additions',
        `This report has had ${ADDITIONS_PER_HOUR_PER_CASE} additions in the last hour, the most we take. Please wait an hour, then send the rest in one message.`,
      )
    }
    await appendEvent(db, {
      caseId: c.id,
      at: ctx.now(),
      actorUserId: actor.role === 'complainant' ? actor.id : null,
      actorLabel: 'Complainant',
      kind: 'complainant_information',
      body,
      visibility: 'complainant',
    })
    // the loop closes: the assigned investigator hears of it, or the office's supervisors when none is assigned
    const investigator = c.investigatorId ? await findUserById(db, c.investigatorId) : undefined
    const recipients = investigator?.active ? [investigator] : await activeStaffOf(db, c.officeId, 'supervisor')
    for (const to of recipients) {
      await queueMail(ctx.boss, client, complainantAddedInformationMail(to, c, `${ctx.publicUrl}/cases/${c.id}`, { unassigned: !investigator?.active }), ctx.mailQueue)
    }
  })
}

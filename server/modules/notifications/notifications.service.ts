/**
 * "E-mails Quietband sends you": the kinds of e-mail a person can receive, read from the one
 * table of mail kinds (shared/domain/mail-kinds.ts) that the templates are held to.
 */
import { MAIL_KINDS, mailKindWhen, mailKindsFor } from '../../../shared/domain/mail-kinds'
import type { MyEmailsResponse } from '../../../shared/schemas/follow-ups'
import type { ServiceContext } from '../../context'
import { unauthenticated } from '../../http/errors'
import type { Actor } from '../../policy/policy'
import { findUserById } from '../users/users.repo'

export async function myEmails(ctx: ServiceContext, actor: Actor): Promise<MyEmailsResponse> {
  const user = await findUserById(ctx.db, actor.id)
  if (!user) throw unauthenticated()
  return {
    role: actor.role,
    address: user.email,
    kinds: mailKindsFor(actor.role).map((k) => ({ kind: k, when: mailKindWhen(k, actor.role), account: 'account' in MAIL_KINDS[k] && MAIL_KINDS[k].account === true })),
  }
}

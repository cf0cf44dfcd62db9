/**
 * The party responsible for the source, and the proof of notice enforcement rests on: the
 * party's record (each edit a new version), the notices served on it and its replies. Each
 * record and its timeline entry are written in one transaction; the author is the session's.
 */
import { NOTICE_METHOD_LABELS } from '../../../shared/domain/follow-ups'
import type { Notice, Reply, ResponsibleParty, ResponsiblePartyResponse } from '../../../shared/schemas/follow-ups'
import type { ServiceContext } from '../../context'
import { withTransaction, type Db } from '../../db/client'
import type { CaseRow } from '../../db/schema'
import { badRequest, forbidden } from '../../http/errors'
import type { CaseActor } from '../../policy/case-policy'
import { mayReadEnforcement, mayRecordEnforcement } from '../../policy/follow-up-policy'
import { loadVisibleCase } from '../cases/case-access'
import { appendEvent, lockCase } from '../cases/cases.repo'
import { findUserById } from '../users/users.repo'
import { presentNotice, presentParty, presentReply } from './responsible-parties.present'
import {
  insertNotice,
  insertPartyVersion,
  insertReply,
  isLiveEvidenceOfCase,
  isNoticeOfCase,
  noticesOfCase,
  partyVersionsOfCase,
  repliesOfCase,
} from './responsible-parties.repo'

/** GET /api/cases/:id/responsible-party */
export async function getResponsibleParty(ctx: ServiceContext, actor: CaseActor, caseId: string): Promise<ResponsiblePartyResponse> {
  const c = await loadVisibleCase(ctx.db, actor, caseId)
  if (!mayReadEnforcement(actor, c)) throw forbidden('Only staff of the case\u2019s office can read its enforcement records.')
  const [versions, notices, replies] = await Promise.all([partyVersionsOfCase(ctx.db, c.id), noticesOfCase(ctx.db, c.id), repliesOfCase(ctx.db, c.id)])
  const views = versions.map(presentParty)
  return {
    current: views[0] ?? null,
    earlier: views.slice(1),
    notices: notices.map(presentNotice),
    replies: replies.map(presentReply),
    abilities: { record: mayRecordEnforcement(actor, c) },
  }
}

/** Loads the case for a record in the transaction: visible (404), the actor office staff (403), locked. */
async function caseForRecord(db: Db, actor: CaseActor, caseId: string): Promise<{ c: CaseRow; actorId: string; actorName: string }> {
  const c = await loadVisibleCase(db, actor, caseId)
  if (!mayRecordEnforcement(actor, c) || actor.role === 'tracking_link') throw forbidden('Only staff of the case\u2019s office can record this.')
  await lockCase(db, c.id)
  const actorName = (await findUserById(db, actor.id))?.name ?? 'Unknown user'
  return { c, actorId: actor.id, actorName }
}

async function checkEvidence(db: Db, caseId: string, evidenceId: string | undefined) {
  if (evidenceId && !(await isLiveEvidenceOfCase(db, caseId, evidenceId))) {
    throw badRequest('validation_failed', 'Some fields need attention.', [{ path: 'evidenceId', message: 'Choose a file among this case\u2019s evidence.' }])
  }
}

/** Records (a new version of) the responsible party. */
export async function recordResponsibleParty(ctx: ServiceContext, actor: CaseActor, caseId: string, input: ResponsibleParty): Promise<void> {
  await withTransaction(ctx.pool, async ({ db }) => {
    const { c, actorId, actorName } = await caseForRecord(db, actor, caseId)
    const row = await insertPartyVersion(db, { caseId: c.id, recordedBy: actorId, name: input.name, address: input.address ?? null, email: input.email ?? null, phone: input.phone ?? null })
    await appendEvent(db, {
      caseId: c.id,
      at: ctx.now(),
      actorUserId: actorId,
      actorLabel: actorName,
      kind: 'party_recorded',
      visibility: 'internal',
      body: row.version === 1 ? `Responsible party: ${row.name}.` : `Responsible party updated (version ${row.version}): ${row.name}.`,
      data: { partyId: row.id, version: row.version },
    })
  })
}

/** Records a notice served on the responsible party (needs the party recorded first). */
export async function recordNotice(ctx: ServiceContext, actor: CaseActor, caseId: string, input: Notice): Promise<void> {
  await withTransaction(ctx.pool, async ({ db }) => {
    const { c, actorId, actorName } = await caseForRecord(db, actor, caseId)
    if ((await partyVersionsOfCase(db, c.id)).length === 0) {
      throw badRequest('validation_failed', 'Some fields need attention.', [{ path: 'servedOn', message: 'Record the responsible party first: a notice is served on someone.' }])
    }
    await checkEvidence(db, c.id, input.evidenceId)
    if (input.servedOn > new Date(ctx.now().getTime() + 86_400_000).toISOString().slice(0, 10)) {
      throw badRequest('validation_failed', 'Some fields need attention.', [{ path: 'servedOn', message: 'A notice cannot have been served in the future.' }])
    }
    const row = await insertNotice(db, {
      caseId: c.id,
      servedOn: input.servedOn,
      method: input.method,
      methodOther: input.method === 'other' ? (input.methodOther ?? null) : null,
      servedBy: input.servedBy ?? actorName,
      reference: input.reference ?? null,
      summary: input.summary,
      evidenceId: input.evidenceId ?? null,
      recordedBy: actorId,
    })
    const how = row.method === 'other' ? row.methodOther : NOTICE_METHOD_LABELS[row.method]
    await appendEvent(db, {
      caseId: c.id,
      at: ctx.now(),
      actorUserId: actorId,
      actorLabel: actorName,
      kind: 'notice_served',
      visibility: 'internal',
      body: `Notice served on ${row.servedOn} (${how}) by ${row.servedBy}${row.reference ? `, reference ${row.reference}` : ''}: ${row.summary}`,
      data: { noticeId: row.id, method: row.method, servedOn: row.servedOn },
    })
  })
}

/** Records a reply from the responsible party. */
export async function recordReply(ctx: ServiceContext, actor: CaseActor, caseId: string, input: Reply): Promise<void> {
  await withTransaction(ctx.pool, async ({ db }) => {
    const { c, actorId, actorName } = await caseForRecord(db, actor, caseId)
    await checkEvidence(db, c.id, input.evidenceId)
    if (input.noticeId && !(await isNoticeOfCase(db, c.id, input.noticeId))) {
      throw badRequest('validation_failed', 'Some fields need attention.', [{ path: 'noticeId', message: 'Choose a notice of this case.' }])
    }
    const row = await insertReply(db, { caseId: c.id, noticeId: input.noticeId ?? null, receivedOn: input.receivedOn, summary: input.summary, evidenceId: input.evidenceId ?? null, recordedBy: actorId })
    await appendEvent(db, {
      caseId: c.id,
      at: ctx.now(),
      actorUserId: actorId,
      actorLabel: actorName,
      kind: 'party_reply',
      visibility: 'internal',
      body: `Reply received on ${row.receivedOn}: ${row.summary}`,
      data: { replyId: row.id, noticeId: row.noticeId },
    })
  })
}

import { NOTICE_METHOD_LABELS } from '../../../shared/domain/follow-ups'
import type { NoticeView, ReplyView, ResponsiblePartyView } from '../../../shared/schemas/follow-ups'
import type { PartyNoticeRow, PartyReplyRow, ResponsiblePartyRow } from '../../db/schema'
import type { WithRecorder } from './responsible-parties.repo'

export function presentParty(r: WithRecorder<ResponsiblePartyRow>): ResponsiblePartyView {
  return { id: r.id, version: r.version, name: r.name, address: r.address, email: r.email, phone: r.phone, recordedAt: r.recordedAt.toISOString(), recordedBy: r.recordedByName }
}

export function presentNotice(r: WithRecorder<PartyNoticeRow>): NoticeView {
  return {
    id: r.id,
    servedOn: r.servedOn,
    method: r.method,
    methodLabel: NOTICE_METHOD_LABELS[r.method],
    methodOther: r.methodOther,
    servedBy: r.servedBy,
    reference: r.reference,
    summary: r.summary,
    evidenceId: r.evidenceId,
    recordedAt: r.recordedAt.toISOString(),
    recordedBy: r.recordedByName,
  }
}

export function presentReply(r: WithRecorder<PartyReplyRow>): ReplyView {
  return { id: r.id, receivedOn: r.receivedOn, noticeId: r.noticeId, summary: r.summary, evidenceId: r.evidenceId, recordedAt: r.recordedAt.toISOString(), recordedBy: r.recordedByName }
}

/** Mocked answers of the enforcement records, built through their view schemas (invented demo data). */
import {
  caseFollowUpsResponseSchema,
  dueFollowUpsResponseSchema,
  followUpViewSchema,
  myEmailsResponseSchema,
  responsiblePartyResponseSchema,
  type CaseFollowUpsResponse,
  type DueFollowUpsResponse,
  type FollowUpView,
  type MyEmailsResponse,
  type ResponsiblePartyResponse,
} from '../../shared/schemas/follow-ups'
import { MAIL_KINDS, mailKindWhen, mailKindsFor } from '../../shared/domain/mail-kinds'
import { legalHoldResponse } from './msw-retention'
import { answer } from './msw-server'

export const FU_CASE_ID = '0b6f1c2e-5d3a-4e8b-9c71-2a4f6e8d0c13'

export function followUpView(over: Partial<FollowUpView> = {}): FollowUpView {
  return followUpViewSchema.parse({
    id: '5a1b2c3d-4e5f-4a6b-8c7d-9e0f1a2b3c4d',
    caseId: FU_CASE_ID,
    dueOn: '2026-12-01',
    expected: 'Send a formal warning: replace the masthead amplifier on the boathouse roof',
    source: 'finding',
    state: 'open',
    stateLabel: 'Open',
    standing: 'overdue',
    version: 1,
    lastNote: null,
    changedAt: null,
    createdAt: '2026-11-24T10:00:00.000Z',
    abilities: { confirm: true, escalate: true, reopen: false },
    ...over,
  })
}

export function caseFollowUps(over: Partial<CaseFollowUpsResponse> = {}): CaseFollowUpsResponse {
  return caseFollowUpsResponseSchema.parse({ today: '2026-12-05', timeZone: 'Atlantic/Azores', followUps: [followUpView()], abilities: { add: true }, ...over })
}

export function partyResponse(over: Partial<ResponsiblePartyResponse> = {}): ResponsiblePartyResponse {
  return responsiblePartyResponseSchema.parse({
    current: { id: '6b2c3d4e-5f6a-4b7c-8d9e-0f1a2b3c4d5e', version: 2, name: 'Tarnwick Boat Club Ltd', address: '3 Quay Row, Tarnwick', email: 'secretary@boatclub.example', phone: null, recordedAt: '2026-11-25T09:00:00.000Z', recordedBy: 'Ilse Marrow' },
    earlier: [{ id: '7c3d4e5f-6a7b-4c8d-9e0f-1a2b3c4d5e6f', version: 1, name: 'Tarnwick boat club', address: null, email: null, phone: '+00 555 0100', recordedAt: '2026-11-24T09:00:00.000Z', recordedBy: 'Ilse Marrow' }],
    notices: [],
    replies: [],
    abilities: { record: true },
    ...over,
  })
}

export function dueFollowUps(over: Partial<DueFollowUpsResponse> = {}): DueFollowUpsResponse {
  return dueFollowUpsResponseSchema.parse({
    today: '2026-12-05',
    timeZone: 'Atlantic/Azores',
    items: [{ id: '5a1b2c3d-4e5f-4a6b-8c7d-9e0f1a2b3c4d', caseId: FU_CASE_ID, caseReference: 'QB-2026-00412', dueOn: '2026-12-01', expected: 'Replace the amplifier', standing: 'overdue', investigatorName: 'Ilse Marrow' }],
    ...over,
  })
}

/** The answer for a role, from the table of mail kinds (as the server builds it). */
export function myEmails(role: MyEmailsResponse['role'], address = 'ilse.marrow@quietband.test'): MyEmailsResponse {
  return myEmailsResponseSchema.parse({
    role,
    address,
    kinds: mailKindsFor(role).map((k) => ({ kind: k, when: mailKindWhen(k, role), account: 'account' in MAIL_KINDS[k] })),
  })
}

/** The case page's enforcement sections with nothing recorded yet: for tests of the case page's other parts. */
export function answerNoEnforcementRecords(): void {
  answer('get', '/api/cases/:id/follow-ups', caseFollowUps({ followUps: [] }))
  answer('get', '/api/cases/:id/responsible-party', partyResponse({ current: null, earlier: [] }))
  // and no legal hold (the retention feature's panel on the same page)
  answer('get', '/api/cases/:id/legal-hold', legalHoldResponse())
}

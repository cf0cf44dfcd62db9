/**
 * Who may read a case's findings, person × relation, written out by hand from the product
 * brief: the office's staff and administrators read them; complainants never do. Proposing is
 * the assigned investigator's `proposeFinding` move (case-policy.test.ts).
 */
import { describe, expect, it } from 'vitest'
import { mayReadFindings } from '../../server/policy/finding-policy'
import { mayMakeMove, type CaseAccess, type CaseActor } from '../../server/policy/case-policy'

const HOME = 'office-home'
const theCase: CaseAccess = { id: 'case-1', officeId: HOME, status: 'field_work', investigatorId: 'inv-assigned', complainantUserId: 'c-owner' }

const TABLE: [string, CaseActor, { read: boolean; propose: boolean }][] = [
  ['its complainant', { id: 'c-owner', role: 'complainant', officeId: null }, { read: false, propose: false }],
  ['its tracking link', { role: 'tracking_link', caseId: 'case-1' }, { read: false, propose: false }],
  ['the assigned investigator', { id: 'inv-assigned', role: 'investigator', officeId: HOME }, { read: true, propose: true }],
  ['another investigator of the office', { id: 'inv-home', role: 'investigator', officeId: HOME }, { read: true, propose: false }],
  ['an investigator of another office', { id: 'inv-other', role: 'investigator', officeId: 'office-other' }, { read: false, propose: false }],
  ['a supervisor of the office', { id: 'sup-home', role: 'supervisor', officeId: HOME }, { read: true, propose: false }],
  ['a supervisor of another office', { id: 'sup-other', role: 'supervisor', officeId: 'office-other' }, { read: false, propose: false }],
  ['an administrator', { id: 'admin', role: 'admin', officeId: null }, { read: true, propose: false }],
]

describe('the finding policy', () => {
  for (const [who, actor, expected] of TABLE) {
    it(`${who}: ${expected.read ? 'reads' : 'does not read'} the findings, ${expected.propose ? 'proposes' : 'does not propose'} one`, () => {
      expect(mayReadFindings(actor, theCase)).toBe(expected.read)
      expect(mayMakeMove(actor, 'proposeFinding', theCase)).toBe(expected.propose)
    })
  }
})

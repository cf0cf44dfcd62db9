/**
 * Who may do what with a case, as a table of person × relation to the case × action. The
 * expected answers are written out here by hand from the product brief (supervisors triage,
 * assign, review and close; the assigned investigator works the case; the complainant adds
 * information and withdraws), not derived from the lifecycle data the policy reads.
 */
import { describe, expect, it } from 'vitest'
import { caseAbilities, canSeeCase, mayAddComplainantInformation, mayAddInternalNote, mayMakeMove, mayMessageComplainant, type CaseAccess, type CaseActor } from '../../server/policy/case-policy'
import type { CaseMoveName } from '../../shared/domain/case-lifecycle'

const HOME = 'office-home'
const OTHER = 'office-other'
const CASE_ID = 'case-1'
const theCase: CaseAccess = { id: CASE_ID, officeId: HOME, status: 'assigned', investigatorId: 'inv-assigned', complainantUserId: 'c-owner' }

const PEOPLE: Record<string, CaseActor> = {
  'its complainant (account)': { id: 'c-owner', role: 'complainant', officeId: null },
  'another complainant': { id: 'c-other', role: 'complainant', officeId: null },
  'its tracking link': { role: 'tracking_link', caseId: CASE_ID },
  'another case’s tracking link': { role: 'tracking_link', caseId: 'case-2' },
  'the assigned investigator': { id: 'inv-assigned', role: 'investigator', officeId: HOME },
  'another investigator of the office': { id: 'inv-home', role: 'investigator', officeId: HOME },
  'an investigator of another office': { id: 'inv-other', role: 'investigator', officeId: OTHER },
  'a supervisor of the office': { id: 'sup-home', role: 'supervisor', officeId: HOME },
  'a supervisor of another office': { id: 'sup-other', role: 'supervisor', officeId: OTHER },
  'an administrator': { id: 'admin', role: 'admin', officeId: null },
}
type Person = keyof typeof PEOPLE

const SUPERVISOR_MOVES: CaseMoveName[] = ['triage', 'assign', 'transfer', 'merge', 'dismiss', 'returnFinding', 'close', 'reopen']
const INVESTIGATOR_MOVES: CaseMoveName[] = ['startFieldWork', 'proposeFinding']

/** Who, besides nobody else, may make each kind of move (role and relation only; the state is separate). */
const MAY: { what: string; check: (a: CaseActor) => boolean; who: Person[] }[] = [
  ...SUPERVISOR_MOVES.map((m) => ({ what: `move ${m}`, check: (a: CaseActor) => mayMakeMove(a, m, theCase), who: ['a supervisor of the office'] as Person[] })),
  ...INVESTIGATOR_MOVES.map((m) => ({ what: `move ${m}`, check: (a: CaseActor) => mayMakeMove(a, m, theCase), who: ['the assigned investigator'] as Person[] })),
  { what: 'move withdraw', check: (a) => mayMakeMove(a, 'withdraw', theCase), who: ['its complainant (account)', 'its tracking link'] },
  { what: 'add complainant information', check: (a) => mayAddComplainantInformation(a, theCase), who: ['its complainant (account)', 'its tracking link'] },
  { what: 'add an internal note', check: (a) => mayAddInternalNote(a, theCase), who: ['the assigned investigator', 'another investigator of the office', 'a supervisor of the office'] },
  { what: 'message the complainant while open', check: (a) => mayMessageComplainant(a, theCase), who: ['the assigned investigator', 'a supervisor of the office'] },
  { what: 'message the complainant once closed', check: (a) => mayMessageComplainant(a, { ...theCase, status: 'closed' }), who: [] },
  { what: 'run and store calculations while worked', check: (a) => caseAbilities(a, theCase).storeCalculation, who: ['the assigned investigator', 'a supervisor of the office'] },
  { what: 'run and store calculations once a finding is proposed', check: (a) => caseAbilities(a, { ...theCase, status: 'finding_proposed' }).storeCalculation, who: [] },
  {
    what: 'see the case',
    check: (a) => canSeeCase(a, theCase),
    who: ['its complainant (account)', 'its tracking link', 'the assigned investigator', 'another investigator of the office', 'a supervisor of the office', 'an administrator'],
  },
]

describe('the case policy', () => {
  for (const row of MAY) {
    it(`lets only ${row.who.length ? row.who.join(', ') : 'nobody'} ${row.what}`, () => {
      const allowed = (Object.keys(PEOPLE) as Person[]).filter((p) => row.check(PEOPLE[p]!))
      expect(allowed.sort()).toEqual([...row.who].sort())
    })
  }

  it('offers no closing at triage for a case that holds merged reports, and every other move as before', () => {
    const supervisor = PEOPLE['a supervisor of the office']!
    const fresh: CaseAccess = { ...theCase, status: 'received', investigatorId: null }
    expect(caseAbilities(supervisor, fresh)).toMatchObject({ dismiss: true, merge: true, triage: true })
    expect(caseAbilities(supervisor, { ...fresh, holdsMergedReports: true })).toMatchObject({ dismiss: false, merge: true, triage: true, assign: true })
  })

  it('gives an investigator no supervisor move even on a case assigned to them', () => {
    for (const m of SUPERVISOR_MOVES) expect(mayMakeMove(PEOPLE['the assigned investigator']!, m, theCase), m).toBe(false)
  })
})

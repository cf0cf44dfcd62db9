/** The authorization table: role × action × relation to the record's office. */
import { describe, expect, it } from 'vitest'
import { can, officeScope, type Action, type Actor } from '../../server/policy/policy'

const HOME = 'office-home'
const OTHER = 'office-other'
const actors: Record<string, Actor> = {
  complainant: { id: 'c', role: 'complainant', officeId: null },
  investigator: { id: 'i', role: 'investigator', officeId: HOME },
  supervisor: { id: 's', role: 'supervisor', officeId: HOME },
  admin: { id: 'a', role: 'admin', officeId: null },
}

// [action, resource office, complainant, investigator, supervisor, admin]
const TABLE: [Action, string | null, boolean, boolean, boolean, boolean][] = [
  ['office.list', null, false, true, true, true],
  ['office.read', HOME, false, true, true, true],
  ['office.read', OTHER, false, false, false, true],
  ['office.configure', HOME, false, false, true, true],
  ['office.configure', OTHER, false, false, false, true],
  ['staff.list', null, false, true, true, true],
  ['staff.read', HOME, false, true, true, true],
  ['staff.read', OTHER, false, false, false, true],
  ['user.list', null, false, false, false, true],
  ['user.create', null, false, false, false, true],
  ['user.update', null, false, false, false, true],
]

describe('can(actor, action, resource)', () => {
  for (const [action, office, ...expected] of TABLE) {
    it(`${action} on ${office ?? 'the collection'}: complainant ${expected[0]}, investigator ${expected[1]}, supervisor ${expected[2]}, admin ${expected[3]}`, () => {
      const resource = office === null ? undefined : { officeId: office }
      const got = ['complainant', 'investigator', 'supervisor', 'admin'].map((r) => can(actors[r]!, action, resource))
      expect(got).toEqual(expected)
    })
  }

  it('scopes staff queries to their own office and an administrator to all', () => {
    expect(officeScope(actors.investigator!)).toEqual({ officeId: HOME })
    expect(officeScope(actors.admin!)).toEqual({ all: true })
    expect(officeScope(actors.complainant!)).toEqual({ none: true })
  })
})

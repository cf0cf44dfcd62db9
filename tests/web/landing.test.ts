import { describe, expect, it } from 'vitest'
import { landingPathFor, safeNextPath, signInPathFor } from '@/features/auth/lib/landing'
import { accountAbilities } from '../../server/policy/account-policy'
import { NO_ACCOUNT_ABILITIES } from '../../shared/schemas/auth'
import type { Role } from '../../shared/domain/roles'

const OFFICE = '00000000-0000-4000-8000-000000000001'
const abilitiesOf = (role: Role) => accountAbilities({ id: '00000000-0000-4000-8000-0000000000aa', role, officeId: role === 'investigator' || role === 'supervisor' ? OFFICE : null })

describe('landingPathFor', () => {
  it('sends field staff to /work, administrators to /admin/users and complainants to /my-reports', () => {
    expect(landingPathFor(abilitiesOf('investigator'))).toBe('/work')
    expect(landingPathFor(abilitiesOf('supervisor'))).toBe('/work')
    expect(landingPathFor(abilitiesOf('admin'))).toBe('/admin/users')
    expect(landingPathFor(abilitiesOf('complainant'))).toBe('/my-reports')
  })

  it('sends an account that may do nothing in particular to the home page', () => {
    expect(landingPathFor(NO_ACCOUNT_ABILITIES)).toBe('/')
  })
})

describe('safeNextPath', () => {
  it('keeps a path on this site, with its query and hash', () => {
    expect(safeNextPath('/admin/users?sort=name#top')).toBe('/admin/users?sort=name#top')
  })

  it('refuses addresses that would leave the site', () => {
    for (const next of ['https://elsewhere.test/', '//elsewhere.test/x', '/\\elsewhere.test', 'javascript:alert(1)', 'work', '/work\n']) {
      expect(safeNextPath(next)).toBeNull()
    }
  })

  it('refuses the sign-in and password pages themselves, so sign-in cannot loop', () => {
    expect(safeNextPath('/sign-in?next=/work')).toBeNull()
    expect(safeNextPath('/set-password?token=abc')).toBeNull()
    expect(safeNextPath('/confirm-email?token=abc')).toBeNull()
  })

  it('gives null for a missing value', () => {
    expect(safeNextPath(null)).toBeNull()
    expect(safeNextPath('')).toBeNull()
  })
})

describe('signInPathFor', () => {
  it('round-trips the current page through next=', () => {
    const path = signInPathFor({ pathname: '/admin/users', search: '?q=a&b=1' })
    expect(path).toBe('/sign-in?next=%2Fadmin%2Fusers%3Fq%3Da%26b%3D1')
    expect(safeNextPath(new URLSearchParams(path.split('?')[1]).get('next'))).toBe('/admin/users?q=a&b=1')
  })
})

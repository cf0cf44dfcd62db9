import { describe, expect, it } from 'vitest'
import { navItemsFor } from '@/app/layout/nav-items'
import { accountAbilities } from '../../server/policy/account-policy'
import { NO_ACCOUNT_ABILITIES } from '../../shared/schemas/auth'
import { ROLES, type Role } from '../../shared/domain/roles'

const OFFICE = '00000000-0000-4000-8000-000000000001'
/** The abilities /api/me gives each kind of account (from the server's policy). */
const abilitiesOf = (role: Role) => accountAbilities({ id: '00000000-0000-4000-8000-0000000000aa', role, officeId: role === 'investigator' || role === 'supervisor' ? OFFICE : null })
const labels = (abilities: Parameters<typeof navItemsFor>[0]) => navItemsFor(abilities).map((i) => `${i.label} → ${i.to}`)

describe('navItemsFor', () => {
  it('offers an anonymous visitor reporting, following and signing in', () => {
    expect(labels(null)).toEqual(['Report interference → /report', 'Follow a report → /track', 'Sign in → /sign-in'])
  })

  it('gives each kind of account its own main links, from its abilities', () => {
    expect(labels(abilitiesOf('complainant'))).toEqual(['My reports → /my-reports', 'Report interference → /report'])
    expect(labels(abilitiesOf('investigator'))).toEqual(['My cases → /work', 'Band limits → /registers/band-limits', 'Licence register → /registers/stations', 'Equipment → /registers/equipment', 'Calculator → /calculator'])
    expect(labels(abilitiesOf('supervisor'))).toEqual(['Dashboard → /dashboard', 'Office queue → /work', 'Cases → /cases', 'Band limits → /registers/band-limits', 'Licence register → /registers/stations', 'Equipment → /registers/equipment', 'Calculator → /calculator'])
    expect(labels(abilitiesOf('admin'))).toEqual(['Dashboard → /dashboard', 'Users → /admin/users', 'Offices → /admin/offices', 'Audit → /admin/audit', 'Cases → /cases', 'Band limits → /registers/band-limits', 'Licence register → /registers/stations', 'Equipment → /registers/equipment', 'Calculator → /calculator'])
  })

  it('shows a link only for what the account may do', () => {
    expect(labels({ ...NO_ACCOUNT_ABILITIES, manageOffices: true })).toEqual(['Offices → /admin/offices'])
    expect(labels(NO_ACCOUNT_ABILITIES)).toEqual([])
  })

  it('never shows Sign in to someone already signed in', () => {
    for (const role of ROLES) {
      expect(navItemsFor(abilitiesOf(role)).some((i) => i.to === '/sign-in')).toBe(false)
    }
  })
})

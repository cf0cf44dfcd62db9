/** Which main-navigation links each kind of visitor sees. Pure, so it is tested on its own. */
import type { Role } from '../../../../shared/domain/roles'

export interface NavItem {
  /** Visible text, which is also the link's accessible name. */
  label: string
  to: string
}

const ANONYMOUS: NavItem[] = [
  { label: 'Report interference', to: '/report' },
  { label: 'Follow a report', to: '/track' },
  { label: 'Sign in', to: '/sign-in' },
]

const BY_ROLE: Record<Role, NavItem[]> = {
  complainant: [
    { label: 'My reports', to: '/my-reports' },
    { label: 'Report interference', to: '/report' },
  ],
  investigator: [{ label: 'My cases', to: '/work' }],
  supervisor: [
    { label: 'Office queue', to: '/work' },
    { label: 'Cases', to: '/cases' },
  ],
  admin: [
    { label: 'Users', to: '/admin/users' },
    { label: 'Offices', to: '/admin/offices' },
    { label: 'Cases', to: '/cases' },
  ],
}

export function navItemsFor(role: Role | null): NavItem[] {
  return role ? BY_ROLE[role] : ANONYMOUS
}

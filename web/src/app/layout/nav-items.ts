/**
 * Which main-navigation links a visitor sees, from what their account may do (/api/me's
 * abilities; null for an anonymous visitor). Pure, so it is tested on its own.
 */
import type { AccountAbilities } from '../../../../shared/schemas/auth'

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

export function navItemsFor(abilities: AccountAbilities | null): NavItem[] {
  if (!abilities) return ANONYMOUS
  const items: NavItem[] = []
  if (abilities.followOwnReports) items.push({ label: 'My reports', to: '/my-reports' })
  if (abilities.reportAsAccount) items.push({ label: 'Report interference', to: '/report' })
  if (abilities.runOfficeQueue) items.push({ label: 'Office queue', to: '/work' })
  else if (abilities.workAssignedCases) items.push({ label: 'My cases', to: '/work' })
  if (abilities.manageUsers) items.push({ label: 'Users', to: '/admin/users' })
  if (abilities.manageOffices) items.push({ label: 'Offices', to: '/admin/offices' })
  // an investigator reaches the full list from My cases; the main links stay their own work
  if (abilities.readCases && !abilities.workAssignedCases) items.push({ label: 'Cases', to: '/cases' })
  return items
}

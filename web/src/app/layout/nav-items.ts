/**
 * Which main-navigation links a visitor sees, from what their account may do (/api/me's
 * abilities; null for an anonymous visitor). Pure, so it is tested on its own.
 */
import type { AccountAbilities } from '@shared/schemas/auth'
import { paths } from '@/lib/paths'

export interface NavItem {
  /** Visible text, which is also the link's accessible name. */
  label: string
  to: string
}

const ANONYMOUS: NavItem[] = [
  { label: 'Report interference', to: paths.report.href() },
  { label: 'Follow a report', to: paths.track.href() },
  { label: 'Sign in', to: paths.signIn.href() },
]

export function navItemsFor(abilities: AccountAbilities | null): NavItem[] {
  if (!abilities) return ANONYMOUS
  const items: NavItem[] = []
  if (abilities.followOwnReports) items.push({ label: 'My reports', to: paths.myReports.href() })
  if (abilities.reportAsAccount) items.push({ label: 'Report interference', to: paths.report.href() })
  // the office at a glance comes first for those who run it
  if (abilities.readDashboard) items.push({ label: 'Dashboard', to: paths.dashboard.href() })
  if (abilities.runOfficeQueue) items.push({ label: 'Office queue', to: paths.work.href() })
  else if (abilities.workAssignedCases) items.push({ label: 'My cases', to: paths.work.href() })
  if (abilities.manageUsers) items.push({ label: 'Users', to: paths.adminUsers.href() })
  if (abilities.manageOffices) items.push({ label: 'Offices', to: paths.adminOffices.href() })
  if (abilities.readAudit) items.push({ label: 'Audit', to: paths.adminAudit.href() })
  // an investigator reaches the full list from My cases; the main links stay their own work
  if (abilities.readCases && !abilities.workAssignedCases) items.push({ label: 'Cases', to: paths.cases.href() })
  if (abilities.readBandLimits) items.push({ label: 'Band limits', to: paths.bandLimits.href() })
  if (abilities.readStationRegister) items.push({ label: 'Licence register', to: paths.stationRegister.href() })
  if (abilities.readEquipment) items.push({ label: 'Equipment', to: paths.equipment.href() })
  if (abilities.readBandLimits) items.push({ label: 'Calculator', to: paths.calculator.href() })
  return items
}

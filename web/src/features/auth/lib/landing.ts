/** Where people go after signing in. Pure: shared by the forms, the guard and the nav. */
import type { AccountAbilities } from '@shared/schemas/auth'
import { paths } from '@/lib/paths'

/** An account's first page, from what it may do: its work, then administration, then its reports. */
export function landingPathFor(abilities: AccountAbilities): string {
  if (abilities.runOfficeQueue || abilities.workAssignedCases) return paths.work.href()
  if (abilities.manageUsers) return paths.adminUsers.href()
  if (abilities.readCases) return paths.cases.href()
  if (abilities.followOwnReports) return paths.myReports.href()
  return paths.home.href()
}

/**
 * Accepts a `next` value only if it is a path on this site; anything else (absolute URLs,
 * protocol-relative `//host`, back-slash tricks, the auth pages themselves) gives null.
 */
const AUTH_PAGES: string[] = [paths.signIn.path, paths.register.path, paths.forgotPassword.path, paths.setPassword.path, paths.confirmEmail.path]

export function safeNextPath(next: string | null | undefined): string | null {
  if (!next || next.length > 2000) return null
  if (!next.startsWith('/') || next.startsWith('//') || next.includes('\\')) return null
  // eslint-disable-next-line no-control-regex -- finding control characters is the point
  if (/[\u0000-\u001f]/.test(next)) return null
  const pathname = next.split(/[?#]/)[0] ?? ''
  if (AUTH_PAGES.includes(pathname)) return null
  return next
}

/** Sign-in URL that brings the person back to where they were. */
export function signInPathFor(location: { pathname: string; search: string }): string {
  return paths.signIn.href(location.pathname + location.search)
}

/**
 * Gate for signed-in areas. Anonymous visitors go to sign-in and come back afterwards; a
 * signed-in person of another role sees a plain "not available" page. The server enforces
 * the same rules on every API call; this only keeps people off pages that would refuse them.
 */
import { Navigate, Outlet, useLocation } from 'react-router-dom'
import type { Role } from '../../../../shared/domain/roles'
import { Loading } from '../../components/ui/loading'
import { QueryError } from '../../components/ui/query-error'
import { useMe } from '../../features/auth/api/get-me'
import { signInPathFor } from '../../features/auth/lib/landing'
import { NotAvailable } from './not-available'

export function RequireRole({ roles }: { roles: readonly Role[] }) {
  const me = useMe()
  const location = useLocation()
  if (me.isPending) return <Loading label="Checking your sign-in…" />
  if (me.isError) return <QueryError error={me.error} what="your sign-in" title="Could not check your sign-in." onRetry={() => void me.refetch()} />
  if (!me.data) return <Navigate to={signInPathFor(location)} replace />
  if (!roles.includes(me.data.role)) return <NotAvailable user={me.data} />
  return <Outlet />
}

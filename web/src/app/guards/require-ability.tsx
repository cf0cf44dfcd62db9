/**
 * Gate for signed-in areas. Anonymous visitors go to sign-in and come back afterwards; a
 * signed-in person whose account may do none of `anyOf` sees a plain "not available" page.
 * The server enforces the same rules on every API call; this only keeps people off pages
 * that would refuse them.
 */
import { Navigate, Outlet, useLocation } from 'react-router-dom'
import type { AccountAbility } from '@shared/schemas/auth'
import { Loading } from '@/components/ui/loading'
import { QueryError } from '@/components/ui/query-error'
import { abilitiesOf, meQueryOptions } from '@/features/auth/api/get-me'
import { signInPathFor } from '@/features/auth/lib/landing'
import { useQuery } from '@tanstack/react-query'
import { NotAvailable } from './not-available'

export function RequireAbility({ anyOf }: { anyOf: readonly AccountAbility[] }) {
  const me = useQuery(meQueryOptions())
  const location = useLocation()
  if (me.isPending) return <Loading label="Checking your sign-in…" />
  if (me.isError) return <QueryError error={me.error} what="your sign-in" title="Could not check your sign-in." onRetry={() => void me.refetch()} />
  if (!me.data.user) return <Navigate to={signInPathFor(location)} replace />
  const abilities = abilitiesOf(me.data)
  if (!anyOf.some((a) => abilities[a])) return <NotAvailable user={me.data.user} abilities={abilities} />
  return <Outlet />
}

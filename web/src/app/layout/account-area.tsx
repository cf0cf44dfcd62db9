/** Who is signed in (name, role, office) and the way out. */
import type { SessionUser } from '@shared/schemas/auth'
import { ROLE_LABELS } from '@shared/domain/roles'
import { Link } from 'react-router-dom'
import { useSignOut } from '@/features/auth/api/sign-out'
import { paths } from '@/lib/paths'

export function AccountArea({ user }: { user: SessionUser }) {
  const signOut = useSignOut()
  return (
    <section aria-label="Account" className="flex flex-wrap items-center gap-x-4 gap-y-1">
      <div className="text-sm leading-tight">
        <p className="font-semibold text-paper">{user.name}</p>
        <p className="text-paper/80">
          {ROLE_LABELS[user.role]}
          {user.officeName && <> · {user.officeName}</>}
        </p>
        <p>
          <Link to={paths.myEmails.href()} className="text-paper underline">
            E-mails you get
          </Link>
        </p>
      </div>
      <button
        type="button"
        onClick={() => signOut.mutate()}
        disabled={signOut.isPending}
        className="min-h-11 rounded-control border border-paper/60 px-3 font-semibold text-paper hover:bg-paper/15 disabled:opacity-60"
      >
        {signOut.isPending ? 'Signing out…' : 'Sign out'}
      </button>
      {signOut.isError && (
        <p role="alert" className="w-full text-sm text-paper">
          Sign-out did not reach the server. Try again.
        </p>
      )}
    </section>
  )
}

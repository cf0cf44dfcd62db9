/** /sign-in?next=… — back to `next` (if it is a page on this site) or the role's start page. */
import { Link, useNavigate, useSearchParams } from 'react-router-dom'
import { Panel } from '@/components/ui/panel'
import { PageHeader } from '@/components/ui/page-header'
import { Notice } from '@/components/ui/notice'
import { useAbilities, useMe } from '@/features/auth/api/get-me'
import { SignInForm } from '@/features/auth/components/sign-in-form'
import { landingPathFor, safeNextPath } from '@/features/auth/lib/landing'
import { paths } from '@/lib/paths'

export function Component() {
  const [params] = useSearchParams()
  const navigate = useNavigate()
  const me = useMe()
  const abilities = useAbilities().data
  const next = safeNextPath(params.get('next'))

  return (
    <div className="max-w-lg">
      <PageHeader title="Sign in" lead={next ? <p>Sign in to continue to that page.</p> : undefined} />
      {me.data && (
        <div className="mb-5">
          <Notice title={`You are already signed in as ${me.data.name}.`}>
            <p>
              <Link to={abilities ? landingPathFor(abilities) : paths.home.href()}>Go to your start page</Link>, or sign in below as someone else.
            </p>
          </Notice>
        </div>
      )}
      <Panel>
        <SignInForm onSignedIn={(session) => navigate(next ?? landingPathFor(session.abilities), { replace: true })} />
      </Panel>
      <ul className="mt-5 flex flex-col gap-2">
        <li>
          <Link to={paths.forgotPassword.href()}>Forgot your password?</Link>
        </li>
        <li>
          <Link to={paths.register.href()}>Create a complainant account</Link> <span className="text-ink-muted">(optional — you can report without one)</span>
        </li>
      </ul>
    </div>
  )
}

/** /set-password?token=… — one page for password resets and new-staff invitations. */
import { Link, useNavigate } from 'react-router-dom'
import { PageHeader } from '@/components/ui/page-header'
import { Notice } from '@/components/ui/notice'
import { Panel } from '@/components/ui/panel'
import { SetPasswordForm } from '@/features/auth/components/set-password-form'
import { landingPathFor } from '@/features/auth/lib/landing'
import { useEmailedToken } from '@/features/auth/lib/use-emailed-token'
import { paths } from '@/lib/paths'

export function Component() {
  const navigate = useNavigate()
  const { token, usable, refuse } = useEmailedToken()

  return (
    <div className="max-w-lg">
      <PageHeader title="Choose a password" lead={usable ? <p>You will be signed in once it is saved.</p> : undefined} />
      {usable ? (
        <Panel>
          <SetPasswordForm
            token={token}
            onDone={(session) => navigate(landingPathFor(session.abilities), { replace: true })}
            onInvalidToken={refuse}
          />
        </Panel>
      ) : (
        <Notice tone="caution" title="This link cannot be used." live>
          <p>
            It may be incomplete, already used, or expired. <Link to={paths.forgotPassword.href()}>Ask for a new link</Link>; staff who were
            invited can also ask their administrator to send the invitation again.
          </p>
        </Notice>
      )}
    </div>
  )
}

/** /confirm-email?token=… — the link in the e-mail sent at registration. */
import { Link, useNavigate } from 'react-router-dom'
import { Notice } from '@/components/ui/notice'
import { PageHeader } from '@/components/ui/page-header'
import { Panel } from '@/components/ui/panel'
import { ConfirmEmailButton } from '@/features/auth/components/confirm-email-button'
import { landingPathFor } from '@/features/auth/lib/landing'
import { useEmailedToken } from '@/features/auth/lib/use-emailed-token'
import { paths } from '@/lib/paths'

export function Component() {
  const navigate = useNavigate()
  const { token, usable, refuse } = useEmailedToken()

  return (
    <div className="max-w-lg">
      <PageHeader
        title="Confirm your e-mail address"
        lead={usable ? <p>This makes your account work, and brings the reports you filed with this address into your list.</p> : undefined}
      />
      {usable ? (
        <Panel>
          <ConfirmEmailButton token={token} onDone={(session) => navigate(landingPathFor(session.abilities), { replace: true })} onInvalidToken={refuse} />
        </Panel>
      ) : (
        <Notice tone="caution" title="This link cannot be used." live>
          <p>
            It may be incomplete, already used, or expired. If your address is confirmed already, <Link to={paths.signIn.href()}>sign in</Link>.
            Otherwise <Link to={paths.forgotPassword.href()}>ask for a link to choose a password</Link>: choosing one also confirms the address.
          </p>
        </Notice>
      )}
    </div>
  )
}

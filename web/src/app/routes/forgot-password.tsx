/** /forgot-password — e-mails a link to /set-password. */
import { Link } from 'react-router-dom'
import { PageHeader } from '@/components/ui/page-header'
import { Panel } from '@/components/ui/panel'
import { ForgotPasswordForm } from '@/features/auth/components/forgot-password-form'
import { paths } from '@/lib/paths'

export function Component() {
  return (
    <div className="max-w-lg">
      <PageHeader title="Reset your password" lead={<p>Enter the e-mail address of your account. We will send a link to choose a new password.</p>} />
      <Panel>
        <ForgotPasswordForm />
      </Panel>
      <p className="mt-5">
        <Link to={paths.signIn.href()}>Back to sign-in</Link>
      </p>
    </div>
  )
}

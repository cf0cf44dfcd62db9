/** /register — optional complainant account; it works once the e-mailed link confirms the address. */
import { Link } from 'react-router-dom'
import { PageHeader } from '@/components/ui/page-header'
import { Panel } from '@/components/ui/panel'
import { RegisterForm } from '@/features/auth/components/register-form'
import { paths } from '@/lib/paths'

export function Component() {
  return (
    <div className="max-w-lg">
      <PageHeader
        title="Create an account"
        lead={<p>An account keeps all your reports in one list, also those you filed with the same e-mail address without one. You can also report without an account: every report gets its own tracking link.</p>}
      />
      <Panel>
        <RegisterForm />
      </Panel>
      <p className="mt-5">
        Have an account already? <Link to={paths.signIn.href()}>Sign in</Link>
      </p>
    </div>
  )
}

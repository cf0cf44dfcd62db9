/** /register — optional complainant account; afterwards the person is signed in. */
import { Link, useNavigate } from 'react-router-dom'
import { PageHeader } from '../../components/ui/page-header'
import { Panel } from '../../components/ui/panel'
import { RegisterForm } from '../../features/auth/components/register-form'
import { landingPathFor } from '../../features/auth/lib/landing'

export function Component() {
  const navigate = useNavigate()
  return (
    <div className="max-w-lg">
      <PageHeader
        title="Create an account"
        lead={<p>An account keeps all your reports in one list. You can also report without one: every report gets its own tracking link.</p>}
      />
      <Panel>
        <RegisterForm onRegistered={(user) => navigate(landingPathFor(user.role), { replace: true })} />
      </Panel>
      <p className="mt-5">
        Have an account already? <Link to="/sign-in">Sign in</Link>
      </p>
    </div>
  )
}

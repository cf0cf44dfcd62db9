/** What a signed-in person sees on a page their account cannot use. */
import { Link } from 'react-router-dom'
import { ROLE_LABELS } from '@shared/domain/roles'
import type { AccountAbilities, SessionUser } from '@shared/schemas/auth'
import { PageHeader } from '@/components/ui/page-header'
import { buttonClass } from '@/components/ui/button'
import { landingPathFor } from '@/features/auth/lib/landing'

export function NotAvailable({ user, abilities }: { user: SessionUser; abilities: AccountAbilities }) {
  return (
    <>
      <PageHeader
        title="Not available for your role"
        lead={
          <p>
            You are signed in as {user.name} ({ROLE_LABELS[user.role]}). This page belongs to another kind of account, so there
            is nothing here for you.
          </p>
        }
      />
      <Link to={landingPathFor(abilities)} className={buttonClass('primary')}>
        Go to your start page
      </Link>
    </>
  )
}

/** /account/emails — what Quietband e-mails the signed-in person, from the server's table of mail kinds. */
import { Link } from 'react-router-dom'
import { PageHeader } from '@/components/ui/page-header'
import { useMe } from '@/features/auth/api/get-me'
import { MyEmailsPanel } from '@/features/notifications/components/my-emails-panel'
import { paths } from '@/lib/paths'

export function Component() {
  const me = useMe()
  if (me.data === null) {
    return (
      <div className="max-w-2xl">
        <PageHeader title="E-mails Quietband sends you" />
        <p>
          <Link to={paths.signIn.href(paths.myEmails.href())}>Sign in</Link> to see which e-mails Quietband sends you.
        </p>
      </div>
    )
  }
  return (
    <div className="flex max-w-3xl flex-col gap-6">
      <PageHeader title="E-mails Quietband sends you" lead={<p>Each message Quietband can send you, and what makes it go out.</p>} />
      <MyEmailsPanel />
    </div>
  )
}

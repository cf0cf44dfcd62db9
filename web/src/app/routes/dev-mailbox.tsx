/** /dev/mailbox — read the e-mails a development server "sent" (reset links, invitations…). */
import { Button } from '@/components/ui/button'
import { Loading } from '@/components/ui/loading'
import { Notice } from '@/components/ui/notice'
import { PageHeader } from '@/components/ui/page-header'
import { QueryError } from '@/components/ui/query-error'
import { useMailbox } from '@/features/dev-mailbox/api/get-mailbox'
import { MessageList } from '@/features/dev-mailbox/components/message-list'
import { isApiError } from '@/lib/api-client'

export function Component() {
  const mailbox = useMailbox()
  const disabled = isApiError(mailbox.error) && mailbox.error.code === 'mailbox_disabled'
  return (
    <>
      <PageHeader
        kicker="Development"
        title="Mailbox"
        lead={<p>E-mails the server has sent while no real mail server is set up, newest first.</p>}
      />
      <div className="mb-4">
        <Button variant="secondary" onClick={() => void mailbox.refetch()} disabled={mailbox.isFetching}>
          {mailbox.isFetching ? 'Checking…' : 'Check for new messages'}
        </Button>
      </div>
      {mailbox.isPending && <Loading label="Loading messages…" />}
      {disabled && (
        <Notice tone="info" title="The development mailbox is off.">
          <p>{isApiError(mailbox.error) ? mailbox.error.message : null}</p>
          <p>Read the e-mails in the mailboxes they were sent to instead.</p>
        </Notice>
      )}
      {mailbox.isError && !disabled && <QueryError error={mailbox.error} what="the mailbox" onRetry={() => void mailbox.refetch()} />}
      {mailbox.data && <MessageList messages={mailbox.data.messages} />}
    </>
  )
}

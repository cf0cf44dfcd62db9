/** GET /api/dev/mailbox — e-mails the server would have sent, newest first (development only). */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { api } from '../../../lib/api-client'

export interface MailboxMessage {
  id: string
  from: string
  to: string[]
  subject: string
  /** ISO 8601 */
  date: string
  text: string
  html: string | null
}

export const getMailbox = (signal?: AbortSignal) => api.get<{ messages: MailboxMessage[] }>('/api/dev/mailbox', signal)

export const mailboxQueryOptions = () =>
  queryOptions({ queryKey: ['dev', 'mailbox'], queryFn: ({ signal }) => getMailbox(signal), staleTime: 0 })

export const useMailbox = () => useQuery(mailboxQueryOptions())

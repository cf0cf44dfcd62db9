/** GET /api/dev/mailbox — e-mails the server would have sent, newest first (development only). */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { api } from '@/lib/api-client'
import { mailboxKeys } from '@/lib/query-keys'
import type { MailboxMessage } from '@shared/schemas/views'
export type { MailboxMessage }

export const getMailbox = (signal?: AbortSignal) => api.get<{ messages: MailboxMessage[] }>('/api/dev/mailbox', signal)

export const mailboxQueryOptions = () =>
  queryOptions({ queryKey: mailboxKeys.all, queryFn: ({ signal }) => getMailbox(signal), staleTime: 0 })

export const useMailbox = () => useQuery(mailboxQueryOptions())

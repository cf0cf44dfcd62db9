/** GET /api/me/emails — the kinds of e-mail Quietband sends the signed-in person. */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { myEmailsResponseSchema, type MyEmailsResponse } from '@shared/schemas/follow-ups'
import { api } from '@/lib/api-client'
import { notificationKeys } from '@/lib/query-keys'
export type { MyEmailsResponse }

export const getMyEmails = (signal?: AbortSignal) => api.read(myEmailsResponseSchema, '/api/me/emails', signal)

export const myEmailsQueryOptions = () => queryOptions({ queryKey: notificationKeys.myEmails(), queryFn: ({ signal }) => getMyEmails(signal) })

export const useMyEmails = () => useQuery(myEmailsQueryOptions())

/** GET /api/follow-ups/due — the viewer's follow-ups due today or overdue (their cases, or their office's). */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { dueFollowUpsResponseSchema, type DueFollowUpsResponse } from '@shared/schemas/follow-ups'
import { api } from '@/lib/api-client'
import { enforcementKeys } from '@/lib/query-keys'
export type { DueFollowUpsResponse }

export const getDueFollowUps = (signal?: AbortSignal) => api.read(dueFollowUpsResponseSchema, '/api/follow-ups/due', signal)

export const dueFollowUpsQueryOptions = () => queryOptions({ queryKey: enforcementKeys.due(), queryFn: ({ signal }) => getDueFollowUps(signal) })

export const useDueFollowUps = () => useQuery(dueFollowUpsQueryOptions())

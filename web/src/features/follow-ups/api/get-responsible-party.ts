/** GET /api/cases/:id/responsible-party — the party (current and earlier versions), notices served and replies. */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { responsiblePartyResponseSchema, type ResponsiblePartyResponse } from '@shared/schemas/follow-ups'
import { api } from '@/lib/api-client'
import { enforcementKeys } from '@/lib/query-keys'
export type { ResponsiblePartyResponse }

export const getResponsibleParty = (caseId: string, signal?: AbortSignal) =>
  api.read(responsiblePartyResponseSchema, `/api/cases/${encodeURIComponent(caseId)}/responsible-party`, signal)

export const responsiblePartyQueryOptions = (caseId: string) =>
  queryOptions({ queryKey: enforcementKeys.party(caseId), queryFn: ({ signal }) => getResponsibleParty(caseId, signal) })

export const useResponsibleParty = (caseId: string) => useQuery(responsiblePartyQueryOptions(caseId))

/** GET /api/cases/:id/transfer-offices — the other offices, nearest to the report's location first. */
import { queryOptions, useQuery } from '@tanstack/react-query'
import type { TransferOffice } from '@shared/schemas/views'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'

export type OfficeChoice = TransferOffice

export const getTransferOffices = (caseId: string, signal?: AbortSignal) =>
  api.get<{ offices: OfficeChoice[] }>(`/api/cases/${encodeURIComponent(caseId)}/transfer-offices`, signal).then((r) => r.offices)

export const transferOfficesQueryOptions = (caseId: string) =>
  queryOptions({ queryKey: caseKeys.transferOffices(caseId), queryFn: ({ signal }) => getTransferOffices(caseId, signal), staleTime: 5 * 60_000 })

/** Offices the case may go to; fetched only when the transfer move is possible. */
export const useTransferOffices = (caseId: string, enabled: boolean) => useQuery({ ...transferOfficesQueryOptions(caseId), enabled })

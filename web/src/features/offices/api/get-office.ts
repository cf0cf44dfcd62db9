/** GET /api/offices/:id — one office, read afresh when its edit page opens (its version goes back with the edit). */
import { useQuery } from '@tanstack/react-query'
import { officeResponseSchema } from '@shared/schemas/views'
import { api } from '@/lib/api-client'
import { officeKeys } from '@/lib/query-keys'

export const getOffice = (officeId: string, signal?: AbortSignal) => api.read(officeResponseSchema, `/api/offices/${encodeURIComponent(officeId)}`, signal)

export const useOffice = (officeId: string) =>
  useQuery({ queryKey: officeKeys.detail(officeId), queryFn: ({ signal }) => getOffice(officeId, signal), staleTime: 0, refetchOnWindowFocus: false })

/**
 * POST /api/admin/offices/check-area — an area's size and its overlaps with other offices' areas
 * (and whether the office's position lies in it), asked while the administrator draws: the
 * request waits until the area has stayed the same for a moment.
 */
import { useEffect, useState } from 'react'
import { useQuery } from '@tanstack/react-query'
import type { z } from 'zod'
import type { AreaCheckRequest, areaCheckResponseSchema } from '@shared/schemas/offices'
import { apiRequest } from '@/lib/api-client'
import { officeKeys } from '@/lib/query-keys'

export type AreaCheck = z.infer<typeof areaCheckResponseSchema>

export const checkArea = (request: AreaCheckRequest, signal?: AbortSignal) => apiRequest<AreaCheck>({ method: 'POST', path: '/api/admin/offices/check-area', body: request, signal })

/** How long the area must stay unchanged before it is checked [ms]. */
export const AREA_CHECK_DELAY_MS = 600

/** The check of `request` once it has not changed for AREA_CHECK_DELAY_MS; nothing is asked while it is null. */
export function useAreaCheck(request: AreaCheckRequest | null) {
  const text = request ? JSON.stringify(request) : null
  const [settled, setSettled] = useState<string | null>(text)
  useEffect(() => {
    const timer = setTimeout(() => setSettled(text), AREA_CHECK_DELAY_MS)
    return () => clearTimeout(timer)
  }, [text])
  const asked = settled !== null && settled === text ? (JSON.parse(settled) as AreaCheckRequest) : null
  const query = useQuery({
    queryKey: officeKeys.areaCheck(asked ?? { area: null }),
    queryFn: ({ signal }) => checkArea(asked!, signal),
    enabled: asked !== null,
    staleTime: 60_000,
  })
  return { ...query, waiting: text !== null && asked === null }
}

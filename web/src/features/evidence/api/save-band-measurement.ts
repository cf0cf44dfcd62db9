/**
 * POST /api/evidence/:id/band-measurement — a band of a processed trace in dBm kept as a
 * measurement of the case. The page sends the band's edges and when and where the file was
 * recorded; the server computes the channel power itself and stores it, linked to the file.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { BandMeasurementRequestInput, BandMeasurementResponse } from '@shared/schemas/band-measurement'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'

export const saveBandMeasurement = (evidenceId: string, request: BandMeasurementRequestInput) =>
  api.post<BandMeasurementResponse>(`/api/evidence/${encodeURIComponent(evidenceId)}/band-measurement`, request)

export function useSaveBandMeasurement(caseId: string, evidenceId: string) {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: (request: BandMeasurementRequestInput) => saveBandMeasurement(evidenceId, request),
    onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: caseKeys.measurements(caseId) }), queryClient.invalidateQueries({ queryKey: caseKeys.detail(caseId) })]),
  })
}

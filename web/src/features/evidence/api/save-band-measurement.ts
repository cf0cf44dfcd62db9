/**
 * POST /api/cases/:id/measurements — a band's channel power (a trace in dBm only) kept as a
 * measurement of the case, linked to its evidence file. The server derives the levels itself.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { MeasurementContentInput, MeasurementView } from '@shared/schemas/measurements'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'

export const saveBandMeasurement = (caseId: string, measurement: MeasurementContentInput) =>
  api.post<{ measurement: MeasurementView }>(`/api/cases/${encodeURIComponent(caseId)}/measurements`, { measurement })

export function useSaveBandMeasurement(caseId: string) {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: (measurement: MeasurementContentInput) => saveBandMeasurement(caseId, measurement),
    onSuccess: () => Promise.all([queryClient.invalidateQueries({ queryKey: caseKeys.measurements(caseId) }), queryClient.invalidateQueries({ queryKey: caseKeys.detail(caseId) })]),
  })
}

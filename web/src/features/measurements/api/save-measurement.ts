/**
 * POST /api/cases/:id/measurements (record), PATCH /api/measurements/:id (edit, with the version
 * seen, until a calculation uses it) and POST /api/measurements/:id/corrections (a correction that
 * supersedes it). The server derives the levels itself; the form never sends them.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { MeasurementContentInput } from '@shared/schemas/measurements'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'
import type { Measurement } from './get-measurements'

export type SaveMeasurement =
  | { kind: 'record'; caseId: string; measurement: MeasurementContentInput }
  | { kind: 'edit'; caseId: string; measurementId: string; version: number; measurement: MeasurementContentInput }
  | { kind: 'correct'; caseId: string; measurementId: string; measurement: MeasurementContentInput }

export function saveMeasurement(s: SaveMeasurement) {
  const id = s.kind === 'record' ? '' : encodeURIComponent(s.measurementId)
  if (s.kind === 'record') return api.post<{ measurement: Measurement }>(`/api/cases/${encodeURIComponent(s.caseId)}/measurements`, { measurement: s.measurement })
  if (s.kind === 'edit') return api.patch<{ measurement: Measurement }>(`/api/measurements/${id}`, { measurement: s.measurement, version: s.version })
  return api.post<{ measurement: Measurement }>(`/api/measurements/${id}/corrections`, { measurement: s.measurement })
}

export function useSaveMeasurement() {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: saveMeasurement,
    // the list changes, and the case's timeline gains an entry
    onSuccess: (_data, s) => queryClient.invalidateQueries({ queryKey: caseKeys.measurements(s.caseId) }).then(() => queryClient.invalidateQueries({ queryKey: caseKeys.detail(s.caseId) })),
  })
}

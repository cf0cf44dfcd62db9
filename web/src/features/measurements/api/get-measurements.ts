/** GET /api/cases/:id/measurements — a case's measurements and whether the viewer may record more. */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { measurementsResponseSchema, type MeasurementView } from '@shared/schemas/measurements'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'

export type Measurement = MeasurementView

export const getMeasurements = (caseId: string, signal?: AbortSignal) =>
  api.read(measurementsResponseSchema, `/api/cases/${encodeURIComponent(caseId)}/measurements`, signal)

export const measurementsQueryOptions = (caseId: string) =>
  queryOptions({ queryKey: caseKeys.measurements(caseId), queryFn: ({ signal }) => getMeasurements(caseId, signal) })

export const useMeasurements = (caseId: string) => useQuery(measurementsQueryOptions(caseId))

/** GET /api/cases/:id/measurements — the case's measurements (superseded ones included; the checklist leaves them out). */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { measurementsResponseSchema } from '@shared/schemas/measurements'
import { api } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'

export const getMeasurements = (caseId: string, signal?: AbortSignal) =>
  api.read(measurementsResponseSchema, `/api/cases/${encodeURIComponent(caseId)}/measurements`, signal)

export const measurementsQueryOptions = (caseId: string) =>
  queryOptions({ queryKey: caseKeys.measurements(caseId), queryFn: ({ signal }) => getMeasurements(caseId, signal) })

export const useCaseMeasurements = (caseId: string) => useQuery(measurementsQueryOptions(caseId))

/** Network answers for a case's measurements, built from the shared view schemas. */
import { measurementsResponseSchema } from '../../shared/schemas/measurements'

/** GET /api/cases/:id/measurements: none recorded; `record` says whether the viewer may record one. */
export function measurementsResponse(record = false) {
  return measurementsResponseSchema.parse({ measurements: [], abilities: { record } })
}

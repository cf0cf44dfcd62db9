/** A case's measurements, as the API document describes them (routes: measurements.routes.ts). */
import { idParamSchema } from '../../../shared/schemas/ids'
import { measurementPatchSchema, measurementResponseSchema, measurementsResponseSchema, newMeasurementSchema } from '../../../shared/schemas/measurements'
import { STAFF, type ApiOperation } from '../../openapi/operation'

const tag = 'Measurements'

export const measurementsApi: ApiOperation[] = [
  {
    method: 'get',
    path: '/api/cases/:id/measurements',
    summary: 'A case\'s measurements with their derived levels, and whether the caller may record more',
    tag,
    callers: STAFF,
    params: idParamSchema,
    responses: { 200: measurementsResponseSchema },
  },
  {
    method: 'post',
    path: '/api/cases/:id/measurements',
    summary: 'Record a measurement on a case: the server derives its levels from the reading and the chain',
    tag,
    callers: ['investigator', 'supervisor'],
    params: idParamSchema,
    body: newMeasurementSchema,
    responses: { 201: measurementResponseSchema },
    errors: [409],
    description: 'The assigned investigator or the office\'s supervisor, while the case is worked (another state: 409).',
  },
  {
    method: 'patch',
    path: '/api/measurements/:id',
    summary: 'Edit a measurement no calculation uses yet, on the version last read',
    tag,
    callers: ['investigator', 'supervisor'],
    params: idParamSchema,
    body: measurementPatchSchema,
    responses: { 200: measurementResponseSchema },
    errors: [409],
    description: 'Once a calculation names the measurement it is corrected instead (409).',
  },
  {
    method: 'post',
    path: '/api/measurements/:id/corrections',
    summary: 'Correct a measurement: a new one that supersedes it, the old one kept',
    tag,
    callers: ['investigator', 'supervisor'],
    params: idParamSchema,
    body: newMeasurementSchema,
    responses: { 201: measurementResponseSchema },
    errors: [409],
  },
]

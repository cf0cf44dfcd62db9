/** A case's calculation records, as the API document describes them (routes: calculations.routes.ts). */
import { newCalculationSchema } from '../../../shared/calculations/kinds'
import { idParamSchema } from '../../../shared/schemas/ids'
import { calculationResponseSchema, calculationsResponseSchema, recomputeResponseSchema } from '../../../shared/schemas/views'
import { STAFF, type ApiOperation } from '../../openapi/operation'

const tag = 'Calculations'

export const calculationsApi: ApiOperation[] = [
  {
    method: 'post',
    path: '/api/cases/:id/calculations',
    summary: 'Store a calculation on a case: the server computes it from the inputs as typed',
    tag,
    callers: ['investigator', 'supervisor'],
    params: idParamSchema,
    body: newCalculationSchema,
    responses: { 201: calculationResponseSchema },
    errors: [409],
    description:
      'The assigned investigator or the office\'s supervisor, while the case is worked (another state: 409). The record keeps its inputs, outputs, warnings, methods and the library version, and cannot be changed afterwards.',
  },
  {
    method: 'get',
    path: '/api/cases/:id/calculations',
    summary: 'A case\'s calculation records',
    tag,
    callers: STAFF,
    params: idParamSchema,
    responses: { 200: calculationsResponseSchema },
  },
  {
    method: 'get',
    path: '/api/calculations/:id/recompute',
    summary: 'Run a stored calculation again with the current library, each output beside the stored one',
    tag,
    callers: STAFF,
    params: idParamSchema,
    responses: { 200: recomputeResponseSchema },
    description: 'Nothing is stored. A record of a case the caller may not see is not found (404).',
  },
]

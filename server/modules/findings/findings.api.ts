/** A case's findings, as the API document describes them (route: findings.routes.ts). */
import { findingsResponseSchema } from '../../../shared/schemas/findings'
import { idParamSchema } from '../../../shared/schemas/ids'
import { STAFF, type ApiOperation } from '../../openapi/operation'

export const findingsApi: ApiOperation[] = [
  {
    method: 'get',
    path: '/api/cases/:id/findings',
    summary: 'A case\'s current finding and earlier ones, with their reviews and what they rest on',
    tag: 'Findings',
    callers: STAFF,
    params: idParamSchema,
    responses: { 200: findingsResponseSchema },
    description: 'Read only: a finding is proposed with the case\'s move POST /api/cases/:id/propose-finding.',
  },
]

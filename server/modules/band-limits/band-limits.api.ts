/** The band-limit list's operations, as the API document describes them (routes: band-limits.routes.ts). */
import { bandLimitPatchSchema } from '../../../shared/schemas/band-limits'
import { idParamSchema } from '../../../shared/schemas/ids'
import { bandLimitHistoryResponseSchema, bandLimitResponseSchema, bandLimitsResponseSchema } from '../../../shared/schemas/views'
import { STAFF, type ApiOperation } from '../../openapi/operation'

const tag = 'Band limits'

export const bandLimitsApi: ApiOperation[] = [
  {
    method: 'get',
    path: '/api/band-limits',
    summary: 'The national list of band limits, with who last changed each entry',
    tag,
    callers: STAFF,
    responses: { 200: bandLimitsResponseSchema },
  },
  {
    method: 'patch',
    path: '/api/band-limits/:id',
    summary: 'Revise a band limit, with the reason, on the version last read',
    tag,
    callers: ['supervisor', 'admin'],
    params: idParamSchema,
    body: bandLimitPatchSchema,
    responses: { 200: bandLimitResponseSchema },
    errors: [409],
    description: 'A stale version is refused (409 stale_version); the change and its reason join the entry\'s history.',
  },
  {
    method: 'get',
    path: '/api/band-limits/:id/history',
    summary: 'A band limit\'s changes, each with its author, reason and the fields before and after',
    tag,
    callers: STAFF,
    params: idParamSchema,
    responses: { 200: bandLimitHistoryResponseSchema },
  },
]

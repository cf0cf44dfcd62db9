/** The document's entries for a person's saved views of the case list (saved-views.routes.ts). */
import { idParamSchema } from '../../../shared/schemas/ids'
import { savedViewInputSchema, savedViewResponseSchema, savedViewsResponseSchema } from '../../../shared/schemas/saved-views'
import { STAFF, type ApiOperation } from '../../openapi/operation'

const tag = 'Saved views'

export const savedViewsApi: ApiOperation[] = [
  { method: 'get', path: '/api/me/saved-views', summary: "The caller's saved views of the case list", tag, callers: STAFF, responses: { 200: savedViewsResponseSchema } },
  {
    method: 'post',
    path: '/api/me/saved-views',
    summary: 'Save a view of the case list under a name',
    tag,
    callers: STAFF,
    body: savedViewInputSchema,
    responses: { 201: savedViewResponseSchema },
    errors: [409],
    description: '409 too_many_views or view_name_taken.',
  },
  {
    method: 'delete',
    path: '/api/me/saved-views/:id',
    summary: 'Remove one of the caller’s saved views',
    tag,
    callers: STAFF,
    params: idParamSchema,
    responses: { 204: { description: 'Removed.' } },
    description: "Another person's view is 404.",
  },
]

/** The document's entries for the audit log (audit.routes.ts). */
import { auditFilterSchema, auditListQuerySchema, auditPageSchema } from '../../../shared/schemas/audit'
import type { ApiOperation } from '../../openapi/operation'

const tag = 'Audit log'

export const auditApi: ApiOperation[] = [
  { method: 'get', path: '/api/admin/audit', summary: 'The audit log, newest first, filtered', tag, callers: ['admin'], query: auditListQuerySchema, responses: { 200: auditPageSchema } },
  {
    method: 'get',
    path: '/api/admin/audit.csv',
    summary: 'The filtered audit log as CSV',
    tag,
    callers: ['admin'],
    query: auditFilterSchema,
    responses: { 200: { contentType: 'text/csv', description: 'Newest first; X-Quietband-Truncated: true when the filters match more rows than the file holds.' } },
    description: 'The export itself is audited.',
  },
]

/** The document's entry for the signed case file (case-file.routes.ts). */
import { idParamSchema } from '../../../shared/schemas/ids'
import { STAFF, type ApiOperation } from '../../openapi/operation'

export const caseFileApi: ApiOperation[] = [
  {
    method: 'get',
    path: '/api/cases/:id/case-file',
    summary: 'Issue a signed case file (PDF) of the case',
    tag: 'Cases',
    callers: STAFF,
    params: idParamSchema,
    responses: { 200: { contentType: 'application/pdf', description: 'The signed PDF; headers X-Case-File-Sha256 and X-Case-File-Reference name it.' } },
    errors: [503],
    description: "Each call issues a new file and records it on the case's timeline. Staff of the case's office and administrators. Audited.",
  },
]

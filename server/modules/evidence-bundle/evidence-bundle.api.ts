/** A case's evidence bundle, as the API document describes it (route: evidence-bundle.routes.ts). */
import { idParamSchema } from '../../../shared/schemas/ids'
import { STAFF, type ApiOperation } from '../../openapi/operation'

export const evidenceBundleApi: ApiOperation[] = [
  {
    method: 'get',
    path: '/api/cases/:id/evidence-bundle',
    summary: 'Download a case\'s evidence files and their manifest as one ZIP',
    tag: 'Evidence',
    callers: STAFF,
    params: idParamSchema,
    responses: {
      200: {
        contentType: 'application/zip',
        description:
          'Streamed: every file still on the case, then manifest.json and manifest.txt (each file\'s name, size, SHA-256 taken at intake and again as bundled, uploader, times and custody log).',
      },
    },
    errors: [503],
    description: 'Each bundled file gains a custody entry.',
  },
]

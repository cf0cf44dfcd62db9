/** The service's own routes: health, and this API document. */
import { apiDocumentResponseSchema, healthResponseSchema } from '../../shared/schemas/service'
import { EVERYONE, type ApiOperation } from './operation'

export const coreApi: ApiOperation[] = [
  {
    method: 'get',
    path: '/api/health',
    summary: 'Whether the service and its database answer',
    tag: 'Service',
    callers: EVERYONE,
    responses: { 200: healthResponseSchema },
    errors: [503],
    description: 'Answers 503 database_unavailable (with Retry-After) while PostgreSQL is away.',
  },
  {
    method: 'get',
    path: '/api/openapi.json',
    summary: 'This API document (OpenAPI 3.1)',
    tag: 'Service',
    callers: EVERYONE,
    responses: { 200: apiDocumentResponseSchema },
    description: 'Built from the same zod schemas the routes check requests with and the presenters answer with.',
  },
]

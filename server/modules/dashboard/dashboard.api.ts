/** The document's entry for the dashboard (dashboard.routes.ts). */
import { dashboardQuerySchema, dashboardViewSchema } from '../../../shared/schemas/dashboard'
import type { ApiOperation } from '../../openapi/operation'

export const dashboardApi: ApiOperation[] = [
  {
    method: 'get',
    path: '/api/dashboard',
    summary: "An office's open work, clocks, workload and response performance",
    tag: 'Dashboard',
    callers: ['supervisor', 'admin'],
    query: dashboardQuerySchema,
    responses: { 200: dashboardViewSchema },
    description: 'A supervisor sees their office; an administrator every office, or one with officeId.',
  },
]

import { Router } from 'express'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { caseIdOf } from '../cases/case-access'
import { listFindings } from './findings.service'

/**
 * A case's findings (read only: a finding is proposed with the case's `propose-finding` move,
 * POST /api/cases/:id/propose-finding, in cases.routes.ts).
 */
export function findingsRoutes(ctx: ServiceContext): Router {
  const r = Router()
  const staff = requireRole('investigator', 'supervisor', 'admin')
  r.get('/cases/:id/findings', staff, async (req, res) => {
    res.json(await listFindings(ctx, actorOf(req), caseIdOf(req.params)))
  })
  return r
}

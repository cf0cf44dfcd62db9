import { Router } from 'express'
import { dashboardQuerySchema } from '../../../shared/schemas/dashboard'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { parseWith } from '../../http/validate'
import { getDashboard } from './dashboard.service'

export function dashboardRoutes(ctx: ServiceContext): Router {
  const r = Router()
  r.get('/dashboard', requireRole('supervisor', 'admin'), async (req, res) => {
    res.json(await getDashboard(ctx, actorOf(req), parseWith(dashboardQuerySchema, req.query)))
  })
  return r
}

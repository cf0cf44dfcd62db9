import { Router } from 'express'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { parseWith } from '../../http/validate'
import { idParamSchema } from '../../../shared/schemas/ids'
import { bandLimitPatchSchema } from '../../../shared/schemas/band-limits'
import { bandLimitHistory, listBandLimits, reviseBandLimit } from './band-limits.service'

export function bandLimitsRoutes(ctx: ServiceContext): Router {
  const r = Router()
  // the policy decides who edits (supervisors and administrators); every member of staff reads
  const staff = requireRole('investigator', 'supervisor', 'admin')
  r.get('/band-limits', staff, async (req, res) => {
    res.json({ bandLimits: await listBandLimits(ctx, actorOf(req)) })
  })
  r.patch('/band-limits/:id', staff, async (req, res) => {
    const { id } = parseWith(idParamSchema, req.params)
    res.json({ bandLimit: await reviseBandLimit(ctx, actorOf(req), id, parseWith(bandLimitPatchSchema, req.body)) })
  })
  r.get('/band-limits/:id/history', staff, async (req, res) => {
    const { id } = parseWith(idParamSchema, req.params)
    res.json({ changes: await bandLimitHistory(ctx, actorOf(req), id) })
  })
  return r
}

import { Router } from 'express'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { parseWith } from '../../http/validate'
import { idParamSchema } from '../../../shared/schemas/ids'
import { responseTargetsSchema } from '../../../shared/schemas/auth'
import { officeTimeZoneSchema } from '../../../shared/schemas/offices'
import { getOffice, listOffices, setFirstResponseTargets, setResponseTargets, setTimeZone } from './offices.service'

const idParam = idParamSchema

export function officesRoutes(ctx: ServiceContext): Router {
  const r = Router()
  const staffOrAdmin = requireRole('investigator', 'supervisor', 'admin')
  r.get('/offices', staffOrAdmin, async (req, res) => {
    res.json({ offices: await listOffices(ctx, actorOf(req)) })
  })
  r.get('/offices/:id', staffOrAdmin, async (req, res) => {
    const { id } = parseWith(idParam, req.params)
    res.json({ office: await getOffice(ctx, actorOf(req), id) })
  })
  r.put('/offices/:id/response-targets', requireRole('supervisor', 'admin'), async (req, res) => {
    const { id } = parseWith(idParam, req.params)
    res.json({ office: await setResponseTargets(ctx, actorOf(req), id, parseWith(responseTargetsSchema, req.body)) })
  })
  r.put('/offices/:id/first-response-targets', requireRole('supervisor', 'admin'), async (req, res) => {
    const { id } = parseWith(idParam, req.params)
    res.json({ office: await setFirstResponseTargets(ctx, actorOf(req), id, parseWith(responseTargetsSchema, req.body)) })
  })
  r.put('/offices/:id/time-zone', requireRole('supervisor', 'admin'), async (req, res) => {
    const { id } = parseWith(idParam, req.params)
    res.json({ office: await setTimeZone(ctx, actorOf(req), id, parseWith(officeTimeZoneSchema, req.body).timeZone) })
  })
  return r
}

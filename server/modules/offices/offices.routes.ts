import { Router } from 'express'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { parseWith } from '../../http/validate'
import { idParamSchema } from '../../../shared/schemas/ids'
import { responseTargetsSchema } from '../../../shared/schemas/auth'
import { areaCheckRequestSchema, officeInputSchema, officeTimeZoneSchema, officeUpdateSchema } from '../../../shared/schemas/offices'
import { checkArea, createOffice, updateOffice } from './office-setup.service'
import { getOffice, listOffices, setTargets, setTimeZone } from './offices.service'

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
    res.json({ office: await setTargets(ctx, actorOf(req), id, 'resolution', parseWith(responseTargetsSchema, req.body)) })
  })
  r.put('/offices/:id/first-response-targets', requireRole('supervisor', 'admin'), async (req, res) => {
    const { id } = parseWith(idParam, req.params)
    res.json({ office: await setTargets(ctx, actorOf(req), id, 'firstResponse', parseWith(responseTargetsSchema, req.body)) })
  })
  r.put('/offices/:id/time-zone', requireRole('supervisor', 'admin'), async (req, res) => {
    const { id } = parseWith(idParam, req.params)
    res.json({ office: await setTimeZone(ctx, actorOf(req), id, parseWith(officeTimeZoneSchema, req.body).timeZone) })
  })
  const admin = requireRole('admin')
  r.post('/admin/offices', admin, async (req, res) => {
    res.status(201).json(await createOffice(ctx, actorOf(req), parseWith(officeInputSchema, req.body)))
  })
  r.post('/admin/offices/check-area', admin, async (req, res) => {
    res.json(await checkArea(ctx, actorOf(req), parseWith(areaCheckRequestSchema, req.body)))
  })
  r.put('/admin/offices/:id', admin, async (req, res) => {
    const { id } = parseWith(idParam, req.params)
    res.json(await updateOffice(ctx, actorOf(req), id, parseWith(officeUpdateSchema, req.body)))
  })
  return r
}

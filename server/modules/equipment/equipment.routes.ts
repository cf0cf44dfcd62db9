import { Router } from 'express'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { parseWith } from '../../http/validate'
import { idParamSchema } from '../../../shared/schemas/ids'
import { equipmentPatchSchema, newEquipmentSchema } from '../../../shared/schemas/measurements'
import { addEquipment, equipmentHistory, equipmentNotFound, listOfficeEquipment, reviseEquipment } from './equipment.service'
import { notFound } from '../../http/errors'

const officeIdOf = (params: unknown): string => {
  const r = idParamSchema.safeParse(params)
  if (!r.success) throw notFound('office_not_found', 'No such office.')
  return r.data.id
}
const itemIdOf = (params: unknown): string => {
  const r = idParamSchema.safeParse(params)
  if (!r.success) throw equipmentNotFound()
  return r.data.id
}

/** An office's antennas and instruments: staff of the office read, its supervisor and administrators keep it. */
export function equipmentRoutes(ctx: ServiceContext): Router {
  const r = Router()
  const staff = requireRole('investigator', 'supervisor', 'admin')
  r.get('/offices/:id/equipment', staff, async (req, res) => {
    res.json(await listOfficeEquipment(ctx, actorOf(req), officeIdOf(req.params)))
  })
  r.post('/offices/:id/equipment', staff, async (req, res) => {
    const officeId = officeIdOf(req.params)
    res.status(201).json({ item: await addEquipment(ctx, actorOf(req), officeId, parseWith(newEquipmentSchema, req.body).item) })
  })
  r.patch('/equipment/:id', staff, async (req, res) => {
    const id = itemIdOf(req.params)
    res.json({ item: await reviseEquipment(ctx, actorOf(req), id, parseWith(equipmentPatchSchema, req.body)) })
  })
  r.get('/equipment/:id/history', staff, async (req, res) => {
    res.json({ changes: await equipmentHistory(ctx, actorOf(req), itemIdOf(req.params)) })
  })
  return r
}

import { Router } from 'express'
import { idParamSchema } from '../../../shared/schemas/ids'
import { measurementPatchSchema, newMeasurementSchema } from '../../../shared/schemas/measurements'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { parseWith } from '../../http/validate'
import { caseIdOf } from '../cases/case-access'
import { correctMeasurement, editMeasurement, listMeasurements, measurementNotFound, recordMeasurement } from './measurements.service'

const measurementIdOf = (params: unknown): string => {
  const r = idParamSchema.safeParse(params)
  if (!r.success) throw measurementNotFound()
  return r.data.id
}

/** A case's measurements: list, record, edit (until a calculation uses one), correct. */
export function measurementsRoutes(ctx: ServiceContext): Router {
  const r = Router()
  const staff = requireRole('investigator', 'supervisor', 'admin')
  r.get('/cases/:id/measurements', staff, async (req, res) => {
    res.json(await listMeasurements(ctx, actorOf(req), caseIdOf(req.params)))
  })
  r.post('/cases/:id/measurements', staff, async (req, res) => {
    const id = caseIdOf(req.params)
    res.status(201).json({ measurement: await recordMeasurement(ctx, actorOf(req), id, parseWith(newMeasurementSchema, req.body).measurement) })
  })
  r.patch('/measurements/:id', staff, async (req, res) => {
    const id = measurementIdOf(req.params)
    res.json({ measurement: await editMeasurement(ctx, actorOf(req), id, parseWith(measurementPatchSchema, req.body)) })
  })
  r.post('/measurements/:id/corrections', staff, async (req, res) => {
    const id = measurementIdOf(req.params)
    res.status(201).json({ measurement: await correctMeasurement(ctx, actorOf(req), id, parseWith(newMeasurementSchema, req.body).measurement) })
  })
  return r
}

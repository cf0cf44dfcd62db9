import { Router } from 'express'
import { newCalculationSchema } from '../../../shared/calculations/kinds'
import { idParamSchema } from '../../../shared/schemas/ids'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { parseWith } from '../../http/validate'
import { caseIdOf } from '../cases/case-access'
import { calculationNotFound, listCalculations, recomputeCalculation, storeCalculation } from './calculations.service'

/** A case's calculation records: store one (the server computes it), list them, recompute one. */
export function calculationsRoutes(ctx: ServiceContext): Router {
  const r = Router()
  const staff = requireRole('investigator', 'supervisor', 'admin')

  r.post('/cases/:id/calculations', staff, async (req, res) => {
    const id = caseIdOf(req.params)
    res.status(201).json({ calculation: await storeCalculation(ctx, actorOf(req), id, parseWith(newCalculationSchema, req.body)) })
  })
  r.get('/cases/:id/calculations', staff, async (req, res) => {
    res.json({ calculations: await listCalculations(ctx, actorOf(req), caseIdOf(req.params)) })
  })
  r.get('/calculations/:id/recompute', staff, async (req, res) => {
    const p = idParamSchema.safeParse(req.params)
    if (!p.success) throw calculationNotFound()
    res.json({ recompute: await recomputeCalculation(ctx, actorOf(req), p.data.id) })
  })
  return r
}

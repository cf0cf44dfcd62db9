import { Router } from 'express'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { parseWith } from '../../http/validate'
import { idParamSchema } from '../../../shared/schemas/ids'
import { liftLegalHoldSchema, setLegalHoldSchema, setRetentionSchema } from '../../../shared/schemas/retention'
import { caseIdOf } from '../cases/case-access'
import { getLegalHold, liftLegalHold, setLegalHold } from './legal-hold.service'
import { getRetentionSetting, previewRetention, setRetentionSetting } from './retention.service'

export function retentionRoutes(ctx: ServiceContext): Router {
  const r = Router()
  const staff = requireRole('investigator', 'supervisor', 'admin')
  const holders = requireRole('supervisor', 'admin')
  r.get('/cases/:id/legal-hold', staff, async (req, res) => {
    res.json({ legalHold: await getLegalHold(ctx, actorOf(req), caseIdOf(req.params)) })
  })
  r.post('/cases/:id/legal-hold', holders, async (req, res) => {
    const caseId = caseIdOf(req.params)
    res.json({ legalHold: await setLegalHold(ctx, actorOf(req), caseId, parseWith(setLegalHoldSchema, req.body)) })
  })
  r.post('/cases/:id/legal-hold/lift', holders, async (req, res) => {
    const caseId = caseIdOf(req.params)
    res.json({ legalHold: await liftLegalHold(ctx, actorOf(req), caseId, parseWith(liftLegalHoldSchema, req.body)) })
  })
  r.get('/offices/:id/retention', staff, async (req, res) => {
    const { id } = parseWith(idParamSchema, req.params)
    res.json({ retention: await getRetentionSetting(ctx, actorOf(req), id) })
  })
  r.put('/offices/:id/retention', requireRole('admin'), async (req, res) => {
    const { id } = parseWith(idParamSchema, req.params)
    res.json({ retention: await setRetentionSetting(ctx, actorOf(req), id, parseWith(setRetentionSchema, req.body).retentionMonths) })
  })
  r.get('/admin/retention/dry-run', requireRole('admin'), async (req, res) => {
    res.json({ run: await previewRetention(ctx, actorOf(req)) })
  })
  return r
}

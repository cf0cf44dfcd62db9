import { Router } from 'express'
import { FOLLOW_UP_MOVE_NAMES } from '../../../shared/domain/follow-ups'
import { idParamSchema } from '../../../shared/schemas/ids'
import { followUpInputSchema, followUpMoveInputSchema } from '../../../shared/schemas/follow-ups'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { parseWith } from '../../http/validate'
import { caseIdOf } from '../cases/case-access'
import { addFollowUp, followUpNotFound, listCaseFollowUps, listDueFollowUps, moveFollowUp } from './follow-ups.service'

const followUpIdOf = (params: unknown): string => {
  const r = idParamSchema.safeParse(params)
  if (!r.success) throw followUpNotFound()
  return r.data.id
}

/** A case's follow-ups, their moves (one route each) and the actor's due and overdue ones. */
export function followUpsRoutes(ctx: ServiceContext): Router {
  const r = Router()
  const staff = requireRole('investigator', 'supervisor', 'admin')
  r.get('/follow-ups/due', staff, async (req, res) => {
    res.json(await listDueFollowUps(ctx, actorOf(req)))
  })
  r.get('/cases/:id/follow-ups', staff, async (req, res) => {
    res.json(await listCaseFollowUps(ctx, actorOf(req), caseIdOf(req.params)))
  })
  r.post('/cases/:id/follow-ups', staff, async (req, res) => {
    const caseId = caseIdOf(req.params)
    const followUp = await addFollowUp(ctx, actorOf(req), caseId, parseWith(followUpInputSchema, req.body))
    res.status(201).json({ followUp })
  })
  for (const move of FOLLOW_UP_MOVE_NAMES) {
    r.post(`/follow-ups/:id/${move}`, staff, async (req, res) => {
      const id = followUpIdOf(req.params)
      res.json({ followUp: await moveFollowUp(ctx, actorOf(req), id, move, parseWith(followUpMoveInputSchema, req.body)) })
    })
  }
  return r
}

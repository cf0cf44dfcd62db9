import { Router } from 'express'
import { noticeInputSchema, replyInputSchema, responsiblePartyInputSchema } from '../../../shared/schemas/follow-ups'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { parseWith } from '../../http/validate'
import { caseIdOf } from '../cases/case-access'
import { getResponsibleParty, recordNotice, recordReply, recordResponsibleParty } from './responsible-parties.service'

/** The responsible party of a case, the notices served on it and its replies (staff of the case's office; administrators read). */
export function responsiblePartiesRoutes(ctx: ServiceContext): Router {
  const r = Router()
  const staff = requireRole('investigator', 'supervisor', 'admin')
  r.get('/cases/:id/responsible-party', staff, async (req, res) => {
    res.json(await getResponsibleParty(ctx, actorOf(req), caseIdOf(req.params)))
  })
  r.post('/cases/:id/responsible-party', staff, async (req, res) => {
    const caseId = caseIdOf(req.params)
    await recordResponsibleParty(ctx, actorOf(req), caseId, parseWith(responsiblePartyInputSchema, req.body))
    res.status(201).json(await getResponsibleParty(ctx, actorOf(req), caseId))
  })
  r.post('/cases/:id/notices', staff, async (req, res) => {
    const caseId = caseIdOf(req.params)
    await recordNotice(ctx, actorOf(req), caseId, parseWith(noticeInputSchema, req.body))
    res.status(201).json(await getResponsibleParty(ctx, actorOf(req), caseId))
  })
  r.post('/cases/:id/party-replies', staff, async (req, res) => {
    const caseId = caseIdOf(req.params)
    await recordReply(ctx, actorOf(req), caseId, parseWith(replyInputSchema, req.body))
    res.status(201).json(await getResponsibleParty(ctx, actorOf(req), caseId))
  })
  return r
}

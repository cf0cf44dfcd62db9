/** A person's saved views of the case list: HTTP only. */
import { Router } from 'express'
import { idParamSchema } from '../../../shared/schemas/ids'
import { savedViewInputSchema } from '../../../shared/schemas/saved-views'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { parseWith } from '../../http/validate'
import { removeView, saveView, savedViewsOf } from './saved-views.service'

export function savedViewsRoutes(ctx: ServiceContext): Router {
  const r = Router()
  const staff = requireRole('investigator', 'supervisor', 'admin')
  r.get('/me/saved-views', staff, async (req, res) => {
    res.json({ views: await savedViewsOf(ctx, actorOf(req)) })
  })
  r.post('/me/saved-views', staff, async (req, res) => {
    res.status(201).json({ view: await saveView(ctx, actorOf(req), parseWith(savedViewInputSchema, req.body)) })
  })
  r.delete('/me/saved-views/:id', staff, async (req, res) => {
    await removeView(ctx, actorOf(req), parseWith(idParamSchema, req.params).id)
    res.status(204).end()
  })
  return r
}

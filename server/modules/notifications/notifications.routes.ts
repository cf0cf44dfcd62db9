import { Router } from 'express'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { myEmails } from './notifications.service'

/** What Quietband e-mails the signed-in person. */
export function notificationsRoutes(ctx: ServiceContext): Router {
  const r = Router()
  r.get('/me/emails', requireRole('complainant', 'investigator', 'supervisor', 'admin'), async (req, res) => {
    res.json(await myEmails(ctx, actorOf(req)))
  })
  return r
}

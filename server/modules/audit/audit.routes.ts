import { Router } from 'express'
import { auditFilterSchema, auditListQuerySchema } from '../../../shared/schemas/audit'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { parseWith } from '../../http/validate'
import { exportAuditCsv, listAuditEntries } from './audit.service'

export function auditRoutes(ctx: ServiceContext): Router {
  const r = Router()
  r.get('/admin/audit', requireRole('admin'), async (req, res) => {
    res.json(await listAuditEntries(ctx, actorOf(req), parseWith(auditListQuerySchema, req.query)))
  })
  r.get('/admin/audit.csv', requireRole('admin'), async (req, res) => {
    const { csv, truncated } = await exportAuditCsv(ctx, actorOf(req), parseWith(auditFilterSchema, req.query))
    res.setHeader('Content-Type', 'text/csv; charset=utf-8')
    res.setHeader('Content-Disposition', `attachment; filename="quietband-audit-${new Date().toISOString().slice(0, 10)}.csv"`)
    if (truncated) res.setHeader('X-Quietband-Truncated', 'true')
    res.send(csv)
  })
  return r
}

import { Router } from 'express'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { caseIdOf } from '../cases/case-access'
import { issueCaseFile } from './case-file.service'

/** GET /api/cases/:id/case-file — a new signed case file (PDF) of the case, recorded on its timeline (staff of its office, administrators). */
export function caseFileRoutes(ctx: ServiceContext): Router {
  const r = Router()
  r.get('/cases/:id/case-file', requireRole('investigator', 'supervisor', 'admin'), async (req, res) => {
    const file = await issueCaseFile(ctx, actorOf(req), caseIdOf(req.params))
    res.status(200)
    res.setHeader('Content-Type', 'application/pdf')
    res.setHeader('Content-Disposition', `attachment; filename="${file.fileName.replace(/[^A-Za-z0-9._-]/g, '_')}"`)
    res.setHeader('Content-Length', String(file.pdf.length))
    res.setHeader('X-Case-File-Sha256', file.sha256)
    res.setHeader('X-Case-File-Reference', file.fileReference)
    res.end(file.pdf)
  })
  return r
}

import { Router } from 'express'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { caseIdOf } from '../cases/case-access'
import { openEvidenceBundle } from './evidence-bundle.service'

/** GET /api/cases/:id/evidence-bundle — the case's evidence files and their manifest, as one ZIP (staff of its office). */
export function evidenceBundleRoutes(ctx: ServiceContext): Router {
  const r = Router()
  r.get('/cases/:id/evidence-bundle', requireRole('investigator', 'supervisor', 'admin'), async (req, res) => {
    const bundle = await openEvidenceBundle(ctx, actorOf(req), caseIdOf(req.params))
    res.status(200)
    res.setHeader('Content-Type', 'application/zip')
    res.setHeader('Content-Disposition', `attachment; filename="${bundle.fileName.replace(/[^A-Za-z0-9._-]/g, '_')}"`)
    res.setHeader('Cache-Control', 'no-store')
    await bundle.write(res, req.ip ?? null)
  })
  return r
}

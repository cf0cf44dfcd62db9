/** Evidence files on a case: HTTP only (the service decides, the policy says who may). */
import { pipeline } from 'node:stream/promises'
import { Router, type Request, type Response } from 'express'
import { idParamSchema } from '../../../shared/schemas/ids'
import { trackingTokenParamSchema } from '../../../shared/schemas/cases'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { HttpError } from '../../http/errors'
import { parseWith } from '../../http/validate'
import type { TrackingLinkHolder } from '../../policy/case-policy'
import { caseIdOf } from '../cases/case-access'
import { caseIdForToken } from '../cases/tracking-tokens'
import { trackingGuessLimit } from '../cases/public.routes'
import { downloadEvidence, downloadSharedEvidence, evidenceCustodyLog, evidenceNotFound, listEvidence, removeEvidence, shareEvidence, uploadEvidence, verifyEvidence, type EvidenceDownload } from './evidence.service'
import { attachmentDisposition } from './file-names'
import { openEvidenceThumbnail } from './thumbnails/thumbnail.service'

/** The evidence id of a route's path; anything but a uuid is no such file (404). */
function evidenceIdOf(params: unknown): string {
  const r = idParamSchema.safeParse(params)
  if (!r.success) throw evidenceNotFound()
  return r.data.id
}

const from = (req: Request) => req.ip ?? null

/** Streams a file through the server (never a redirect to the store), marked not to be sniffed or cached. */
async function sendDownload(res: Response, d: EvidenceDownload): Promise<void> {
  res.status(200)
  res.setHeader('Content-Type', d.contentType)
  res.setHeader('Content-Disposition', attachmentDisposition(d.fileName))
  res.setHeader('X-Content-Type-Options', 'nosniff')
  res.setHeader('Cache-Control', 'private, no-store')
  res.setHeader('X-Evidence-SHA256', d.sha256)
  await pipeline(d.body, res)
}

export function evidenceRoutes(ctx: ServiceContext): Router {
  const r = Router()
  const staff = requireRole('investigator', 'supervisor')
  const complainant = requireRole('complainant')

  // staff of the case's office
  r.post('/cases/:id/evidence', staff, async (req, res) => {
    const evidence = await uploadEvidence(ctx, actorOf(req), caseIdOf(req.params), req, res, from(req))
    res.status(201).json({ evidence })
  })
  r.get('/cases/:id/evidence', staff, async (req, res) => {
    res.json({ evidence: await listEvidence(ctx, actorOf(req), caseIdOf(req.params)) })
  })

  // the complainant: the tracking link, and a signed-in complainant's reports
  const guessLimit = trackingGuessLimit()
  const holder = async (token: string): Promise<TrackingLinkHolder> => {
    const caseId = await caseIdForToken(ctx.db, token)
    if (!caseId) throw new HttpError(404, 'tracking_not_found', 'This tracking link is not valid. Check the link in your e-mail.')
    return { role: 'tracking_link', caseId }
  }
  r.post('/track/:token/evidence', guessLimit, async (req, res) => {
    const h = await holder(parseWith(trackingTokenParamSchema, req.params).token)
    const evidence = await uploadEvidence(ctx, h, h.caseId, req, res, from(req))
    res.status(201).json({ evidence })
  })
  r.get('/track/:token/evidence', guessLimit, async (req, res) => {
    const h = await holder(parseWith(trackingTokenParamSchema, req.params).token)
    res.json({ evidence: await listEvidence(ctx, h, h.caseId) })
  })
  // a file the office shared with the complainant (each download is a custody entry)
  r.get('/track/:token/evidence/:evidenceId/download', guessLimit, async (req, res) => {
    const h = await holder(parseWith(trackingTokenParamSchema, { token: req.params.token }).token)
    await sendDownload(res, await downloadSharedEvidence(ctx, h, h.caseId, evidenceIdOf({ id: req.params.evidenceId }), from(req)))
  })
  r.get('/my/reports/:id/evidence/:evidenceId/download', complainant, async (req, res) => {
    await sendDownload(res, await downloadSharedEvidence(ctx, actorOf(req), caseIdOf({ id: req.params.id }), evidenceIdOf({ id: req.params.evidenceId }), from(req)))
  })
  r.post('/my/reports/:id/evidence', complainant, async (req, res) => {
    const evidence = await uploadEvidence(ctx, actorOf(req), caseIdOf(req.params), req, res, from(req))
    res.status(201).json({ evidence })
  })
  r.get('/my/reports/:id/evidence', complainant, async (req, res) => {
    res.json({ evidence: await listEvidence(ctx, actorOf(req), caseIdOf(req.params)) })
  })

  // one file
  r.get('/evidence/:id/download', staff, async (req, res) => {
    await sendDownload(res, await downloadEvidence(ctx, actorOf(req), evidenceIdOf(req.params), from(req)))
  })
  r.post('/evidence/:id/share', staff, async (req, res) => {
    res.json({ evidence: await shareEvidence(ctx, actorOf(req), evidenceIdOf(req.params), req.body, from(req)) })
  })
  r.post('/evidence/:id/verify', staff, async (req, res) => {
    res.json(await verifyEvidence(ctx, actorOf(req), evidenceIdOf(req.params), from(req)))
  })
  r.post('/evidence/:id/remove', staff, async (req, res) => {
    const evidence = await removeEvidence(ctx, actorOf(req), evidenceIdOf(req.params), req.body, from(req))
    res.json({ evidence })
  })
  // a photo's thumbnail: whoever may see the file (no custody entry: see thumbnail.service.ts)
  r.get('/evidence/:id/thumbnail', requireRole('investigator', 'supervisor', 'complainant'), async (req, res) => {
    const th = await openEvidenceThumbnail(ctx, actorOf(req), evidenceIdOf(req.params))
    res.status(200)
    res.setHeader('Content-Type', th.contentType)
    res.setHeader('Content-Length', String(th.sizeBytes))
    res.setHeader('X-Content-Type-Options', 'nosniff')
    res.setHeader('Cache-Control', 'private, max-age=300')
    await pipeline(th.body, res)
  })
  r.get('/evidence/:id/custody', staff, async (req, res) => {
    res.json({ custody: await evidenceCustodyLog(ctx, actorOf(req), evidenceIdOf(req.params)) })
  })
  return r
}

import { Router } from 'express'
import { z } from 'zod'
import { complainantInfoSchema, reportSchema, withdrawSchema } from '../../../shared/schemas/cases'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { HttpError } from '../../http/errors'
import { parseWith } from '../../http/validate'
import { perAddressLimit } from '../../http/rate-limit'
import { addComplainantInformation } from './case-notes.service'
import { withdrawReport } from './case-moves.service'
import { getComplainantView, listMyReports } from './case-read.service'
import { submitReport } from './reports.service'
import { caseIdForToken } from './tracking-tokens'
import type { TrackingLinkHolder } from '../../policy/case-policy'

const tokenParam = z.object({ token: z.string() })
const idParam = z.object({ id: z.string() })

/** Reports per address per hour before the form refuses (abuse limit; common practice, no source). */
export const REPORTS_PER_HOUR_PER_ADDRESS = 10

/** The complainant's side: filing a report, the tracking link, and a signed-in complainant's reports. */
export function publicCaseRoutes(ctx: ServiceContext): Router {
  const r = Router()
  const reportLimit = perAddressLimit({
    perHour: REPORTS_PER_HOUR_PER_ADDRESS,
    code: 'too_many_reports',
    message: 'Too many reports from this address. Try again later, or call your regional office.',
  })

  r.post('/reports', reportLimit, async (req, res) => {
    const report = parseWith(reportSchema, req.body)
    const submitted = await submitReport(ctx, report, req.user)
    res.status(201).json({ reference: submitted.reference, officeName: submitted.officeName, trackingUrl: submitted.trackingUrl })
  })

  const holder = async (token: string): Promise<TrackingLinkHolder> => {
    const caseId = await caseIdForToken(ctx.db, token)
    if (!caseId) throw new HttpError(404, 'tracking_not_found', 'This tracking link is not valid. Check the link in your e-mail.')
    return { role: 'tracking_link', caseId }
  }
  r.get('/track/:token', async (req, res) => {
    const h = await holder(parseWith(tokenParam, req.params).token)
    res.json({ report: await getComplainantView(ctx, h, h.caseId) })
  })
  r.post('/track/:token/information', async (req, res) => {
    const h = await holder(parseWith(tokenParam, req.params).token)
    await addComplainantInformation(ctx, h, h.caseId, parseWith(complainantInfoSchema, req.body).body)
    res.status(201).json({ report: await getComplainantView(ctx, h, h.caseId) })
  })
  r.post('/track/:token/withdraw', async (req, res) => {
    const h = await holder(parseWith(tokenParam, req.params).token)
    await withdrawReport(ctx, h, h.caseId, parseWith(withdrawSchema, req.body))
    res.json({ report: await getComplainantView(ctx, h, h.caseId) })
  })

  const complainant = requireRole('complainant')
  r.get('/my/reports', complainant, async (req, res) => {
    res.json({ reports: await listMyReports(ctx, actorOf(req)) })
  })
  r.get('/my/reports/:id', complainant, async (req, res) => {
    const { id } = parseWith(idParam, req.params)
    res.json({ report: await getComplainantView(ctx, actorOf(req), id) })
  })
  r.post('/my/reports/:id/information', complainant, async (req, res) => {
    const { id } = parseWith(idParam, req.params)
    await addComplainantInformation(ctx, actorOf(req), id, parseWith(complainantInfoSchema, req.body).body)
    res.status(201).json({ report: await getComplainantView(ctx, actorOf(req), id) })
  })
  r.post('/my/reports/:id/withdraw', complainant, async (req, res) => {
    const { id } = parseWith(idParam, req.params)
    await withdrawReport(ctx, actorOf(req), id, parseWith(withdrawSchema, req.body))
    res.json({ report: await getComplainantView(ctx, actorOf(req), id) })
  })
  return r
}

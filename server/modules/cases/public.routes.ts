import { Router } from 'express'
import { complainantInfoSchema, reportSchema, trackingTokenParamSchema, withdrawSchema } from '../../../shared/schemas/cases'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { HttpError } from '../../http/errors'
import { parseWith } from '../../http/validate'
import rateLimit from 'express-rate-limit'
import { perAddressLimit } from '../../http/rate-limit'
import { caseIdOf } from './case-access'
import { addComplainantInformation } from './case-notes.service'
import { withdrawReport } from './case-moves.service'
import { getComplainantView, listMyReports } from './case-read.service'
import { submitReport } from './reports.service'
import { caseIdForToken } from './tracking-tokens'
import type { TrackingLinkHolder } from '../../policy/case-policy'

const tokenParam = trackingTokenParamSchema

/** Reports per address per hour before the form refuses (abuse limit; common practice, no source). */
export const REPORTS_PER_HOUR_PER_ADDRESS = 10
/**
 * Tracking links that do not open (unknown or revoked tokens) per address per hour before the
 * address is refused for the rest of the hour (abuse limit; common practice, no source). A
 * person who mistypes a link a few times stays well under it.
 */
export const TRACKING_GUESSES_PER_HOUR_PER_ADDRESS = 20

/**
 * Counts only the tracking requests whose link does not open (404); once an address has had
 * too many, every tracking request from it is refused until the hour has passed. Counted in
 * this process's memory: a token has 256 random bits, so this is about load and noise, not
 * about guessing one (additions are counted in PostgreSQL, see addComplainantInformation).
 */
export function trackingGuessLimit() {
  return rateLimit({
    windowMs: 60 * 60 * 1000,
    limit: TRACKING_GUESSES_PER_HOUR_PER_ADDRESS,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    skipSuccessfulRequests: true,
    requestWasSuccessful: (_req, res) => res.statusCode !== 404,
    handler: (_req, _res, next) =>
      next(new HttpError(429, 'too_many_tracking_attempts', 'Too many tracking links that do not work have been tried from this address. Wait an hour, then open the newest link in your e-mail.')),
  })
}

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
    res.status(201).json({ reference: submitted.reference, officeName: submitted.officeName, trackingUrl: submitted.trackingUrl, warnings: submitted.warnings })
  })

  const guessLimit = trackingGuessLimit()
  const holder = async (token: string): Promise<TrackingLinkHolder> => {
    const caseId = await caseIdForToken(ctx.db, token)
    if (!caseId) throw new HttpError(404, 'tracking_not_found', 'This tracking link is not valid. Check the link in your e-mail.')
    return { role: 'tracking_link', caseId }
  }
  r.get('/track/:token', guessLimit, async (req, res) => {
    const h = await holder(parseWith(tokenParam, req.params).token)
    res.json({ report: await getComplainantView(ctx, h, h.caseId) })
  })
  r.post('/track/:token/information', guessLimit, async (req, res) => {
    const h = await holder(parseWith(tokenParam, req.params).token)
    await addComplainantInformation(ctx, h, h.caseId, parseWith(complainantInfoSchema, req.body).body)
    res.status(201).json({ report: await getComplainantView(ctx, h, h.caseId) })
  })
  r.post('/track/:token/withdraw', guessLimit, async (req, res) => {
    const h = await holder(parseWith(tokenParam, req.params).token)
    await withdrawReport(ctx, h, h.caseId, parseWith(withdrawSchema, req.body))
    res.json({ report: await getComplainantView(ctx, h, h.caseId) })
  })

  const complainant = requireRole('complainant')
  r.get('/my/reports', complainant, async (req, res) => {
    res.json({ reports: await listMyReports(ctx, actorOf(req)) })
  })
  r.get('/my/reports/:id', complainant, async (req, res) => {
    const id = caseIdOf(req.params)
    res.json({ report: await getComplainantView(ctx, actorOf(req), id) })
  })
  r.post('/my/reports/:id/information', complainant, async (req, res) => {
    const id = caseIdOf(req.params)
    await addComplainantInformation(ctx, actorOf(req), id, parseWith(complainantInfoSchema, req.body).body)
    res.status(201).json({ report: await getComplainantView(ctx, actorOf(req), id) })
  })
  r.post('/my/reports/:id/withdraw', complainant, async (req, res) => {
    const id = caseIdOf(req.params)
    await withdrawReport(ctx, actorOf(req), id, parseWith(withdrawSchema, req.body))
    res.json({ report: await getComplainantView(ctx, actorOf(req), id) })
  })
  return r
}

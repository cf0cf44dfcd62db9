/**
 * A complainant's report becomes a case: routed to the office whose area holds its place (else
 * the nearest office by geodesic distance, with a warning on the case; shared/domain/office-areas.ts),
 * given a suggested priority from the affected service, and acknowledged by e-mail with a
 * private tracking link — all in one transaction.
 */
import { routeReport } from '../../../shared/domain/office-areas'
import { harmClassText, suggestPriority, type Priority } from '../../../shared/domain/services'
import { reportFrequencyHz, type Report, type ReportWarning } from '../../../shared/schemas/cases'
import type { SessionUser } from '../../../shared/schemas/auth'
import { withTransaction } from '../../db/client'
import type { ServiceContext } from '../../context'
import { HttpError } from '../../http/errors'
import { queueMail } from '../../jobs/boss'
import { reportReceivedMail, safetyReportMail } from '../../mail/case-templates'
import { allOffices as officesAll } from '../offices/offices.repo'
import { activeStaffOf } from '../users/users.repo'
import { appendEvent, confirmedComplainantOf, insertCase, nextCaseReference } from './cases.repo'
import { dueTimesFor } from './due'
import { issueTrackingLink } from './tracking-tokens'

/**
 * Distance beyond which a report lies "far from every office" [m]: it is still accepted and
 * routed to the nearest office, but the reporter is warned and the case says so (a field
 * office covers a region a few hours' drive across; common practice, no source).
 */
export const FAR_FROM_EVERY_OFFICE_M = 200_000

/** How the routing entry on the timeline explains the office chosen. */
const ROUTING_WORDS = {
  inside_area: 'whose area holds the place',
  inside_overlap: 'the nearest of the offices whose areas hold the place (their areas overlap)',
  outside_areas: 'the nearest office (the place is outside every office area)',
  no_areas: 'the nearest office',
} as const

export interface SubmittedReport {
  caseId: string
  reference: string
  officeName: string
  trackingUrl: string
  /** Things the reporter should check; the report is filed all the same. */
  warnings: ReportWarning[]
}

export async function submitReport(ctx: ServiceContext, report: Report, signedIn?: SessionUser): Promise<SubmittedReport> {
  const allOffices = await officesAll(ctx.db)
  if (allOffices.length === 0) throw new HttpError(503, 'no_office', 'No field office is set up yet; reports cannot be routed.')
  const nearest = routeReport(
    { latDeg: report.latDeg, lonDeg: report.lonDeg },
    allOffices.map((o) => ({ id: o.id, latDeg: o.centreLatDeg, lonDeg: o.centreLonDeg, area: o.area })),
  )
  const office = allOffices.find((o) => o.id === nearest.id)!
  const priority: Priority = suggestPriority(report.service, report.experience)
  const { lowHz, highHz } = reportFrequencyHz(report)
  const farKm = nearest.distanceM > FAR_FROM_EVERY_OFFICE_M ? Math.round(nearest.distanceM / 1000) : undefined
  const warnings: ReportWarning[] =
    farKm === undefined
      ? []
      : [
          {
            code: 'far_from_offices',
            path: 'latDeg',
            message: `The place you gave is ${farKm} km from our nearest field office (${office.name}), outside the area we cover. We have filed your report there all the same. If the latitude or longitude is wrong, add the right place on your tracking page.`,
          },
        ]

  return withTransaction(ctx.pool, async ({ db, client }) => {
    const now = ctx.now()
    const reference = await nextCaseReference(db, now)
    const c = await insertCase(db, {
        reference,
        officeId: office.id,
        status: 'received',
        priority,
        suggestedPriority: priority,
        service: report.service,
        licenceRef: report.licenceRef ?? null,
        freqLowHz: lowHz,
        freqHighHz: highHz,
        address: report.address,
        latDeg: report.latDeg,
        lonDeg: report.lonDeg,
        sinceDate: report.since,
        pattern: report.pattern,
        patternDetail: report.patternDetail ?? null,
        experience: report.experience,
        description: report.description,
        complainantName: report.name,
        complainantEmail: report.email,
        complainantPhone: report.phone ?? null,
        complainantOrganisation: report.organisation ?? null,
        complainantUserId: signedIn?.role === 'complainant' ? signedIn.id : await confirmedComplainantOf(db, report.email),
        receivedAt: now,
        ...dueTimesFor(now, priority, office),
      })
    await appendEvent(db, { caseId: c.id, at: now, actorUserId: signedIn?.id ?? null, actorLabel: 'Complainant', kind: 'received', toState: 'received', visibility: 'complainant', data: { officeName: office.name } })
    await appendEvent(db, {
      caseId: c.id,
      at: now,
      actorUserId: null,
      actorLabel: 'Quietband',
      kind: 'routed',
      visibility: 'internal',
      body: `Routed to ${office.name}, ${ROUTING_WORDS[nearest.basis]} (${(nearest.distanceM / 1000).toFixed(1)} km from the office, geodesic). Suggested harm class: ${harmClassText(priority)}, from the affected service.`,
      data: { officeId: office.id, distanceM: nearest.distanceM, suggestedPriority: priority, method: nearest.method, basis: nearest.basis, holderOfficeIds: nearest.holderIds },
    })
    if (nearest.basis === 'outside_areas') {
      await appendEvent(db, {
        caseId: c.id,
        at: now,
        actorUserId: null,
        actorLabel: 'Quietband',
        kind: 'outside_office_areas',
        visibility: 'internal',
        body: `Check the location: it lies outside every office's area, so the case went to the nearest office, ${office.name}. Transfer it if another office should take it, or ask an administrator to extend an area.`,
        data: { distanceM: nearest.distanceM, latDeg: report.latDeg, lonDeg: report.lonDeg },
      })
    }
    if (farKm !== undefined) {
      await appendEvent(db, {
        caseId: c.id,
        at: now,
        actorUserId: null,
        actorLabel: 'Quietband',
        kind: 'far_from_offices',
        visibility: 'internal',
        body: `Check the location: it is ${farKm} km from the nearest office (${office.name}), more than ${FAR_FROM_EVERY_OFFICE_M / 1000} km from every office. The complainant was warned when filing.`,
        data: { distanceM: nearest.distanceM, thresholdM: FAR_FROM_EVERY_OFFICE_M, latDeg: report.latDeg, lonDeg: report.lonDeg },
      })
    }
    const trackingUrl = await issueTrackingLink(db, ctx.publicUrl, c.id)
    await queueMail(ctx.boss, client, reportReceivedMail({ ...c, officeName: office.name }, trackingUrl), ctx.mailQueue)
    if (priority === 1) {
      const supervisors = await activeStaffOf(db, office.id, 'supervisor')
      for (const s of supervisors) {
        await queueMail(ctx.boss, client, safetyReportMail(s, { ...c, service: report.service }, `${ctx.publicUrl}/cases/${c.id}`), ctx.mailQueue)
      }
    }
    return { caseId: c.id, reference, officeName: office.name, trackingUrl, warnings }
  })
}

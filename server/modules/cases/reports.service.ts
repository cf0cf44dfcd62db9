/**
 * A complainant's report becomes a case: routed to the nearest office by geodesic distance,
 * given a suggested priority from the affected service, and acknowledged by e-mail with a
 * private tracking link — all in one transaction.
 */
import { and, eq } from 'drizzle-orm'
import { nearestOffice } from '../../../shared/radio/geo'
import { suggestPriority, type Priority } from '../../../shared/domain/services'
import { reportFrequencyHz, type Report } from '../../../shared/schemas/cases'
import type { SessionUser } from '../../../shared/schemas/auth'
import { withTransaction } from '../../db/client'
import { cases, offices, users } from '../../db/schema'
import type { ServiceContext } from '../../context'
import { HttpError } from '../../http/errors'
import { queueMail } from '../../jobs/boss'
import { reportReceivedMail, safetyReportMail } from '../../mail/case-templates'
import { appendEvent, nextCaseReference } from './cases.repo'
import { dueAt } from './due'
import { issueTrackingLink } from './tracking-tokens'

export interface SubmittedReport {
  caseId: string
  reference: string
  officeName: string
  trackingUrl: string
}

export async function submitReport(ctx: ServiceContext, report: Report, signedIn?: SessionUser): Promise<SubmittedReport> {
  const allOffices = await ctx.db.select().from(offices)
  if (allOffices.length === 0) throw new HttpError(503, 'no_office', 'No field office is set up yet; reports cannot be routed.')
  const nearest = nearestOffice({
    point: { latDeg: report.latDeg, lonDeg: report.lonDeg },
    offices: allOffices.map((o) => ({ id: o.id, latDeg: o.centreLatDeg, lonDeg: o.centreLonDeg })),
  })
  const office = allOffices.find((o) => o.id === nearest.id)!
  const priority: Priority = suggestPriority(report.service, report.experience)
  const { lowHz, highHz } = reportFrequencyHz(report)
  const targets = { 1: office.targetP1Hours, 2: office.targetP2Hours, 3: office.targetP3Hours, 4: office.targetP4Hours } as const

  return withTransaction(ctx.pool, async ({ db, client }) => {
    const now = ctx.now()
    const reference = await nextCaseReference(db, now)
    const [c] = await db
      .insert(cases)
      .values({
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
        complainantUserId: signedIn?.role === 'complainant' ? signedIn.id : null,
        receivedAt: now,
        dueAt: dueAt(now, priority, targets),
      })
      .returning()
    await appendEvent(db, { caseId: c!.id, at: now, actorUserId: signedIn?.id ?? null, actorLabel: 'Complainant', kind: 'received', toState: 'received', visibility: 'complainant', data: { officeName: office.name } })
    await appendEvent(db, {
      caseId: c!.id,
      at: now,
      actorUserId: null,
      actorLabel: 'Quietband',
      kind: 'routed',
      visibility: 'internal',
      body: `Routed to ${office.name}, the nearest office (${(nearest.distanceM / 1000).toFixed(1)} km, geodesic). Suggested priority ${priority} from the affected service.`,
      data: { officeId: office.id, distanceM: nearest.distanceM, suggestedPriority: priority, method: nearest.method },
    })
    const trackingUrl = await issueTrackingLink(db, ctx.publicUrl, c!.id)
    await queueMail(ctx.boss, client, reportReceivedMail({ ...c!, officeName: office.name }, trackingUrl), ctx.mailQueue)
    if (priority === 1) {
      const supervisors = await db
        .select({ name: users.name, email: users.email })
        .from(users)
        .where(and(eq(users.officeId, office.id), eq(users.role, 'supervisor'), eq(users.active, true)))
      for (const s of supervisors) {
        await queueMail(ctx.boss, client, safetyReportMail(s, { ...c!, service: report.service }, `${ctx.publicUrl}/cases/${c!.id}`), ctx.mailQueue)
      }
    }
    return { caseId: c!.id, reference, officeName: office.name, trackingUrl }
  })
}

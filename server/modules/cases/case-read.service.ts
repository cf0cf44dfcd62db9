/** Reading cases: the staff case page, the complainant's view, and triage helpers. */
import { COMPLAINANT_STEP_LABELS, COMPLAINANT_STEP_OF_STATE, moveAllowedFrom } from '../../../shared/domain/case-lifecycle'
import { geodesicInverse } from '../../../shared/radio/geo'
import type { ServiceContext } from '../../context'
import { caseAbilities, type CaseActor } from '../../policy/case-policy'
import type { Actor } from '../../policy/policy'
import { forbidden } from '../../http/errors'
import { findOffice, otherOffices } from '../offices/offices.repo'
import { findUserById } from '../users/users.repo'
import { noteComplainantDetailsViewed } from '../audit/audit.service'
import { loadVisibleCase } from './case-access'
import { casesOfComplainant, findCaseReference, investigatorLoads, mergedReportsOf, openCasesNear, timelineOf } from './cases.repo'
import { presentCaseDetail, presentComplainantView, toTimelineEvent } from './cases.present'
import type { InvestigatorLoad, MergeCandidate, MyReportRow, TimelineEvent, TransferOffice } from '../../../shared/schemas/views'

async function timeline(ctx: ServiceContext, caseId: string): Promise<TimelineEvent[]> {
  return (await timelineOf(ctx.db, caseId)).map(toTimelineEvent)
}

export async function getCaseDetail(ctx: ServiceContext, actor: Actor, caseId: string) {
  const c = await loadVisibleCase(ctx.db, actor, caseId)
  const office = await findOffice(ctx.db, c.officeId)
  const investigator = c.investigatorId ? await findUserById(ctx.db, c.investigatorId) : undefined
  const mergedIntoReference = c.mergedIntoCaseId ? await findCaseReference(ctx.db, c.mergedIntoCaseId) : undefined
  const holdsMergedReports = (await mergedReportsOf(ctx.db, c.id)).length > 0
  return presentCaseDetail(
    c,
    {
      officeName: office!.name,
      investigatorName: investigator?.name ?? null,
      mergedIntoReference: mergedIntoReference ?? null,
      abilities: caseAbilities(actor, { ...c, holdsMergedReports }),
      timeline: await timeline(ctx, c.id),
    },
    ctx.now(),
  )
}

/**
 * A member of staff opening the case page: its detail, complainant's personal details
 * included — an opening the audit log records (at most once per person and case per hour).
 */
export async function openCaseDetail(ctx: ServiceContext, actor: Actor, caseId: string) {
  const detail = await getCaseDetail(ctx, actor, caseId)
  await noteComplainantDetailsViewed(ctx, actor, detail)
  return detail
}

export async function getComplainantView(ctx: ServiceContext, actor: CaseActor, caseId: string) {
  const c = await loadVisibleCase(ctx.db, actor, caseId)
  const abilities = caseAbilities(actor, c)
  return presentComplainantView(c, await timeline(ctx, c.id), { withdraw: abilities.withdraw, addInformation: true })
}

/**
 * A signed-in complainant's reports, newest first — including those filed without signing in
 * with the account's confirmed address (see linkReportsToConfirmedAccount).
 */
export async function listMyReports(ctx: ServiceContext, actor: Actor): Promise<MyReportRow[]> {
  if (actor.role !== 'complainant') throw forbidden('Only complainant accounts have reports.')
  const rows = await casesOfComplainant(ctx.db, actor.id)
  return rows.map((c) => {
    const step = COMPLAINANT_STEP_OF_STATE[c.status]
    return { id: c.id, reference: c.reference, step, statusLabel: COMPLAINANT_STEP_LABELS[step], service: c.service, address: c.address, freqLowHz: c.freqLowHz, freqHighHz: c.freqHighHz, receivedAt: c.receivedAt.toISOString(), closedAt: c.closedAt?.toISOString() ?? null }
  })
}

/** Distance within which an open case is suggested for merging [m] (common practice, no source). */
export const MERGE_RADIUS_M = 5_000

/**
 * Open cases of the same office worth merging a report into: overlapping frequency range and
 * within a few km (geodesic), nearest first.
 */
export async function mergeCandidates(ctx: ServiceContext, actor: Actor, caseId: string): Promise<MergeCandidate[]> {
  const c = await loadVisibleCase(ctx.db, actor, caseId)
  if (!moveAllowedFrom('merge', c.status)) return []
  // coarse box first (1° latitude ≈ 111 km), then the exact geodesic distance
  const dLat = MERGE_RADIUS_M / 111_000 + 0.01
  const dLon = dLat / Math.max(0.1, Math.cos((c.latDeg * Math.PI) / 180))
  const rows = await openCasesNear(ctx.db, {
    officeId: c.officeId,
    exceptCaseId: c.id,
    lowHz: c.freqLowHz,
    highHz: c.freqHighHz,
    latDeg: [c.latDeg - dLat, c.latDeg + dLat],
    lonDeg: [c.lonDeg - dLon, c.lonDeg + dLon],
  })
  return rows
    .map((o) => ({ o, distanceM: geodesicInverse({ from: { latDeg: c.latDeg, lonDeg: c.lonDeg }, to: { latDeg: o.latDeg, lonDeg: o.lonDeg } }).distanceM }))
    .filter((x) => x.distanceM <= MERGE_RADIUS_M)
    .sort((a, b) => a.distanceM - b.distanceM)
    .slice(0, 10)
    .map(({ o, distanceM }) => ({ id: o.id, reference: o.reference, status: o.status, service: o.service, address: o.address, freqLowHz: o.freqLowHz, freqHighHz: o.freqHighHz, distanceM: Math.round(distanceM), receivedAt: o.receivedAt.toISOString() }))
}

/** Active investigators of the case's office with their open workload, lightest first. */
export async function investigatorsForCase(ctx: ServiceContext, actor: Actor, caseId: string): Promise<InvestigatorLoad[]> {
  const c = await loadVisibleCase(ctx.db, actor, caseId)
  return investigatorLoads(ctx.db, c.officeId)
}

/** Offices a case may be transferred to, nearest to the report's location first. */
export async function transferOffices(ctx: ServiceContext, actor: Actor, caseId: string): Promise<TransferOffice[]> {
  const c = await loadVisibleCase(ctx.db, actor, caseId)
  const rows = await otherOffices(ctx.db, c.officeId)
  return rows
    .map((o) => ({ id: o.id, name: o.name, distanceM: Math.round(geodesicInverse({ from: { latDeg: c.latDeg, lonDeg: c.lonDeg }, to: { latDeg: o.centreLatDeg, lonDeg: o.centreLonDeg } }).distanceM) }))
    .sort((a, b) => a.distanceM - b.distanceM)
}

/** Reading cases: the staff case page, the complainant's view, and triage helpers. */
import { and, asc, count, desc, eq, gte, lte, ne, sql } from 'drizzle-orm'
import { COMPLAINANT_STEP_LABELS, COMPLAINANT_STEP_OF_STATE, moveAllowedFrom, OPEN_STATES, type CaseState } from '../../../shared/domain/case-lifecycle'
import { geodesicInverse } from '../../../shared/radio/geo'
import type { ServiceContext } from '../../context'
import { caseEvents, cases, offices, users, type CaseRow } from '../../db/schema'
import { caseAbilities, type CaseActor } from '../../policy/case-policy'
import type { Actor } from '../../policy/policy'
import { forbidden } from '../../http/errors'
import { loadVisibleCase } from './case-moves.service'
import { mergedReportsOf } from './cases.repo'
import { presentCaseDetail, presentComplainantView, toTimelineEvent } from './cases.present'
import type { InvestigatorLoad, MergeCandidate, MyReportRow, TimelineEvent, TransferOffice } from '../../../shared/schemas/views'

async function timeline(ctx: ServiceContext, caseId: string): Promise<TimelineEvent[]> {
  const rows = await ctx.db.select().from(caseEvents).where(eq(caseEvents.caseId, caseId)).orderBy(asc(caseEvents.id))
  return rows.map(toTimelineEvent)
}

export async function getCaseDetail(ctx: ServiceContext, actor: Actor, caseId: string) {
  const c = await loadVisibleCase(ctx.db, actor, caseId)
  const [office] = await ctx.db.select({ name: offices.name }).from(offices).where(eq(offices.id, c.officeId))
  const investigator = c.investigatorId ? (await ctx.db.select({ name: users.name }).from(users).where(eq(users.id, c.investigatorId)))[0] : undefined
  const merged = c.mergedIntoCaseId ? (await ctx.db.select({ reference: cases.reference }).from(cases).where(eq(cases.id, c.mergedIntoCaseId)))[0] : undefined
  const holdsMergedReports = (await mergedReportsOf(ctx.db, c.id)).length > 0
  return presentCaseDetail(
    c,
    {
      officeName: office!.name,
      investigatorName: investigator?.name ?? null,
      mergedIntoReference: merged?.reference ?? null,
      abilities: caseAbilities(actor, { ...c, status: c.status as CaseState, holdsMergedReports }),
      timeline: await timeline(ctx, c.id),
    },
    ctx.now(),
  )
}

export async function getComplainantView(ctx: ServiceContext, actor: CaseActor, caseId: string) {
  const c = await loadVisibleCase(ctx.db, actor, caseId)
  const abilities = caseAbilities(actor, { ...c, status: c.status as CaseState })
  return presentComplainantView(c, await timeline(ctx, c.id), { withdraw: abilities.withdraw, addInformation: true })
}

/**
 * A signed-in complainant's reports, newest first — including those filed without signing in
 * with the account's confirmed address (see linkReportsToConfirmedAccount).
 */
export async function listMyReports(ctx: ServiceContext, actor: Actor): Promise<MyReportRow[]> {
  if (actor.role !== 'complainant') throw forbidden('Only complainant accounts have reports.')
  const rows = await ctx.db.select().from(cases).where(eq(cases.complainantUserId, actor.id)).orderBy(desc(cases.receivedAt))
  return rows.map((c) => ({ id: c.id, reference: c.reference, step: COMPLAINANT_STEP_OF_STATE[c.status as CaseState], statusLabel: COMPLAINANT_STEP_LABELS[COMPLAINANT_STEP_OF_STATE[c.status as CaseState]], service: c.service, address: c.address, freqLowHz: c.freqLowHz, freqHighHz: c.freqHighHz, receivedAt: c.receivedAt.toISOString(), closedAt: c.closedAt?.toISOString() ?? null }))
}

/** Distance within which an open case is suggested for merging [m] (common practice, no source). */
export const MERGE_RADIUS_M = 5_000

/**
 * Open cases of the same office worth merging a report into: overlapping frequency range and
 * within a few km (geodesic), nearest first.
 */
export async function mergeCandidates(ctx: ServiceContext, actor: Actor, caseId: string): Promise<MergeCandidate[]> {
  const c = await loadVisibleCase(ctx.db, actor, caseId)
  if (!moveAllowedFrom('merge', c.status as CaseState)) return []
  // coarse box first (1° latitude ≈ 111 km), then the exact geodesic distance
  const dLat = MERGE_RADIUS_M / 111_000 + 0.01
  const dLon = dLat / Math.max(0.1, Math.cos((c.latDeg * Math.PI) / 180))
  const rows = await ctx.db
    .select()
    .from(cases)
    .where(
      and(
        eq(cases.officeId, c.officeId),
        ne(cases.id, c.id),
        ne(cases.status, 'closed'),
        lte(cases.freqLowHz, c.freqHighHz),
        gte(cases.freqHighHz, c.freqLowHz),
        sql`${cases.latDeg} between ${c.latDeg - dLat} and ${c.latDeg + dLat}`,
        sql`${cases.lonDeg} between ${c.lonDeg - dLon} and ${c.lonDeg + dLon}`,
      ),
    )
    .limit(200)
  return rows
    .map((o) => ({ o, distanceM: geodesicInverse({ from: { latDeg: c.latDeg, lonDeg: c.lonDeg }, to: { latDeg: o.latDeg, lonDeg: o.lonDeg } }).distanceM }))
    .filter((x) => x.distanceM <= MERGE_RADIUS_M)
    .sort((a, b) => a.distanceM - b.distanceM)
    .slice(0, 10)
    .map(({ o, distanceM }) => ({ id: o.id, reference: o.reference, status: o.status, service: o.service, address: o.address, freqLowHz: o.freqLowHz, freqHighHz: o.freqHighHz, distanceM: Math.round(distanceM), receivedAt: o.receivedAt.toISOString() }))
}

/** Active investigators of the case's office with their open workload, lightest first. */
export async function investigatorsForCase(ctx: ServiceContext, actor: Actor, caseId: string): Promise<InvestigatorLoad[]> {
  const c: CaseRow = await loadVisibleCase(ctx.db, actor, caseId)
  const open = sql`${cases.status} in (${sql.join(OPEN_STATES.map((s) => sql`${s}`), sql`, `)})`
  const rows = await ctx.db
    .select({ id: users.id, name: users.name, openCases: count(cases.id) })
    .from(users)
    .leftJoin(cases, and(eq(cases.investigatorId, users.id), open))
    .where(and(eq(users.officeId, c.officeId), eq(users.role, 'investigator'), eq(users.active, true)))
    .groupBy(users.id, users.name)
    .orderBy(asc(count(cases.id)), asc(users.name))
  return rows
}

/** Offices a case may be transferred to, nearest to the report's location first. */
export async function transferOffices(ctx: ServiceContext, actor: Actor, caseId: string): Promise<TransferOffice[]> {
  const c = await loadVisibleCase(ctx.db, actor, caseId)
  const rows = await ctx.db.select({ id: offices.id, name: offices.name, latDeg: offices.centreLatDeg, lonDeg: offices.centreLonDeg }).from(offices).where(ne(offices.id, c.officeId))
  return rows
    .map((o) => ({ id: o.id, name: o.name, distanceM: Math.round(geodesicInverse({ from: { latDeg: c.latDeg, lonDeg: c.lonDeg }, to: { latDeg: o.latDeg, lonDeg: o.lonDeg } }).distanceM) }))
    .sort((a, b) => a.distanceM - b.distanceM)
}

/**
 * A case's findings: the structured record written with the `proposeFinding` move (see
 * case-moves.service.ts, which calls `recordFinding` inside the move's transaction), and the
 * findings read back with their linked calculations and the supervisor's answers.
 */
import type { ProposeFinding } from '../../../shared/schemas/findings'
import type { FindingReview, FindingsResponse } from '../../../shared/schemas/findings'
import type { ServiceContext } from '../../context'
import type { Db } from '../../db/client'
import type { CaseRow, FindingRow } from '../../db/schema'
import { badRequest, forbidden } from '../../http/errors'
import { mayReadFindings } from '../../policy/finding-policy'
import type { CaseActor } from '../../policy/case-policy'
import { loadVisibleCase } from '../cases/case-access'
import { timelineOf, type CaseEventRow } from '../cases/cases.repo'
import { calculationsOfCase } from '../calculations/calculations.repo'
import { presentCalculation } from '../calculations/calculations.present'
import { evidenceOfCase } from '../evidence/evidence.repo'
import { calculationIdsOfCase, findingsOfCase, insertFinding } from './findings.repo'
import { presentFinding } from './findings.present'

/**
 * Writes the finding row of a proposal. Called inside the move's transaction, after the move
 * has been allowed: a calculation that is not a record of the same case, or an evidence file
 * that is not a file of the same case or was removed from it, is a 400 naming every such id,
 * and the whole move (state, timeline, e-mails) is then rolled back.
 */
export async function recordFinding(db: Db, c: CaseRow, authorUserId: string, input: ProposeFinding): Promise<FindingRow> {
  const own = new Set(await calculationIdsOfCase(db, c.id, input.calculationIds))
  const bad = input.calculationIds.filter((id) => !own.has(id))
  const problems: { path: string; message: string }[] = []
  if (bad.length > 0) problems.push({ path: 'calculationIds', message: `Not calculations of this case: ${bad.join(', ')}. Link only records stored on this case.` })
  if (input.evidenceIds.length > 0) {
    const files = new Map((await evidenceOfCase(db, c.id)).map((e) => [e.id, e]))
    const foreign = input.evidenceIds.filter((id) => !files.has(id))
    const removed = input.evidenceIds.filter((id) => files.get(id)?.removedAt)
    const words: string[] = []
    if (foreign.length > 0) words.push(`Not evidence files of this case: ${foreign.join(', ')}.`)
    if (removed.length > 0) words.push(`Removed from the case, so not linkable: ${removed.map((id) => `${id} (${files.get(id)!.displayName})`).join(', ')}.`)
    if (words.length > 0) problems.push({ path: 'evidenceIds', message: `${words.join(' ')} Link only files on this case.` })
  }
  if (problems.length > 0) throw badRequest('validation_failed', 'Some fields need attention.', problems)
  return insertFinding(db, {
    caseId: c.id,
    authorUserId,
    sourceDescription: input.sourceDescription,
    sourceLatDeg: input.sourceLatDeg ?? null,
    sourceLonDeg: input.sourceLonDeg ?? null,
    operator: input.operator ?? null,
    authorisedStationId: input.authorisedStationId ?? null,
    calculationIds: input.calculationIds,
    evidenceIds: input.evidenceIds,
    recommendedAction: input.recommendedAction,
    complianceDeadline: input.complianceDeadline ?? null,
    summary: input.summary,
  })
}

/**
 * The supervisor's answer to each proposal: the first "send back" or "approve and close" on
 * the timeline after the proposal's own event and before the next proposal.
 */
function reviewsByFinding(timeline: CaseEventRow[]): Map<string, FindingReview> {
  const reviews = new Map<string, FindingReview>()
  let open: string | null = null
  for (const e of timeline) {
    if (e.kind === 'proposeFinding') {
      const findingId = e.data?.findingId
      open = typeof findingId === 'string' ? findingId : null
    } else if (open && (e.kind === 'returnFinding' || e.kind === 'close')) {
      reviews.set(open, { outcome: e.kind === 'close' ? 'approved' : 'returned', at: e.at.toISOString(), by: e.actorLabel, comments: e.body })
      open = null
    }
  }
  return reviews
}

/** GET /api/cases/:id/findings: the current finding and the earlier proposals, newest first. */
export async function listFindings(ctx: ServiceContext, actor: CaseActor, caseId: string): Promise<FindingsResponse> {
  const c = await loadVisibleCase(ctx.db, actor, caseId)
  if (!mayReadFindings(actor, c)) throw forbidden('Only staff of the case\u2019s office can read its findings.')
  const rows = await findingsOfCase(ctx.db, c.id)
  if (rows.length === 0) return { current: null, earlier: [] }
  const [calcs, timeline, files] = await Promise.all([calculationsOfCase(ctx.db, c.id), timelineOf(ctx.db, c.id), evidenceOfCase(ctx.db, c.id)])
  const byId = new Map(calcs.map((r) => [r.id, presentCalculation(r)]))
  const evidence = new Map(files.map((e) => [e.id, { id: e.id, name: e.displayName, sha256: e.file.sha256, removed: e.removedAt !== null }]))
  const reviews = reviewsByFinding(timeline)
  const views = rows.map((r) => presentFinding(r, byId, evidence, reviews.get(r.id) ?? null))
  return { current: views[0]!, earlier: views.slice(1) }
}

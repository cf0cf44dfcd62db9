/** Loading a case for an actor: the one place every case service gets its case from. */
import { idParamSchema } from '../../../shared/schemas/ids'
import type { Db } from '../../db/client'
import type { CaseRow } from '../../db/schema'
import { conflict, notFound } from '../../http/errors'
import { canSeeCase, type CaseActor } from '../../policy/case-policy'
import { findCase } from './cases.repo'

export const caseNotFound = () => notFound('case_not_found', 'No such case in your office.')

export const staleVersion = () =>
  conflict('stale_version', 'Someone else changed this case a moment ago. Reload it to see their change, then try again.')

/**
 * Loads a case the actor may see, or throws 404 (another office's case is not found, never
 * forbidden). `caseId` has been checked as a uuid by the route (`caseIdOf`).
 */
export async function loadVisibleCase(db: Db, actor: CaseActor, caseId: string): Promise<CaseRow> {
  const c = await findCase(db, caseId)
  if (!c || !canSeeCase(actor, c)) throw caseNotFound()
  return c
}

/** The case id of a route's path, checked with the one id schema (idParamSchema); anything else is no case (404). */
export function caseIdOf(params: unknown): string {
  const r = idParamSchema.safeParse(params)
  if (!r.success) throw caseNotFound()
  return r.data.id
}

/**
 * Calculations kept as records on a case: stored, listed, recomputed. The server runs every
 * calculation itself from the inputs (shared/calculations → shared/radio); the author is the
 * session's user and the time is the database's.
 */
import { CalculationRefused, runNewCalculation, type NewCalculation, type ReferenceLookup } from '../../../shared/calculations/kinds'
import { RADIO_LIBRARY_VERSION } from '../../../shared/radio'
import type { CalculationView, RecomputeView } from '../../../shared/schemas/views'
import type { ServiceContext } from '../../context'
import { withTransaction } from '../../db/client'
import { badRequest, conflict, forbidden, HttpError, notFound } from '../../http/errors'
import { calculationAllowedIn, mayReadCalculations, mayStoreCalculation } from '../../policy/calculation-policy'
import type { Actor } from '../../policy/policy'
import { loadVisibleCase } from '../cases/case-access'
import { appendEvent } from '../cases/cases.repo'
import { findUserById } from '../users/users.repo'
import { candidateSourcesLookup } from '../stations/station-references'
import type { Db } from '../../db/client'
import { prefetchReferences } from './calculation-references'
import { calculationsOfCase, findCalculation, insertCalculation } from './calculations.repo'
import { presentCalculation } from './calculations.present'
import { recomputeStored } from './recompute'

export const calculationNotFound = () => notFound('calculation_not_found', 'No such calculation in your office.')

/**
 * The references a calculation names, read from the office's registers and the case as they are
 * now (the record keeps a copy, so later edits of a register never change it).
 */
async function registerReferences(db: Db, caseId: string, input: NewCalculation): Promise<{ lookup: ReferenceLookup; measurementIds: string[]; evidenceIds: string[] }> {
  const { lookup, measurementIds, evidenceIds } = await prefetchReferences(db, caseId, input)
  // candidate sources: the licence register's stations overlapping the interference (server/modules/stations)
  const candidates = input.kind === 'candidate_sources' ? await candidateSourcesLookup(db, input.inputs) : {}
  return { lookup: { ...lookup, ...candidates }, measurementIds, evidenceIds }
}

/** Runs a calculation on the case and stores it as a record, with an internal timeline event. */
export async function storeCalculation(ctx: ServiceContext, actor: Actor, caseId: string, input: NewCalculation): Promise<CalculationView> {
  return withTransaction(ctx.pool, async ({ db }) => {
    const c = await loadVisibleCase(db, actor, caseId)
    if (!mayStoreCalculation(actor, c)) throw forbidden('Only the assigned investigator or the office supervisor can store calculations on this case.')
    if (!calculationAllowedIn(c.status)) throw conflict('invalid_state', 'Calculations are stored while the case is being worked (assigned, in field work or sent back).')
    const named = await registerReferences(db, c.id, input)
    let result
    try {
      result = runNewCalculation(input, named.lookup)
    } catch (e) {
      if (e instanceof CalculationRefused) throw badRequest('calculation_refused', e.message)
      throw e
    }
    const row = await insertCalculation(db, {
      caseId: c.id,
      kind: input.kind,
      inputs: JSON.parse(JSON.stringify(input.inputs)),
      outputs: result.run.outputs,
      warnings: result.run.warnings,
      methods: result.run.methods,
      libraryVersion: RADIO_LIBRARY_VERSION,
      authorUserId: actor.id,
      referenceCopies: result.references,
      measurementIds: named.measurementIds,
      // the evidence files the measurements it used were taken from
      evidenceIds: named.evidenceIds,
    })
    const name = (await findUserById(db, actor.id))?.name ?? 'Unknown user'
    await appendEvent(db, {
      caseId: c.id,
      actorUserId: actor.id,
      actorLabel: name,
      kind: 'calculation_stored',
      body: result.run.summary,
      visibility: 'internal',
      data: { calculationId: row.id, calculationKind: row.kind, libraryVersion: row.libraryVersion },
    })
    return presentCalculation({ ...row, authorName: name })
  })
}

export async function listCalculations(ctx: ServiceContext, actor: Actor, caseId: string): Promise<CalculationView[]> {
  const c = await loadVisibleCase(ctx.db, actor, caseId)
  if (!mayReadCalculations(actor, c)) throw forbidden('Only staff of the case\u2019s office can read its calculations.')
  return (await calculationsOfCase(ctx.db, c.id)).map(presentCalculation)
}

/** A record run again with the current library, each output beside the stored one. */
export async function recomputeCalculation(ctx: ServiceContext, actor: Actor, calculationId: string): Promise<RecomputeView> {
  const r = await findCalculation(ctx.db, calculationId)
  if (!r) throw calculationNotFound()
  // a record of a case the actor may not see is not found either (never forbidden)
  const c = await loadVisibleCase(ctx.db, actor, r.caseId).catch((e: unknown) => {
    throw e instanceof HttpError && e.status === 404 ? calculationNotFound() : e
  })
  if (!mayReadCalculations(actor, c)) throw forbidden('Only staff of the case\u2019s office can read its calculations.')
  return recomputeStored(r)
}

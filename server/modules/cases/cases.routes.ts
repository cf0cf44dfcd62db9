import { Router } from 'express'
import { z } from 'zod'
import {
  assignSchema,
  caseListQuerySchema,
  closeSchema,
  dismissSchema,
  mergeSchema,
  noteSchema,
  reopenSchema,
  returnFindingSchema,
  startFieldWorkSchema,
  transferSchema,
  triageSchema,
} from '../../../shared/schemas/cases'
import { proposeFindingSchema } from '../../../shared/schemas/findings'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { parseWith } from '../../http/validate'
import { HttpError } from '../../http/errors'
import { caseIdOf } from './case-access'
import { addCaseNote } from './case-notes.service'
import { exportCasesCsv, listCases } from './case-list.service'
import * as moves from './case-moves.service'
import { getCaseDetail, investigatorsForCase, mergeCandidates, openCaseDetail, transferOffices } from './case-read.service'
import { nearbyOpenCases } from './nearby-cases.service'
import { revokeTrackingLinks } from './tracking-links.service'
import { revokeTrackingLinksSchema } from '../../../shared/schemas/people'
import type { Actor } from '../../policy/policy'
import type { CaseMoveResponse } from '../../../shared/schemas/views'


/** Staff routes: the case list, the case page, and one route per move. */
export function casesRoutes(ctx: ServiceContext): Router {
  const r = Router()
  const staff = requireRole('investigator', 'supervisor', 'admin')

  r.get('/cases', staff, async (req, res) => {
    res.json(await listCases(ctx, actorOf(req), parseWith(caseListQuerySchema, req.query)))
  })
  r.get('/cases/export.csv', staff, async (req, res) => {
    const csv = await exportCasesCsv(ctx, actorOf(req), parseWith(caseListQuerySchema, req.query))
    res.setHeader('Content-Type', 'text/csv; charset=utf-8')
    res.setHeader('Content-Disposition', `attachment; filename="quietband-cases-${new Date().toISOString().slice(0, 10)}.csv"`)
    res.send(csv)
  })
  r.get('/cases/:id', staff, async (req, res) => {
    res.json({ case: await openCaseDetail(ctx, actorOf(req), caseIdOf(req.params)) })
  })
  r.get('/cases/:id/merge-candidates', staff, async (req, res) => {
    res.json({ candidates: await mergeCandidates(ctx, actorOf(req), caseIdOf(req.params)) })
  })
  r.get('/cases/:id/nearby-cases', staff, async (req, res) => {
    res.json({ cases: await nearbyOpenCases(ctx, actorOf(req), caseIdOf(req.params)) })
  })
  r.get('/cases/:id/investigators', staff, async (req, res) => {
    res.json({ investigators: await investigatorsForCase(ctx, actorOf(req), caseIdOf(req.params)) })
  })
  r.get('/cases/:id/transfer-offices', staff, async (req, res) => {
    res.json({ offices: await transferOffices(ctx, actorOf(req), caseIdOf(req.params)) })
  })
  r.post('/cases/:id/notes', staff, async (req, res) => {
    const id = caseIdOf(req.params)
    await addCaseNote(ctx, actorOf(req), id, parseWith(noteSchema, req.body))
    res.status(201).json({ case: await getCaseDetail(ctx, actorOf(req), id) })
  })

  r.post('/cases/:id/tracking-links/revoke', staff, async (req, res) => {
    res.json(await revokeTrackingLinks(ctx, actorOf(req), caseIdOf(req.params), parseWith(revokeTrackingLinksSchema, req.body)))
  })

  // one route per move; each answers with the case as it now stands (with fresh abilities)
  const move = <S extends z.ZodType>(path: string, schema: S, run: (actor: Actor, id: string, input: z.infer<S>) => Promise<unknown>) => {
    r.post(`/cases/:id/${path}`, staff, async (req, res) => {
      const id = caseIdOf(req.params)
      const actor = actorOf(req)
      await run(actor, id, parseWith(schema, req.body))
      // after a transfer the case belongs to another office and is no longer the actor's to see
      const detail = await getCaseDetail(ctx, actor, id).catch((e: unknown) => {
        if (e instanceof HttpError && e.status === 404) return null
        throw e
      })
      const body: CaseMoveResponse = { case: detail }
      res.json(body)
    })
  }
  move('triage', triageSchema, (a, id, i) => moves.triageCase(ctx, a, id, i))
  move('assign', assignSchema, (a, id, i) => moves.assignCase(ctx, a, id, i))
  move('transfer', transferSchema, (a, id, i) => moves.transferCase(ctx, a, id, i))
  move('merge', mergeSchema, (a, id, i) => moves.mergeCase(ctx, a, id, i))
  move('dismiss', dismissSchema, (a, id, i) => moves.dismissReport(ctx, a, id, i))
  move('start-field-work', startFieldWorkSchema, (a, id, i) => moves.startFieldWork(ctx, a, id, i))
  move('propose-finding', proposeFindingSchema, (a, id, i) => moves.proposeFinding(ctx, a, id, i))
  move('return-finding', returnFindingSchema, (a, id, i) => moves.returnFinding(ctx, a, id, i))
  move('close', closeSchema, (a, id, i) => moves.closeCase(ctx, a, id, i))
  move('reopen', reopenSchema, (a, id, i) => moves.reopenCase(ctx, a, id, i))
  return r
}

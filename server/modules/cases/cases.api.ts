/** The document's entries for staff case routes: the list, the case page, one route per move (cases.routes.ts). */
import type { z } from 'zod'
import { CASE_MOVE_LABELS, type CaseMoveName } from '../../../shared/domain/case-lifecycle'
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
import { idParamSchema } from '../../../shared/schemas/ids'
import { nearbyCasesResponseSchema } from '../../../shared/schemas/nearby-cases'
import { revokeTrackingLinksSchema, trackingLinksRevokedResponseSchema } from '../../../shared/schemas/people'
import {
  caseMoveResponseSchema,
  casePageSchema,
  caseResponseSchema,
  investigatorsResponseSchema,
  mergeCandidatesResponseSchema,
  transferOfficesResponseSchema,
} from '../../../shared/schemas/views'
import { STAFF, type ApiOperation } from '../../openapi/operation'
import { publicCasesApi } from './public.api'

const tag = 'Cases'
const ofCase = { tag, callers: STAFF, params: idParamSchema } as const
const read = (path: string, summary: string, answer: z.ZodType): ApiOperation => ({ method: 'get', path: `/api/cases/:id/${path}`, summary, ...ofCase, responses: { 200: answer } })

/** The move routes as cases.routes.ts mounts them: path segment, move, request schema. */
const MOVES: [string, CaseMoveName, z.ZodType][] = [
  ['triage', 'triage', triageSchema],
  ['assign', 'assign', assignSchema],
  ['transfer', 'transfer', transferSchema],
  ['merge', 'merge', mergeSchema],
  ['dismiss', 'dismiss', dismissSchema],
  ['start-field-work', 'startFieldWork', startFieldWorkSchema],
  ['propose-finding', 'proposeFinding', proposeFindingSchema],
  ['return-finding', 'returnFinding', returnFindingSchema],
  ['close', 'close', closeSchema],
  ['reopen', 'reopen', reopenSchema],
]

const moveOperation = ([segment, move, schema]: (typeof MOVES)[number]): ApiOperation => ({
  method: 'post',
  path: `/api/cases/:id/${segment}`,
  summary: `${CASE_MOVE_LABELS[move]} (a move)`,
  ...ofCase,
  body: schema,
  responses: { 200: caseMoveResponseSchema },
  errors: [409],
  description:
    'Who may make it depends on the role, the office and the state (the case policy). 409 invalid_transition when the state forbids it, stale_version when `version` is not the current one. Answers the case as it now stands; `case` is null when the move took it out of the caller’s sight (a transfer).',
})

/** The complainant's side (public.api.ts) and the staff routes. */
export const casesApi: ApiOperation[] = [
  ...publicCasesApi,
  {
    method: 'get',
    path: '/api/cases',
    summary: 'The case list: filtered, sorted, one page',
    tag,
    callers: STAFF,
    query: caseListQuerySchema,
    responses: { 200: casePageSchema },
    description: "Staff see their office's cases; an administrator every office's.",
  },
  {
    method: 'get',
    path: '/api/cases/export.csv',
    summary: 'The filtered case list as CSV',
    tag,
    callers: STAFF,
    query: caseListQuerySchema,
    responses: { 200: { contentType: 'text/csv', description: 'Every matching case, one row each.' } },
    description: 'The export is audited.',
  },
  {
    method: 'get',
    path: '/api/cases/:id',
    summary: 'A case with its timeline and what the caller may do with it',
    ...ofCase,
    responses: { 200: caseResponseSchema },
    description: "Another office's case is 404 to staff. Opening the complainant's details is audited.",
  },
  read('merge-candidates', 'Open cases this case could be merged into', mergeCandidatesResponseSchema),
  read('nearby-cases', "The office's other open cases around this case", nearbyCasesResponseSchema),
  read('investigators', "The office's investigators with their open cases, for assigning", investigatorsResponseSchema),
  read('transfer-offices', 'Offices the case could be transferred to, nearest first', transferOfficesResponseSchema),
  {
    method: 'post',
    path: '/api/cases/:id/notes',
    summary: 'Add an internal note or a message to the complainant',
    ...ofCase,
    body: noteSchema,
    responses: { 201: caseResponseSchema },
  },
  {
    method: 'post',
    path: '/api/cases/:id/tracking-links/revoke',
    summary: "Close every tracking link of the case",
    ...ofCase,
    body: revokeTrackingLinksSchema,
    responses: { 200: trackingLinksRevokedResponseSchema },
    description: "A supervisor of the case's office. Audited.",
  },
  ...MOVES.map(moveOperation),
]

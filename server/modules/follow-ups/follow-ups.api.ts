/** Follow-ups and their moves, as the API document describes them (routes: follow-ups.routes.ts). */
import { FOLLOW_UP_MOVE_LABELS, FOLLOW_UP_MOVE_NAMES, FOLLOW_UP_MOVES, FOLLOW_UP_STATE_LABELS, type FollowUpMover } from '../../../shared/domain/follow-ups'
import { caseFollowUpsResponseSchema, dueFollowUpsResponseSchema, followUpInputSchema, followUpMoveInputSchema, followUpResponseSchema } from '../../../shared/schemas/follow-ups'
import { idParamSchema } from '../../../shared/schemas/ids'
import { STAFF, type ApiOperation, type Caller } from '../../openapi/operation'

const tag = 'Enforcement'
/** The role each kind of mover signs in with (the policy then asks the office and the assignment). */
const ROLE_OF_MOVER: Record<FollowUpMover, Caller> = { office_supervisor: 'supervisor', assigned_investigator: 'investigator' }

export const followUpsApi: ApiOperation[] = [
  {
    method: 'get',
    path: '/api/follow-ups/due',
    summary: 'The caller\'s due and overdue follow-ups: an investigator\'s cases, a supervisor\'s office, every office for an administrator',
    tag,
    callers: STAFF,
    responses: { 200: dueFollowUpsResponseSchema },
  },
  {
    method: 'get',
    path: '/api/cases/:id/follow-ups',
    summary: 'A case\'s follow-ups, where each stands on the office\'s today, and the moves the caller may make',
    tag,
    callers: STAFF,
    params: idParamSchema,
    responses: { 200: caseFollowUpsResponseSchema },
  },
  {
    method: 'post',
    path: '/api/cases/:id/follow-ups',
    summary: 'Add a follow-up: what the responsible party must do, and by when',
    tag,
    callers: ['investigator', 'supervisor'],
    params: idParamSchema,
    body: followUpInputSchema,
    responses: { 201: followUpResponseSchema },
    description: 'Staff of the case\'s office; the deadline cannot lie before the office\'s today.',
  },
  ...FOLLOW_UP_MOVE_NAMES.map(
    (move): ApiOperation => ({
      method: 'post',
      path: `/api/follow-ups/:id/${move}`,
      summary: `${FOLLOW_UP_MOVE_LABELS[move]}: a follow-up that is ${FOLLOW_UP_MOVES[move].from.map((s) => `“${FOLLOW_UP_STATE_LABELS[s]}”`).join(' or ')} becomes “${FOLLOW_UP_STATE_LABELS[FOLLOW_UP_MOVES[move].to]}”, with a note`,
      tag,
      callers: (['investigator', 'supervisor'] as const).filter((role) => FOLLOW_UP_MOVES[move].by.some((m) => ROLE_OF_MOVER[m] === role)),
      params: idParamSchema,
      body: followUpMoveInputSchema,
      responses: { 200: followUpResponseSchema },
      errors: [409],
      description: 'On the version last read (409 stale_version); a move the follow-up\'s state does not allow is 409 invalid_transition. Only reopening sets a new deadline.',
    }),
  ),
]

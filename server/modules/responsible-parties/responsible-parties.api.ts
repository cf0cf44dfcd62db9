/** A case's responsible party, notices and replies, as the API document describes them (routes: responsible-parties.routes.ts). */
import { noticeInputSchema, replyInputSchema, responsiblePartyInputSchema, responsiblePartyResponseSchema } from '../../../shared/schemas/follow-ups'
import { idParamSchema } from '../../../shared/schemas/ids'
import { STAFF, type ApiOperation, type Caller } from '../../openapi/operation'

const tag = 'Enforcement'
/** Staff of the case's office record; administrators only read. */
const RECORDERS: readonly Caller[] = ['investigator', 'supervisor']
const answersAll = 'Answers the whole record as GET does: the current party, earlier versions, notices and replies.'

export const responsiblePartiesApi: ApiOperation[] = [
  {
    method: 'get',
    path: '/api/cases/:id/responsible-party',
    summary: 'A case\'s responsible party (current and earlier versions), the notices served on it and its replies',
    tag,
    callers: STAFF,
    params: idParamSchema,
    responses: { 200: responsiblePartyResponseSchema },
  },
  {
    method: 'post',
    path: '/api/cases/:id/responsible-party',
    summary: 'Record who is responsible for the source: a new version of the party\'s record',
    tag,
    callers: RECORDERS,
    params: idParamSchema,
    body: responsiblePartyInputSchema,
    responses: { 201: responsiblePartyResponseSchema },
    description: answersAll,
  },
  {
    method: 'post',
    path: '/api/cases/:id/notices',
    summary: 'Record a notice served on the responsible party',
    tag,
    callers: RECORDERS,
    params: idParamSchema,
    body: noticeInputSchema,
    responses: { 201: responsiblePartyResponseSchema },
    description: `The party must be recorded first, and a notice cannot be served in the future. ${answersAll}`,
  },
  {
    method: 'post',
    path: '/api/cases/:id/party-replies',
    summary: 'Record a reply from the responsible party',
    tag,
    callers: RECORDERS,
    params: idParamSchema,
    body: replyInputSchema,
    responses: { 201: responsiblePartyResponseSchema },
    description: answersAll,
  },
]

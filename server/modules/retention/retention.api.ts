/** The document's entries for legal holds and retention (retention.routes.ts). */
import { idParamSchema } from '../../../shared/schemas/ids'
import {
  legalHoldResponseSchema,
  liftLegalHoldSchema,
  retentionRunResponseSchema,
  retentionSettingResponseSchema,
  setLegalHoldSchema,
  setRetentionSchema,
} from '../../../shared/schemas/retention'
import { STAFF, type ApiOperation } from '../../openapi/operation'

const tag = 'Retention'
const holders = ['supervisor', 'admin'] as const

export const retentionApi: ApiOperation[] = [
  { method: 'get', path: '/api/cases/:id/legal-hold', summary: "A case's legal hold and its history", tag, callers: STAFF, params: idParamSchema, responses: { 200: legalHoldResponseSchema } },
  {
    method: 'post',
    path: '/api/cases/:id/legal-hold',
    summary: 'Set a legal hold: retention keeps the case while it holds',
    tag,
    callers: holders,
    params: idParamSchema,
    body: setLegalHoldSchema,
    responses: { 200: legalHoldResponseSchema },
    description: "A supervisor of the case's office or an administrator. Audited.",
  },
  {
    method: 'post',
    path: '/api/cases/:id/legal-hold/lift',
    summary: 'Lift the legal hold in force',
    tag,
    callers: holders,
    params: idParamSchema,
    body: liftLegalHoldSchema,
    responses: { 200: legalHoldResponseSchema },
    errors: [409],
    description: '409 no_legal_hold when none is in force. Audited.',
  },
  { method: 'get', path: '/api/offices/:id/retention', summary: "An office's retention period", tag, callers: STAFF, params: idParamSchema, responses: { 200: retentionSettingResponseSchema } },
  {
    method: 'put',
    path: '/api/offices/:id/retention',
    summary: "Set an office's retention period (whole months after closing)",
    tag,
    callers: ['admin'],
    params: idParamSchema,
    body: setRetentionSchema,
    responses: { 200: retentionSettingResponseSchema },
    description: 'Never shorter than the open follow-ups of its closed cases need. Audited.',
  },
  {
    method: 'get',
    path: '/api/admin/retention/dry-run',
    summary: 'What a retention run would erase and dispose of now',
    tag,
    callers: ['admin'],
    responses: { 200: retentionRunResponseSchema },
  },
]

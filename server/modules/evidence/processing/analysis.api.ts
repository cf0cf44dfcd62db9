/** A spectrum evidence file's analysis and bands, as the API document describes them (routes: analysis.routes.ts). */
import { bandMeasurementRequestSchema, bandMeasurementResponseSchema } from '../../../../shared/schemas/band-measurement'
import { idParamSchema } from '../../../../shared/schemas/ids'
import { bandRequestSchema, evidenceAnalysisResponseSchema, evidenceBandResponseSchema } from '../../../../shared/schemas/spectrum'
import type { ApiOperation, Caller } from '../../../openapi/operation'

const tag = 'Evidence'
/** Staff of the file's office. */
const CASE_STAFF: readonly Caller[] = ['investigator', 'supervisor']

export const evidenceAnalysisApi: ApiOperation[] = [
  {
    method: 'get',
    path: '/api/evidence/:id/analysis',
    summary: 'A spectrum file\'s analysis: its processing state, summary, display trace and spectrogram',
    tag,
    callers: CASE_STAFF,
    params: idParamSchema,
    responses: { 200: evidenceAnalysisResponseSchema },
  },
  {
    method: 'post',
    path: '/api/evidence/:id/band',
    summary: 'Channel power and occupied bandwidth of a band of the file\'s stored display trace (nothing is stored)',
    tag,
    callers: CASE_STAFF,
    params: idParamSchema,
    body: bandRequestSchema,
    responses: { 200: evidenceBandResponseSchema },
    errors: [409],
    description: 'Each edge is a number of hertz or text with its unit ("433.9 MHz"). A file without a finished analysis: 409 analysis_not_ready.',
  },
  {
    method: 'post',
    path: '/api/evidence/:id/band-measurement',
    summary: 'Keep a band\'s channel power as a measurement of the case, computed by the server from the stored trace',
    tag,
    callers: CASE_STAFF,
    params: idParamSchema,
    body: bandMeasurementRequestSchema,
    responses: { 201: bandMeasurementResponseSchema },
    errors: [409],
    description:
      'The assigned investigator or the office\'s supervisor, while the case is worked. A removed file, a trace in dBFS, or a band whose channel power cannot be computed is refused (409) before anything is stored.',
  },
]

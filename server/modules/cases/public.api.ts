/** The document's entries for the complainant's side: reports, tracking links, a complainant's own reports (public.routes.ts). */
import { complainantInfoSchema, reportSchema, trackingTokenParamSchema, withdrawSchema } from '../../../shared/schemas/cases'
import { idParamSchema } from '../../../shared/schemas/ids'
import { complainantReportResponseSchema, myReportsResponseSchema, submittedReportSchema } from '../../../shared/schemas/views'
import { EVERYONE, type ApiOperation } from '../../openapi/operation'

const tag = 'Reports and tracking'
const complainant = ['complainant'] as const
const tokenWords = 'An unknown or closed link is 404 tracking_not_found; too many of those from one address in an hour, 429.'

export const publicCasesApi: ApiOperation[] = [
  {
    method: 'post',
    path: '/api/reports',
    summary: 'File a report of harmful interference',
    tag,
    callers: EVERYONE,
    body: reportSchema,
    responses: { 201: submittedReportSchema },
    errors: [429],
    description: 'Routed to the office whose area holds the place; the tracking link is also e-mailed. Signed in as a complainant, the report belongs to the account.',
  },
  { method: 'get', path: '/api/track/:token', summary: 'A report as its tracking link shows it', tag, callers: EVERYONE, params: trackingTokenParamSchema, responses: { 200: complainantReportResponseSchema }, errors: [429], description: tokenWords },
  {
    method: 'post',
    path: '/api/track/:token/information',
    summary: 'Add information to a report through its tracking link',
    tag,
    callers: EVERYONE,
    params: trackingTokenParamSchema,
    body: complainantInfoSchema,
    responses: { 201: complainantReportResponseSchema },
    errors: [409, 429],
    description: tokenWords,
  },
  {
    method: 'post',
    path: '/api/track/:token/withdraw',
    summary: 'Withdraw a report through its tracking link',
    tag,
    callers: EVERYONE,
    params: trackingTokenParamSchema,
    body: withdrawSchema,
    responses: { 200: complainantReportResponseSchema },
    errors: [409, 429],
    description: tokenWords,
  },
  { method: 'get', path: '/api/my/reports', summary: "The signed-in complainant's reports", tag, callers: complainant, responses: { 200: myReportsResponseSchema } },
  {
    method: 'get',
    path: '/api/my/reports/:id',
    summary: 'One of the complainant’s reports',
    tag,
    callers: complainant,
    params: idParamSchema,
    responses: { 200: complainantReportResponseSchema },
    description: "Another person's report is 404.",
  },
  {
    method: 'post',
    path: '/api/my/reports/:id/information',
    summary: 'Add information to one of the complainant’s reports',
    tag,
    callers: complainant,
    params: idParamSchema,
    body: complainantInfoSchema,
    responses: { 201: complainantReportResponseSchema },
    errors: [409, 429],
  },
  {
    method: 'post',
    path: '/api/my/reports/:id/withdraw',
    summary: 'Withdraw one of the complainant’s reports',
    tag,
    callers: complainant,
    params: idParamSchema,
    body: withdrawSchema,
    responses: { 200: complainantReportResponseSchema },
    errors: [409],
  },
]

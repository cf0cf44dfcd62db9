/** The document's entry for "E-mails Quietband sends you" (notifications.routes.ts). */
import { myEmailsResponseSchema } from '../../../shared/schemas/follow-ups'
import type { ApiOperation } from '../../openapi/operation'

export const notificationsApi: ApiOperation[] = [
  {
    method: 'get',
    path: '/api/me/emails',
    summary: 'The kinds of e-mail Quietband sends the signed-in person, and when',
    tag: 'Sign-in and accounts',
    callers: ['complainant', 'investigator', 'supervisor', 'admin'],
    responses: { 200: myEmailsResponseSchema },
  },
]

/** The document's entry for the development mailbox (mailbox.routes.ts). */
import { mailboxResponseSchema } from '../../../shared/schemas/views'
import { EVERYONE, type ApiOperation } from '../../openapi/operation'

export const devApi: ApiOperation[] = [
  {
    method: 'get',
    path: '/api/dev/mailbox',
    summary: 'Messages caught by the local SMTP fake',
    tag: 'Development only',
    callers: EVERYONE,
    responses: { 200: mailboxResponseSchema },
    errors: [404],
    description: 'Served only to loopback connections of a loopback development server with no proxy declared; everywhere else 404 mailbox_disabled, saying why.',
  },
]

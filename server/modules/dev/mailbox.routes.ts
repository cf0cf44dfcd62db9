import { Router } from 'express'
import { readMailbox } from '../../mail/dev-mailbox'
import { notFound } from '../../http/errors'

/**
 * Development mailbox: the messages caught by the local SMTP fake, so a developer (or a
 * demo complainant) can follow links from e-mails. Off when a real SMTP server is configured.
 */
export function mailboxRoutes(mailboxDir: string | undefined): Router {
  const r = Router()
  r.get('/dev/mailbox', async (_req, res) => {
    if (!mailboxDir) throw notFound('mailbox_disabled', 'The development mailbox is off: a real mail server is configured.')
    res.json({ messages: await readMailbox(mailboxDir) })
  })
  return r
}

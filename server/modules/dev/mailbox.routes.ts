import { Router } from 'express'
import { readMailbox } from '../../mail/dev-mailbox'
import { notFound } from '../../http/errors'
import { MAILBOX_REFUSAL_WORDS, MAILBOX_RULE, mailboxAccess, type MailboxSetting } from './mailbox-guard'

/**
 * Development mailbox: the messages caught by the local SMTP fake, so a developer on this
 * machine can follow links from e-mails. Served only as mailbox-guard.ts allows; otherwise
 * 404 `mailbox_disabled`, saying why in plain words.
 */
export function mailboxRoutes(setting: MailboxSetting): Router {
  const r = Router()
  r.get('/dev/mailbox', async (req, res) => {
    const forwarded = ['x-forwarded-for', 'forwarded', 'x-real-ip'].some((h) => req.headers[h] !== undefined)
    const access = mailboxAccess(setting, { remoteAddress: req.socket.remoteAddress, forwarded })
    if (!access.on) throw notFound('mailbox_disabled', `The development mailbox is off here: ${MAILBOX_REFUSAL_WORDS[access.reason]}. ${MAILBOX_RULE}`)
    res.json({ messages: await readMailbox(setting.dir!) })
  })
  return r
}

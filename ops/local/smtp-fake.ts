/**
 * Local SMTP fake for development and tests: accepts every message on 127.0.0.1 and keeps
 * it as <n>.eml + <n>.json in a folder, which the development mailbox page lists.
 * It can be stopped and started again on the same port (tests of mail that is never lost).
 */
import fs from 'node:fs/promises'
import path from 'node:path'
import type { AddressInfo } from 'node:net'
import { SMTPServer } from 'smtp-server'
import { simpleParser } from 'mailparser'
import type { StoredMessage } from '../../server/mail/dev-mailbox'

export interface SmtpFake {
  host: string
  port: number
  url: string
  dir: string
  close(): Promise<void>
}

export async function startSmtpFake(opts: { dir: string; port?: number }): Promise<SmtpFake> {
  await fs.mkdir(opts.dir, { recursive: true })
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    size: 25 * 1024 * 1024,
    onData(stream, session, callback) {
      const chunks: Buffer[] = []
      stream.on('data', (c: Buffer) => chunks.push(c))
      stream.on('end', async () => {
        try {
          const raw = Buffer.concat(chunks)
          const parsed = await simpleParser(raw)
          const id = `${Date.now()}-${Math.random().toString(36).slice(2, 8)}`
          const message: StoredMessage = {
            id,
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: parsed.subject ?? '',
            date: new Date().toISOString(),
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
            messageId: parsed.messageId ?? null,
          }
          await fs.writeFile(path.join(opts.dir, `${id}.eml`), raw)
          await fs.writeFile(path.join(opts.dir, `${id}.json`), JSON.stringify(message, null, 2))
          callback()
        } catch (e) {
          callback(e as Error)
        }
      })
    },
  })
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject)
    server.listen(opts.port ?? 0, '127.0.0.1', () => resolve())
  })
  const port = (server as unknown as { server: { address(): AddressInfo } }).server.address().port
  return {
    host: '127.0.0.1',
    port,
    url: `smtp://127.0.0.1:${port}`,
    dir: opts.dir,
    close: () => new Promise<void>((r) => server.close(() => r())),
  }
}

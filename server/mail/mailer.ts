import nodemailer, { type Transporter } from 'nodemailer'

export interface OutgoingMail {
  to: string
  subject: string
  text: string
  html: string
}

export interface Mailer {
  send(mail: OutgoingMail & { messageId?: string }): Promise<void>
  close(): void
}

/** SMTP through nodemailer; plain SMTP on loopback (the local fake), TLS as the URL says elsewhere. */
export function createMailer(opts: { smtpUrl: string; from: string }): Mailer {
  const u = new URL(opts.smtpUrl)
  const loopback = ['127.0.0.1', 'localhost', '::1'].includes(u.hostname)
  const transport: Transporter = nodemailer.createTransport({
    host: u.hostname,
    port: Number(u.port || (u.protocol === 'smtps:' ? 465 : 587)),
    secure: u.protocol === 'smtps:',
    ignoreTLS: loopback && u.protocol === 'smtp:',
    auth: u.username ? { user: decodeURIComponent(u.username), pass: decodeURIComponent(u.password) } : undefined,
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    // below the mail worker's deadline for one send: a hung connection is dropped before the
    // worker counts the send as failed, so a late acceptance cannot double a message
    socketTimeout: 14_000,
  })
  return {
    async send(mail) {
      await transport.sendMail({ from: opts.from, ...mail })
    },
    close: () => transport.close(),
  }
}

/**
 * When the development mailbox may be served. It shows every e-mail the server sent —
 * password links, confirmation links, complainants' tracking links — so it must never be
 * reachable by accident. It is on only when all of these hold:
 *   1. DEV_MAILBOX_DIR is set (the local SMTP fake keeps messages there),
 *   2. NODE_ENV is not `production`,
 *   3. the server listens on a loopback address only (127.0.0.0/8, ::1, localhost),
 *   4. no proxy is declared in front (TRUST_PROXY is 0): behind a proxy every request
 *      arrives from the proxy, often over loopback, whoever sent it,
 * and then it answers only a request whose connection comes from loopback
 * (`req.socket.remoteAddress`, never `req.ip`, which believes X-Forwarded-For) and that
 * carries no forwarding header (a proxy on the same machine would connect over loopback).
 * Pure functions, so every refusal is tested on its own.
 */

export interface MailboxSetting {
  /** DEV_MAILBOX_DIR */
  dir?: string
  /** NODE_ENV */
  nodeEnv?: string
  /** The host the server listens on (HOST); unknown counts as not loopback. */
  listenHost?: string
  /** TRUST_PROXY: the number of proxies in front. */
  trustProxy?: number
}

export type MailboxOff = 'no_mailbox_dir' | 'production' | 'not_loopback_listener' | 'behind_proxy'
export type MailboxRefusal = MailboxOff | 'remote_client' | 'forwarded_request'

export type MailboxDecision = { on: true } | { on: false; reason: MailboxRefusal }

/** Plain words for each refusal (the start banner and the API's answer use them). */
export const MAILBOX_REFUSAL_WORDS: Record<MailboxRefusal, string> = {
  no_mailbox_dir: 'DEV_MAILBOX_DIR is not set (a real mail server sends the e-mails)',
  production: 'NODE_ENV is production',
  not_loopback_listener: 'the server does not listen on a loopback address only',
  behind_proxy: 'TRUST_PROXY says a proxy is in front',
  remote_client: 'the request does not come from this machine',
  forwarded_request: 'the request came through a proxy',
}

/** The rule in one sentence, for the banner, the README and the refusal. */
export const MAILBOX_RULE =
  'The development mailbox is served only when DEV_MAILBOX_DIR is set, NODE_ENV is not production, the server listens on loopback (127.0.0.1 or ::1) with no proxy declared (TRUST_PROXY=0), and only to browsers on the same machine.'

/** 127.0.0.0/8, ::1, and those written as IPv4-mapped IPv6 addresses. */
export function isLoopbackAddress(address: string | undefined): boolean {
  if (!address) return false
  const a = address.trim().toLowerCase().replace(/^\[|\]$/g, '')
  if (a === '::1' || a === '0:0:0:0:0:0:0:1') return true
  const v4 = a.startsWith('::ffff:') ? a.slice('::ffff:'.length) : a
  const m = /^(\d{1,3})\.(\d{1,3})\.(\d{1,3})\.(\d{1,3})$/.exec(v4)
  return !!m && m.slice(1).every((o) => Number(o) <= 255) && m[1] === '127'
}

/** A listen host that accepts loopback connections only (`localhost` included; `0.0.0.0`, `::` and names are not). */
export function isLoopbackHost(host: string | undefined): boolean {
  if (!host) return false
  return host.trim().toLowerCase() === 'localhost' || isLoopbackAddress(host)
}

/** Whether the server may serve the mailbox at all (checked once, at start). */
export function mailboxSetting(s: MailboxSetting): MailboxDecision {
  if (!s.dir) return { on: false, reason: 'no_mailbox_dir' }
  if (s.nodeEnv === 'production') return { on: false, reason: 'production' }
  if (!isLoopbackHost(s.listenHost)) return { on: false, reason: 'not_loopback_listener' }
  if (s.trustProxy && s.trustProxy > 0) return { on: false, reason: 'behind_proxy' }
  return { on: true }
}

export interface MailboxRequest {
  /** req.socket.remoteAddress: the connection's own peer, which no header can change. */
  remoteAddress: string | undefined
  /** Whether the request carries X-Forwarded-For, Forwarded or X-Real-IP. */
  forwarded: boolean
}

/** Whether this request may read the mailbox. */
export function mailboxAccess(s: MailboxSetting, req: MailboxRequest): MailboxDecision {
  const setting = mailboxSetting(s)
  if (!setting.on) return setting
  if (!isLoopbackAddress(req.remoteAddress)) return { on: false, reason: 'remote_client' }
  if (req.forwarded) return { on: false, reason: 'forwarded_request' }
  return { on: true }
}

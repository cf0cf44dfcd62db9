/**
 * The one logger: structured JSON lines (pino) for operators and log shippers, or readable
 * lines in development. Requests are logged by `requestLog`; nothing logs bodies, headers,
 * tokens, passwords or tracking links.
 */
import { pino, type Logger } from 'pino'
import pretty from 'pino-pretty'

export type { Logger }

export type LogFormat = 'json' | 'pretty'

export interface LoggerOptions {
  level?: string
  format?: LogFormat
  /** Where lines go (default stdout); tests pass a stream they read back. */
  destination?: NodeJS.WritableStream
}

export function createLogger(opts: LoggerOptions = {}): Logger {
  const base = { level: opts.level ?? 'info', base: { service: 'quietband' } }
  if (opts.format === 'pretty') {
    // synchronous pretty-printing in this thread (no worker to lose lines at exit); one line a
    // request: the message already says method, path, status and duration
    return pino(base, pretty({ sync: true, colorize: process.stdout.isTTY, singleLine: true, ignore: 'pid,hostname,service,req,res,durationMs', destination: opts.destination ?? 1 }))
  }
  return opts.destination ? pino(base, opts.destination) : pino(base)
}

/** A logger that writes nothing, for tests and tools that do not ask for one. */
export const silentLogger: Logger = pino({ level: 'silent' })

/**
 * The process's logger for work outside a request (job queue, connection pools, the mail
 * worker). JSON at `LOG_LEVEL` until the server's start sets the configured one.
 */
let processLogger: Logger = pino({ level: process.env.LOG_LEVEL ?? 'info', base: { service: 'quietband' } })

export function setProcessLogger(logger: Logger): void {
  processLogger = logger
}

export function log(): Logger {
  return processLogger
}

/** The development mailbox: one expandable row per message. */
import { format, parseISO } from 'date-fns'
import type { MailboxMessage } from '../api/get-mailbox'
import { splitLinks } from '../lib/split-links'

export function MessageList({ messages }: { messages: MailboxMessage[] }) {
  if (messages.length === 0) return <p className="text-ink-muted">No messages yet. Anything the server sends will show up here.</p>
  return (
    <ul className="flex flex-col gap-2" aria-label="Messages">
      {messages.map((m) => (
        <li key={m.id} className="rounded-panel border border-rule bg-surface">
          <details className="group">
            <summary className="flex min-h-11 cursor-pointer list-none flex-wrap items-baseline gap-x-4 gap-y-1 px-4 py-3 [&::-webkit-details-marker]:hidden">
              <svg aria-hidden="true" width="12" height="12" viewBox="0 0 12 12" className="shrink-0 self-center text-ink-muted transition-transform group-open:rotate-90">
                <path d="M4 2l4 4-4 4" fill="none" stroke="currentColor" strokeWidth="2" strokeLinecap="round" strokeLinejoin="round" />
              </svg>
              <span className="font-semibold">{m.subject || '(no subject)'}</span>
              <span className="text-sm text-ink-muted">to {m.to.join(', ')}</span>
              <time dateTime={m.date} className="ml-auto font-mono text-sm text-ink-muted">
                {formatDate(m.date)}
              </time>
            </summary>
            <div className="border-t border-rule px-4 py-3">
              <p className="mb-2 text-sm text-ink-muted">From {m.from}</p>
              <pre className="whitespace-pre-wrap break-words font-mono text-sm">
                {splitLinks(m.text).map((piece, i) =>
                  piece.kind === 'link' ? (
                    <a key={i} href={piece.href}>
                      {piece.href}
                    </a>
                  ) : (
                    piece.text
                  ),
                )}
              </pre>
            </div>
          </details>
        </li>
      ))}
    </ul>
  )
}

function formatDate(iso: string): string {
  const date = parseISO(iso)
  return Number.isNaN(date.getTime()) ? iso : format(date, 'd MMM yyyy, HH:mm:ss')
}

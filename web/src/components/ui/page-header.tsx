/** Page title block. Also sets the document title (React 19 hoists <title> into <head>). */
import type { ReactNode } from 'react'

export function PageHeader({ title, lead, kicker }: { title: string; lead?: ReactNode; kicker?: string }) {
  return (
    <header className="mb-6 flex flex-col gap-2">
      <title>{`${title} · Quietband`}</title>
      {kicker && <p className="font-mono text-sm uppercase tracking-wide text-ink-muted">{kicker}</p>}
      <h1 className="text-3xl font-bold leading-tight text-ink">{title}</h1>
      {lead && <div className="max-w-prose text-lg text-ink-muted">{lead}</div>}
    </header>
  )
}

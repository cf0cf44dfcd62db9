/** Parts every result shows: its warnings (never hidden), the method of every step and the library version. */
import type { MethodRef } from '@shared/radio'
import { Notice } from '@/components/ui/notice'

export function ResultWarnings({ warnings }: { warnings: string[] }) {
  if (warnings.length === 0) return <p className="text-sm text-ink-muted">No warnings from the library for these inputs.</p>
  return (
    <Notice tone="caution" title={warnings.length === 1 ? 'Read this warning with the result' : `Read these ${warnings.length} warnings with the result`}>
      <ul aria-label="Warnings" className="list-disc pl-5">
        {warnings.map((w) => (
          <li key={w}>{w}</li>
        ))}
      </ul>
    </Notice>
  )
}

export function MethodsList({ methods, libraryVersion }: { methods: MethodRef[]; libraryVersion: string }) {
  return (
    <details className="rounded-control border border-rule px-4 py-2 text-sm">
      <summary className="min-h-11 cursor-pointer py-2 font-semibold">Methods and sources (radio library {libraryVersion})</summary>
      <ol className="flex list-decimal flex-col gap-2 pb-2 pl-5">
        {methods.map((m) => (
          <li key={m.id} className="break-words">
            <span className="font-mono">{m.id}</span>: {m.source}
          </li>
        ))}
      </ol>
    </details>
  )
}

/** A labelled figure in a definition list; wraps on phones. */
export function Figure({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="flex min-w-0 flex-col">
      <dt className="text-sm text-ink-muted">{label}</dt>
      <dd className="font-mono text-lg break-words">{children}</dd>
    </div>
  )
}

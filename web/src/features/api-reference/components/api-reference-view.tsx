/**
 * The reference read from a loaded document: the introduction, a filter, the contents (the
 * document's tags, each with its count), then each tag's operations. The filter narrows the
 * operations as one types; the count of what is shown is announced.
 */
import { useDeferredValue, useEffect, useMemo, useState } from 'react'
import { useLocation } from 'react-router-dom'
import { TextField } from '@/components/ui/text-field'
import { filterOperations, groupByTag, listOperations, type TagGroup } from '../lib/openapi'
import { ApiIntro } from './api-intro'
import { OperationCard } from './operation-card'
import { InlineText } from './inline-text'

const CONTENTS_ID = 'api-contents'

/** The id a `#…` in the address names ('' for none, or one that cannot be decoded). */
function anchorOf(hash: string): string {
  try {
    return decodeURIComponent(hash.slice(1))
  } catch {
    return ''
  }
}

export function ApiReferenceView({ document }: { document: unknown }) {
  const operations = useMemo(() => listOperations(document), [document])
  const [query, setQuery] = useState('')
  const deferredQuery = useDeferredValue(query)
  const groups = useMemo(() => groupByTag(document, filterOperations(operations, deferredQuery)), [document, operations, deferredQuery])
  const shown = groups.reduce((n, g) => n + g.operations.length, 0)
  // a link to one operation (#op-…) opens it
  const openId = anchorOf(useLocation().hash)
  // the operations arrive after the browser looked for the anchor: go to it once they are there
  useEffect(() => {
    if (openId) window.document.getElementById(openId)?.scrollIntoView?.()
  }, [openId])

  return (
    <div className="flex min-w-0 flex-col gap-8">
      <ApiIntro document={document} />

      <section aria-labelledby={`${CONTENTS_ID}-heading`} id={CONTENTS_ID} className="flex min-w-0 scroll-mt-4 flex-col gap-4">
        <h2 id={`${CONTENTS_ID}-heading`} className="text-xl font-bold">
          Operations by group
        </h2>
        <div role="search" className="max-w-xl">
          <TextField
            label="Filter operations"
            name="api-filter"
            type="search"
            hint="Words from the address, the summary, the method or the group, in any order — e.g. “cases triage” or “post evidence”."
            value={query}
            onChange={(event) => setQuery(event.target.value)}
            autoComplete="off"
          />
        </div>
        <p role="status" className="text-ink-muted">
          {operations.length === 0
            ? 'The document lists no operations.'
            : shown === operations.length
              ? `${operations.length} operations in ${groups.length} groups.`
              : shown === 0
                ? `No operation matches “${deferredQuery.trim()}”.`
                : `${shown} of ${operations.length} operations match.`}
        </p>
        {groups.length > 0 && (
          <nav aria-label="Groups of operations">
            <ul className="flex flex-wrap gap-2">
              {groups.map((group) => (
                <li key={group.id}>
                  <a
                    href={`#${group.id}`}
                    aria-label={`${group.name}, ${group.operations.length} ${group.operations.length === 1 ? 'operation' : 'operations'}`}
                    className="inline-flex min-h-11 items-center gap-1.5 rounded-control border border-field bg-surface px-3 no-underline hover:bg-signal-soft"
                  >
                    <span className="underline underline-offset-4">{group.name}</span>
                    <span className="font-mono text-sm text-ink-muted">{group.operations.length}</span>
                  </a>
                </li>
              ))}
            </ul>
          </nav>
        )}
      </section>

      {groups.map((group) => (
        <TagSection key={group.id} group={group} document={document} openId={openId} />
      ))}
    </div>
  )
}

function TagSection({ group, document, openId }: { group: TagGroup; document: unknown; openId: string }) {
  return (
    <section id={group.id} aria-labelledby={`${group.id}-heading`} className="flex min-w-0 scroll-mt-4 flex-col gap-4">
      <div className="flex flex-col gap-1 border-b-2 border-ink pb-2">
        <h2 id={`${group.id}-heading`} className="text-2xl font-bold">
          {group.name}
        </h2>
        {group.description && (
          <p className="whitespace-pre-line text-ink-muted">
            <InlineText text={group.description} />
          </p>
        )}
      </div>
      {group.operations.map((operation) => (
        <OperationCard key={operation.id} operation={operation} document={document} initiallyOpen={operation.id === openId} />
      ))}
      <p className="text-sm">
        <a href={`#${CONTENTS_ID}`}>Back to the groups</a>
      </p>
    </section>
  )
}

/**
 * One operation: its method and address, what it does, who may call it, and — folded until the
 * reader opens it — its parameters, request body and answers. The fold's content is built when
 * first opened, so a long document's page stays quick.
 */
import { memo, useState } from 'react'
import { TableFrame } from '@/components/ui/table'
import { useTableWidth } from '@/lib/use-media-query'
import { callersInWords, errorBodyRef, isObject, refName, statusWords, type ApiMedia, type ApiOperationEntry, type ApiParameter } from '../lib/openapi'
import { schemaTree, typeInWords } from '../lib/schema-tree'
import { ERRORS_ID } from './api-intro'
import { SchemaView } from './schema-view'
import { InlineText } from './inline-text'

/** Memoised: typing in the filter re-renders the list, not each operation's open tree. */
export const OperationCard = memo(function OperationCard({
  operation,
  document,
  initiallyOpen = false,
}: {
  operation: ApiOperationEntry
  document: unknown
  initiallyOpen?: boolean
}) {
  const [opened, setOpened] = useState(initiallyOpen)
  const titleId = `${operation.id}-title`
  const callers = callersInWords(operation.callers)
  return (
    <article id={operation.id} aria-labelledby={titleId} className="flex min-w-0 scroll-mt-4 flex-col gap-2 rounded-panel border border-rule bg-surface p-4 sm:p-5">
      <h3 id={titleId} className="flex min-w-0 flex-wrap items-baseline gap-x-3 gap-y-1 text-lg leading-snug">
        <span className="rounded-control border-2 border-ink px-1.5 font-mono text-sm font-semibold">{operation.method}</span>{' '}
        <code className="min-w-0 font-semibold [overflow-wrap:anywhere]">{operation.path}</code>
      </h3>
      <p>
        {operation.summary}
        {operation.deprecated && <span className="font-semibold"> (deprecated: kept for now, do not build on it)</span>}
      </p>
      {operation.description && (
        <p className="whitespace-pre-line text-ink-muted">
          <InlineText text={operation.description} />
        </p>
      )}
      <dl className="grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[max-content_1fr]">
        <dt className="font-semibold">Who may call it</dt>
        <dd>{callers ? callers.join(', ') : 'Not stated in the document'}</dd>
        <dt className="font-semibold">Sign-in</dt>
        <dd>{operation.signIn ? 'Needs the session cookie' : 'Not needed'}</dd>
      </dl>
      <details
        open={initiallyOpen || undefined}
        onToggle={(event) => {
          if (event.currentTarget.open) setOpened(true)
        }}
      >
        <summary className="cursor-pointer py-2.5 font-semibold text-signal">
          Parameters, body and answers<span className="sr-only"> of {operation.method} {operation.path}</span>
        </summary>
        {opened && <OperationDetails operation={operation} document={document} />}
      </details>
    </article>
  )
})

function OperationDetails({ operation, document }: { operation: ApiOperationEntry; document: unknown }) {
  const { requestBody } = operation
  const errorRef = errorBodyRef(operation)
  const name = `${operation.method} ${operation.path}`
  return (
    <div className="mt-2 flex min-w-0 flex-col gap-5 border-t border-rule pt-4">
      <section className="flex min-w-0 flex-col gap-2">
        <h4 className="font-bold">Parameters</h4>
        {operation.parameters.length ? <Parameters parameters={operation.parameters} caption={`Parameters of ${name}`} document={document} /> : <p className="text-ink-muted">None.</p>}
      </section>
      {requestBody && (
        <section className="flex min-w-0 flex-col gap-2">
          <h4 className="font-bold">Request body ({requestBody.required ? 'required' : 'optional'})</h4>
          {requestBody.description && (
            <p className="whitespace-pre-line">
              <InlineText text={requestBody.description} />
            </p>
          )}
          {requestBody.media.map((media) => (
            <Media key={media.contentType} media={media} document={document} />
          ))}
        </section>
      )}
      <section className="flex min-w-0 flex-col gap-2">
        <h4 className="font-bold">Answers</h4>
        {operation.responses.length === 0 && <p className="text-ink-muted">The document lists none.</p>}
        <ul className="flex min-w-0 flex-col gap-4">
          {operation.responses.map((response) => (
            <li key={response.status} className="flex min-w-0 flex-col gap-2">
              <StatusLine status={response.status} description={response.description} />
              {response.media.length === 0 ? (
                <p className="text-sm text-ink-muted">No body.</p>
              ) : (
                response.media.map((media) =>
                  errorRef && isObject(media.schema) && media.schema.$ref === errorRef ? (
                    <p key={media.contentType} className="text-sm">
                      The error body, <code>{refName(errorRef)}</code> (<a href={`#${ERRORS_ID}`}>its fields</a>).
                    </p>
                  ) : (
                    <Media key={media.contentType} media={media} document={document} />
                  ),
                )
              )}
            </li>
          ))}
        </ul>
      </section>
    </div>
  )
}

function StatusLine({ status, description }: { status: string; description?: string }) {
  const words = statusWords(status)
  // the document's words, unless they only repeat the status's
  const said = description && description.toLowerCase() !== words?.toLowerCase() ? description : undefined
  return (
    <p>
      {status !== 'default' && <code className="font-semibold">{status}</code>} {words && <span className="font-semibold">{words}</span>}
      {said && <> — {said}</>}
    </p>
  )
}

function Media({ media, document }: { media: ApiMedia; document: unknown }) {
  return (
    <div className="flex min-w-0 flex-col gap-2 rounded-control border border-rule p-3">
      <p className="text-sm">
        <span className="text-ink-muted">As </span>
        <code className="[overflow-wrap:anywhere]">{media.contentType}</code>
      </p>
      {media.schema === undefined ? <p className="text-sm text-ink-muted">No schema given.</p> : <SchemaView schema={media.schema} document={document} />}
    </div>
  )
}

/** A parameter's type in words, with its allowed values and limits. */
function parameterType(parameter: ApiParameter, document: unknown) {
  const node = schemaTree(parameter.schema, document)
  return {
    type: `${typeInWords(node)}${node.format && node.kind !== 'array' ? ` (${node.format})` : ''}${node.nullable ? ' or null' : ''}`,
    notes: [
      ...(node.enumValues?.length ? [`one of ${node.enumValues.join(', ')}`] : []),
      ...(node.items?.enumValues?.length ? [`each one of ${node.items.enumValues.join(', ')}`] : []),
      ...node.constraints,
    ],
  }
}

/** A table from 640 px up, a list of small cards below. */
function Parameters({ parameters, caption, document }: { parameters: ApiParameter[]; caption: string; document: unknown }) {
  const wide = useTableWidth()
  const rows = parameters.map((p) => ({ p, ...parameterType(p, document) }))
  if (!wide) {
    return (
      <ul aria-label={caption} className="flex flex-col gap-2">
        {rows.map(({ p, type, notes }) => (
          <li key={`${p.in}:${p.name}`} className="rounded-control border border-rule p-3 text-sm">
            <p className="flex flex-wrap gap-x-2">
              <code className="font-semibold [overflow-wrap:anywhere]">{p.name}</code>
              <span className="text-ink-muted">
                in {p.in}, {p.required ? 'required' : 'optional'}
              </span>
            </p>
            <p className="[overflow-wrap:anywhere]">
              <code>{type}</code>
              {notes.length > 0 && <span className="text-ink-muted"> · {notes.join(' · ')}</span>}
            </p>
            {(p.description || p.deprecated) && <p className="[overflow-wrap:anywhere]">{[p.description, p.deprecated && 'Deprecated.'].filter(Boolean).join(' ')}</p>}
          </li>
        ))}
      </ul>
    )
  }
  return (
    <TableFrame
      caption={caption}
      head={
        <tr>
          {['Name', 'In', 'Type', 'Required', 'Description'].map((h) => (
            <th key={h} scope="col" className="whitespace-nowrap px-3 py-2">
              {h}
            </th>
          ))}
        </tr>
      }
    >
      {rows.map(({ p, type, notes }) => (
        <tr key={`${p.in}:${p.name}`} className="border-t border-rule align-top text-sm">
          <td className="px-3 py-2">
            <code className="font-semibold [overflow-wrap:anywhere]">{p.name}</code>
          </td>
          <td className="px-3 py-2">{p.in}</td>
          <td className="px-3 py-2 [overflow-wrap:anywhere]">
            <code>{type}</code>
            {notes.length > 0 && <span className="block text-ink-muted">{notes.join(' · ')}</span>}
          </td>
          <td className="px-3 py-2">{p.required ? 'Yes' : 'No'}</td>
          <td className="px-3 py-2 [overflow-wrap:anywhere]">{[p.description, p.deprecated && 'Deprecated.'].filter(Boolean).join(' ')}</td>
        </tr>
      ))}
    </TableFrame>
  )
}

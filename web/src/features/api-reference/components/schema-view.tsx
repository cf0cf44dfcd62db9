/**
 * A body's or answer's schema as a tree: the top level's fields listed, each deeper object,
 * array item or set of choices folded in a <details> the reader opens (keyboard: the summary is
 * a control). Every mark is a word ("required", "can be null"), never a colour alone.
 */
import { useMemo, type ReactNode } from 'react'
import { hasInside, schemaTree, typeInWords, type SchemaNode } from '../lib/schema-tree'
import { InlineText } from './inline-text'

export function SchemaView({ schema, document }: { schema: unknown; document: unknown }) {
  const root = useMemo(() => schemaTree(schema, document), [schema, document])
  return (
    <div className="flex min-w-0 flex-col gap-2">
      <p className="text-sm">
        <span className="text-ink-muted">Type </span>
        <code className="[overflow-wrap:anywhere]">{typeInWords(root)}</code>
        {root.nullable && <Mark>can be null</Mark>}
        {root.format && root.kind !== 'array' && <Format format={root.format} />}
      </p>
      <NodeWords node={root} />
      {hasInside(root) && <Inside node={root} />}
    </div>
  )
}

/** What a node holds: its fields, its item's fields, or its choices. */
function Inside({ node }: { node: SchemaNode }) {
  if (node.items) {
    return hasInside(node.items) ? (
      <div className="flex flex-col gap-1">
        <p className="text-sm text-ink-muted">Each item:</p>
        <Inside node={node.items} />
      </div>
    ) : null
  }
  return (
    <>
      {node.children.length > 0 && (
        <ul className="flex min-w-0 flex-col gap-1">
          {node.children.map((child, i) => (
            <NodeRow key={child.name ?? `${child.label}-${i}`} node={child} />
          ))}
        </ul>
      )}
      {node.variants.length > 0 && (
        <div className="flex min-w-0 flex-col gap-1">
          <p className="text-sm text-ink-muted">
            {node.kind === 'all of' ? 'All of these together:' : 'One of these:'}
            {node.discriminator && (
              <>
                {' '}
                told apart by <code>{node.discriminator}</code>
              </>
            )}
          </p>
          <ul className="flex min-w-0 flex-col gap-1">
            {node.variants.map((variant, i) => (
              <NodeRow key={`${variant.label}-${i}`} node={variant} unfolded />
            ))}
          </ul>
        </div>
      )}
    </>
  )
}

/** One property (or choice). `unfolded`: its inside shows at once (a choice, inside the fold that lists the choices). */
function NodeRow({ node, unfolded = false }: { node: SchemaNode; unfolded?: boolean }) {
  return (
    <li className="min-w-0 border-l-2 border-rule py-1 pl-3">
      <p className="flex flex-wrap items-baseline gap-x-2 gap-y-0.5">
        {node.name !== undefined ? (
          <code className="font-semibold [overflow-wrap:anywhere]">{node.name}</code>
        ) : (
          <span className="font-semibold">{node.label}</span>
        )}
        <code className="text-sm text-ink-muted [overflow-wrap:anywhere]">{typeInWords(node)}</code>
        {node.name !== undefined && (node.required ? <Mark strong>required</Mark> : <span className="text-sm text-ink-muted">optional</span>)}
        {node.nullable && <Mark>can be null</Mark>}
        {node.format && node.kind !== 'array' && <Format format={node.format} />}
        {node.deprecated && <Mark>deprecated</Mark>}
      </p>
      <NodeWords node={node} />
      {hasInside(node) && unfolded && (
        <div className="mt-1">
          <Inside node={node} />
        </div>
      )}
      {hasInside(node) && !unfolded && (
        <details className="mt-1">
          <summary className="cursor-pointer py-2 text-sm font-semibold text-signal">{insideSummary(node)}</summary>
          <div className="pl-1">
            <Inside node={node} />
          </div>
        </details>
      )}
    </li>
  )
}

/** The words of a fold, naming what opens (so each fold's control has its own name). */
function insideSummary(node: SchemaNode): string {
  const whose = node.refName ?? node.name ?? node.label ?? 'this value'
  if (node.items) {
    const item = node.items
    if (item.variants.length) return `Each item of ${node.name ?? whose}: ${item.variants.length} choices`
    return `Fields of each item of ${node.name ?? whose} (${item.children.length})`
  }
  if (node.variants.length) return `The ${node.variants.length} choices of ${whose}`
  if (node.kind === 'tuple') return `The places of ${whose} (${node.children.length})`
  return `Fields of ${whose} (${node.children.length})`
}

/** Description, fixed or allowed values, limits, and notes on references. */
function NodeWords({ node }: { node: SchemaNode }) {
  const item = node.items
  const lines: ReactNode[] = []
  if (node.description) lines.push(<span className="whitespace-pre-line"><InlineText text={node.description} /></span>)
  if (node.constValue !== undefined) lines.push(<>Always <code>{node.constValue}</code></>)
  if (node.enumValues?.length) lines.push(<Values intro="One of" values={node.enumValues} />)
  if (item?.enumValues?.length) lines.push(<Values intro="Each item one of" values={item.enumValues} />)
  if (node.constraints.length) lines.push(<span className="text-ink-muted">{node.constraints.join(' · ')}</span>)
  if (item?.constraints.length) lines.push(<span className="text-ink-muted">Each item: {item.constraints.join(' · ')}</span>)
  if (node.cycle) lines.push(<span className="text-ink-muted">Refers back to {node.refName}, shown above; not repeated here.</span>)
  if (node.missingRef) lines.push(<span className="text-ink-muted">The document names {node.refName} but does not describe it.</span>)
  if (lines.length === 0) return null
  return (
    <div className="flex flex-col gap-0.5 text-sm">
      {lines.map((line, i) => (
        <p key={i} className="[overflow-wrap:anywhere]">
          {line}
        </p>
      ))}
    </div>
  )
}

function Values({ intro, values }: { intro: string; values: string[] }) {
  return (
    <>
      {intro}:{' '}
      {values.map((value, i) => (
        <span key={value}>
          {i > 0 && ', '}
          <code className="rounded-control bg-paper px-1">{value}</code>
        </span>
      ))}
    </>
  )
}

function Mark({ children, strong = false }: { children: ReactNode; strong?: boolean }) {
  return (
    <span className={`rounded-control border px-1.5 text-xs font-semibold ${strong ? 'border-ink text-ink' : 'border-field text-ink-muted'}`}>{children}</span>
  )
}

function Format({ format }: { format: string }) {
  return (
    <span className="text-sm text-ink-muted">
      format <code>{format}</code>
    </span>
  )
}

/** One panel per office whose response targets the viewer may change (the server's abilities say which). */
import type { Office } from '../api/get-offices'
import { ResponseTargetsForm } from './response-targets-form'

export function OfficeTargetsPanels({ offices }: { offices: Office[] }) {
  const editable = offices.filter((o) => o.abilities.setResponseTargets)
  if (editable.length === 0) return null
  return (
    <>
      {editable.map((office) => (
        <section key={office.id} aria-labelledby={`targets-${office.id}`} className="rounded-panel border border-rule bg-surface p-5">
          <h2 id={`targets-${office.id}`} className="mb-1 text-lg font-bold">
            Response targets — {office.name}
          </h2>
          <p className="mb-4 text-sm text-ink-muted">Hours from a report's arrival to its response, per priority. Open cases past their target are flagged overdue.</p>
          <ResponseTargetsForm office={office} />
        </section>
      ))}
    </>
  )
}

/** One panel per office whose targets and time zone the viewer may change (the server's abilities say which). */
import type { Office } from '../api/get-offices'
import { ResponseTargetsForm } from './response-targets-form'
import { TimeZoneForm } from './time-zone-form'

export function OfficeTargetsPanels({ offices }: { offices: Office[] }) {
  const editable = offices.filter((o) => o.abilities.setResponseTargets)
  if (editable.length === 0) return null
  return (
    <>
      {editable.map((office) => (
        <section key={office.id} aria-labelledby={`targets-${office.id}`} className="rounded-panel border border-rule bg-surface p-5">
          <h2 id={`targets-${office.id}`} className="mb-1 text-lg font-bold">
            Targets and time zone — {office.name}
          </h2>
          <p className="mb-4 text-sm text-ink-muted">
            Hours from a report’s arrival, per harm class. <strong>First response</strong>: the priority set at triage or a first message to the complainant, whichever comes first.{' '}
            <strong>Resolution</strong>: closing the case. A case past a target is flagged overdue on it. The office’s day (“today” on the dashboard) follows its time zone, {office.timeZone}.
          </p>
          <div className="flex flex-col gap-6">
            <ResponseTargetsForm office={office} clock="firstResponse" />
            <ResponseTargetsForm office={office} clock="resolution" />
            <TimeZoneForm office={office} />
          </div>
        </section>
      ))}
    </>
  )
}

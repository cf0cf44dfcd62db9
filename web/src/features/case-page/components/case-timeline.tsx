/**
 * Everything that happened to the case, oldest first. Each entry carries a lane tag —
 * "Internal", "Sent to complainant" or "From complainant" — as a word, a drawn sign and a
 * border style, so who could read it is never in doubt.
 */
import { format, parseISO } from 'date-fns'
import type { TimelineEvent } from '../api/get-case'
import { LANE_LABELS, eventTitle, laneOf, type TimelineLane } from '../lib/timeline'

const LANE_STYLE: Record<TimelineLane, string> = {
  internal: 'border-l-4 border-dashed border-field bg-surface',
  to_complainant: 'border-l-4 border-signal bg-signal-soft',
  from_complainant: 'border-r-4 border-ok bg-ok-soft',
}

export function CaseTimeline({ events }: { events: TimelineEvent[] }) {
  return (
    <section aria-labelledby="timeline-heading" className="flex flex-col gap-3">
      <h2 id="timeline-heading" className="text-xl font-bold">
        Timeline
      </h2>
      <ol className="flex flex-col gap-2">
        {events.map((e) => {
          const lane = laneOf(e)
          const title = eventTitle(e)
          // Some moves store a body that only repeats the title ("Assigned to …").
          const body = e.body && e.body.replace(/\.$/, '') !== title ? e.body : null
          return (
            <li key={e.id} className={`rounded-control px-4 py-3 ${LANE_STYLE[lane]}`}>
              <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
                <LaneTag lane={lane} />
                <h3 className="font-semibold">{title}</h3>
                <span className="text-sm text-ink-muted">
                  {e.actor} · <time dateTime={e.at} className="font-mono">{format(parseISO(e.at), 'd MMM yyyy, HH:mm')}</time>
                </span>
              </div>
              {/* a long token (a SHA-256, a link) wraps rather than widening the page */}
              {body && <p className="mt-1 whitespace-pre-wrap [overflow-wrap:anywhere]">{body}</p>}
            </li>
          )
        })}
      </ol>
    </section>
  )
}

function LaneTag({ lane }: { lane: TimelineLane }) {
  return (
    <span className="inline-flex items-center gap-1 rounded-sm border border-field bg-surface px-1.5 py-0.5 text-xs font-bold uppercase tracking-wide text-ink">
      <svg aria-hidden="true" width="12" height="12" viewBox="0 0 12 12">
        {lane === 'internal' && <path d="M3 5.5V4a3 3 0 0 1 6 0v1.5M2 5.5h8V11H2Z" fill="none" stroke="currentColor" strokeWidth="1.6" />}
        {lane === 'to_complainant' && <path d="M1 6h8M6 2.5 9.5 6 6 9.5" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />}
        {lane === 'from_complainant' && <path d="M11 6H3M6 2.5 2.5 6 6 9.5" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />}
      </svg>
      {LANE_LABELS[lane]}
    </span>
  )
}

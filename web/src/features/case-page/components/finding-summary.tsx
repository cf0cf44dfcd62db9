/** The investigator's latest proposed finding, with the product's caution beside it. */
import { format, parseISO } from 'date-fns'
import { EstimateCaution } from '@/components/cautions/estimate-caution'
import type { TimelineEvent } from '../api/get-case'

export function FindingSummary({ events, underReview }: { events: TimelineEvent[]; underReview: boolean }) {
  const finding = [...events].reverse().find((e) => e.kind === 'proposeFinding')
  if (!finding) return null
  return (
    <section aria-labelledby="finding-heading" className={`flex flex-col gap-3 rounded-panel border bg-surface p-5 ${underReview ? 'border-2 border-signal' : 'border-rule'}`}>
      <h2 id="finding-heading" className="text-xl font-bold">
        {underReview ? 'Finding awaiting review' : 'Latest proposed finding'}
      </h2>
      <p className="text-sm text-ink-muted">
        Proposed by {finding.actor} on <time dateTime={finding.at}>{format(parseISO(finding.at), 'd MMM yyyy, HH:mm')}</time>
      </p>
      <p className="whitespace-pre-wrap">{finding.body}</p>
      <EstimateCaution />
    </section>
  )
}

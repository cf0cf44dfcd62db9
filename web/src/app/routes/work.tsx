/** /work — staff start page: "Office queue" for whoever runs the office's queue, else "My cases". */
import { Link } from 'react-router-dom'
import { PageHeader } from '@/components/ui/page-header'
import { PRIORITIES, PRIORITY_LABELS } from '@shared/domain/services'
import { PriorityBadge } from '@/components/ui/priority-badge'
import { useAbilities, useMe } from '@/features/auth/api/get-me'
import { paths } from '@/lib/paths'
import { useNow } from '@/lib/use-now'
import { AWAITING_REVIEW, MY_OPEN_CASES, NEW_REPORTS } from '@/features/office-queue/api/get-queue'
import { QueueSection } from '@/features/office-queue/components/queue-section'
import { useOffices } from '@/features/offices/api/get-offices'
import { OfficeTargetsPanels } from '@/features/offices/components/office-targets-panels'

export function Component() {
  const user = useMe().data
  const now = useNow()
  const supervisor = useAbilities().data?.runOfficeQueue === true
  const offices = useOffices()
  return (
    <div className="flex flex-col gap-8">
      <PageHeader
        kicker={user?.officeName ?? undefined}
        title={supervisor ? 'Office queue' : 'My cases'}
        lead={
          <p>
            {supervisor
              ? 'New reports waiting for a priority and an investigator, most urgent first, and findings waiting for your review.'
              : 'Open cases assigned to you, the earliest due first.'}
          </p>
        }
      />
      {supervisor ? (
        <>
          <QueueSection
            id="queue-new"
            title="New reports"
            list={NEW_REPORTS}
            now={now}
            empty="No new report is waiting. Every report of the office has a priority and an investigator."
          />
          <QueueSection id="queue-review" title="Findings awaiting your review" list={AWAITING_REVIEW} now={now} showInvestigator empty="No finding is waiting for review." />
          <p>
            <Link to={paths.cases.href({ open: true })}>The office's open work in the case list</Link>
          </p>
          {offices.data && <OfficeTargetsPanels offices={offices.data.offices} />}
        </>
      ) : (
        <QueueSection
          id="my-cases"
          title="Assigned to you"
          list={MY_OPEN_CASES}
          now={now}
          empty="No open case is assigned to you."
          footer={
            <p>
              <Link to={paths.cases.href({ investigatorId: 'me', open: true })}>Open as a full list</Link> (filter, sort, download)
            </p>
          }
        />
      )}
      <section aria-labelledby="priority-key" className="rounded-panel border border-rule bg-surface p-5">
        <h2 id="priority-key" className="mb-3 text-lg font-bold">
          Priority key
        </h2>
        <ul className="flex flex-col gap-3">
          {PRIORITIES.map((level) => (
            <li key={level} className="flex flex-wrap items-center gap-3">
              <PriorityBadge level={level} />
              <span className="text-ink-muted">{PRIORITY_LABELS[level].long}</span>
            </li>
          ))}
        </ul>
      </section>
    </div>
  )
}

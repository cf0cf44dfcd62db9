/** /work — staff start page: "Office queue" for whoever runs the office's queue, else "My cases". */
import { Link } from 'react-router-dom'
import { PageHeader } from '@/components/ui/page-header'
import { PRIORITIES, PRIORITY_LABELS } from '@shared/domain/services'
import { PriorityBadge } from '@/components/ui/priority-badge'
import { useAbilities, useMe } from '@/features/auth/api/get-me'
import { paths } from '@/lib/paths'
import { useNow } from '@/lib/use-now'
import { AWAITING_REVIEW, IN_PROGRESS, MY_OPEN_CASES, NEW_REPORTS, OVERDUE, WAITING_FOR_INVESTIGATOR } from '@/features/office-queue/api/get-queue'
import { QueueSection } from '@/features/office-queue/components/queue-section'
import { DueFollowUpsSection } from '@/features/follow-ups/components/due-follow-ups-section'

export function Component() {
  const user = useMe().data
  const now = useNow()
  const supervisor = useAbilities().data?.runOfficeQueue === true
  return (
    <div className="flex flex-col gap-8">
      <PageHeader
        kicker={user?.officeName ?? undefined}
        title={supervisor ? 'Office queue' : 'My cases'}
        lead={
          <p>
            {supervisor
              ? 'The office’s work in the order it goes: new reports to triage, cases waiting for an investigator, work in progress, findings to review, and whatever is overdue.'
              : 'Open cases assigned to you, the earliest due first.'}
          </p>
        }
      />
      <DueFollowUpsSection showInvestigator={supervisor} />
      {supervisor ? (
        <>
          <QueueSection id="queue-new" title="New reports" list={NEW_REPORTS} now={now} empty="No new report is waiting for triage." />
          <QueueSection id="queue-waiting" title="Waiting for an investigator" list={WAITING_FOR_INVESTIGATOR} now={now} empty="Every triaged case has an investigator." />
          <QueueSection id="queue-progress" title="In progress" list={IN_PROGRESS} now={now} showInvestigator empty="No case is being worked." />
          <QueueSection id="queue-review" title="Findings to review" list={AWAITING_REVIEW} now={now} showInvestigator empty="No finding is waiting for review." />
          <QueueSection id="queue-overdue" title="Overdue" list={OVERDUE} now={now} showInvestigator empty="Nothing is past its target." />
          <p>
            <Link to={paths.cases.href({ open: true })}>The office's open work in the case list</Link>
          </p>
          <p>
            <Link to={paths.dashboard.href()}>The office at a glance</Link> (figures, workload, performance) · <Link to={paths.officeSettings.href()}>Office settings</Link> (targets)
          </p>
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
          Harm classes
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

/** /work — staff start page: "My cases" for an investigator, "Office queue" for a supervisor. */
import { Link } from 'react-router-dom'
import { ComingSoon } from '../../components/ui/coming-soon'
import { EstimateCaution } from '../../components/cautions/estimate-caution'
import { PageHeader } from '../../components/ui/page-header'
import { PRIORITY_TEXT, PriorityBadge, type PriorityLevel } from '../../components/ui/priority-badge'
import { useMe } from '../../features/auth/api/get-me'

const LEVELS: PriorityLevel[] = [1, 2, 3, 4]

export function Component() {
  const user = useMe().data
  const supervisor = user?.role === 'supervisor'
  return (
    <div className="flex flex-col gap-6">
      <PageHeader
        kicker={user?.officeName ?? undefined}
        title={supervisor ? 'Office queue' : 'My cases'}
        lead={
          <p>
            {supervisor
              ? 'New reports for your office, waiting for a priority and an investigator, and findings waiting for your review.'
              : 'Cases assigned to you, most urgent first, with what each one needs next.'}
          </p>
        }
      />
      <ComingSoon arrivesWith="the case workflow">
        <p>{supervisor ? 'The office queue' : 'Your case list'} is not built yet. Nothing is missing from your office: no cases are handled in Quietband yet.</p>
        {supervisor && (
          <p>
            Meanwhile, <Link to="/cases">Cases</Link> will hold the office's full case list.
          </p>
        )}
      </ComingSoon>
      <section aria-labelledby="priority-key" className="rounded-panel border border-rule bg-surface p-5">
        <h2 id="priority-key" className="mb-3 text-lg font-bold">
          Priority key
        </h2>
        <ul className="flex flex-col gap-3">
          {LEVELS.map((level) => (
            <li key={level} className="flex flex-wrap items-center gap-3">
              <PriorityBadge level={level} />
              <span className="text-ink-muted">{PRIORITY_TEXT[level].long}</span>
            </li>
          ))}
        </ul>
      </section>
      <EstimateCaution />
    </div>
  )
}

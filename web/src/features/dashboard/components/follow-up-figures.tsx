/**
 * Follow-ups due today and overdue (compliance deadlines of approved findings), from the
 * follow-ups module: kept apart from the case figures, since the case list has no filter for
 * them; the office queue lists them one by one.
 */
import { Link } from 'react-router-dom'
import { paths } from '@/lib/paths'
import type { DashboardView } from '../api/get-dashboard'

export function FollowUpFigures({ view, queueLink }: { view: DashboardView; queueLink: boolean }) {
  const { due, overdue } = view.followUps
  return (
    <section aria-labelledby="dash-follow-ups" className="flex flex-col gap-2 rounded-panel border border-rule bg-surface p-4">
      <h2 id="dash-follow-ups" className="text-lg font-bold">
        Follow-ups
      </h2>
      <p>
        <span className={`font-mono text-xl font-bold ${overdue > 0 ? 'text-priority-1' : ''}`}>{overdue}</span> overdue ·{' '}
        <span className="font-mono text-xl font-bold">{due}</span> due today
        {queueLink && (
          <>
            {' '}
            — listed in the <Link to={paths.work.href()}>office queue</Link>
          </>
        )}
      </p>
    </section>
  )
}

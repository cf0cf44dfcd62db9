/** The four figures of the office's clocks, each a link to the cases behind it. */
import { Link } from 'react-router-dom'
import { DUE_SOON_HOURS } from '@shared/domain/case-clocks'
import { figureFilters } from '@shared/domain/dashboard-figures'
import { figureHref } from '@/lib/figure-links'
import type { DashboardView } from '../api/get-dashboard'

export function ClockFigures({ view }: { view: DashboardView }) {
  const o = view.officeId
  const zones = [...new Set(view.offices.map((x) => x.timeZone))]
  const tiles = [
    { label: 'Overdue', hint: 'past the resolution target', value: view.clocks.overdue, href: figureHref(figureFilters.overdue(o)), alarm: view.clocks.overdue > 0 },
    { label: `Due in the next ${DUE_SOON_HOURS} hours`, hint: 'resolution target', value: view.clocks.dueSoon, href: figureHref(figureFilters.dueSoon(o)), alarm: false },
    { label: 'First response overdue', hint: 'no triage or message yet', value: view.clocks.firstResponseOverdue, href: figureHref(figureFilters.firstResponseOverdue(o)), alarm: view.clocks.firstResponseOverdue > 0 },
    { label: 'Received today', hint: zones.length === 1 ? `office time, ${zones[0]}` : 'each office’s own day', value: view.clocks.receivedToday, href: figureHref(figureFilters.receivedToday(o)), alarm: false },
  ]
  return (
    <section aria-labelledby="dash-clocks">
      <h2 id="dash-clocks" className="sr-only">
        Clocks
      </h2>
      <ul className="grid grid-cols-2 gap-3 lg:grid-cols-4">
        {tiles.map((t) => (
          <li key={t.label}>
            <Link
              to={t.href}
              className={`flex h-full flex-col gap-1 rounded-panel border bg-surface p-4 no-underline hover:border-ink ${t.alarm ? 'border-2 border-priority-1' : 'border-rule'}`}
            >
              <span className="font-mono text-3xl font-bold text-ink">{t.value.toLocaleString('en-GB')}</span>
              <span className="font-semibold text-ink">{t.label}</span>
              <span className="text-sm text-ink-muted">{t.hint}</span>
            </Link>
          </li>
        ))}
      </ul>
    </section>
  )
}

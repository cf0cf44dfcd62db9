/** Open cases by state (rows) and harm class (columns); every count links to its cases. */
import { Link } from 'react-router-dom'
import { CASE_STATE_LABELS, OPEN_STATES, type CaseState } from '@shared/domain/case-lifecycle'
import { figureFilters } from '@shared/domain/dashboard-figures'
import { PRIORITIES, PRIORITY_LABELS, type Priority } from '@shared/domain/services'
import { PriorityShape } from '@/components/ui/priority-badge'
import { TableFrame } from '@/components/ui/table'
import { figureHref } from '@/lib/figure-links'
import type { DashboardView } from '../api/get-dashboard'

function Count({ n, href, label }: { n: number; href: string; label: string }) {
  if (n === 0) return <span className="text-ink-muted">0</span>
  return (
    <Link to={href} aria-label={`${n} ${label}`} className="font-semibold">
      {n.toLocaleString('en-GB')}
    </Link>
  )
}

export function OpenWorkTable({ view }: { view: DashboardView }) {
  const o = view.officeId
  const n = (s?: CaseState, p?: Priority) => view.openByStatePriority.filter((c) => (!s || c.status === s) && (!p || c.priority === p)).reduce((sum, c) => sum + c.count, 0)
  const cell = 'px-3 py-2 text-right font-mono'
  return (
    <section aria-labelledby="dash-open" className="flex min-w-0 flex-col gap-3">
      <h2 id="dash-open" className="text-xl font-bold">
        Open cases by state and harm class
      </h2>
      {/* a phone: one line per state, its classes as shapes with their counts */}
      <ul aria-label="Open cases by state" className="flex flex-col divide-y divide-rule rounded-panel border border-rule bg-surface sm:hidden">
        {OPEN_STATES.map((s) => (
          <li key={s} className="flex flex-wrap items-center gap-x-3 gap-y-1 px-3 py-2">
            <span className="min-w-0 flex-1">{CASE_STATE_LABELS[s]}</span>
            {PRIORITIES.filter((p) => n(s, p) > 0).map((p) => (
              <span key={p} className="inline-flex items-center gap-1 font-mono">
                <PriorityShape level={p} sizePx={12} />
                <Count n={n(s, p)} href={figureHref(figureFilters.open(o, s, p))} label={`${CASE_STATE_LABELS[s].toLowerCase()}, ${PRIORITY_LABELS[p].short.toLowerCase()}`} />
              </span>
            ))}
            <span className="w-8 text-right font-mono">
              <Count n={n(s)} href={figureHref(figureFilters.open(o, s))} label={CASE_STATE_LABELS[s].toLowerCase()} />
            </span>
          </li>
        ))}
        <li className="flex items-center px-3 py-2 font-semibold">
          <span className="flex-1">All open</span>
          <span className="font-mono">
            <Count n={n()} href={figureHref(figureFilters.open(o))} label="open cases" />
          </span>
        </li>
      </ul>
      <div className="hidden sm:block">
        <TableFrame
          caption="Open cases by state and harm class"
          head={
            <tr>
              <th scope="col" className="px-3 py-2">
                State
              </th>
              {PRIORITIES.map((p) => (
                <th key={p} scope="col" className="px-3 py-2 text-right">
                  <span className="inline-flex items-center gap-1">
                    <PriorityShape level={p} sizePx={12} />
                    {PRIORITY_LABELS[p].short}
                  </span>
                </th>
              ))}
              <th scope="col" className="px-3 py-2 text-right">
                All
              </th>
            </tr>
          }
        >
          {OPEN_STATES.map((s) => (
            <tr key={s} className="border-b border-rule">
              <th scope="row" className="px-3 py-2 font-normal">
                {CASE_STATE_LABELS[s]}
              </th>
              {PRIORITIES.map((p) => (
                <td key={p} className={cell}>
                  <Count n={n(s, p)} href={figureHref(figureFilters.open(o, s, p))} label={`${CASE_STATE_LABELS[s].toLowerCase()}, ${PRIORITY_LABELS[p].short.toLowerCase()}`} />
                </td>
              ))}
              <td className={cell}>
                <Count n={n(s)} href={figureHref(figureFilters.open(o, s))} label={CASE_STATE_LABELS[s].toLowerCase()} />
              </td>
            </tr>
          ))}
          <tr className="border-t-2 border-ink">
            <th scope="row" className="px-3 py-2">
              All open
            </th>
            {PRIORITIES.map((p) => (
              <td key={p} className={cell}>
                <Count n={n(undefined, p)} href={figureHref(figureFilters.open(o, undefined, p))} label={`open, ${PRIORITY_LABELS[p].short.toLowerCase()}`} />
              </td>
            ))}
            <td className={cell}>
              <Count n={n()} href={figureHref(figureFilters.open(o))} label="open cases" />
            </td>
          </tr>
        </TableFrame>
      </div>
    </section>
  )
}

/**
 * Response performance over the last 30 or 90 days, per harm class: time to first response and
 * to closing (median and 90th percentile) against the targets, as charts and as a table whose
 * counts link to the cases each figure is computed from.
 */
import { useState } from 'react'
import { Link } from 'react-router-dom'
import { CASE_CLOCKS, CASE_CLOCK_NAMES, type CaseClockName } from '@shared/domain/case-clocks'
import { figureFilters } from '@shared/domain/dashboard-figures'
import { PRIORITIES, PRIORITY_LABELS, type Priority } from '@shared/domain/services'
import { DASHBOARD_WINDOWS_DAYS } from '@shared/schemas/dashboard'
import { PerformanceChart } from '@/components/charts'
import { TableFrame } from '@/components/ui/table'
import { figureHref } from '@/lib/figure-links'
import type { DashboardView } from '../api/get-dashboard'

const CLOCK_TITLES: Record<CaseClockName, { title: string; stopped: string }> = {
  firstResponse: { title: 'Time to first response', stopped: 'first answered' },
  resolution: { title: 'Time to closing', stopped: 'closed' },
}

const hoursText = (h: number | null) => (h === null ? '—' : h < 48 ? `${h.toFixed(1)} h` : `${(h / 24).toFixed(1)} days`)

export function PerformanceSection({ view }: { view: DashboardView }) {
  const [windowDays, setWindowDays] = useState<number>(DASHBOARD_WINDOWS_DAYS[0])
  const o = view.officeId
  const single = view.offices.length === 1 ? view.offices[0]! : null
  const target = (clock: CaseClockName, p: Priority) => (single ? (clock === 'firstResponse' ? single.firstResponseTargetsHours : single.resolutionTargetsHours)[`p${p}`] : null)
  const rows = (clock: CaseClockName) => PRIORITIES.map((p) => ({ p, r: view.performance.find((x) => x.clock === clock && x.windowDays === windowDays && x.priority === p)! }))
  return (
    <section aria-labelledby="dash-performance" className="flex min-w-0 flex-col gap-4">
      <div className="flex flex-wrap items-center gap-3">
        <h2 id="dash-performance" className="text-xl font-bold">
          Response performance
        </h2>
        <div role="group" aria-label="Period" className="flex gap-1">
          {DASHBOARD_WINDOWS_DAYS.map((d) => (
            <button
              key={d}
              type="button"
              aria-pressed={windowDays === d}
              onClick={() => setWindowDays(d)}
              className={`min-h-11 rounded-panel border px-3 font-semibold ${windowDays === d ? 'border-ink bg-ink text-surface' : 'border-rule bg-surface text-ink'}`}
            >
              Last {d} days
            </button>
          ))}
        </div>
      </div>
      {!single && <p className="text-sm text-ink-muted">Offices set their own targets: pick one office to see its targets on the charts.</p>}
      <div className="grid min-w-0 gap-6 lg:grid-cols-2">
        {CASE_CLOCK_NAMES.map((clock) => (
          <div key={clock} className="flex min-w-0 flex-col gap-3 rounded-panel border border-rule bg-surface p-3 sm:p-4">
            <PerformanceChart
              title={`${CLOCK_TITLES[clock].title}, last ${windowDays} days`}
              groups={rows(clock).map(({ p, r }) => ({ label: PRIORITY_LABELS[p].short, medianHours: r.medianHours, p90Hours: r.p90Hours, targetHours: target(clock, p) }))}
            />
            <TableFrame
              caption={`${CASE_CLOCKS[clock].label}: cases ${CLOCK_TITLES[clock].stopped} in the last ${windowDays} days`}
              head={
                <tr>
                  <th scope="col" className="px-2 py-2">
                    Class
                  </th>
                  <th scope="col" className="px-2 py-2 text-right">
                    Cases
                  </th>
                  <th scope="col" className="px-2 py-2 text-right">
                    Median
                  </th>
                  <th scope="col" className="px-2 py-2 text-right">
                    90th pct.
                  </th>
                  <th scope="col" className="px-2 py-2 text-right">
                    On target
                  </th>
                </tr>
              }
            >
              {rows(clock).map(({ p, r }) => (
                <tr key={p} className="border-b border-rule text-sm">
                  <th scope="row" className="px-2 py-2 font-normal">
                    {PRIORITY_LABELS[p].short}
                    {target(clock, p) !== null && <span className="block text-ink-muted">target {hoursText(target(clock, p))}</span>}
                  </th>
                  <td className="px-2 py-2 text-right font-mono whitespace-nowrap">
                    <Link to={figureHref(figureFilters.performance(o, clock, windowDays, p))} aria-label={`${r.count} cases ${CLOCK_TITLES[clock].stopped}, ${PRIORITY_LABELS[p].short.toLowerCase()}, last ${windowDays} days`}>
                      {r.count}
                    </Link>
                  </td>
                  <td className="px-2 py-2 text-right font-mono whitespace-nowrap">{hoursText(r.medianHours)}</td>
                  <td className="px-2 py-2 text-right font-mono whitespace-nowrap">{hoursText(r.p90Hours)}</td>
                  <td className="px-2 py-2 text-right font-mono whitespace-nowrap">{r.count ? `${Math.round((100 * r.metTarget) / r.count)} %` : '—'}</td>
                </tr>
              ))}
            </TableFrame>
          </div>
        ))}
      </div>
      <p className="text-sm text-ink-muted">
        Percentiles interpolate linearly between the nearest cases. First response: the priority set at triage or a first message to the complainant, whichever came first.
      </p>
    </section>
  )
}

/** Each investigator's open and overdue cases, and the open cases nobody has yet. */
import { Link } from 'react-router-dom'
import { figureFilters } from '@shared/domain/dashboard-figures'
import { TableFrame } from '@/components/ui/table'
import { figureHref } from '@/lib/figure-links'
import type { DashboardView } from '../api/get-dashboard'

export function WorkloadTable({ view }: { view: DashboardView }) {
  const o = view.officeId
  const showOffice = view.offices.length > 1
  const most = Math.max(1, ...view.workload.map((w) => w.open))
  const row = (key: string, name: string, office: string | null, open: number, overdue: number, id: string | 'none') => (
    <tr key={key} className="border-b border-rule">
      <th scope="row" className="px-3 py-2 font-normal">
        {name}
        {showOffice && office && <span className="block text-sm text-ink-muted">{office}</span>}
      </th>
      <td className="px-3 py-2 text-right font-mono">
        <Link to={figureHref(figureFilters.workload(o, id))} aria-label={`${open} open cases: ${name}`}>
          {open}
        </Link>
      </td>
      <td className="px-3 py-2 text-right font-mono">
        {overdue > 0 ? (
          <Link to={figureHref(figureFilters.workload(o, id, true))} aria-label={`${overdue} overdue: ${name}`} className="font-bold">
            {overdue}
          </Link>
        ) : (
          <span className="text-ink-muted">0</span>
        )}
      </td>
      <td className="hidden w-1/3 px-3 py-2 sm:table-cell" aria-hidden="true">
        <span className="block h-2 rounded-sm bg-ink" style={{ width: `${(open / most) * 100}%` }} />
      </td>
    </tr>
  )
  return (
    <section aria-labelledby="dash-workload" className="flex min-w-0 flex-col gap-3">
      <h2 id="dash-workload" className="text-xl font-bold">
        Workload
      </h2>
      <TableFrame
        caption="Open cases per investigator"
        head={
          <tr>
            <th scope="col" className="px-3 py-2">
              Investigator
            </th>
            <th scope="col" className="px-3 py-2 text-right">
              Open
            </th>
            <th scope="col" className="px-3 py-2 text-right">
              Overdue
            </th>
            <th scope="col" className="hidden px-3 py-2 sm:table-cell">
              <span className="sr-only">Share</span>
            </th>
          </tr>
        }
      >
        {view.workload.map((w) => row(w.investigatorId, w.name, w.officeName, w.open, w.overdue, w.investigatorId))}
        {row('none', 'No investigator yet', null, view.unassigned.open, view.unassigned.overdue, 'none')}
      </TableFrame>
    </section>
  )
}

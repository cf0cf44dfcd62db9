/** The open cases on the map with the offices' areas; the list beside it names each class's count. */
import { Link } from 'react-router-dom'
import { figureFilters } from '@shared/domain/dashboard-figures'
import { PRIORITIES, PRIORITY_LABELS } from '@shared/domain/services'
import { FieldMap } from '@/components/map'
import { PriorityShape } from '@/components/ui/priority-badge'
import { figureHref } from '@/lib/figure-links'
import type { DashboardView } from '../api/get-dashboard'

export function OpenCasesMap({ view }: { view: DashboardView }) {
  const o = view.officeId
  const byPriority = PRIORITIES.map((p) => ({ p, n: view.map.cases.filter((c) => c.priority === p).length }))
  return (
    <section aria-labelledby="dash-map" className="flex min-w-0 flex-col gap-3">
      <h2 id="dash-map" className="text-xl font-bold">
        Open cases on the map
      </h2>
      <ul className="flex flex-wrap gap-x-5 gap-y-2 text-sm">
        {byPriority.map(({ p, n }) => (
          <li key={p} className="flex items-center gap-1.5">
            <PriorityShape level={p} />
            <Link to={figureHref(figureFilters.open(o, undefined, p))}>
              {PRIORITY_LABELS[p].short}: {n}
            </Link>
          </li>
        ))}
      </ul>
      {view.map.truncated && <p className="text-sm">The map shows the {view.map.cases.length.toLocaleString('en-GB')} most urgent open cases.</p>}
      <FieldMap
        label={`Map of ${view.map.cases.length} open cases and the office areas`}
        offices={view.offices.map((x) => ({ name: x.name, at: { latDeg: x.centreLatDeg, lonDeg: x.centreLonDeg }, area: x.area }))}
        nearbyCases={view.map.cases.map((c) => ({ id: c.id, at: { latDeg: c.latDeg, lonDeg: c.lonDeg }, label: `${c.reference} · ${PRIORITY_LABELS[c.priority].short}${c.overdue ? ' · overdue' : ''}`, priority: c.priority }))}
        casesNoun={{ one: 'open case', many: 'open cases' }}
        heightPx={380}
      />
    </section>
  )
}

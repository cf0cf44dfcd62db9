/** Offices with their address, area, position and resolution targets (hours per harm class). */
import { PriorityShape } from '@/components/ui/priority-badge'
import { PRIORITIES, PRIORITY_LABELS, type Priority } from '@shared/domain/services'
import { TableFrame } from '@/components/ui/table'
import type { Office } from '../api/get-offices'

const SHAPE_COLOUR: Record<Priority, string> = { 1: 'text-priority-1', 2: 'text-priority-2', 3: 'text-priority-3', 4: 'text-priority-4' }

export function OfficesTable({ offices }: { offices: Office[] }) {
  if (offices.length === 0) return <p className="text-ink-muted">No offices yet.</p>
  const head = (
    <tr>
      <th scope="col" className="px-4 py-3">Office</th>
      <th scope="col" className="px-4 py-3">Area</th>
      <th scope="col" className="px-4 py-3">Position (lat, lon)</th>
      {PRIORITIES.map((level) => (
        <th key={level} scope="col" className="px-4 py-3 text-right">
          <span className="inline-flex items-center gap-1.5">
            <span className={SHAPE_COLOUR[level]}>
              <PriorityShape level={level} />
            </span>
            {PRIORITY_LABELS[level].short}: target
          </span>
        </th>
      ))}
    </tr>
  )
  return (
    <TableFrame caption="Field offices" head={head}>
      {offices.map((o) => (
        <tr key={o.id} className="border-b border-rule last:border-b-0">
          <th scope="row" className="px-4 py-3 font-semibold [overflow-wrap:anywhere]">
            {o.name}
            {o.address && <span className="block text-sm font-normal text-ink-muted">{o.address}</span>}
          </th>
          <td className="px-4 py-3">
            {o.regionName}
            {!o.area && <span className="block text-sm text-ink-muted">No area drawn: takes reports only as the nearest office</span>}
          </td>
          <td className="px-4 py-3 font-mono text-sm">
            {o.centreLatDeg.toFixed(4)}°, {o.centreLonDeg.toFixed(4)}°
          </td>
          {PRIORITIES.map((level) => (
            <td key={level} className="px-4 py-3 text-right font-mono text-sm">
              {o.responseTargetsHours[`p${level}`]} h
            </td>
          ))}
        </tr>
      ))}
    </TableFrame>
  )
}

/** A signed-in complainant's reports: reference (a link), where it stands, when it arrived. */
import { format, parseISO } from 'date-fns'
import { Link } from 'react-router-dom'
import { TableFrame } from '@/components/ui/table'
import type { MyReportRow } from '../api/get-my-reports'
import { paths } from '@/lib/paths'

export function MyReportsList({ reports }: { reports: MyReportRow[] }) {
  if (reports.length === 0) {
    return <p className="text-ink-muted">You have not sent a report while signed in yet.</p>
  }
  const head = (
    <tr>
      <th scope="col" className="px-4 py-2">Reference</th>
      <th scope="col" className="px-4 py-2">Status</th>
      <th scope="col" className="px-4 py-2">Where</th>
      <th scope="col" className="px-4 py-2">Received</th>
    </tr>
  )
  return (
    <TableFrame caption="Your reports, newest first" head={head}>
      {reports.map((r) => (
        <tr key={r.id} className="border-b border-rule last:border-b-0">
          <td className="px-4 py-3">
            <Link to={paths.myReport.href(r.id)} className="font-mono font-semibold">
              {r.reference}
            </Link>
          </td>
          <td className="px-4 py-3">{r.statusLabel}</td>
          <td className="px-4 py-3">{r.address}</td>
          <td className="px-4 py-3 whitespace-nowrap">
            <time dateTime={r.receivedAt}>{format(parseISO(r.receivedAt), 'd MMM yyyy')}</time>
          </td>
        </tr>
      ))}
    </TableFrame>
  )
}

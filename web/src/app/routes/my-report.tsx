/** /my-reports/:id — one of a signed-in complainant's reports (the same view as the tracking link). */
import { Link, useParams } from 'react-router-dom'
import { ComplainantReportScreen } from '@/features/tracking/components/complainant-report-screen'
import { paths } from '@/lib/paths'

export function Component() {
  const { id = '' } = useParams()
  return (
    <div className="max-w-3xl">
      <p className="mb-2">
        <Link to={paths.myReports.href()}>Back to the list of your reports</Link>
      </p>
      <ComplainantReportScreen source={{ kind: 'account', id }} />
    </div>
  )
}

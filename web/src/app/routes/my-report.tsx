/** /my-reports/:id — one of a signed-in complainant's reports (the same view as the tracking link). */
import { Link, useParams } from 'react-router-dom'
import { Loading } from '../../components/ui/loading'
import { Notice } from '../../components/ui/notice'
import { PageHeader } from '../../components/ui/page-header'
import { QueryError } from '../../components/ui/query-error'
import { useComplainantReport, type ReportSource } from '../../features/tracking/api/get-complainant-report'
import { ComplainantReportView } from '../../features/tracking/components/complainant-report-view'
import { isApiError } from '../../lib/api-client'

export function Component() {
  const { id = '' } = useParams()
  const source: ReportSource = { kind: 'account', id }
  const report = useComplainantReport(source)
  const missing = isApiError(report.error) && report.error.status === 404

  return (
    <div className="max-w-3xl">
      <p className="mb-2">
        <Link to="/my-reports">Back to the list of your reports</Link>
      </p>
      <PageHeader kicker={report.data ? `Reference ${report.data.reference}` : undefined} title="Your report" />
      {report.isPending && <Loading label="Loading your report…" />}
      {missing && (
        <Notice tone="danger" title="This report is not among yours." live>
          <p>It may belong to another account. Reports sent without signing in are followed through the link in their e-mail.</p>
        </Notice>
      )}
      {report.isError && !missing && <QueryError error={report.error} what="your report" onRetry={() => void report.refetch()} />}
      {report.data && <ComplainantReportView source={source} report={report.data} />}
    </div>
  )
}

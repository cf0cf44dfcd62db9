/** /track/:token — the complainant's page for one report, opened from the e-mailed link. */
import { useParams } from 'react-router-dom'
import { Loading } from '../../components/ui/loading'
import { Notice } from '../../components/ui/notice'
import { PageHeader } from '../../components/ui/page-header'
import { QueryError } from '../../components/ui/query-error'
import { useComplainantReport, type ReportSource } from '../../features/tracking/api/get-complainant-report'
import { ComplainantReportView } from '../../features/tracking/components/complainant-report-view'
import { isApiError } from '../../lib/api-client'

export function Component() {
  const { token = '' } = useParams()
  const source: ReportSource = { kind: 'token', token }
  const report = useComplainantReport(source)
  const invalid = isApiError(report.error) && report.error.status === 404

  return (
    <div className="max-w-3xl">
      <PageHeader kicker={report.data ? `Reference ${report.data.reference}` : undefined} title="Your report" />
      {report.isPending && <Loading label="Loading your report…" />}
      {invalid && (
        <Notice tone="danger" title="This tracking link is not valid. Check the link in your e-mail." live>
          <p>Copy the whole link from the e-mail into the address bar. If it still does not open, use the newest e-mail about your report.</p>
        </Notice>
      )}
      {report.isError && !invalid && <QueryError error={report.error} what="your report" onRetry={() => void report.refetch()} />}
      {report.data && <ComplainantReportView source={source} report={report.data} />}
      {report.data && <p className="mt-6 text-sm text-ink-muted">Keep this link private: anyone who has it can read this report.</p>}
    </div>
  )
}

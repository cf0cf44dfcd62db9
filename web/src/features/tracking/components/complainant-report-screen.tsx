/**
 * A complainant's report page, reached by the e-mailed link or from their account: loading,
 * "no such report" in the words that fit how they came, or the report itself.
 */
import { Loading } from '@/components/ui/loading'
import { Notice } from '@/components/ui/notice'
import { PageHeader } from '@/components/ui/page-header'
import { QueryError } from '@/components/ui/query-error'
import { isApiError } from '@/lib/api-client'
import { useComplainantReport, type ReportSource } from '../api/get-complainant-report'
import { ComplainantReportView } from './complainant-report-view'

export function ComplainantReportScreen({ source }: { source: ReportSource }) {
  const report = useComplainantReport(source)
  const missing = isApiError(report.error) && report.error.status === 404
  const tooMany = isApiError(report.error) && report.error.status === 429
  const byLink = source.kind === 'token'
  return (
    <>
      <PageHeader kicker={report.data ? `Reference ${report.data.reference}` : undefined} title="Your report" />
      {report.isPending && <Loading label="Loading your report…" />}
      {missing && byLink && (
        <Notice tone="danger" title="This tracking link is not valid. Check the link in your e-mail." live>
          <p>Copy the whole link from the e-mail into the address bar. If it still does not open, use the newest e-mail about your report.</p>
        </Notice>
      )}
      {missing && !byLink && (
        <Notice tone="danger" title="This report is not among yours." live>
          <p>It may belong to another account. Reports sent without signing in are followed through the link in their e-mail.</p>
        </Notice>
      )}
      {tooMany && (
        <Notice tone="danger" title="Too many tries from this address." live>
          <p>{report.error?.message}</p>
        </Notice>
      )}
      {report.isError && !missing && !tooMany && <QueryError error={report.error} what="your report" onRetry={() => void report.refetch()} />}
      {report.data && <ComplainantReportView source={source} report={report.data} />}
      {report.data && byLink && <p className="mt-6 text-sm text-ink-muted">Keep this link private: anyone who has it can read this report.</p>}
    </>
  )
}

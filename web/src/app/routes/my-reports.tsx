/** /my-reports — a signed-in complainant's reports. */
import { Link } from 'react-router-dom'
import { buttonClass } from '@/components/ui/button'
import { Loading } from '@/components/ui/loading'
import { PageHeader } from '@/components/ui/page-header'
import { QueryError } from '@/components/ui/query-error'
import { useMyReports } from '@/features/tracking/api/get-my-reports'
import { MyReportsList } from '@/features/tracking/components/my-reports-list'
import { paths } from '@/lib/paths'

export function Component() {
  const reports = useMyReports()
  return (
    <>
      <PageHeader title="My reports" lead={<p>Reports you sent while signed in or with this account’s e-mail address, with where each one stands.</p>} />
      <div className="flex flex-col gap-5">
        {reports.isPending && <Loading label="Loading your reports…" />}
        {reports.isError && <QueryError error={reports.error} what="your reports" onRetry={() => void reports.refetch()} />}
        {reports.data && <MyReportsList reports={reports.data} />}
        <div>
          <Link to={paths.report.href()} className={buttonClass('secondary')}>
            Report interference
          </Link>
        </div>
      </div>
    </>
  )
}

/** /admin/offices — the field offices and their response targets (read-only for now). */
import { Loading } from '../../components/ui/loading'
import { PageHeader } from '../../components/ui/page-header'
import { QueryError } from '../../components/ui/query-error'
import { ComingSoon } from '../../components/ui/coming-soon'
import { useOffices } from '../../features/offices/api/get-offices'
import { OfficesTable } from '../../features/offices/components/offices-table'

export function Component() {
  const offices = useOffices()
  return (
    <>
      <PageHeader title="Offices" lead={<p>Each office answers reports from its region. Response targets are hours per priority.</p>} />
      <div className="flex flex-col gap-6">
        {offices.isPending && <Loading label="Loading offices…" />}
        {offices.isError && <QueryError error={offices.error} what="offices" onRetry={() => void offices.refetch()} />}
        {offices.data && <OfficesTable offices={offices.data.offices} />}
        <ComingSoon arrivesWith="office settings">
          <p>Adding offices and changing regions or response targets is not possible from this page yet.</p>
        </ComingSoon>
      </div>
    </>
  )
}

/** /admin/offices — the field offices and their response targets. */
import { Loading } from '@/components/ui/loading'
import { PageHeader } from '@/components/ui/page-header'
import { QueryError } from '@/components/ui/query-error'
import { useOffices } from '@/features/offices/api/get-offices'
import { OfficesTable } from '@/features/offices/components/offices-table'
import { OfficeTargetsPanels } from '@/features/offices/components/office-targets-panels'
import { RetentionPanels } from '@/features/retention/components/retention-panels'
import { RetentionDryRun } from '@/features/retention/components/retention-dry-run'

export function Component() {
  const offices = useOffices()
  return (
    <>
      <PageHeader title="Offices" lead={<p>Each office answers reports from its region. Response targets are hours per priority.</p>} />
      <div className="flex flex-col gap-6">
        {offices.isPending && <Loading label="Loading offices…" />}
        {offices.isError && <QueryError error={offices.error} what="offices" onRetry={() => void offices.refetch()} />}
        {offices.data && <OfficesTable offices={offices.data.offices} />}
        {offices.data && <OfficeTargetsPanels offices={offices.data.offices} />}
        {offices.data && <RetentionPanels offices={offices.data.offices} />}
        <RetentionDryRun />
      </div>
    </>
  )
}

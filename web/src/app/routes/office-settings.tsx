/** /office/settings — the supervisor's own office: its first-response and resolution targets, its time zone. */
import { Link } from 'react-router-dom'
import { Loading } from '@/components/ui/loading'
import { PageHeader } from '@/components/ui/page-header'
import { QueryError } from '@/components/ui/query-error'
import { useMe } from '@/features/auth/api/get-me'
import { useOffices } from '@/features/offices/api/get-offices'
import { OfficeTargetsPanels } from '@/features/offices/components/office-targets-panels'
import { RetentionPanels } from '@/features/retention/components/retention-panels'
import { paths } from '@/lib/paths'

export function Component() {
  const user = useMe().data
  const offices = useOffices()
  return (
    <>
      <PageHeader kicker={user?.officeName ?? undefined} title="Office settings" lead={<p>The office’s targets per harm class and its time zone. The dashboard shows how the office meets the targets.</p>} />
      <div className="flex flex-col gap-6">
        {offices.isPending && <Loading label="Loading the office…" />}
        {offices.isError && <QueryError error={offices.error} what="the office" onRetry={() => void offices.refetch()} />}
        {offices.data && <OfficeTargetsPanels offices={offices.data.offices} />}
        {offices.data && <RetentionPanels offices={offices.data.offices} />}
        {offices.data && !offices.data.offices.some((o) => o.abilities.setResponseTargets) && <p>Only the office’s supervisor changes its targets.</p>}
        <p>
          <Link to={paths.dashboard.href()}>Back to the dashboard</Link>
        </p>
      </div>
    </>
  )
}

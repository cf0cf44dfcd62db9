/**
 * /dashboard — the office at a glance: a supervisor's own office, every office for an
 * administrator (or one, chosen in the filter, kept in the address as ?officeId=).
 */
import { Link, useSearchParams } from 'react-router-dom'
import { Loading } from '@/components/ui/loading'
import { PageHeader } from '@/components/ui/page-header'
import { QueryError } from '@/components/ui/query-error'
import { SelectField } from '@/components/ui/select-field'
import { useDashboard } from '@/features/dashboard/api/get-dashboard'
import { ClockFigures } from '@/features/dashboard/components/clock-figures'
import { FollowUpFigures } from '@/features/dashboard/components/follow-up-figures'
import { OpenCasesMap } from '@/features/dashboard/components/open-cases-map'
import { OpenWorkTable } from '@/features/dashboard/components/open-work-table'
import { PerformanceSection } from '@/features/dashboard/components/performance-section'
import { WorkloadTable } from '@/features/dashboard/components/workload-table'
import { useAbilities } from '@/features/auth/api/get-me'
import { paths } from '@/lib/paths'

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

export function Component() {
  const [params, setParams] = useSearchParams()
  const asked = params.get('officeId')
  const officeId = asked && UUID.test(asked) ? asked : null
  const dashboard = useDashboard(officeId)
  const abilities = useAbilities().data
  const view = dashboard.data
  const kicker = view ? (view.offices.length === 1 ? view.offices[0]!.name : 'All offices') : undefined
  return (
    <div className="flex min-w-0 flex-col gap-8">
      <PageHeader
        kicker={kicker}
        title="Dashboard"
        lead={
          <p>
            Open work, clocks, workload and response performance. Every figure opens the cases behind it.
            {abilities?.runOfficeQueue && (
              <>
                {' '}
                Targets are set in the <Link to={paths.officeSettings.href()}>office settings</Link>.
              </>
            )}
            {abilities?.manageOffices && (
              <>
                {' '}
                Targets are set under <Link to={paths.adminOffices.href()}>Offices</Link>.
              </>
            )}
          </p>
        }
      />
      {view && view.officeChoices.length > 1 && (
        <div className="max-w-sm">
          <SelectField
            label="Office"
            name="officeId"
            value={officeId ?? ''}
            onChange={(e) => setParams(e.target.value ? { officeId: e.target.value } : {})}
            options={[{ value: '', label: 'All offices' }, ...view.officeChoices.map((o) => ({ value: o.id, label: o.name }))]}
          />
        </div>
      )}
      {dashboard.isPending && <Loading label="Loading the dashboard…" />}
      {dashboard.isError && <QueryError error={dashboard.error} what="the dashboard" onRetry={() => void dashboard.refetch()} />}
      {view && (
        <>
          <ClockFigures view={view} />
          <FollowUpFigures view={view} queueLink={abilities?.runOfficeQueue === true} />
          <div className="grid min-w-0 gap-8 xl:grid-cols-[3fr_2fr]">
            <OpenWorkTable view={view} />
            <WorkloadTable view={view} />
          </div>
          <PerformanceSection view={view} />
          <OpenCasesMap view={view} />
          <p className="text-sm text-ink-muted">
            Figures as of {new Date(view.asOf).toLocaleString('en-GB', { timeZone: view.offices.length === 1 ? view.offices[0]!.timeZone : 'UTC', dateStyle: 'medium', timeStyle: 'short' })}
            {view.offices.length === 1 ? ` (${view.offices[0]!.timeZone})` : ' (UTC)'}; refreshed every minute.
          </p>
        </>
      )}
    </div>
  )
}

/** /registers/band-limits — the national band-limit list; supervisors and administrators edit it. */
import { useQuery } from '@tanstack/react-query'
import { Loading } from '@/components/ui/loading'
import { PageHeader } from '@/components/ui/page-header'
import { QueryError } from '@/components/ui/query-error'
import { abilitiesOf, meQueryOptions } from '@/features/auth/api/get-me'
import { useBandLimits } from '@/features/band-limits/api/get-band-limits'
import { BandLimitList } from '@/features/band-limits/components/band-limit-list'

export function Component() {
  const me = useQuery(meQueryOptions())
  const bandLimits = useBandLimits()
  const canEdit = abilitiesOf(me.data).manageBandLimits
  return (
    <>
      <PageHeader
        title="Band limits"
        lead={<p>The national list of licence-exempt limits with their citations. A value marked unverified was recalled, not checked against the regulation’s text.</p>}
      />
      <div className="flex flex-col gap-4">
        {bandLimits.isPending && <Loading label="Loading band limits…" />}
        {bandLimits.isError && <QueryError error={bandLimits.error} what="band limits" onRetry={() => void bandLimits.refetch()} />}
        {bandLimits.data && <BandLimitList bandLimits={bandLimits.data.bandLimits} canEdit={canEdit} />}
      </div>
    </>
  )
}

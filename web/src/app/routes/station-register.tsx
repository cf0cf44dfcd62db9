/** /registers/stations — the licence register: its stations and versions; administrators import new versions. */
import { useQuery } from '@tanstack/react-query'
import { PageHeader } from '@/components/ui/page-header'
import { abilitiesOf, meQueryOptions } from '@/features/auth/api/get-me'
import { ImportFlow } from '@/features/station-register/components/import-flow'
import { StationList } from '@/features/station-register/components/station-list'
import { VersionHistory } from '@/features/station-register/components/version-history'

export function Component() {
  const me = useQuery(meQueryOptions())
  const canImport = abilitiesOf(me.data).importStationRegister
  return (
    <>
      <PageHeader
        title="Licence register"
        lead={<p>The authorised stations of the regulator’s licence register, as last imported. Each import is a new version; older versions and the calculations made against them are kept as they were.</p>}
      />
      <div className="flex flex-col gap-8">
        {canImport && <ImportFlow />}
        <StationList />
        <VersionHistory />
      </div>
    </>
  )
}

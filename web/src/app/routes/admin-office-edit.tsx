/** /admin/offices/:id/edit — an office's details and area, read afresh (its version goes back with the save). */
import { useNavigate, useParams } from 'react-router-dom'
import { Loading } from '@/components/ui/loading'
import { PageHeader } from '@/components/ui/page-header'
import { QueryError } from '@/components/ui/query-error'
import { useOffice } from '@/features/offices/api/get-office'
import { OfficeEditor } from '@/features/offices/components/office-editor'
import { paths } from '@/lib/paths'
import type { OfficeSavedState } from './admin-offices'

export function Component() {
  const officeId = useParams().id ?? ''
  const navigate = useNavigate()
  const query = useOffice(officeId)
  const office = query.data?.office
  return (
    <>
      <PageHeader kicker={office?.name} title="Details and area" lead={<p>The office’s name, position, time zone and area. Reports from inside the area go to this office.</p>} />
      {query.isPending && <Loading label="Loading the office…" />}
      {query.isError && <QueryError error={query.error} what="the office" onRetry={() => void query.refetch()} />}
      {office && !office.abilities.edit && <p>Only an administrator changes an office’s details and area.</p>}
      {office?.abilities.edit && (
        <OfficeEditor
          key={office.id}
          office={office}
          onSaved={(saved) => navigate(paths.adminOffices.href(saved.office.id), { state: { saved: { name: saved.office.name, created: false, warnings: saved.warnings } } satisfies OfficeSavedState })}
        />
      )}
    </>
  )
}

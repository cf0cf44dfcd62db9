/** /admin/offices/new — a new field office: its details, position, time zone and area. */
import { useNavigate } from 'react-router-dom'
import { PageHeader } from '@/components/ui/page-header'
import { OfficeEditor } from '@/features/offices/components/office-editor'
import { paths } from '@/lib/paths'
import type { OfficeSavedState } from './admin-offices'

export function Component() {
  const navigate = useNavigate()
  return (
    <>
      <PageHeader title="New office" lead={<p>Name the office, give its position and time zone, and draw or upload its area. Reports from inside the area go to it.</p>} />
      <OfficeEditor
        office={null}
        onSaved={(saved) => navigate(paths.adminOffices.href(saved.office.id), { state: { saved: { name: saved.office.name, created: true, warnings: saved.warnings } } satisfies OfficeSavedState })}
      />
    </>
  )
}

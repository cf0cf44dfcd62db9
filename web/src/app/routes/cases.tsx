/** /cases — every case the viewer may see (their office's; all offices for an administrator). */
import { PageHeader } from '@/components/ui/page-header'
import { useStaff } from '@/features/case-list/api/get-staff'
import { CaseListView } from '@/features/case-list/components/case-list-view'
import { useOffices } from '@/features/offices/api/get-offices'

const NONE: { id: string; name: string }[] = []

/** The list takes the whole width of the screen. */
export const handle = { wide: true }

export function Component() {
  const offices = useOffices()
  const staff = useStaff()
  const investigators = staff.data?.filter((s) => s.role === 'investigator') ?? NONE
  return (
    <>
      <PageHeader
        title="Cases"
        lead={<p>Open and closed cases, filtered and sorted as you choose. The address keeps the view, so you can bookmark or share it.</p>}
      />
      <CaseListView offices={offices.data?.offices ?? NONE} investigators={investigators} />
    </>
  )
}

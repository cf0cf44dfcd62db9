/** /admin/audit — who changed what in administration, who exported what, who opened whose personal details. */
import { PageHeader } from '@/components/ui/page-header'
import { useUsers } from '@/features/admin-users/api/get-users'
import { AuditView } from '@/features/audit/components/audit-view'
import { useOffices } from '@/features/offices/api/get-offices'

export function Component() {
  const users = useUsers()
  const offices = useOffices()
  const people = (users.data?.users ?? []).filter((u) => u.role !== 'complainant').sort((a, b) => a.name.localeCompare(b.name))
  return (
    <>
      <PageHeader
        title="Audit"
        lead={
          <p>
            Every change to people, offices and registers, every export, and every time a member of staff opened a complainant’s personal details (at most once an hour per
            person and case). Entries cannot be changed or removed.
          </p>
        }
      />
      <AuditView people={people} offices={offices.data?.offices ?? []} />
    </>
  )
}

/** /admin/users — every account and its last sign-in; add staff; move staff between roles and offices; let accounts in or keep them out. */
import { useState } from 'react'
import type { PersonChangedResponse } from '@shared/schemas/people'
import { FormAlert } from '@/components/ui/form-alert'
import { Notice } from '@/components/ui/notice'
import { Loading } from '@/components/ui/loading'
import { PageHeader } from '@/components/ui/page-header'
import { Panel } from '@/components/ui/panel'
import { QueryError } from '@/components/ui/query-error'
import { useUsers } from '@/features/admin-users/api/get-users'
import { useSetUserActive } from '@/features/admin-users/api/set-user-active'
import { CreateUserForm } from '@/features/admin-users/components/create-user-form'
import { PersonEditForm } from '@/features/admin-users/components/person-edit-form'
import { UsersTable } from '@/features/admin-users/components/users-table'
import { useMe } from '@/features/auth/api/get-me'
import { useOffices } from '@/features/offices/api/get-offices'
import { formProblem, type FormProblem } from '@/lib/form-errors'

/** What a deactivation or reactivation did, in words: who, sessions ended, cases back to triage. */
function activeOutcomeWords(name: string, active: boolean, r: PersonChangedResponse): string {
  if (active) return `${name} can sign in again.`
  const cases = r.casesReturnedToTriage === 1 ? '1 open case went' : `${r.casesReturnedToTriage} open cases went`
  return `${name} is deactivated and signed out everywhere (${r.sessionsEnded} session${r.sessionsEnded === 1 ? '' : 's'} ended); ${cases} back to the office's triage.`
}

export function Component() {
  const users = useUsers()
  const offices = useOffices()
  const me = useMe()
  const setActive = useSetUserActive()
  const [problem, setProblem] = useState<FormProblem | null>(null)
  const [outcome, setOutcome] = useState<string | null>(null)
  const [editingId, setEditingId] = useState<string | null>(null)
  const editing = users.data?.users.find((u) => u.id === editingId) ?? null

  return (
    <>
      <PageHeader title="Users" lead={<p>Staff accounts and complainant accounts. New staff choose their own password from an e-mailed link.</p>} />
      <div className="flex flex-col gap-8">
        <section aria-label="All users" className="flex flex-col gap-3">
          <FormAlert problem={problem} />
          {outcome && <Notice tone="ok" title={outcome} live />}
          {users.isPending && <Loading label="Loading users…" />}
          {users.isError && <QueryError error={users.error} what="users" onRetry={() => void users.refetch()} />}
          {users.data && (
            <UsersTable
              users={users.data.users}
              currentUserId={me.data?.id ?? null}
              pendingUserId={setActive.isPending ? (setActive.variables?.userId ?? null) : null}
              onSetActive={(user, active) => {
                setProblem(null)
                setOutcome(null)
                setActive.mutate(
                  { userId: user.id, active },
                  { onError: (error) => setProblem(formProblem(error)), onSuccess: (r) => setOutcome(activeOutcomeWords(user.name, active, r)) },
                )
              }}
              onEdit={(user) => setEditingId(user.id)}
            />
          )}
        </section>
        {editing && (
          <Panel className="max-w-3xl">
            <PersonEditForm key={editing.id} user={editing} offices={offices.data?.offices ?? []} onClose={() => setEditingId(null)} />
          </Panel>
        )}
        <Panel className="max-w-3xl">
          {offices.isError && <QueryError error={offices.error} what="offices" onRetry={() => void offices.refetch()} />}
          <CreateUserForm offices={offices.data?.offices ?? []} />
        </Panel>
      </div>
    </>
  )
}

/** All accounts, sortable by any column, with their last sign-in, a change of role or office and deactivate/reactivate per row (TanStack Table v9). */
import {
  createColumnHelper,
  createSortedRowModel,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  sortFn_text,
  tableFeatures,
  useTable,
} from '@tanstack/react-table'
import { format, parseISO } from 'date-fns'
import { ROLE_LABELS } from '@shared/domain/roles'
import { SortableTh, TableFrame } from '@/components/ui/table'
import { useTableWidth } from '@/lib/use-media-query'
import type { AdminUser } from '../api/get-users'

const features = tableFeatures({
  rowSortingFeature,
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, text: sortFn_text, basic: sortFn_basic },
})
const helper = createColumnHelper<typeof features, AdminUser>()

// Module scope: stable columns keep the row models from being rebuilt on every render.
const columns = helper.columns([
  helper.accessor('name', { header: 'Name', sortFn: 'text' }),
  helper.accessor('email', { header: 'E-mail', sortFn: 'text', cell: (c) => <EmailAddress email={c.getValue()} /> }),
  helper.accessor((u) => ROLE_LABELS[u.role], { id: 'role', header: 'Role', sortFn: 'text' }),
  helper.accessor((u) => u.officeName ?? '', { id: 'office', header: 'Office', sortFn: 'text', cell: (c) => c.getValue() || <span className="text-ink-muted">—</span> }),
  helper.accessor('active', { header: 'Status', sortFn: 'basic', cell: (c) => <ActiveState active={c.getValue()} /> }),
  helper.accessor('createdAt', {
    header: 'Created',
    sortFn: 'alphanumeric',
    cell: (c) => <time dateTime={c.getValue()} className="font-mono text-sm whitespace-nowrap">{format(parseISO(c.getValue()), 'd MMM yyyy')}</time>,
  }),
  helper.accessor((u) => u.lastSignedInAt ?? '', { id: 'lastSignedIn', header: 'Last sign-in', sortFn: 'alphanumeric', cell: (c) => <LastSignIn at={c.getValue() || null} /> }),
])

export interface UsersTableProps {
  users: AdminUser[]
  currentUserId: string | null
  /** Id of the row whose change is on its way to the server. */
  pendingUserId: string | null
  onSetActive: (user: AdminUser, active: boolean) => void
  /** Opens the change of role or office for a staff account. */
  onEdit: (user: AdminUser) => void
}

export function UsersTable(props: UsersTableProps) {
  // under 640 px each account is a card (a seven-column table cannot fit a phone)
  return useTableWidth() ? <UsersGrid {...props} /> : <UserCards {...props} />
}

function UserCards({ users, currentUserId, pendingUserId, onSetActive, onEdit }: UsersTableProps) {
  const sorted = [...users].sort((a, b) => a.name.localeCompare(b.name))
  return (
    <ul aria-label="Users" className="flex flex-col gap-2">
      {sorted.map((u) => (
        <li key={u.id} className={`flex flex-col gap-1 rounded-panel border border-rule px-3 py-2 ${u.active ? 'bg-surface' : 'bg-paper text-ink-muted'}`}>
          <p className="font-semibold">{u.name}</p>
          <EmailAddress email={u.email} />
          <p className="text-sm">
            {ROLE_LABELS[u.role]}
            {u.officeName ? ` · ${u.officeName}` : ''}
          </p>
          <p className="text-sm">
            Last sign-in: <LastSignIn at={u.lastSignedInAt} />
          </p>
          <div className="flex flex-wrap items-center justify-between gap-2">
            <ActiveState active={u.active} />
            <RowAction user={u} isSelf={u.id === currentUserId} pending={pendingUserId === u.id} onSetActive={onSetActive} onEdit={onEdit} />
          </div>
        </li>
      ))}
    </ul>
  )
}

function UsersGrid({ users, currentUserId, pendingUserId, onSetActive, onEdit }: UsersTableProps) {
  const table = useTable({ features, columns, data: users, initialState: { sorting: [{ id: 'name', desc: false }] } })

  const head = table.getHeaderGroups().map((group) => (
    <tr key={group.id}>
      {group.headers.map((header) => (
        <SortableTh key={header.id} column={header.column} className="px-3 py-2 whitespace-nowrap">
          <table.FlexRender header={header} />
        </SortableTh>
      ))}
      <th scope="col" className="px-4 py-2">
        <span className="sr-only">Actions</span>
      </th>
    </tr>
  ))

  return (
    <TableFrame caption="Users. Column headers sort the table." head={head}>
      {table.getRowModel().rows.map((row) => (
        <tr key={row.id} className={`border-b border-rule last:border-b-0 ${row.original.active ? '' : 'bg-paper text-ink-muted'}`}>
          {row.getAllCells().map((cell) => (
            <td key={cell.id} className="px-3 py-2">
              <table.FlexRender cell={cell} />
            </td>
          ))}
          <td className="px-4 py-2">
            <RowAction user={row.original} isSelf={row.original.id === currentUserId} pending={pendingUserId === row.original.id} onSetActive={onSetActive} onEdit={onEdit} />
          </td>
        </tr>
      ))}
    </TableFrame>
  )
}

function RowAction({
  user,
  isSelf,
  pending,
  onSetActive,
  onEdit,
}: {
  user: AdminUser
  isSelf: boolean
  pending: boolean
  onSetActive: UsersTableProps['onSetActive']
  onEdit: UsersTableProps['onEdit']
}) {
  // a complainant account keeps its role and has no office: nothing to move
  const change =
    user.role === 'complainant' ? null : (
      <button
        type="button"
        disabled={pending}
        onClick={() => onEdit(user)}
        className="min-h-11 rounded-control border border-field bg-surface px-3 text-sm font-semibold whitespace-nowrap hover:bg-signal-soft disabled:opacity-60"
      >
        Change…
        <span className="sr-only"> role or office of {user.name}</span>
      </button>
    )
  // Deactivating yourself would lock you out; another administrator has to do that.
  if (isSelf)
    return (
      <span className="flex flex-wrap items-center gap-2">
        {change}
        <span className="text-sm text-ink-muted">Your account</span>
      </span>
    )
  return (
    <span className="flex flex-wrap items-center gap-2">
    {change}
    <button
      type="button"
      disabled={pending}
      onClick={() => onSetActive(user, !user.active)}
      className={`min-h-11 rounded-control border bg-surface px-3 text-sm font-semibold whitespace-nowrap disabled:opacity-60 ${
        user.active ? 'border-danger text-danger hover:bg-danger-soft' : 'border-signal text-signal hover:bg-signal-soft'
      }`}
    >
      {pending ? 'Saving…' : user.active ? 'Deactivate' : 'Reactivate'}
      <span className="sr-only"> {user.name}</span>
    </button>
    </span>
  )
}

function LastSignIn({ at }: { at: string | null }) {
  if (!at) return <span className="text-sm text-ink-muted">Never</span>
  return (
    <time dateTime={at} className="font-mono text-sm whitespace-nowrap">
      {format(parseISO(at), 'd MMM yyyy HH:mm')}
    </time>
  )
}

function ActiveState({ active }: { active: boolean }) {
  return (
    <span className={`inline-flex items-center gap-1.5 text-sm font-semibold ${active ? 'text-ok' : 'text-ink-muted'}`}>
      <svg aria-hidden="true" width="10" height="10" viewBox="0 0 10 10">
        {active ? <circle cx="5" cy="5" r="5" fill="currentColor" /> : <circle cx="5" cy="5" r="4" fill="none" stroke="currentColor" strokeWidth="2" />}
      </svg>
      {active ? 'Active' : 'Inactive'}
    </span>
  )
}

/** An e-mail address that may wrap after its "@" only, so a narrow column stays readable. */
function EmailAddress({ email }: { email: string }) {
  const at = email.indexOf('@')
  if (at < 0) return <span className="font-mono text-sm">{email}</span>
  return (
    <span className="font-mono text-sm">
      {email.slice(0, at + 1)}
      <wbr />
      {email.slice(at + 1)}
    </span>
  )
}

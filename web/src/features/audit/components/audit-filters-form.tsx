/** The audit list's filters: what was done, by whom, in which office, to what, and between which days. */
import { useState, type FormEvent } from 'react'
import { AUDIT_ACTIONS, AUDIT_ACTION_LABELS } from '@shared/domain/audit'
import { Button } from '@/components/ui/button'
import { SelectField } from '@/components/ui/select-field'
import { TextField } from '@/components/ui/text-field'
import type { AuditFilterName, AuditFilters } from '../lib/audit-filters'

export interface AuditFiltersFormProps {
  filters: AuditFilters
  people: { id: string; name: string }[]
  offices: { id: string; name: string }[]
  /** The server's refusal of a filter, by its name. */
  errors: Partial<Record<AuditFilterName, string>>
  onApply: (filters: AuditFilters) => void
}

const ANY = { value: '', label: 'Any' }

export function AuditFiltersForm({ filters, people, offices, errors, onApply }: AuditFiltersFormProps) {
  const [draft, setDraft] = useState<AuditFilters>(filters)
  // the URL changed under the form (back, a link): show what the list now shows
  const [shown, setShown] = useState(filters)
  if (shown !== filters) {
    setShown(filters)
    setDraft(filters)
  }
  const set = (name: AuditFilterName) => (e: { target: { value: string } }) => setDraft((d) => ({ ...d, [name]: e.target.value }))
  const submit = (e: FormEvent) => {
    e.preventDefault()
    onApply(draft)
  }
  return (
    <form aria-label="Filter the audit list" onSubmit={submit} className="grid grid-cols-1 gap-3 sm:grid-cols-2 lg:grid-cols-4">
      <SelectField
        label="Action"
        name="action"
        value={draft.action ?? ''}
        onChange={set('action')}
        error={errors.action}
        options={[ANY, ...AUDIT_ACTIONS.map((a) => ({ value: a, label: AUDIT_ACTION_LABELS[a] }))]}
      />
      <SelectField label="Person" name="actorUserId" value={draft.actorUserId ?? ''} onChange={set('actorUserId')} error={errors.actorUserId} options={[ANY, ...people.map((p) => ({ value: p.id, label: p.name }))]} />
      <SelectField label="Office" name="officeId" value={draft.officeId ?? ''} onChange={set('officeId')} error={errors.officeId} options={[ANY, ...offices.map((o) => ({ value: o.id, label: o.name }))]} />
      <SelectField
        label="Target"
        name="targetType"
        value={draft.targetType ?? ''}
        onChange={set('targetType')}
        error={errors.targetType}
        options={[ANY, ...TARGET_TYPES.map((t) => ({ value: t, label: TARGET_TYPE_LABELS[t] }))]}
      />
      <TextField label="Target id" name="targetId" value={draft.targetId ?? ''} onChange={set('targetId')} error={errors.targetId} hint="A case's, person's or office's id." autoComplete="off" />
      <TextField label="From (UTC day)" name="from" type="date" value={draft.from ?? ''} onChange={set('from')} error={errors.from} />
      <TextField label="To (UTC day, inclusive)" name="to" type="date" value={draft.to ?? ''} onChange={set('to')} error={errors.to} />
      <div className="flex items-end gap-2">
        <Button type="submit">Apply filters</Button>
        <Button variant="quiet" onClick={() => onApply({})}>
          Clear
        </Button>
      </div>
    </form>
  )
}

export const TARGET_TYPES = ['case', 'user', 'office', 'band_limit', 'equipment', 'station_register', 'case_list', 'audit_log'] as const
export const TARGET_TYPE_LABELS: Record<(typeof TARGET_TYPES)[number], string> = {
  case: 'Case',
  user: 'Person',
  office: 'Office',
  band_limit: 'Band limit',
  equipment: 'Equipment',
  station_register: 'Licence register',
  case_list: 'Case list',
  audit_log: 'Audit list',
}

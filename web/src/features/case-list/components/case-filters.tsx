/**
 * The case list's filters. The form is re-created whenever the URL changes (the page keys
 * it by the search string), so it always shows what the list shows; "Apply filters"
 * writes a new URL.
 */
import type { FormEvent } from 'react'
import { Link } from 'react-router-dom'
import { CASE_STATES, CASE_STATE_LABELS, type CaseState } from '@shared/domain/case-lifecycle'
import { AFFECTED_SERVICES, PRIORITIES, PRIORITY_LABELS, type AffectedService } from '@shared/domain/services'
import { Button } from '@/components/ui/button'
import { SelectField } from '@/components/ui/select-field'
import { TextField } from '@/components/ui/text-field'
import { FREQUENCY_UNIT_OPTIONS, type FrequencyUnit } from '@/lib/frequency'
import { DEFAULT_LIST_STATE, type CaseListState } from '@/lib/case-list-state'
import { serviceShortLabel } from '@/lib/service-label'
import { ChoiceGroup } from '@/components/ui/choice-group'

export interface CaseFiltersProps {
  state: CaseListState
  onApply: (next: CaseListState) => void
  /** Offer an office filter only when there is more than one office to choose from. */
  offices: { id: string; name: string }[]
  investigators: { id: string; name: string }[]
}

const STATUS_OPTIONS = CASE_STATES.map((s) => ({ value: s, label: CASE_STATE_LABELS[s] }))
const PRIORITY_OPTIONS = PRIORITIES.map((p) => ({ value: String(p), label: PRIORITY_LABELS[p].short }))
const SERVICE_OPTIONS = [{ value: '', label: 'Any service' }, ...AFFECTED_SERVICES.map((s) => ({ value: s, label: serviceShortLabel(s) }))]
const YES_NO_ANY = (yes: string, no: string) => [
  { value: '', label: 'Either' },
  { value: 'true', label: yes },
  { value: 'false', label: no },
]

export function CaseFilters({ state, onApply, offices, investigators }: CaseFiltersProps) {
  const investigatorOptions = [
    { value: '', label: 'Anyone or no one' },
    { value: 'me', label: 'Assigned to me' },
    { value: 'none', label: 'Unassigned' },
    ...investigators.map((i) => ({ value: i.id, label: i.name })),
  ]
  // A link may carry several services; the select then offers that combination as it is.
  const serviceValue = state.service.join(',')
  const serviceOptions = state.service.length > 1 ? [...SERVICE_OPTIONS, { value: serviceValue, label: state.service.map(serviceShortLabel).join(' or ') }] : SERVICE_OPTIONS

  const onSubmit = (e: FormEvent<HTMLFormElement>) => {
    e.preventDefault()
    const f = new FormData(e.currentTarget)
    const text = (k: string) => String(f.get(k) ?? '').trim()
    const figure = (k: string) => {
      const t = text(k).replace(/\u2212/g, '-').replace(',', '.')
      const n = Number(t)
      return t !== '' && Number.isFinite(n) && n >= 0 ? n : null
    }
    const flag = (k: string) => (text(k) === 'true' ? true : text(k) === 'false' ? false : null)
    onApply({
      ...state,
      page: 1,
      q: text('q'),
      status: f.getAll('status').map(String) as CaseState[],
      priority: f.getAll('priority').map(Number),
      service: text('service') ? (text('service').split(',') as AffectedService[]) : [],
      officeId: text('officeId') || null,
      investigatorId: text('investigatorId') || null,
      overdue: flag('overdue'),
      open: flag('open'),
      freqFrom: figure('freqFrom'),
      freqTo: figure('freqTo'),
      freqUnit: (text('freqUnit') || DEFAULT_LIST_STATE.freqUnit) as FrequencyUnit,
    })
  }

  return (
    <form role="search" aria-label="Filter cases" onSubmit={onSubmit} className="flex flex-col gap-4 rounded-panel border border-rule bg-surface p-5">
      <div className="grid gap-4 md:grid-cols-2 lg:grid-cols-4">
        <div className="md:col-span-2">
          <TextField label="Search" name="q" type="search" defaultValue={state.q} hint="Reference, address, complainant or description." />
        </div>
        <SelectField label="Service" name="service" options={serviceOptions} defaultValue={serviceValue} />
        <SelectField label="Investigator" name="investigatorId" options={investigatorOptions} defaultValue={state.investigatorId ?? ''} />
        {offices.length > 1 && (
          <SelectField label="Office" name="officeId" options={[{ value: '', label: 'All offices' }, ...offices.map((o) => ({ value: o.id, label: o.name }))]} defaultValue={state.officeId ?? ''} />
        )}
        <SelectField label="Open or closed" name="open" options={YES_NO_ANY('Open only', 'Closed only')} defaultValue={state.open === null ? '' : String(state.open)} />
        <SelectField label="Overdue" name="overdue" options={YES_NO_ANY('Overdue only', 'Not overdue')} defaultValue={state.overdue === null ? '' : String(state.overdue)} />
        <fieldset className="flex flex-col gap-1 md:col-span-2">
          <legend className="font-semibold">Frequency range</legend>
          <p className="text-sm text-ink-muted">Cases whose range overlaps this one.</p>
          <div className="grid grid-cols-2 gap-3 sm:grid-cols-[1fr_1fr_6rem]">
            <TextField label="Frequency from" name="freqFrom" id="filter-freq-from" inputMode="decimal" defaultValue={state.freqFrom ?? ''} />
            <TextField label="Frequency to" name="freqTo" id="filter-freq-to" inputMode="decimal" defaultValue={state.freqTo ?? ''} />
            <SelectField label="Unit" id="filter-freq-unit" name="freqUnit" options={FREQUENCY_UNIT_OPTIONS.map((u) => ({ value: u, label: u }))} defaultValue={state.freqUnit} />
          </div>
        </fieldset>
      </div>
      <div className="grid gap-4 lg:grid-cols-[3fr_1fr]">
        <ChoiceGroup legend="Status" name="status" type="checkbox" options={STATUS_OPTIONS} defaultChecked={state.status} columns={4} />
        <ChoiceGroup legend="Harm class" name="priority" type="checkbox" options={PRIORITY_OPTIONS} defaultChecked={state.priority.map(String)} />
      </div>
      <div className="flex flex-wrap items-center gap-4">
        <Button type="submit">Apply filters</Button>
        <Link to={{ search: "" }}>Clear filters</Link>
      </div>
    </form>
  )
}

/** Give the case to an investigator; each is listed with the open cases they already carry. */
import { zodResolver } from '@hookform/resolvers/zod'
import { useForm, type UseFormRegisterReturn } from 'react-hook-form'
import type { z } from 'zod'
import { assignSchema } from '@shared/schemas/cases'
import { Loading } from '@/components/ui/loading'
import { QueryError } from '@/components/ui/query-error'
import { FieldError } from '@/components/ui/field'
import { ActionForm } from './action-form'
import { useCaseActionForm } from './use-case-action-form'
import { useAssignCase } from '../api/assign-case'
import { useInvestigators, type InvestigatorLoad } from '../api/get-investigators'

const schema = assignSchema.omit({ version: true })
type In = z.input<typeof schema>

export function AssignForm({ headingless = false }: { headingless?: boolean }) {
  const action = useCaseActionForm()
  const { detail } = action
  const investigators = useInvestigators(detail.id)
  const form = useForm<In>({ resolver: zodResolver(schema), defaultValues: { investigatorId: detail.investigatorId ?? '' } })
  const assign = useAssignCase(detail.id)
  const fieldError = form.formState.errors.investigatorId?.message

  const onSubmit = form.handleSubmit((v) => {
    const name = investigators.data?.find((i) => i.id === v.investigatorId)?.name ?? 'the investigator'
    return action.run({ send: (version) => assign.mutateAsync({ ...v, version }), success: `Assigned to ${name}.`, setFieldError: form.setError, fields: ['investigatorId'] })
  })

  return (
    <ActionForm
      id="assign"
      title={detail.investigatorId ? 'Reassign the case' : 'Assign an investigator'}
      headingless={headingless}
      submitLabel="Assign"
      pendingLabel="Assigning…"
      submitting={form.formState.isSubmitting}
      onSubmit={onSubmit}
      action={action}
    >
      {investigators.isPending && <Loading label="Loading investigators…" />}
      {investigators.isError && <QueryError error={investigators.error} what="investigators" onRetry={() => void investigators.refetch()} />}
      {investigators.data && investigators.data.length === 0 && <p>This office has no active investigator.</p>}
      {investigators.data && investigators.data.length > 0 && (
        <fieldset aria-describedby={fieldError ? 'assign-error' : undefined} className="flex flex-col gap-1">
          <legend className="mb-1 font-semibold">Investigator</legend>
          <p className="text-sm text-ink-muted">Open cases each already carries, lightest first.</p>
          {investigators.data.map((inv) => (
            <InvestigatorChoice key={inv.id} inv={inv} current={inv.id === detail.investigatorId} register={form.register('investigatorId')} />
          ))}
          <FieldError id="assign-error" message={fieldError} />
        </fieldset>
      )}
    </ActionForm>
  )
}

function InvestigatorChoice({ inv, current, register }: { inv: InvestigatorLoad; current: boolean; register: UseFormRegisterReturn<'investigatorId'> }) {
  const id = `assign-${inv.id}`
  return (
    <div className="flex min-h-11 items-start gap-3 py-1">
      <input id={id} type="radio" value={inv.id} aria-describedby={`${id}-load`} className="mt-0.5 h-5 w-5 shrink-0 accent-signal" {...register} />
      <div className="flex flex-col">
        <label htmlFor={id} className="font-semibold">
          {inv.name}
        </label>
        <span id={`${id}-load`} className="flex items-center gap-2 text-sm text-ink-muted">
          <LoadBar openCases={inv.openCases} />
          {inv.openCases} open {inv.openCases === 1 ? 'case' : 'cases'}
          {current && ' · assigned now'}
        </span>
      </div>
    </div>
  )
}

/** A small bar of one block per open case (up to ten), so workloads compare at a glance. */
function LoadBar({ openCases }: { openCases: number }) {
  const shown = Math.min(openCases, 10)
  return (
    <svg aria-hidden="true" width="64" height="10" viewBox="0 0 64 10">
      {Array.from({ length: 10 }, (_, i) => (
        <rect key={i} x={i * 6.4} y="1" width="5" height="8" className={i < shown ? 'fill-ink-muted' : 'fill-rule'} />
      ))}
    </svg>
  )
}

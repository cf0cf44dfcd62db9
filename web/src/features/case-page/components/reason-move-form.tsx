/**
 * A move whose one field is a written reason: send a finding back, reopen. The
 * reason is checked by the server's own schema for that move.
 */
import { zodResolver } from '@hookform/resolvers/zod'
import { useForm } from 'react-hook-form'
import type { z } from 'zod'
import { TextAreaField } from '@/components/ui/text-area-field'
import { ActionForm, type ActionFormProps } from './action-form'
import { useCaseActionForm } from './use-case-action-form'

type ReasonFields = { reason: string }

export interface ReasonMoveFormProps extends Pick<ActionFormProps, 'id' | 'title' | 'intro' | 'submitLabel' | 'pendingLabel' | 'variant'> {
  schema: z.ZodObject<{ version: z.ZodNumber; reason: z.ZodString }>
  /** The move's mutation hook (one file per move in ../api). */
  useMove: (caseId: string) => { mutateAsync: (body: ReasonFields & { version: number }) => Promise<unknown> }
  label: string
  hint?: string
  rows: number
  success: string
}

export function ReasonMoveForm({ schema, useMove, label, hint, rows, success, ...frame }: ReasonMoveFormProps) {
  const action = useCaseActionForm()
  const form = useForm<ReasonFields>({ resolver: zodResolver(schema.pick({ reason: true })), defaultValues: { reason: '' } })
  const move = useMove(action.detail.id)
  const onSubmit = form.handleSubmit((v) =>
    action.run({
      send: (version) => move.mutateAsync({ ...v, version }),
      success,
      setFieldError: form.setError,
      fields: ['reason'],
      after: () => form.reset({ reason: '' }),
    }),
  )
  return (
    <ActionForm {...frame} submitting={form.formState.isSubmitting} onSubmit={onSubmit} action={action}>
      <TextAreaField label={label} id={`${frame.id}-reason`} hint={hint} rows={rows} error={form.formState.errors.reason?.message} {...form.register('reason')} />
    </ActionForm>
  )
}

/** Writing on the timeline: an internal note (staff only) or a message to the complainant (e-mailed). */
import { zodResolver } from '@hookform/resolvers/zod'
import { useForm } from 'react-hook-form'
import { z } from 'zod'
import { noteSchema } from '@shared/schemas/cases'
import { useAddCaseNote } from '../api/add-case-note'
import { ActionForm } from './action-form'
import { TextAreaField } from '@/components/ui/text-area-field'
import { useCaseActionForm } from './use-case-action-form'

const bodyOnly = noteSchema.pick({ body: true })

export function InternalNoteForm() {
  const action = useCaseActionForm()
  const form = useForm<z.input<typeof bodyOnly>>({ resolver: zodResolver(bodyOnly), defaultValues: { body: '' } })
  const add = useAddCaseNote(action.detail.id)
  const onSubmit = form.handleSubmit((v) =>
    action.run({ send: () => add.mutateAsync({ body: v.body, visibility: 'internal' }), success: 'Internal note added.', setFieldError: form.setError, fields: ['body'], after: () => form.reset({ body: '' }) }),
  )
  return (
    <ActionForm
      id="internal-note"
      title="Add an internal note"
      intro={<p>Seen by the office's staff only, never by the complainant.</p>}
      submitLabel="Add internal note"
      pendingLabel="Adding…"
      submitting={form.formState.isSubmitting}
      onSubmit={onSubmit}
      action={action}
      variant="secondary"
    >
      <TextAreaField label="Internal note" id="internal-note-body" rows={3} error={form.formState.errors.body?.message} {...form.register('body')} />
    </ActionForm>
  )
}

const messageSchema = bodyOnly.extend({ requestsInformation: z.boolean() })

export function MessageComplainantForm() {
  const action = useCaseActionForm()
  const form = useForm<z.input<typeof messageSchema>>({ resolver: zodResolver(messageSchema), defaultValues: { body: '', requestsInformation: false } })
  const add = useAddCaseNote(action.detail.id)
  const onSubmit = form.handleSubmit((v) =>
    action.run({
      send: () => add.mutateAsync({ body: v.body, visibility: 'complainant', requestsInformation: v.requestsInformation }),
      success: v.requestsInformation ? 'Question sent to the complainant by e-mail.' : 'Message sent to the complainant by e-mail.',
      setFieldError: form.setError,
      fields: ['body'],
      after: () => form.reset({ body: '', requestsInformation: false }),
    }),
  )
  return (
    <ActionForm
      id="message"
      title="Message the complainant"
      intro={
        <p>
          Sent to <span className="font-mono">{action.detail.complainant.email}</span> and shown on their tracking page.
        </p>
      }
      submitLabel="Send message"
      pendingLabel="Sending…"
      submitting={form.formState.isSubmitting}
      onSubmit={onSubmit}
      action={action}
      variant="secondary"
    >
      <TextAreaField label="Message to the complainant" id="message-body" rows={3} error={form.formState.errors.body?.message} {...form.register('body')} />
      <div className="flex min-h-11 items-center gap-3">
        <input id="message-asks" type="checkbox" className="h-5 w-5 accent-signal" {...form.register('requestsInformation')} />
        <label htmlFor="message-asks">This asks the complainant for information</label>
      </div>
    </ActionForm>
  )
}

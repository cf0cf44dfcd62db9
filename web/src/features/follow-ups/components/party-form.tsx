/** Records the responsible party, or a new version of it (the earlier one stays readable). */
import type { ResponsiblePartyView } from '@shared/schemas/follow-ups'
import { FormAlert } from '@/components/ui/form-alert'
import { SubmitButton } from '@/components/ui/submit-button'
import { TextField } from '@/components/ui/text-field'
import { Button } from '@/components/ui/button'
import { TextAreaField } from '@/components/ui/text-area-field'
import { useRecordEnforcement } from '../api/record-enforcement'
import { useRecordForm } from './use-record-form'

export function PartyForm({ caseId, current, onDone }: { caseId: string; current: ResponsiblePartyView | null; onDone: () => void }) {
  const record = useRecordEnforcement(caseId, 'responsible-party')
  const form = useRecordForm({ name: current?.name ?? '', address: current?.address ?? '', email: current?.email ?? '', phone: current?.phone ?? '' })
  return (
    <form
      noValidate
      aria-label={current ? 'Update the responsible party' : 'Record the responsible party'}
      className="flex flex-col gap-3 rounded-control border border-rule p-4"
      onSubmit={(e) => {
        e.preventDefault()
        void form.submit((v) => record.mutateAsync(v), onDone)
      }}
    >
      <TextField label="Name (person or organisation)" id={`party-name-${caseId}`} autoComplete="off" {...form.field('name')} />
      <TextAreaField label="Postal address" id={`party-address-${caseId}`} rows={2} {...form.field('address')} />
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField label="E-mail" id={`party-email-${caseId}`} type="email" autoComplete="off" {...form.field('email')} />
        <TextField label="Phone" id={`party-phone-${caseId}`} type="tel" autoComplete="off" {...form.field('phone')} />
      </div>
      <FormAlert problem={form.problem} />
      <div className="flex flex-wrap gap-3">
        <SubmitButton submitting={form.submitting} pendingLabel="Saving…">
          {current ? 'Save as a new version' : 'Record the party'}
        </SubmitButton>
        <Button variant="quiet" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  )
}

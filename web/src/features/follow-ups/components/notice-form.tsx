/** Records a notice served on the responsible party: the day, how, by whom, its reference and what it requires. */
import { NOTICE_METHOD_LABELS, NOTICE_METHODS } from '@shared/domain/follow-ups'
import type { NoticeView } from '@shared/schemas/follow-ups'
import { Button } from '@/components/ui/button'
import { FormAlert } from '@/components/ui/form-alert'
import { SelectField } from '@/components/ui/select-field'
import { SubmitButton } from '@/components/ui/submit-button'
import { TextAreaField } from '@/components/ui/text-area-field'
import { TextField } from '@/components/ui/text-field'
import { useRecordEnforcement } from '../api/record-enforcement'
import { EvidenceSelect } from './evidence-select'
import { useRecordForm } from './use-record-form'

const METHOD_OPTIONS = [{ value: '', label: 'Choose…' }, ...NOTICE_METHODS.map((m) => ({ value: m, label: NOTICE_METHOD_LABELS[m] }))]

export function NoticeForm({ caseId, onDone }: { caseId: string; onDone: () => void }) {
  const record = useRecordEnforcement(caseId, 'notices')
  const form = useRecordForm({ servedOn: '', method: '', methodOther: '', servedBy: '', reference: '', summary: '', evidenceId: '' })
  return (
    <form
      noValidate
      aria-label="Record a notice served"
      className="flex flex-col gap-3 rounded-control border border-rule p-4"
      onSubmit={(e) => {
        e.preventDefault()
        void form.submit((v) => record.mutateAsync({ ...v, method: v.method as NoticeView['method'] }), onDone)
      }}
    >
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField label="Served on" id={`notice-served-${caseId}`} type="date" {...form.field('servedOn')} />
        <SelectField label="How it was served" id={`notice-method-${caseId}`} options={METHOD_OPTIONS} {...form.field('method')} />
      </div>
      {form.values.method === 'other' && <TextField label="Describe how" id={`notice-other-${caseId}`} {...form.field('methodOther')} />}
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField label="Served by" id={`notice-by-${caseId}`} hint="Leave empty if you served it yourself." {...form.field('servedBy')} />
        <TextField label="Reference (letter or receipt number)" id={`notice-ref-${caseId}`} {...form.field('reference')} />
      </div>
      <TextAreaField label="What the notice requires" id={`notice-summary-${caseId}`} rows={3} {...form.field('summary')} />
      <EvidenceSelect caseId={caseId} label="Copy or receipt among the case’s evidence" id={`notice-evidence-${caseId}`} {...form.field('evidenceId')} />
      <FormAlert problem={form.problem} />
      <div className="flex flex-wrap gap-3">
        <SubmitButton submitting={form.submitting} pendingLabel="Saving…">
          Record the notice
        </SubmitButton>
        <Button variant="quiet" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  )
}

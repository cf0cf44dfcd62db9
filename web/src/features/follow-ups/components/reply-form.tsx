/** Records a reply from the responsible party, optionally to one notice. */
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

export function ReplyForm({ caseId, notices, onDone }: { caseId: string; notices: NoticeView[]; onDone: () => void }) {
  const record = useRecordEnforcement(caseId, 'party-replies')
  const form = useRecordForm({ receivedOn: '', noticeId: '', summary: '', evidenceId: '' })
  const options = [{ value: '', label: 'Not to a particular notice' }, ...notices.map((n) => ({ value: n.id, label: `${n.servedOn} — ${n.reference ?? n.methodLabel}` }))]
  return (
    <form
      noValidate
      aria-label="Record a reply"
      className="flex flex-col gap-3 rounded-control border border-rule p-4"
      onSubmit={(e) => {
        e.preventDefault()
        void form.submit((v) => record.mutateAsync(v), onDone)
      }}
    >
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField label="Received on" id={`reply-received-${caseId}`} type="date" {...form.field('receivedOn')} />
        <SelectField label="In reply to" id={`reply-notice-${caseId}`} options={options} {...form.field('noticeId')} />
      </div>
      <TextAreaField label="What they replied" id={`reply-summary-${caseId}`} rows={3} {...form.field('summary')} />
      <EvidenceSelect caseId={caseId} label="The reply among the case’s evidence" id={`reply-evidence-${caseId}`} {...form.field('evidenceId')} />
      <FormAlert problem={form.problem} />
      <div className="flex flex-wrap gap-3">
        <SubmitButton submitting={form.submitting} pendingLabel="Saving…">
          Record the reply
        </SubmitButton>
        <Button variant="quiet" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  )
}

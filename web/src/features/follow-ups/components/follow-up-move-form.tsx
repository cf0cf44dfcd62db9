/** One follow-up move: a note (what was seen, or why), and for reopening an optional new deadline. */
import { FOLLOW_UP_MOVE_LABELS, type FollowUpMoveName } from '@shared/domain/follow-ups'
import type { FollowUpView } from '@shared/schemas/follow-ups'
import { Button } from '@/components/ui/button'
import { FormAlert } from '@/components/ui/form-alert'
import { SubmitButton } from '@/components/ui/submit-button'
import { TextAreaField } from '@/components/ui/text-area-field'
import { TextField } from '@/components/ui/text-field'
import { useMoveFollowUp } from '../api/move-follow-up'
import { useRecordForm } from './use-record-form'

export function FollowUpMoveForm({ f, move, onDone }: { f: FollowUpView; move: FollowUpMoveName; onDone: () => void }) {
  const mutation = useMoveFollowUp(f.caseId)
  const form = useRecordForm({ note: '', dueOn: '' })
  return (
    <form
      noValidate
      aria-label={FOLLOW_UP_MOVE_LABELS[move]}
      className="flex flex-col gap-3 rounded-control border border-rule p-3"
      onSubmit={(e) => {
        e.preventDefault()
        void form.submit((v) => mutation.mutateAsync({ id: f.id, move, body: { version: f.version, note: v.note, dueOn: move === 'reopen' ? v.dueOn : undefined } }), onDone)
      }}
    >
      <TextAreaField
        label={move === 'confirm' ? 'What you saw' : move === 'escalate' ? 'Why it is escalated' : 'Why it is reopened'}
        id={`fu-note-${f.id}-${move}`}
        rows={2}
        {...form.field('note')}
      />
      {move === 'reopen' && <TextField label="New deadline (optional)" id={`fu-due-${f.id}`} type="date" {...form.field('dueOn')} />}
      <FormAlert problem={form.problem} />
      <div className="flex flex-wrap gap-3">
        <SubmitButton submitting={form.submitting} pendingLabel="Saving…" variant={move === 'escalate' ? 'danger' : 'primary'}>
          {FOLLOW_UP_MOVE_LABELS[move]}
        </SubmitButton>
        <Button variant="quiet" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  )
}

/**
 * "Follow-ups" on the case page: what the responsible party must do by when, where each stands
 * on the office's today, the moves the viewer may make (confirm, escalate, reopen) and, for
 * staff of the office, a form to add one.
 */
import { useState } from 'react'
import { FOLLOW_UP_MOVE_LABELS, FOLLOW_UP_MOVE_NAMES, type FollowUpMoveName } from '@shared/domain/follow-ups'
import { Button } from '@/components/ui/button'
import { FormAlert } from '@/components/ui/form-alert'
import { Loading } from '@/components/ui/loading'
import { QueryError } from '@/components/ui/query-error'
import { SubmitButton } from '@/components/ui/submit-button'
import { TextAreaField } from '@/components/ui/text-area-field'
import { TextField } from '@/components/ui/text-field'
import { useAddFollowUp } from '../api/add-follow-up'
import { useCaseFollowUps } from '../api/get-case-follow-ups'
import { FollowUpMoveForm } from './follow-up-move-form'
import { FollowUpStanding } from './follow-up-standing'
import { useRecordForm } from './use-record-form'

function AddFollowUpForm({ caseId, today, onDone }: { caseId: string; today: string; onDone: () => void }) {
  const add = useAddFollowUp(caseId)
  const form = useRecordForm({ dueOn: '', expected: '' })
  return (
    <form
      noValidate
      aria-label="Add a follow-up"
      className="flex flex-col gap-3 rounded-control border border-rule p-4"
      onSubmit={(e) => {
        e.preventDefault()
        void form.submit((v) => add.mutateAsync(v), onDone)
      }}
    >
      <TextField label="Deadline" id={`fu-add-due-${caseId}`} type="date" min={today} hint={`Today at the office is ${today}.`} {...form.field('dueOn')} />
      <TextAreaField label="What is expected" id={`fu-add-expected-${caseId}`} rows={2} {...form.field('expected')} />
      <FormAlert problem={form.problem} />
      <div className="flex flex-wrap gap-3">
        <SubmitButton submitting={form.submitting} pendingLabel="Adding…">
          Add the follow-up
        </SubmitButton>
        <Button variant="quiet" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  )
}

export function FollowUpsSection({ caseId }: { caseId: string }) {
  const q = useCaseFollowUps(caseId)
  const [moving, setMoving] = useState<{ id: string; move: FollowUpMoveName } | null>(null)
  const [adding, setAdding] = useState(false)
  const d = q.data
  return (
    <section aria-labelledby={`follow-ups-${caseId}`} className="flex flex-col gap-4 rounded-panel border border-rule bg-surface p-4 sm:p-5">
      <header className="flex flex-wrap items-center justify-between gap-3">
        <h2 id={`follow-ups-${caseId}`} className="text-xl font-semibold">
          Follow-ups
        </h2>
        {d?.abilities.add && !adding && (
          <Button variant="secondary" onClick={() => setAdding(true)} className="w-full sm:w-auto">
            Add a follow-up
          </Button>
        )}
      </header>
      {q.isPending && <Loading label="Loading the follow-ups…" />}
      {q.isError && <QueryError error={q.error} what="the follow-ups" onRetry={() => void q.refetch()} />}
      {d && adding && <AddFollowUpForm caseId={caseId} today={d.today} onDone={() => setAdding(false)} />}
      {d && d.followUps.length === 0 && <p className="text-ink-muted">No follow-up. One is made when a finding with a compliance deadline is approved.</p>}
      {d && d.followUps.length > 0 && (
        <ol aria-label="Follow-ups, by deadline" className="flex flex-col gap-3">
          {d.followUps.map((f) => (
            <li key={f.id} className="flex flex-col gap-2 rounded-control border border-rule p-3">
              <div className="flex flex-wrap items-center gap-2">
                <FollowUpStanding standing={f.standing} label={f.standing === 'closed' ? f.stateLabel : undefined} />
                <span className="font-semibold">Deadline {f.dueOn}</span>
                <span className="text-sm text-ink-muted">{f.source === 'finding' ? 'from the approved finding' : 'added by staff'}</span>
              </div>
              <p>{f.expected}</p>
              {f.lastNote && <p className="text-sm text-ink-muted">Last note: {f.lastNote}</p>}
              {moving?.id === f.id ? (
                <FollowUpMoveForm f={f} move={moving.move} onDone={() => setMoving(null)} />
              ) : (
                <div className="flex flex-col gap-2 sm:flex-row sm:flex-wrap">
                  {FOLLOW_UP_MOVE_NAMES.filter((m) => f.abilities[m]).map((m) => (
                    <Button key={m} variant={m === 'escalate' ? 'danger' : 'secondary'} onClick={() => setMoving({ id: f.id, move: m })}>
                      {FOLLOW_UP_MOVE_LABELS[m]}
                    </Button>
                  ))}
                </div>
              )}
            </li>
          ))}
        </ol>
      )}
      {d && <p className="text-sm text-ink-muted">Dates follow the office’s calendar ({d.timeZone}), where today is {d.today}.</p>}
    </section>
  )
}

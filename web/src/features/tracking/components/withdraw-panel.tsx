/** Withdrawing a report, with a confirm step so it is never done by a slip. */
import { useEffect, useRef, useState } from 'react'
import { Button, buttonClass } from '@/components/ui/button'
import { FormAlert } from '@/components/ui/form-alert'
import { formProblem, type FormProblem } from '@/lib/form-errors'
import { TextAreaField } from '@/components/ui/text-area-field'
import type { ReportSource } from '../api/get-complainant-report'
import { useWithdrawReport } from '../api/withdraw-report'

export function WithdrawPanel({ source, onWithdrawn }: { source: ReportSource; onWithdrawn: () => void }) {
  const [confirming, setConfirming] = useState(false)
  const [reason, setReason] = useState('')
  const [problem, setProblem] = useState<FormProblem | null>(null)
  const withdraw = useWithdrawReport(source)
  const headingRef = useRef<HTMLHeadingElement>(null)
  const openerRef = useRef<HTMLButtonElement>(null)

  useEffect(() => {
    if (confirming) headingRef.current?.focus()
  }, [confirming])

  const cancel = () => {
    setConfirming(false)
    setProblem(null)
    requestAnimationFrame(() => openerRef.current?.focus())
  }

  const confirm = async () => {
    setProblem(null)
    try {
      await withdraw.mutateAsync(reason.trim() || undefined)
      onWithdrawn()
    } catch (error) {
      setProblem(formProblem(error))
    }
  }

  if (!confirming) {
    return (
      <div className="flex flex-col gap-2">
        <p className="text-ink-muted">If the interference has stopped or you no longer need the office's help, you can withdraw the report.</p>
        <div>
          <button ref={openerRef} type="button" className={buttonClass('danger')} onClick={() => setConfirming(true)}>
            Withdraw report
          </button>
        </div>
      </div>
    )
  }

  return (
    <div className="flex flex-col gap-4 rounded-control border-2 border-danger bg-danger-soft p-4">
      <h3 ref={headingRef} tabIndex={-1} className="text-lg font-bold focus:outline-none">
        Withdraw this report?
      </h3>
      <p>The office stops work on it and closes it as withdrawn. You can still read this page afterwards.</p>
      <TextAreaField label="Reason (optional)" name="withdraw-reason" rows={2} value={reason} onChange={(e) => setReason(e.target.value)} maxLength={2000} />
      <FormAlert problem={problem} />
      <div className="flex flex-wrap gap-3">
        <Button variant="danger" onClick={() => void confirm()} disabled={withdraw.isPending}>
          {withdraw.isPending ? 'Withdrawing…' : 'Yes, withdraw the report'}
        </Button>
        <Button variant="secondary" onClick={cancel} disabled={withdraw.isPending}>
          Keep the report
        </Button>
      </div>
    </div>
  )
}

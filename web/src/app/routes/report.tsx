/** /report — the public report form; afterwards its reference and tracking link. */
import { useState } from 'react'
import { Loading } from '@/components/ui/loading'
import { PageHeader } from '@/components/ui/page-header'
import { useAbilities, useMe } from '@/features/auth/api/get-me'
import { FieldMap } from '@/components/map'
import type { SubmittedReport } from '@/features/reports/api/submit-report'
import { ReportConfirmation } from '@/features/reports/components/report-confirmation'
import { ReportForm } from '@/features/reports/components/report-form'

export function Component() {
  const me = useMe()
  const user = me.data ?? null
  const abilities = useAbilities().data
  const [sent, setSent] = useState<{ result: SubmittedReport; email: string } | null>(null)

  if (sent) {
    return (
      <div className="max-w-3xl">
        <PageHeader title="Thank you — your report is in" />
        <ReportConfirmation result={sent.result} email={sent.email} />
      </div>
    )
  }

  return (
    <div className="max-w-3xl">
      <PageHeader
        title="Report interference"
        lead={<p>Tell us what suffers, where, and since when. No account is needed. Fields are required unless marked optional.</p>}
      />
      {me.isPending ? (
        <Loading label="Loading the form…" />
      ) : (
        <ReportForm
          contact={user && abilities?.reportAsAccount ? { name: user.name, email: user.email } : undefined}
          renderLocationPicker={({ value, onPick }) => (
            <FieldMap
              label="Map: pick where it happens"
              victim={value ? { at: value, label: 'The place you gave' } : null}
              offices="region"
              onPick={(latDeg, lonDeg) => onPick({ latDeg, lonDeg })}
            />
          )}
          onSubmitted={(result, email) => {
            setSent({ result, email })
            window.scrollTo({ top: 0 })
          }}
        />
      )}
    </div>
  )
}

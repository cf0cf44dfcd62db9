/**
 * One report as its complainant sees it: the outcome when closed, the plain steps, what was
 * reported, the conversation with the office, and what they can do (from `abilities`).
 */
import { format, parseISO } from 'date-fns'
import { useRef } from 'react'
import { Panel } from '@/components/ui/panel'
import { Sign } from '@/components/ui/sign'
import { formatFrequencyRangeHz } from '@/lib/frequency'
import { serviceLabel } from '@/lib/service-label'
import type { ComplainantReport, ReportSource } from '../api/get-complainant-report'
import { AddInformationForm } from './add-information-form'
import { EntriesList } from './entries-list'
import { MyEvidence } from './my-evidence'
import { StatusSteps } from './status-steps'
import { WithdrawPanel } from './withdraw-panel'

export function ComplainantReportView({ source, report }: { source: ReportSource; report: ComplainantReport }) {
  const outcomeRef = useRef<HTMLHeadingElement>(null)
  const closed = report.step === 'closed'
  return (
    <div className="flex flex-col gap-6">
      {closed && (
        <section aria-labelledby="outcome-title" className="flex flex-col gap-2 rounded-panel border-2 border-ok bg-ok-soft p-5">
          <h2 id="outcome-title" ref={outcomeRef} tabIndex={-1} className="flex items-center gap-2 text-2xl font-bold focus:outline-none">
            <span className="text-ok">
              <Sign kind="ok" sizePx={24} />
            </span>
            Closed: {report.resolutionLabel ?? 'case closed'}
          </h2>
          {report.closingSummary && <p className="whitespace-pre-wrap text-lg">{report.closingSummary}</p>}
          {report.closedAt && <p className="text-sm text-ink-muted">Closed on {format(parseISO(report.closedAt), 'd MMMM yyyy, HH:mm')}.</p>}
        </section>
      )}

      <Panel label="Where it stands">
        <h2 className="mb-1 text-xl font-bold">Where it stands</h2>
        <p className="mb-4 text-lg" role="status">
          {report.statusLabel}
        </p>
        <StatusSteps step={report.step} />
      </Panel>

      <Panel label="What you reported">
        <h2 className="mb-3 text-xl font-bold">What you reported</h2>
        <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-[12rem_1fr]">
          <dt className="font-semibold">Reference</dt>
          <dd className="font-mono">{report.reference}</dd>
          <dt className="font-semibold">Received</dt>
          <dd>{format(parseISO(report.receivedAt), 'd MMMM yyyy, HH:mm')}</dd>
          <dt className="font-semibold">Service</dt>
          <dd>{serviceLabel(report.service)}</dd>
          <dt className="font-semibold">Frequency</dt>
          <dd className="font-mono">{formatFrequencyRangeHz({ lowHz: report.freqLowHz, highHz: report.freqHighHz })}</dd>
          <dt className="font-semibold">Where</dt>
          <dd>{report.address}</dd>
          <dt className="font-semibold">Description</dt>
          <dd className="whitespace-pre-wrap">{report.description}</dd>
        </dl>
      </Panel>

      <Panel label="Messages and updates">
        <h2 className="mb-3 text-xl font-bold">Messages and updates</h2>
        <EntriesList entries={report.entries} />
      </Panel>

      <Panel label="Your files">
        <h2 className="mb-3 text-xl font-bold">Your files</h2>
        <MyEvidence source={source} />
      </Panel>

      {report.abilities.addInformation && (
        <Panel label="Add information">
          <h2 className="mb-3 text-xl font-bold">Add information</h2>
          <AddInformationForm source={source} />
        </Panel>
      )}

      {report.abilities.withdraw && (
        <Panel label="Withdraw">
          <h2 className="mb-3 text-xl font-bold">Withdraw</h2>
          <WithdrawPanel source={source} onWithdrawn={() => requestAnimationFrame(() => outcomeRef.current?.focus())} />
        </Panel>
      )}
    </div>
  )
}

/** The top of the case page: reference, state, priority, overdue flag, the case's key facts, and its two clocks (first response, resolution). */
import { format, parseISO } from 'date-fns'
import type { ReactNode } from 'react'
import { Link } from 'react-router-dom'
import { PriorityBadge } from '@/components/ui/priority-badge'
import type { CaseDetail } from '../api/get-case'
import { formatLatLonDeg } from '@/lib/coordinates'
import { formatFrequencyRangeHz } from '@/lib/frequency'
import { serviceLabel } from '@/lib/service-label'
import { FirstResponseMeter, ResponseMeter } from '@/components/cases/response-meter'
import { OverdueFlag, StatusTag } from '@/components/cases/status-tag'
import { paths } from '@/lib/paths'

export function CaseHeader({ detail, now }: { detail: CaseDetail; now: Date }) {
  const closed = detail.status === 'closed'
  return (
    <header className="flex flex-col gap-4">
      <title>{`${detail.reference} · Quietband`}</title>
      <div className="flex flex-col gap-2">
        <p className="font-mono text-sm uppercase tracking-wide text-ink-muted">Case · {detail.officeName} office</p>
        <h1 className="font-mono text-3xl font-semibold leading-tight">{detail.reference}</h1>
        <div className="flex flex-wrap items-center gap-2">
          <StatusTag label={detail.statusLabel} closed={closed} />
          <PriorityBadge level={detail.priority} />
          {detail.overdue && <OverdueFlag />}
        </div>
      </div>
      {closed && (
        <section aria-label="Outcome" className="rounded-control border-l-4 border-ok bg-ok-soft px-4 py-3">
          <p className="font-bold">Closed: {detail.resolutionLabel ?? 'no resolution recorded'}</p>
          {detail.mergedIntoCaseId && detail.mergedIntoReference && (
            <p>
              Merged into <Link to={paths.case.href(detail.mergedIntoCaseId)} className="font-mono">{detail.mergedIntoReference}</Link>.
            </p>
          )}
          {detail.closingSummary && <p className="mt-1 whitespace-pre-wrap">{detail.closingSummary}</p>}
        </section>
      )}
      <dl className="grid gap-x-8 gap-y-3 rounded-panel border border-rule bg-surface p-5 md:grid-cols-2">
        <Fact term="Service">{serviceLabel(detail.service)}</Fact>
        <Fact term="Frequency">
          <span className="font-mono">{formatFrequencyRangeHz({ lowHz: detail.freqLowHz, highHz: detail.freqHighHz })}</span>
        </Fact>
        <Fact term="Location">
          {detail.address}
          <span className="block font-mono text-sm text-ink-muted">{formatLatLonDeg({ latDeg: detail.latDeg, lonDeg: detail.lonDeg })}</span>
        </Fact>
        <Fact term="Office">{detail.officeName}</Fact>
        <Fact term="Investigator">{detail.investigatorName ?? <span className="text-ink-muted">Not assigned</span>}</Fact>
        <Fact term="Received">
          <time dateTime={detail.receivedAt}>{format(parseISO(detail.receivedAt), 'd MMM yyyy, HH:mm')}</time>
        </Fact>
        <Fact term="Response" className="md:col-span-2">
          <div className="grid gap-x-8 gap-y-4 md:grid-cols-2">
            <FirstResponseMeter
              status={detail.status}
              receivedAt={detail.receivedAt}
              firstResponseDueAt={detail.firstResponseDueAt}
              firstRespondedAt={detail.firstRespondedAt}
              closedAt={detail.closedAt}
              now={now}
            />
            <ResponseMeter label="Resolution" status={detail.status} receivedAt={detail.receivedAt} dueAt={detail.dueAt} closedAt={detail.closedAt} now={now} />
          </div>
        </Fact>
      </dl>
    </header>
  )
}

// a <dl> may hold only <dt>/<dd> groups wrapped in one <div> each: no other wrapper around a Fact
function Fact({ term, children, className = '' }: { term: string; children: ReactNode; className?: string }) {
  return (
    <div className={`flex flex-col ${className}`}>
      <dt className="text-sm font-semibold text-ink-muted">{term}</dt>
      <dd>{children}</dd>
    </div>
  )
}

/**
 * The case's finding as the supervisor reviews it (and as everyone on the case reads it, also
 * after closing): the source, its position on the map, the recommended action, the linked
 * calculations with their numbers, intervals, every warning, methods and library version, the
 * linked evidence files by name and hash,
 * then the earlier proposals with the supervisor's answers. Cautions stand beside it.
 */
import { format, parseISO } from 'date-fns'
import { EnforcementCaution } from '@/components/cautions/enforcement-caution'
import { EstimateCaution } from '@/components/cautions/estimate-caution'
import { FieldMap } from '@/components/map'
import { QueryError } from '@/components/ui/query-error'
import { shortHash } from '@/lib/case-evidence'
import { formatLatLonDeg } from '@/lib/coordinates'
import type { CaseDetail } from '../api/get-case'
import { useFindings, type FindingView } from '../api/get-findings'
import { LinkedCalculation } from './calculation-summary'

const when = (at: string) => format(parseISO(at), 'd MMM yyyy, HH:mm')

function FindingDetails({ finding, detail, withMap }: { finding: FindingView; detail: CaseDetail; withMap: boolean }) {
  const pos = finding.sourcePosition
  return (
    <div className="flex flex-col gap-3">
      <p className="text-sm text-ink-muted">
        Proposed by {finding.author.name} on <time dateTime={finding.at}>{when(finding.at)}</time>
      </p>
      <dl className="grid gap-x-4 gap-y-2 sm:grid-cols-[12rem_minmax(0,1fr)]">
        <dt className="font-semibold">Source</dt>
        <dd className="whitespace-pre-wrap">{finding.sourceDescription}</dd>
        <dt className="font-semibold">Source position</dt>
        <dd>{pos ? formatLatLonDeg(pos) : 'Not given'}</dd>
        <dt className="font-semibold">Operator or licensee</dt>
        <dd>{finding.operator ?? 'Not known'}</dd>
        {finding.authorisedStationId && (
          <>
            <dt className="font-semibold">Authorised station</dt>
            <dd className="break-all">{finding.authorisedStationId}</dd>
          </>
        )}
        <dt className="font-semibold">Recommended action</dt>
        <dd>{finding.recommendedActionLabel}</dd>
        <dt className="font-semibold">Compliance deadline</dt>
        <dd>{finding.complianceDeadline ? format(parseISO(finding.complianceDeadline), 'd MMM yyyy') : 'None set'}</dd>
      </dl>
      <h3 className="font-semibold">Summary</h3>
      <p className="whitespace-pre-wrap">{finding.summary}</p>
      {withMap && pos && (
        <FieldMap
          label={`Map of the source in the finding on ${detail.reference}`}
          victim={{ at: { latDeg: detail.latDeg, lonDeg: detail.lonDeg } }}
          estimatedSource={{ at: pos, label: 'Source in the finding' }}
          heightPx={320}
        />
      )}
      <h3 className="font-semibold">Calculations it rests on</h3>
      {finding.calculations.length === 0 ? (
        <p className="text-ink-muted">No calculations linked.</p>
      ) : (
        <div className="flex flex-col gap-3">
          {finding.calculations.map((c) => (
            <LinkedCalculation key={c.id} calc={c} />
          ))}
        </div>
      )}
      <h3 className="font-semibold">Evidence files it rests on</h3>
      {finding.evidence.length === 0 ? (
        <p className="text-ink-muted">No evidence files linked.</p>
      ) : (
        <ul aria-label="Linked evidence files" className="flex flex-col gap-1">
          {finding.evidence.map((f) => (
            <li key={f.id} className="flex flex-wrap items-baseline gap-x-3 break-all">
              <span className="font-semibold">{f.name}</span>
              <span className="font-mono text-sm" title={`SHA-256 ${f.sha256}`}>
                SHA-256 {shortHash(f.sha256)}…
              </span>
              {f.removed && <span className="rounded-control border border-field px-2 py-0.5 text-sm font-semibold">Removed from the case since</span>}
            </li>
          ))}
        </ul>
      )}
      {finding.review && (
        <p className="rounded-control border-l-4 border-rule bg-paper px-3 py-2 text-sm">
          <span className="font-semibold">{finding.review.outcome === 'returned' ? 'Sent back' : 'Approved'}</span> by {finding.review.by} on {when(finding.review.at)}
          {finding.review.comments && <>: {finding.review.comments}</>}
        </p>
      )}
    </div>
  )
}

export function FindingSummary({ detail }: { detail: CaseDetail }) {
  const query = useFindings(detail.id)
  const underReview = detail.status === 'finding_proposed'
  if (query.isPending) return null
  if (query.isError) return <QueryError error={query.error} what="the finding" onRetry={() => void query.refetch()} />
  const { current, earlier } = query.data
  if (!current) return null
  return (
    <section aria-labelledby="finding-heading" className={`flex flex-col gap-4 rounded-panel border bg-surface p-5 ${underReview ? 'border-2 border-signal' : 'border-rule'}`}>
      <h2 id="finding-heading" className="text-xl font-bold">
        {underReview ? 'Finding awaiting review' : detail.status === 'closed' ? 'Finding' : 'Latest proposed finding'}
      </h2>
      <FindingDetails finding={current} detail={detail} withMap />
      <EnforcementCaution />
      <EstimateCaution />
      {earlier.length > 0 && (
        <details className="rounded-control border border-rule">
          <summary className="flex min-h-11 cursor-pointer items-center px-3 font-semibold">Earlier proposals ({earlier.length})</summary>
          <div className="flex flex-col gap-4 border-t border-rule p-3">
            {earlier.map((f) => (
              <FindingDetails key={f.id} finding={f} detail={detail} withMap={false} />
            ))}
          </div>
        </details>
      )}
    </section>
  )
}

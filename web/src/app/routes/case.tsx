/** /cases/:id — one case: its header, the actions the viewer may take, the report and its timeline. */
import { Link, useParams } from 'react-router-dom'
import { Loading } from '@/components/ui/loading'
import { Notice } from '@/components/ui/notice'
import { PageHeader } from '@/components/ui/page-header'
import { QueryError } from '@/components/ui/query-error'
import { useCase } from '@/features/case-page/api/get-case'
import { CaseActionsPanel } from '@/features/case-page/components/case-actions-panel'
import { CaseFileButton } from '@/features/case-page/components/case-file-button'
import { CaseHeader } from '@/features/case-page/components/case-header'
import { CaseReportDetails } from '@/features/case-page/components/case-report-details'
import { CaseTimeline } from '@/features/case-page/components/case-timeline'
import { FindingSummary } from '@/features/case-page/components/finding-summary'
import { TrackingLinksRevoke } from '@/features/case-page/components/tracking-links-revoke'
import { LegalHoldPanel } from '@/features/retention/components/legal-hold-panel'
import { MeasurementsSection } from '@/features/measurements/components/measurements-section'
import { EvidenceSection } from '@/features/evidence/components/evidence-section'
import { ResponsiblePartySection } from '@/features/follow-ups/components/responsible-party-section'
import { FollowUpsSection } from '@/features/follow-ups/components/follow-ups-section'
import { Workbench } from '@/features/estimates/workbench/workbench'
import { useNow } from '@/lib/use-now'
import { isApiError } from '@/lib/api-client'
import { paths } from '@/lib/paths'

export function Component() {
  const { id = '' } = useParams()
  const query = useCase(id)
  const now = useNow()
  const detail = query.data

  if (query.isPending) return <Loading label="Loading the case…" />
  if (!detail) {
    const missing = isApiError(query.error) && query.error.status === 404
    return (
      <div className="max-w-2xl">
        <PageHeader title={missing ? 'Case not found' : 'Case'} />
        {missing ? (
          <Notice tone="danger" title="There is no such case in your office." live>
            <p>
              It may belong to another office, or the link is wrong. <Link to={paths.cases.href()}>Go to the case list</Link>.
            </p>
          </Notice>
        ) : (
          <QueryError error={query.error} what="the case" onRetry={() => void query.refetch()} />
        )}
      </div>
    )
  }

  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-col gap-3 sm:flex-row sm:items-start sm:justify-between">
        <p>
          <Link to={paths.cases.href()}>Back to the case list</Link>
        </p>
        <CaseFileButton detail={detail} />
      </div>
      <CaseHeader detail={detail} now={now} />
      <Workbench detail={detail} />
      <div className="grid items-start gap-6 lg:grid-cols-[minmax(0,1fr)_26rem]">
        <div className="flex flex-col gap-6 lg:col-start-2 lg:row-start-1">
          <CaseActionsPanel detail={detail} reload={() => void query.refetch()} reloading={query.isFetching} />
          <TrackingLinksRevoke detail={detail} />
          <LegalHoldPanel caseId={detail.id} />
        </div>
        <div className="flex flex-col gap-6 lg:col-start-1 lg:row-start-1">
          <FindingSummary detail={detail} />
          <CaseReportDetails detail={detail} />
          <CaseTimeline events={detail.timeline} />
        </div>
      </div>
      {/* full width: the measurement form keeps its live levels beside the fields on a wide screen */}
      <MeasurementsSection caseId={detail.id} officeId={detail.officeId} casePoint={{ latDeg: detail.latDeg, lonDeg: detail.lonDeg }} />
      <EvidenceSection caseId={detail.id} />
      <div className="grid items-start gap-6 lg:grid-cols-2">
        <ResponsiblePartySection caseId={detail.id} />
        <FollowUpsSection caseId={detail.id} />
      </div>
    </div>
  )
}

/** What the complainant reported, and how to reach them. */
import { format, parseISO } from 'date-fns'
import type { ReactNode } from 'react'
import { EXPERIENCE_LABELS, OCCURRENCE_LABELS, type Experience, type OccurrencePattern } from '@shared/domain/services'
import type { CaseDetail } from '../api/get-case'

export function CaseReportDetails({ detail }: { detail: CaseDetail }) {
  const c = detail.complainant
  return (
    <div className="flex flex-col gap-5">
      <section aria-labelledby="report-heading" className="rounded-panel border border-rule bg-surface p-5">
        <h2 id="report-heading" className="mb-3 text-xl font-bold">
          The report
        </h2>
        <dl className="grid gap-x-4 gap-y-2 sm:grid-cols-[11rem_1fr]">
          <Row term="Experience">{EXPERIENCE_LABELS[detail.experience as Experience] ?? detail.experience}</Row>
          <Row term="Since">{formatDate(detail.sinceDate)}</Row>
          <Row term="When">
            {OCCURRENCE_LABELS[detail.pattern as OccurrencePattern] ?? detail.pattern}
            {detail.patternDetail && <> — {detail.patternDetail}</>}
          </Row>
          <Row term="Licence or station">{detail.licenceRef ?? <span className="text-ink-muted">Not given</span>}</Row>
          <Row term="Description">
            <span className="whitespace-pre-wrap">{detail.description}</span>
          </Row>
        </dl>
      </section>
      <section aria-labelledby="complainant-heading" className="rounded-panel border border-rule bg-surface p-5">
        <h2 id="complainant-heading" className="mb-3 text-xl font-bold">
          Complainant
        </h2>
        <dl className="grid gap-x-4 gap-y-2 sm:grid-cols-[11rem_1fr]">
          <Row term="Name">{c.name}</Row>
          {c.organisation && <Row term="Organisation">{c.organisation}</Row>}
          <Row term="E-mail">
            <a href={`mailto:${c.email}`} className="font-mono break-all">
              {c.email}
            </a>
          </Row>
          {c.phone && (
            <Row term="Phone">
              <a href={`tel:${c.phone}`} className="font-mono">
                {c.phone}
              </a>
            </Row>
          )}
          <Row term="Account">{c.hasAccount ? 'Has a complainant account' : 'Reported without an account'}</Row>
        </dl>
      </section>
    </div>
  )
}

function Row({ term, children }: { term: string; children: ReactNode }) {
  return (
    <>
      <dt className="font-semibold">{term}</dt>
      <dd className="mb-1">{children}</dd>
    </>
  )
}

function formatDate(isoDate: string): string {
  const d = parseISO(isoDate)
  return Number.isNaN(d.getTime()) ? isoDate : format(d, 'd MMMM yyyy')
}

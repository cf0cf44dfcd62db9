/**
 * One estimate's result, computed on the server (a stored record) or in the browser (the quick
 * calculator): the kind's figures, its warnings beside it, the method and source of every step,
 * the library version, and the standing caution.
 */
import {
  CALCULATION_KIND_LABELS,
  candidateSourcesOutputSchema,
  coexistenceOutputSchema,
  complianceVerdictOutputSchema,
  eirpFitOutputSchema,
  eirpSinglePointOutputSchema,
  exposureScreeningOutputSchema,
  sourceLocateOutputSchema,
} from '@shared/calculations'
import { EstimateCaution } from '@/components/cautions/estimate-caution'
import { Notice } from '@/components/ui/notice'
import type { EstimateOutcome } from '../lib/run-estimate'
import { fmt } from '../lib/units'
import { CoexistenceResult } from './coexistence-result'
import { ExposureResult } from './exposure-result'
import { FitResult } from './fit-result'
import { LocateResult } from './locate-result'
import { CandidatesTable, type Candidate } from './candidates-table'
import { MethodsList, ResultWarnings } from './result-parts'
import { SinglePointResult } from './single-point-result'
import { VerdictResult } from './verdict-result'

function KindFigures({ outcome, onUseLicence }: { outcome: EstimateOutcome; onUseLicence?: (station: Candidate) => void }) {
  const v = outcome.outputs.value
  if (outcome.kind === 'eirp_fit') {
    const p = eirpFitOutputSchema.safeParse(v)
    if (p.success) return <FitResult value={p.data} />
  }
  if (outcome.kind === 'source_locate') {
    const p = sourceLocateOutputSchema.safeParse(v)
    if (p.success) return <LocateResult value={p.data} />
  }
  if (outcome.kind === 'coexistence') {
    const p = coexistenceOutputSchema.safeParse(v)
    if (p.success) return <CoexistenceResult value={p.data} />
  }
  if (outcome.kind === 'exposure_screening') {
    const p = exposureScreeningOutputSchema.safeParse(v)
    if (p.success) return <ExposureResult value={p.data} />
  }
  if (outcome.kind === 'candidate_sources') {
    const p = candidateSourcesOutputSchema.safeParse(v)
    if (p.success) return <CandidatesTable value={p.data} onUseLicence={onUseLicence} />
  }
  if (outcome.kind === 'eirp_single_point') {
    const p = eirpSinglePointOutputSchema.safeParse(v)
    if (p.success) return <SinglePointResult value={p.data} />
  }
  if (outcome.kind === 'compliance_verdict') {
    const p = complianceVerdictOutputSchema.safeParse(v)
    if (p.success) return <VerdictResult value={p.data} />
  }
  // a kind this page does not lay out yet: its interval and raw figures, still with every warning
  const i = outcome.outputs.interval
  return (
    <div className="flex flex-col gap-2">
      {i && <p>95 % interval of {i.quantity}: {fmt(i.low, '')} to {fmt(i.high, '')} ({i.basis})</p>}
      <pre className="overflow-x-auto rounded-control bg-paper p-3 text-sm">{JSON.stringify(v, null, 2)}</pre>
    </div>
  )
}

const kindLabel = (kind: string) => (CALCULATION_KIND_LABELS as Record<string, string | undefined>)[kind] ?? kind

export function ResultView({ outcome, title, onUseLicence }: { outcome: EstimateOutcome; title?: string; onUseLicence?: (station: Candidate) => void }) {
  return (
    <section aria-label={title ?? 'Result'} className="flex min-w-0 flex-col gap-4">
      <h3 className="text-xl font-semibold">{title ?? `Result: ${kindLabel(outcome.kind)}`}</h3>
      {outcome.record ? (
        <p className="text-sm text-ink-muted">
          Stored by {outcome.record.author.name} on {new Date(outcome.record.at).toLocaleString('en-GB')}; computed by the server.
        </p>
      ) : (
        <Notice tone="info">
          <p>Computed in this browser with the radio library {outcome.libraryVersion}. Nothing was stored.</p>
        </Notice>
      )}
      <KindFigures outcome={outcome} onUseLicence={onUseLicence} />
      <ResultWarnings warnings={outcome.warnings} />
      <EstimateCaution />
      <MethodsList methods={outcome.methods} libraryVersion={outcome.libraryVersion} />
    </section>
  )
}

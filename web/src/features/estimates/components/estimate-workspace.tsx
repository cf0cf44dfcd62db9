/**
 * The form and, beside it on wide screens (under it on phones), the result of the last run.
 * A candidate station's "Use this licence as the limit" switches the form to the verdict with
 * that licence filled in.
 */
import { useRef } from 'react'
import { complianceVerdictForm, withLicenceLimit } from '../forms/compliance-verdict-form'
import type { EstimateSources, KindForm } from '../forms/kind-form'
import type { FormState } from '../lib/form-state'
import type { EstimateOutcome, RunEstimate } from '../lib/run-estimate'
import { ResultView } from '../results/result-view'
import { EstimatePanel } from './estimate-panel'

export interface EstimateWorkspaceProps {
  kind: string
  state: FormState
  onChange: (kind: string, state: FormState) => void
  run: RunEstimate
  outcome: EstimateOutcome | null
  onOutcome: (outcome: EstimateOutcome | null) => void
  sources?: EstimateSources
  runLabel: string
  idPrefix: string
  forms: KindForm[]
  /** Shown where the result goes before there is one. */
  emptyResult: string
}

export function EstimateWorkspace(p: EstimateWorkspaceProps) {
  const formTop = useRef<HTMLDivElement>(null)
  return (
    <div className="grid min-w-0 grid-cols-1 items-start gap-6 xl:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
      <div ref={formTop} className="min-w-0">
        <EstimatePanel
          kind={p.kind}
          state={p.state}
          onChange={(k, s) => {
            // the outcome goes first: in the calculator both write the URL, and the form's write must be the last
            if (p.outcome && k !== p.outcome.kind) p.onOutcome(null)
            p.onChange(k, s)
          }}
          run={p.run}
          onRan={p.onOutcome}
          sources={p.sources}
          runLabel={p.runLabel}
          idPrefix={p.idPrefix}
          forms={p.forms}
        />
      </div>
      <div className="min-w-0" aria-live="polite">
        {p.outcome ? (
          <ResultView
            outcome={p.outcome}
            onUseLicence={(candidate) => {
              const base = p.kind === complianceVerdictForm.kind ? p.state : complianceVerdictForm.initial
              p.onOutcome(null)
              p.onChange(complianceVerdictForm.kind, withLicenceLimit(base, candidate))
              formTop.current?.scrollIntoView?.({ behavior: 'smooth', block: 'start' })
            }}
          />
        ) : (
          <p className="rounded-control border border-dashed border-field p-4 text-ink-muted">{p.emptyResult}</p>
        )}
      </div>
    </div>
  )
}

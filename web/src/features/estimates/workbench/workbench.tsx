/**
 * The estimates workbench of a case being worked: pick measurements and a kind, fill the form,
 * run — the server computes and stores the record, which joins the case's calculations (newest
 * first). Folded until opened, so the case page asks for nothing more until someone works here.
 */
import { useState } from 'react'
import type { CaseDetail } from '@shared/schemas/views'
import { Loading } from '@/components/ui/loading'
import { QueryError } from '@/components/ui/query-error'
import { isApiError } from '@/lib/api-client'
import { useCalculations } from '../api/get-calculations'
import { useCaseMeasurements } from '../api/get-measurements'
import { useStoreCalculation } from '../api/store-calculation'
import { EstimateWorkspace } from '../components/estimate-workspace'
import { complianceVerdictForm, withLicenceLimit } from '../forms/compliance-verdict-form'
import type { EstimateSources } from '../forms/kind-form'
import { KIND_FORMS } from '../forms/registry'
import { recordSummary } from '../lib/record-summary'
import { inputErrorFromApi, outcomeOfRecord, type EstimateOutcome, type RunEstimate } from '../lib/run-estimate'
import type { Candidate } from '../results/candidates-table'
import { CalculationList } from './calculation-list'
import { CaseMap } from './case-map'
import { MeasurementChecklist, measurementLabel } from './measurement-checklist'
import { useKeptForm } from './use-kept-form'


function WorkbenchBody({ detail }: { detail: CaseDetail }) {
  const first = KIND_FORMS[0]!
  const [form, setForm] = useKeptForm(detail.id, { kind: first.kind, state: first.initial })
  const [outcome, setOutcome] = useState<EstimateOutcome | null>(null)
  const [chosen, setChosen] = useState<string[]>([])
  const calculations = useCalculations(detail.id)
  const measurements = useCaseMeasurements(detail.id)
  const store = useStoreCalculation(detail.id)

  const run: RunEstimate = async (request) => {
    try {
      return outcomeOfRecord(await store.mutateAsync(request))
    } catch (e) {
      throw inputErrorFromApi(e) ?? e
    }
  }

  // a case whose measurements cannot be listed (none yet, or the list is not served) still takes typed levels
  const measurementList = measurements.data?.measurements ?? []
  const records = calculations.data ?? []
  const sources: EstimateSources = {
    measurements: measurementList.filter((m) => chosen.includes(m.id) && m.supersededById === null).map((m) => ({ id: m.id, label: measurementLabel(m) })),
    eirpEstimates: records.filter((r) => r.kind === 'eirp_single_point' || r.kind === 'eirp_fit').map((r) => ({ id: r.id, label: `${recordSummary(r)} (${new Date(r.at).toLocaleString('en-GB', { dateStyle: 'short', timeStyle: 'short' })})` })),
    victim: { latDeg: detail.latDeg, lonDeg: detail.lonDeg, lowFreqHz: detail.freqLowHz, highFreqHz: detail.freqHighHz },
  }
  const useLicence = (c: Candidate) => {
    setOutcome(null)
    setForm({ kind: complianceVerdictForm.kind, state: withLicenceLimit(form.kind === complianceVerdictForm.kind ? form.state : complianceVerdictForm.initial, c) })
  }

  return (
    <div className="flex min-w-0 flex-col gap-6 px-4 pb-4">
      {measurements.isPending ? (
        <Loading label="Loading the measurements…" />
      ) : measurements.isError && !(isApiError(measurements.error) && measurements.error.status === 404) ? (
        <QueryError error={measurements.error} what="the measurements" onRetry={() => void measurements.refetch()} />
      ) : (
        <MeasurementChecklist measurements={measurementList} chosen={chosen} onChange={setChosen} />
      )}
      <EstimateWorkspace
        kind={form.kind}
        state={form.state}
        onChange={(kind, state) => setForm({ kind, state })}
        run={run}
        outcome={outcome}
        onOutcome={setOutcome}
        sources={sources}
        runLabel="Run and store on the case"
        idPrefix="bench"
        forms={KIND_FORMS}
        emptyResult="The stored result appears here once you run. Every run is kept on the case with its inputs, warnings and the library version."
      />
      <section aria-labelledby="bench-calculations" className="flex min-w-0 flex-col gap-3">
        <h3 id="bench-calculations" className="text-xl font-semibold">
          Calculations of this case
        </h3>
        {calculations.isPending ? (
          <Loading label="Loading the calculations…" />
        ) : calculations.isError ? (
          <QueryError error={calculations.error} what="the calculations" onRetry={() => void calculations.refetch()} />
        ) : (
          <CalculationList records={records} onUseLicence={useLicence} />
        )}
      </section>
      <CaseMap detail={detail} measurements={measurementList} records={records} />
    </div>
  )
}

/** Mounted by the case page; shows only while the case is being worked (assigned, field work, sent back). */
export function Workbench({ detail }: { detail: CaseDetail }) {
  const [open, setOpen] = useState(false)
  // the server says who may run estimates now: the assigned investigator or the office supervisor, while the case is worked
  if (!detail.abilities.storeCalculation) return null
  return (
    <section aria-label="Estimates workbench" className="rounded-panel border border-rule bg-surface">
      <details onToggle={(e) => setOpen(e.currentTarget.open)}>
        <summary className="flex min-h-11 cursor-pointer flex-col px-4 py-3">
          <span className="text-xl font-semibold">Estimates workbench</span>
          <span className="text-sm text-ink-muted">EIRP from a level, candidate stations, compliance verdicts; each run is stored on the case.</span>
        </summary>
        {open && <WorkbenchBody detail={detail} />}
      </details>
    </section>
  )
}

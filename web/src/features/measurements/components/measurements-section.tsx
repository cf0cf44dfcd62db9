/**
 * A case's measurements: the list (newest corrections beside what they supersede) and, for the
 * assigned investigator and the supervisor while the case is worked, the form to record, edit
 * or correct one.
 */
import { useState } from 'react'
import { EstimateCaution } from '@/components/cautions/estimate-caution'
import { Button } from '@/components/ui/button'
import { Loading } from '@/components/ui/loading'
import { QueryError } from '@/components/ui/query-error'
import { useCaseEvidence } from '@/lib/case-evidence'
import { useMeasurements } from '../api/get-measurements'
import { useOfficeEquipment } from '../api/get-office-equipment'
import { MeasurementCard } from './measurement-card'
import { MeasurementForm, type FormMode } from './measurement-form'

export function MeasurementsSection({ caseId, officeId, casePoint }: { caseId: string; officeId: string; casePoint: { latDeg: number; lonDeg: number } }) {
  const list = useMeasurements(caseId)
  const evidence = useCaseEvidence(caseId)
  const fileNames = new Map((evidence.data?.evidence ?? []).map((f) => [f.id, f.originalName]))
  const [mode, setMode] = useState<FormMode | null>(null)
  const equipment = useOfficeEquipment(officeId, mode !== null)
  const open = (m: FormMode) => {
    setMode(m)
    requestAnimationFrame(() => document.getElementById(`measurement-form-${caseId}`)?.scrollIntoView?.({ block: 'start' }))
  }
  const measurements = list.data?.measurements ?? []

  return (
    <section aria-labelledby={`measurements-${caseId}`} className="flex flex-col gap-4 rounded-panel border border-rule bg-surface p-4 sm:p-5">
      <header className="flex flex-wrap items-center justify-between gap-3">
        <h2 id={`measurements-${caseId}`} className="text-xl font-semibold">
          Measurements
        </h2>
        {list.data?.abilities.record && !mode && <Button onClick={() => open({ kind: 'record' })} className="w-full sm:w-auto">Record a measurement</Button>}
      </header>
      {list.isPending && <Loading label="Loading the measurements…" />}
      {list.isError && <QueryError error={list.error} what="the measurements" onRetry={() => void list.refetch()} />}
      {mode && (
        <div id={`measurement-form-${caseId}`}>
          {equipment.isPending ? (
            <Loading label="Loading the office’s antennas and instruments…" />
          ) : (
            <MeasurementForm caseId={caseId} mode={mode} equipment={equipment.data?.items ?? []} casePoint={casePoint} onDone={() => setMode(null)} />
          )}
          {equipment.isError && <p className="text-sm text-danger">The equipment register could not be loaded: type the antenna’s gain or factor instead.</p>}
        </div>
      )}
      {list.data && measurements.length === 0 && <p className="text-ink-muted">No measurement recorded yet.</p>}
      {measurements.length > 0 && (
        <>
          <EstimateCaution />
          <ol aria-label="Measurements, by the time they were taken" className="flex flex-col gap-3">
            {measurements.map((m, i) => (
              <MeasurementCard key={m.id} m={m} number={i + 1} evidenceName={m.evidenceFileId ? fileNames.get(m.evidenceFileId) : undefined} onEdit={() => open({ kind: 'edit', measurement: m })} onCorrect={() => open({ kind: 'correct', measurement: m })} />
            ))}
          </ol>
        </>
      )}
    </section>
  )
}

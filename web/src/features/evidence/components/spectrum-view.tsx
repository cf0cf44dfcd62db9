/**
 * The spectrum of a processed evidence file: the display trace (level against frequency) with
 * its peaks marked, zoom and a cursor readout, another processed file of the case over it when
 * picked, a band picked with two frequencies (shaded) whose channel power and occupied bandwidth
 * the server computes on the stored display trace, and the spectrogram under the plot.
 */
import { useMemo, useState, type FormEvent } from 'react'
import { readQuantity } from '@shared/schemas/quantities'
import type { EvidenceBandView } from '@shared/schemas/spectrum'
import { SpectrumChart } from '@/components/charts'
import { Button } from '@/components/ui/button'
import { Loading } from '@/components/ui/loading'
import { QuantityField, emptyQuantity, type QuantityValue } from '@/components/ui/quantity-field'
import { QueryError } from '@/components/ui/query-error'
import { SelectField } from '@/components/ui/select-field'
import { isApiError } from '@/lib/api-client'
import { useAnalysis } from '../api/get-analysis'
import { useEvidence, type Evidence } from '../api/get-evidence'
import { useMeasureBand } from '../api/measure-band'
import { BandResult } from './band-result'
import { SpectrumPeaksTable } from './spectrum-peaks-table'

const SPECTRUM_KINDS: Evidence['kind'][] = ['spectrum_capture', 'iq_recording']

/** A file whose spectrum can be shown: a spectrum kind, processed, still on the case. */
export const hasSpectrum = (e: Evidence) => SPECTRUM_KINDS.includes(e.kind) && e.processing.state === 'done' && !e.removed

import { hzWords, mhz } from './spectrum-format'

type BandErrors = { lowFreqHz?: string; highFreqHz?: string; form?: string }

export function SpectrumView({ caseId, evidence }: { caseId: string; evidence: Evidence }) {
  const analysis = useAnalysis(evidence.id)
  const files = useEvidence(caseId)
  const [otherId, setOtherId] = useState('')
  const other = useAnalysis(otherId === '' ? null : otherId)
  const [low, setLow] = useState<QuantityValue>(emptyQuantity('frequency'))
  const [high, setHigh] = useState<QuantityValue>(emptyQuantity('frequency'))
  const [errors, setErrors] = useState<BandErrors>({})
  const [result, setResult] = useState<EvidenceBandView | null>(null)
  const measure = useMeasureBand(evidence.id)

  const a = analysis.data?.analysis
  const summary = a?.summary
  const trace = a?.displayTrace
  const others = (files.data?.evidence ?? []).filter((f) => f.id !== evidence.id && hasSpectrum(f))
  const otherAnalysis = other.data?.analysis
  const otherUsable = !!otherAnalysis?.displayTrace && otherAnalysis.summary?.levelUnit === summary?.levelUnit
  const otherName = others.find((f) => f.id === otherId)?.originalName ?? 'Second file'

  const main = useMemo(() => (trace ? { label: evidence.originalName, freqHz: trace.freqHz, level: trace.levelDbm } : null), [trace, evidence.originalName])
  const overlay = useMemo(
    () => (otherUsable && otherAnalysis?.displayTrace ? { label: otherName, freqHz: otherAnalysis.displayTrace.freqHz, level: otherAnalysis.displayTrace.levelDbm } : null),
    [otherUsable, otherAnalysis, otherName],
  )
  const peaks = useMemo(() => (summary?.peaks ?? []).map((p) => ({ freqHz: p.freqHz, level: p.levelDbm })), [summary])
  const band = result ? { lowFreqHz: result.lowFreqHz, highFreqHz: result.highFreqHz } : null

  if (analysis.isPending) return <Loading label="Loading the spectrum…" />
  if (analysis.isError) return <QueryError error={analysis.error} what="the spectrum" onRetry={() => void analysis.refetch()} />
  if (!a || !summary || !trace || !main) return <p className="text-ink-muted">This file has no finished spectrum analysis.</p>
  const unit = summary.levelUnit
  const spacingHz = (trace.freqHz[trace.freqHz.length - 1]! - trace.freqHz[0]!) / Math.max(1, trace.freqHz.length - 1)
  const resolution = `${trace.freqHz.length} points about ${hzWords(spacingHz)} apart${trace.decimated ? `, reduced from ${trace.sourcePointCount} (each bucket's lowest and highest level kept)` : ''}`

  const submit = (ev: FormEvent) => {
    ev.preventDefault()
    const lo = readQuantity(low.figure.trim() === '' ? '' : `${low.figure.trim()} ${low.unit}`, 'frequency', { label: 'the low edge', min: 0, minExclusive: true })
    const hi = readQuantity(high.figure.trim() === '' ? '' : `${high.figure.trim()} ${high.unit}`, 'frequency', { label: 'the high edge', min: 0, minExclusive: true })
    const next: BandErrors = {}
    if (!lo.ok) next.lowFreqHz = lo.message
    if (!hi.ok) next.highFreqHz = hi.message
    if (lo.ok && hi.ok && !(hi.value > lo.value)) next.highFreqHz = 'The high edge of the band must be above its low edge.'
    setErrors(next)
    if (!lo.ok || !hi.ok || next.highFreqHz) return
    measure.mutate(
      { lowFreqHz: lo.value, highFreqHz: hi.value },
      {
        onSuccess: (r) => setResult(r.band),
        onError: (err) => {
          if (!isApiError(err)) return setErrors({ form: 'The band could not be measured.' })
          const byField: BandErrors = {}
          for (const d of err.details) {
            if (d.path === 'lowFreqHz' || d.path === 'highFreqHz') byField[d.path] = [byField[d.path], d.message].filter(Boolean).join(' ')
          }
          setErrors(Object.keys(byField).length > 0 ? byField : { form: err.message })
        },
      },
    )
  }

  return (
    <section aria-label={`Spectrum of ${evidence.originalName}`} className="flex min-w-0 flex-col gap-4 rounded-control border border-rule p-3 sm:p-4">
      <dl className="grid grid-cols-[8rem_minmax(0,1fr)] gap-x-4 gap-y-1 text-sm">
        <dt className="font-semibold">Span</dt>
        <dd>
          {mhz(summary.startHz)} to {mhz(summary.stopHz)}
        </dd>
        <dt className="font-semibold">Level unit</dt>
        <dd>{unit === 'dBFS' ? 'dBFS (relative to the recorder’s full scale, not calibrated)' : 'dBm'}</dd>
        <dt className="font-semibold">Display trace</dt>
        <dd>{resolution}</dd>
        <dt className="font-semibold">Noise floor</dt>
        <dd>
          {summary.noiseFloorDbm.toFixed(1)} {unit} ({summary.noiseFloorBasis})
        </dd>
      </dl>

      {others.length > 0 && (
        <SelectField
          label="Compare with another file of the case"
          name={`compare-${evidence.id}`}
          value={otherId}
          onChange={(e) => setOtherId(e.target.value)}
          options={[{ value: '', label: 'No second trace' }, ...others.map((f) => ({ value: f.id, label: f.originalName }))]}
        />
      )}
      {other.isError && <QueryError error={other.error} what="the second file's spectrum" onRetry={() => void other.refetch()} />}
      {otherAnalysis?.summary && !otherUsable && (
        <p className="text-sm text-danger">
          {otherName} is in {otherAnalysis.summary.levelUnit}, this file in {unit}: the two cannot share one level axis.
        </p>
      )}

      <SpectrumChart title={`Spectrum of ${evidence.originalName}`} levelUnit={unit} main={main} overlay={overlay} peaks={peaks} band={band} spectrogram={a.spectrogram} />

      <SpectrumPeaksTable peaks={summary.peaks} levelUnit={unit} />

      <form onSubmit={submit} noValidate className="flex flex-col gap-3" aria-label="Measure a band">
        <h4 className="font-semibold">Measure a band</h4>
        <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
          <QuantityField label="Low edge" name={`band-low-${evidence.id}`} kind="frequency" value={low} onChange={setLow} error={errors.lowFreqHz} placeholder="433.85" />
          <QuantityField label="High edge" name={`band-high-${evidence.id}`} kind="frequency" value={high} onChange={setHigh} error={errors.highFreqHz} placeholder="433.99" />
        </div>
        {errors.form && (
          <p role="alert" className="text-sm text-danger">
            {errors.form}
          </p>
        )}
        <Button type="submit" className="w-full sm:w-auto" disabled={measure.isPending}>
          {measure.isPending ? 'Measuring…' : 'Measure the band'}
        </Button>
      </form>

      {result && <BandResult caseId={caseId} result={result} />}
    </section>
  )
}

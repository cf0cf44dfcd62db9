/**
 * "Save as a measurement": a band's channel power in dBm (a calibrated trace only) kept as a
 * measurement of the case, with the time and place it was taken, which the file does not hold.
 * Only the band's edges and the time and place are sent: the server computes the channel power
 * again itself and stores it with the band's centre and width, the evidence file, the method,
 * its basis and the radio library version. The figure shown here is never sent.
 */
import { useState, type FormEvent } from 'react'
import type { BandMeasurementRequestInput } from '@shared/schemas/band-measurement'
import { readQuantity } from '@shared/schemas/quantities'
import type { EvidenceBandView } from '@shared/schemas/spectrum'
import { Button } from '@/components/ui/button'
import { QuantityField, emptyQuantity, type QuantityValue } from '@/components/ui/quantity-field'
import { TextField } from '@/components/ui/text-field'
import { isApiError } from '@/lib/api-client'
import { fromLocalInput } from '@/lib/local-time'
import { useSaveBandMeasurement } from '../api/save-band-measurement'


type Errors = { takenAt?: string; latDeg?: string; lonDeg?: string; form?: string }

export function SaveBandForm({ caseId, band }: { caseId: string; band: EvidenceBandView }) {
  const save = useSaveBandMeasurement(caseId, band.evidenceId)
  const [takenAtLocal, setTakenAtLocal] = useState('')
  const [lat, setLat] = useState<QuantityValue>(emptyQuantity('angle'))
  const [lon, setLon] = useState<QuantityValue>(emptyQuantity('angle'))
  const [errors, setErrors] = useState<Errors>({})
  const [saved, setSaved] = useState(false)

  const submit = (ev: FormEvent) => {
    ev.preventDefault()
    const takenAt = fromLocalInput(takenAtLocal)
    const la = readQuantity(`${lat.figure.trim()} ${lat.unit}`.trim(), 'angle', { label: 'the latitude', min: -90, max: 90 })
    const lo = readQuantity(`${lon.figure.trim()} ${lon.unit}`.trim(), 'angle', { label: 'the longitude', min: -180, max: 180 })
    const next: Errors = {}
    if (!takenAt) next.takenAt = 'Enter the date and time the file was recorded.'
    if (lat.figure.trim() === '') next.latDeg = 'Enter the latitude.'
    else if (!la.ok) next.latDeg = la.message
    if (lon.figure.trim() === '') next.lonDeg = 'Enter the longitude.'
    else if (!lo.ok) next.lonDeg = lo.message
    setErrors(next)
    if (Object.keys(next).length > 0 || !takenAt || !la.ok || !lo.ok) return
    const request: BandMeasurementRequestInput = { lowFreqHz: band.lowFreqHz, highFreqHz: band.highFreqHz, takenAt, latDeg: la.value, lonDeg: lo.value }
    save.mutate(request, {
      onSuccess: () => setSaved(true),
      onError: (err) => {
        if (!isApiError(err)) return setErrors({ form: 'The measurement could not be saved.' })
        const byField: Errors = {}
        const rest: string[] = []
        for (const d of err.details) {
          const key = d.path.replace(/^measurement\./, '')
          if (key === 'takenAt' || key === 'latDeg' || key === 'lonDeg') byField[key] = d.message
          else rest.push(d.message)
        }
        setErrors({ ...byField, ...(rest.length > 0 || Object.keys(byField).length === 0 ? { form: [err.message, ...rest].join(' ') } : {}) })
      },
    })
  }

  if (saved) return <p role="status" className="text-sm font-semibold text-ok">Saved as a measurement of the case.</p>
  return (
    <form onSubmit={submit} noValidate aria-label="Save as a measurement" className="flex flex-col gap-3 rounded-control border border-rule p-3">
      <h4 className="font-semibold">Save as a measurement</h4>
      <p className="text-sm">The file does not say when and where it was recorded: give both. The reading is the channel power in dBm over the band, computed again by the server from the stored trace.</p>
      <TextField label="Recorded at" name={`band-taken-${band.evidenceId}`} type="datetime-local" value={takenAtLocal} onChange={(e) => setTakenAtLocal(e.target.value)} error={errors.takenAt} />
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        <QuantityField label="Latitude" name={`band-lat-${band.evidenceId}`} kind="angle" value={lat} onChange={setLat} error={errors.latDeg} hint="Decimal degrees, north positive (WGS 84)." />
        <QuantityField label="Longitude" name={`band-lon-${band.evidenceId}`} kind="angle" value={lon} onChange={setLon} error={errors.lonDeg} hint="Decimal degrees, east positive (WGS 84)." />
      </div>
      {errors.form && (
        <p role="alert" className="text-sm text-danger">
          {errors.form}
        </p>
      )}
      <Button type="submit" className="w-full sm:w-auto" disabled={save.isPending}>
        {save.isPending ? 'Saving…' : 'Save as a measurement'}
      </Button>
    </form>
  )
}

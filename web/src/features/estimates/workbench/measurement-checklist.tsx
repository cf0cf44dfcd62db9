/** The case's measurements to work with: a checklist (superseded ones are left out: their correction is listed instead). */
import type { MeasurementView } from '@shared/schemas/measurements'
import { fmt, fmtHz } from '../lib/units'

/** The measurement's level, the most derived one it has: "105.07 dBµV/m". */
export function measurementLevel(m: MeasurementView): string {
  const d = m.derived
  return d.fieldStrengthDbuvPerM !== undefined ? fmt(d.fieldStrengthDbuvPerM, 'dBµV/m') : d.pfdDbwPerM2 !== undefined ? fmt(d.pfdDbwPerM2, 'dBW/m²') : d.isotropicReceivedPowerDbm !== undefined ? fmt(d.isotropicReceivedPowerDbm, 'dBm') : `${fmt(m.reading.value, m.reading.unit)} read`
}

export function measurementLabel(m: MeasurementView): string {
  const level = measurementLevel(m)
  const at = new Date(m.takenAt).toLocaleString('en-GB', { dateStyle: 'short', timeStyle: 'short' })
  return `${level} at ${fmtHz(m.freqHz)}, ${at}`
}

export function MeasurementChecklist({ measurements, chosen, onChange }: { measurements: MeasurementView[]; chosen: string[]; onChange: (ids: string[]) => void }) {
  const current = measurements.filter((m) => m.supersededById === null)
  if (current.length === 0) return <p className="text-ink-muted">No measurements are recorded on this case yet. Typed levels work all the same.</p>
  return (
    <fieldset className="flex min-w-0 flex-col gap-1">
      <legend className="mb-1 font-semibold">Measurements to use</legend>
      <p className="text-sm text-ink-muted">Corrected measurements show their latest version only.</p>
      <ul className="flex flex-col">
        {current.map((m) => {
          const id = `bench-measurement-${m.id}`
          return (
            <li key={m.id} className="flex min-h-11 items-start gap-3 py-1">
              <input
                id={id}
                type="checkbox"
                className="mt-1 h-5 w-5 shrink-0 accent-signal"
                checked={chosen.includes(m.id)}
                onChange={(e) => onChange(e.target.checked ? [...chosen, m.id] : chosen.filter((x) => x !== m.id))}
              />
              <label htmlFor={id} className="min-w-0 break-words">
                {measurementLabel(m)}
                {m.bearingDeg !== null && <span className="text-ink-muted">; bearing {fmt(m.bearingDeg, '°', 1)}</span>}
                {m.warnings.length > 0 && <span className="block text-sm text-caution">{m.warnings.join(' ')}</span>}
              </label>
            </li>
          )
        })}
      </ul>
    </fieldset>
  )
}

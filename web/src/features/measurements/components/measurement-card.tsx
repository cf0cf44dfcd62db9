/**
 * One measurement as a card: when and where, the frequency and reading, the levels the server
 * derived, its warnings, and whether it is superseded by a correction (kept, never overwritten).
 */
import { DETECTOR_LABELS, POLARISATION_LABELS, READING_UNIT_LABELS } from '@shared/domain/equipment'
import { Button } from '@/components/ui/button'
import { formatLatLonDeg } from '@/lib/coordinates'
import { formatFrequencyHz } from '@/lib/frequency'
import type { Measurement } from '../api/get-measurements'
import { formatLevel, LEVELS } from '../lib/format-levels'

function antennaText(m: Measurement): string {
  const a = m.antenna
  if (a.source === 'register') return m.equipment.find((e) => e.equipmentId === a.equipmentId)?.name ?? 'From the register'
  if (a.source === 'gain') return `Typed gain ${a.antennaGainDbi} dBi`
  if (a.source === 'factor') return `Typed antenna factor ${a.antennaFactorDbPerM} dB/m`
  return 'None given'
}

export function MeasurementCard({
  m,
  number,
  evidenceName,
  onEdit,
  onCorrect,
}: {
  m: Measurement
  number: number
  /** The linked evidence file's name, when the case's files could be read. */
  evidenceName?: string
  onEdit: () => void
  onCorrect: () => void
}) {
  const superseded = m.supersededById !== null
  const headingId = `measurement-${m.id}`
  const taken = new Date(m.takenAt).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' })
  const details: [string, string][] = [
    ['Position', `${formatLatLonDeg({ latDeg: m.latDeg, lonDeg: m.lonDeg, decimals: 5 })}${m.heightM !== null ? `, antenna ${m.heightM} m above ground` : ''}`],
    ['Reading', `${formatLevel(m.reading.value, m.reading.unit)} — ${READING_UNIT_LABELS[m.reading.unit].replace(/ \(.*\)$/, '').toLowerCase()}`],
    ['Antenna', `${antennaText(m)}${m.derived.antennaFactorDbPerM !== undefined ? ` — antenna factor ${formatLevel(m.derived.antennaFactorDbPerM, 'dB/m', 2)} at this frequency` : ''}`],
  ]
  const instrument = m.instrumentId && m.equipment.find((e) => e.equipmentId === m.instrumentId)
  if (instrument) details.push(['Instrument', `${instrument.name}${instrument.calibrationDueOn ? `, calibrated until ${instrument.calibrationDueOn}` : ''}`])
  const settings = [m.rbwHz !== null && `RBW ${formatFrequencyHz(m.rbwHz)}`, m.measurementBandwidthHz !== null && `bandwidth ${formatFrequencyHz(m.measurementBandwidthHz)}`, m.detector && DETECTOR_LABELS[m.detector], m.polarisation && `${POLARISATION_LABELS[m.polarisation]} polarisation`].filter(Boolean)
  if (settings.length) details.push(['Settings', settings.join(', ')])
  if (m.cableLossDb !== null || m.preampGainDb !== null) details.push(['Chain', [m.cableLossDb !== null && `cable ${m.cableLossDb} dB`, m.preampGainDb !== null && `preamplifier ${m.preampGainDb} dB`].filter(Boolean).join(', ')])
  if (m.bearingDeg !== null) details.push(['Bearing', `${m.bearingDeg}° true${m.bearingSigmaDeg !== null ? ` (σ ${m.bearingSigmaDeg}°)` : ''}`])
  if (m.evidenceFileId) details.push(['Evidence file', evidenceName ?? `File ${m.evidenceFileId.slice(0, 8)}… (its name could not be read)`])
  if (m.notes) details.push(['Notes', m.notes])
  details.push(['Recorded by', `${m.author}, version ${m.version}${m.usedByCalculations > 0 ? ` · used by ${m.usedByCalculations} calculation${m.usedByCalculations > 1 ? 's' : ''}` : ''}`])

  return (
    <li>
      <article aria-labelledby={headingId} className={`flex flex-col gap-3 rounded-panel border p-4 ${superseded ? 'border-dashed border-field bg-paper' : 'border-rule bg-surface'}`}>
        <header className="flex flex-col gap-1">
          <h3 id={headingId} className="font-semibold">
            M{number} · {formatFrequencyHz(m.freqHz)} · <time dateTime={m.takenAt}>{taken}</time>
          </h3>
          <div className="flex flex-wrap gap-2 text-sm">
            {superseded && <span className="rounded-control border border-field px-2 py-0.5 font-semibold">Superseded by a correction — kept as recorded</span>}
            {m.supersedesId && <span className="rounded-control border border-signal bg-signal-soft px-2 py-0.5 font-semibold">Correction of an earlier measurement</span>}
          </div>
        </header>
        <dl className="grid grid-cols-1 gap-x-3 gap-y-1 rounded-control bg-signal-soft p-3 sm:grid-cols-3">
          {LEVELS.map((l) => (
            <div key={l.key} className="flex justify-between gap-2 sm:flex-col">
              <dt className="text-sm">{l.label}</dt>
              <dd className="font-mono font-semibold">{formatLevel(m.derived[l.key], l.unit)}</dd>
            </div>
          ))}
        </dl>
        {m.warnings.length > 0 && (
          <ul aria-label="Warnings" className="flex flex-col gap-1 rounded-control border-l-4 border-caution bg-caution-soft px-3 py-2 text-sm">
            {m.warnings.map((w) => (
              <li key={w}>⚠ {w}</li>
            ))}
          </ul>
        )}
        <dl className="grid gap-x-3 gap-y-1 text-sm sm:grid-cols-[9rem_1fr]">
          {details.map(([k, v]) => (
            <div key={k} className="contents">
              <dt className="font-semibold">{k}</dt>
              <dd className="break-words">{v}</dd>
            </div>
          ))}
        </dl>
        {Object.keys(m.methods).length > 0 && (
          <details className="text-sm">
            <summary className="min-h-11 cursor-pointer py-2">How these levels were derived (radio library {m.libraryVersion})</summary>
            <ul className="list-disc pl-5">
              {[...new Map(Object.values(m.methods).map((x) => [x.id, x])).values()].map((x) => (
                <li key={x.id}>{x.source}</li>
              ))}
            </ul>
          </details>
        )}
        {(m.abilities.edit || m.abilities.correct) && (
          <div className="flex flex-wrap gap-3">
            {m.abilities.edit ? (
              <Button variant="secondary" onClick={onEdit} className="w-full sm:w-auto">
                Edit M{number}
              </Button>
            ) : (
              <Button variant="secondary" onClick={onCorrect} className="w-full sm:w-auto">
                Correct M{number}
              </Button>
            )}
          </div>
        )}
        {!m.abilities.edit && m.abilities.correct && <p className="text-sm text-ink-muted">A calculation uses this measurement: a correction is saved as a new one and this one stays as recorded.</p>}
      </article>
    </li>
  )
}

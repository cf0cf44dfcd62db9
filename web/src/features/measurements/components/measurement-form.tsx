/**
 * Recording, editing or correcting a measurement. One column on a phone, big touch targets;
 * every number a quantity with its unit; the levels derived live beside the form; the server's
 * messages beside each field it names.
 */
import { useMemo, useState, type FormEvent } from 'react'
import { DETECTOR_LABELS, DETECTORS, POLARISATION_LABELS, POLARISATIONS, READING_UNIT_LABELS, READING_UNITS, INSTRUMENT_TYPES, type ReadingUnit } from '@shared/domain/equipment'
import { READING_QUANTITY, type EquipmentView } from '@shared/schemas/measurements'
import { unitsOf } from '@shared/schemas/quantities'
import { Button } from '@/components/ui/button'
import { FormAlert } from '@/components/ui/form-alert'
import { QuantityField } from '@/components/ui/quantity-field'
import { SelectField } from '@/components/ui/select-field'
import { SubmitButton } from '@/components/ui/submit-button'
import { TextAreaField } from '@/components/ui/text-area-field'
import { TextField } from '@/components/ui/text-field'
import { shortHash, useCaseEvidence } from '@/lib/case-evidence'
import { fieldIssues, unplacedIssues } from '@/lib/field-issues'
import { formProblem } from '@/lib/form-errors'
import type { Measurement } from '../api/get-measurements'
import { useSaveMeasurement } from '../api/save-measurement'
import { emptyForm, formFrom, liveLevels, toRequest, type AntennaChoice, type MeasurementFormState } from '../lib/measurement-form-state'
import { LiveLevelsBar, LiveLevelsPanel } from './live-levels'
import { PositionFields } from './position-fields'

export type FormMode = { kind: 'record' } | { kind: 'edit'; measurement: Measurement } | { kind: 'correct'; measurement: Measurement }

const TITLES = { record: 'Record a measurement', edit: 'Edit the measurement', correct: 'Correct the measurement' }
const SUBMIT = { record: 'Save the measurement', edit: 'Save the changes', correct: 'Save the correction' }

/** The paths of the server's messages each field of the form answers (a message goes once its field is changed). */
const PATHS_OF: Record<keyof MeasurementFormState, string[]> = {
  takenAtLocal: ['takenAt'],
  lat: ['latDeg'],
  lon: ['lonDeg'],
  height: ['heightM'],
  freq: ['freqHz'],
  measurementBandwidth: ['measurementBandwidthHz'],
  rbw: ['rbwHz'],
  detector: ['detector'],
  readingUnit: ['reading', 'reading.unit', 'reading.value'],
  reading: ['reading', 'reading.value'],
  antenna: ['antenna', 'antenna.equipmentId', 'freqHz'],
  antennaGain: ['antenna.antennaGainDbi'],
  antennaFactor: ['antenna.antennaFactorDbPerM'],
  instrumentId: ['instrumentId', 'reading.value'],
  cableLoss: ['cableLossDb'],
  preampGain: ['preampGainDb'],
  polarisation: ['polarisation'],
  bearing: ['bearingDeg', 'bearingSigmaDeg'],
  bearingSigma: ['bearingSigmaDeg'],
  notes: ['notes'],
  evidenceFileId: ['evidenceFileId'],
}

/** Fields of the form, by the path the server's messages name. */
const PLACED = ['takenAt', 'latDeg', 'lonDeg', 'heightM', 'freqHz', 'measurementBandwidthHz', 'rbwHz', 'detector', 'reading', 'antenna', 'instrumentId', 'cableLossDb', 'preampGainDb', 'polarisation', 'bearingDeg', 'bearingSigmaDeg', 'notes', 'evidenceFileId']

export function MeasurementForm({
  caseId,
  mode,
  equipment,
  casePoint,
  onDone,
}: {
  caseId: string
  mode: FormMode
  equipment: EquipmentView[]
  casePoint: { latDeg: number; lonDeg: number }
  onDone: () => void
}) {
  const [s, setS] = useState<MeasurementFormState>(() => (mode.kind === 'record' ? emptyForm(new Date()) : formFrom(mode.measurement)))
  const save = useSaveMeasurement()
  /** Paths whose server message is out of date: their field changed since the last save. */
  const [answered, setAnswered] = useState<Set<string>>(new Set())
  const touch = (...keys: (keyof MeasurementFormState)[]) => setAnswered((a) => new Set([...a, ...keys.flatMap((k) => PATHS_OF[k])]))
  const set = <K extends keyof MeasurementFormState>(k: K, v: MeasurementFormState[K]) => {
    setS((x) => ({ ...x, [k]: v }))
    touch(k)
  }
  const live = useMemo(() => liveLevels(s, equipment), [s, equipment])
  const issues = fieldIssues(save.error, 'measurement')
  const evidence = useCaseEvidence(caseId)
  // the case's files that were not removed, and the one already linked (kept on an edit even if removed since)
  const files = (evidence.data?.evidence ?? []).filter((f) => f.removed === null || f.id === s.evidenceFileId)
  const antennas = equipment.filter((e) => e.type === 'antenna')
  const instruments = equipment.filter((e) => INSTRUMENT_TYPES.includes(e.type))

  /** A register item's usual cable loss and preamplifier gain fill empty fields. */
  function withDefaults(x: MeasurementFormState, id: string): MeasurementFormState {
    const item = equipment.find((e) => e.id === id)
    if (!item) return x
    return {
      ...x,
      cableLoss: !x.cableLoss.figure && item.defaultCableLossDb !== null ? { figure: String(item.defaultCableLossDb), unit: 'dB' } : x.cableLoss,
      preampGain: !x.preampGain.figure && item.defaultPreampGainDb !== null ? { figure: String(item.defaultPreampGainDb), unit: 'dB' } : x.preampGain,
    }
  }

  function submit(e: FormEvent) {
    e.preventDefault()
    setAnswered(new Set())
    const measurement = toRequest(s)
    const request =
      mode.kind === 'record'
        ? { kind: 'record' as const, caseId, measurement }
        : mode.kind === 'edit'
          ? { kind: 'edit' as const, caseId, measurementId: mode.measurement.id, version: mode.measurement.version, measurement }
          : { kind: 'correct' as const, caseId, measurementId: mode.measurement.id, measurement }
    save.mutate(request, { onSuccess: onDone })
  }

  const problem = save.isError ? formProblem(save.error, { byCode: { validation_failed: 'Some fields need attention: see the messages beside them.' } }) : null
  const leftOver = unplacedIssues(issues, PLACED)
  const readingKind = READING_QUANTITY[s.readingUnit]
  const needsAntenna = s.readingUnit === 'dBm' || s.readingUnit === 'dBµV'
  const sel = (k: string) => (answered.has(k) ? undefined : issues[k])

  return (
    <form onSubmit={submit} noValidate aria-label={TITLES[mode.kind]} className="@container flex min-w-0 flex-col gap-5 rounded-panel border border-rule bg-paper p-4 sm:p-5 [&_input]:max-w-full [&_select]:max-w-full">
      <h3 className="text-xl font-semibold">{TITLES[mode.kind]}</h3>
      {mode.kind === 'correct' && (
        <p className="text-sm">A correction is saved as a new measurement. The original stays on the case, marked as superseded, because a calculation may rest on it.</p>
      )}
      <FormAlert problem={problem} />
      {leftOver.length > 0 && (
        <ul className="list-disc pl-5 text-sm font-semibold text-danger">
          {leftOver.map((m) => (
            <li key={m}>{m}</li>
          ))}
        </ul>
      )}
      <div className="grid grid-cols-1 items-start gap-5 @4xl:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="flex min-w-0 flex-col gap-5">
          <TextField
            label="Taken at"
            name="takenAt"
            type="datetime-local"
            value={s.takenAtLocal}
            onChange={(e) => set('takenAtLocal', e.target.value)}
            error={sel('takenAt')}
            hint={`Date and time on this device (${Intl.DateTimeFormat().resolvedOptions().timeZone}); not in the future.`}
          />
          <PositionFields lat={s.lat} lon={s.lon} onChange={(lat, lon) => {
              setS((x) => ({ ...x, lat, lon }))
              touch('lat', 'lon')
            }} errors={{ lat: sel('latDeg'), lon: sel('lonDeg') }} casePoint={casePoint} />
          <QuantityField label="Antenna height above ground" name="heightM" kind="height" value={s.height} onChange={(v) => set('height', v)} error={sel('heightM')} />

          <fieldset className="flex min-w-0 flex-col gap-4">
            <legend className="text-lg font-semibold">Reading</legend>
            <QuantityField label="Centre frequency" name="freqHz" kind="frequency" value={s.freq} onChange={(v) => set('freq', v)} error={sel('freqHz')} />
            <SelectField
              label="What the instrument shows"
              name="readingUnit"
              value={s.readingUnit}
              onChange={(e) => {
                const u = e.target.value as ReadingUnit
                setS((x) => ({ ...x, readingUnit: u, reading: { figure: x.reading.figure, unit: unitsOf(READING_QUANTITY[u])[0]! } }))
                touch('readingUnit')
              }}
              options={READING_UNITS.map((u) => ({ value: u, label: READING_UNIT_LABELS[u] }))}
              error={sel('reading.unit')}
            />
            <QuantityField label="Reading" name="reading" kind={readingKind} value={s.reading} onChange={(v) => set('reading', v)} error={sel('reading.value') ?? sel('reading')} />
            <div className="grid grid-cols-1 gap-4 @2xl:grid-cols-2">
              <QuantityField label="Resolution bandwidth (RBW)" name="rbwHz" kind="bandwidth" value={s.rbw} onChange={(v) => set('rbw', v)} error={sel('rbwHz')} />
              <QuantityField label="Measurement bandwidth" name="measurementBandwidthHz" kind="bandwidth" value={s.measurementBandwidth} onChange={(v) => set('measurementBandwidth', v)} error={sel('measurementBandwidthHz')} />
              <SelectField
                label="Detector"
                name="detector"
                value={s.detector}
                onChange={(e) => set('detector', e.target.value as MeasurementFormState['detector'])}
                options={[{ value: '', label: 'Not recorded' }, ...DETECTORS.map((d) => ({ value: d, label: DETECTOR_LABELS[d] }))]}
                error={sel('detector')}
              />
              <SelectField
                label="Polarisation"
                name="polarisation"
                value={s.polarisation}
                onChange={(e) => set('polarisation', e.target.value as MeasurementFormState['polarisation'])}
                options={[{ value: '', label: 'Not recorded' }, ...POLARISATIONS.map((p) => ({ value: p, label: POLARISATION_LABELS[p] }))]}
                error={sel('polarisation')}
              />
            </div>
          </fieldset>

          <fieldset className="flex min-w-0 flex-col gap-4">
            <legend className="text-lg font-semibold">Antenna, instrument and cable</legend>
            <SelectField
              label="Antenna"
              name="antenna"
              value={s.antenna}
              onChange={(e) => {
                const v = e.target.value as AntennaChoice
                setS((x) => (v.startsWith('register:') ? withDefaults({ ...x, antenna: v }, v.slice('register:'.length)) : { ...x, antenna: v }))
                touch('antenna')
              }}
              options={[
                ...antennas.map((a) => ({ value: `register:${a.id}`, label: `${a.name}${a.serial ? ` (${a.serial})` : ''}${a.calibrationState !== 'ok' ? ' — calibration not in date' : ''}` })),
                { value: 'gain', label: 'Not in the register: type its gain (dBi)' },
                { value: 'factor', label: 'Not in the register: type its antenna factor (dB/m)' },
                { value: 'none', label: 'No antenna given' },
              ]}
              hint={needsAntenna ? 'A reading at the instrument input needs the antenna to give field strength.' : 'Not needed for a reading already in field strength or flux density.'}
              error={sel('antenna.equipmentId') ?? sel('antenna')}
            />
            {s.antenna === 'gain' && <QuantityField label="Antenna gain" name="antennaGainDbi" kind="gain" value={s.antennaGain} onChange={(v) => set('antennaGain', v)} error={sel('antenna.antennaGainDbi')} />}
            {s.antenna === 'factor' && (
              <QuantityField label="Antenna factor at this frequency" name="antennaFactorDbPerM" kind="antennaFactor" value={s.antennaFactor} onChange={(v) => set('antennaFactor', v)} error={sel('antenna.antennaFactorDbPerM')} />
            )}
            <SelectField
              label="Instrument"
              name="instrumentId"
              value={s.instrumentId}
              onChange={(e) => {
                const v = e.target.value
                setS((x) => withDefaults({ ...x, instrumentId: v }, v))
                touch('instrumentId')
              }}
              options={[{ value: '', label: 'Not recorded' }, ...instruments.map((i) => ({ value: i.id, label: `${i.name}${i.serial ? ` (${i.serial})` : ''}${i.calibrationState !== 'ok' ? ' — calibration not in date' : ''}` }))]}
              error={sel('instrumentId')}
            />
            <div className="grid grid-cols-1 gap-4 @2xl:grid-cols-2">
              <QuantityField label="Cable loss" name="cableLossDb" kind="loss" value={s.cableLoss} onChange={(v) => set('cableLoss', v)} error={sel('cableLossDb')} hint="Positive dB, between antenna and instrument." />
              <QuantityField label="Preamplifier gain" name="preampGainDb" kind="loss" value={s.preampGain} onChange={(v) => set('preampGain', v)} error={sel('preampGainDb')} hint="0 or empty without a preamplifier." />
            </div>
          </fieldset>

          <fieldset className="flex min-w-0 flex-col gap-4">
            <legend className="text-lg font-semibold">Direction finding (optional)</legend>
            <div className="grid grid-cols-1 gap-4 @2xl:grid-cols-2">
              <QuantityField label="Bearing to the source" name="bearingDeg" kind="angle" value={s.bearing} onChange={(v) => set('bearing', v)} error={sel('bearingDeg')} hint="Degrees clockwise from true north (not magnetic)." />
              <QuantityField label="Bearing σ" name="bearingSigmaDeg" kind="angle" value={s.bearingSigma} onChange={(v) => set('bearingSigma', v)} error={sel('bearingSigmaDeg')} hint="One standard deviation of the bearing." />
            </div>
          </fieldset>

          <SelectField
            label="Evidence file (optional)"
            name="evidenceFileId"
            value={s.evidenceFileId}
            onChange={(e) => set('evidenceFileId', e.target.value)}
            options={[
              { value: '', label: 'None' },
              ...(s.evidenceFileId && !files.some((f) => f.id === s.evidenceFileId) ? [{ value: s.evidenceFileId, label: 'The file linked now' }] : []),
              ...files.map((f) => ({ value: f.id, label: `${f.originalName} (SHA-256 ${shortHash(f.sha256)}…)${f.removed ? ' — removed from the case' : ''}` })),
            ]}
            hint={evidence.isError ? 'The case’s evidence files could not be loaded.' : 'The capture or file of the case this reading comes from.'}
            error={sel('evidenceFileId')}
          />
          <TextAreaField label="Notes" name="notes" rows={3} value={s.notes} onChange={(e) => set('notes', e.target.value)} error={sel('notes')} />
        </div>
        <aside className="flex flex-col gap-3 @4xl:sticky @4xl:top-4">
          <LiveLevelsPanel live={live} />
        </aside>
      </div>
      <div className="flex flex-wrap gap-3">
        <SubmitButton submitting={save.isPending} pendingLabel="Saving…" className="w-full sm:w-auto">
          {SUBMIT[mode.kind]}
        </SubmitButton>
        <Button variant="secondary" onClick={onDone} className="w-full sm:w-auto">
          Cancel
        </Button>
      </div>
      <LiveLevelsBar live={live} />
    </form>
  )
}

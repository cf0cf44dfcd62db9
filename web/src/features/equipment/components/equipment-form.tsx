/**
 * Adding or editing an item of the register. Every number is a quantity with its unit; an
 * antenna is described by its gain or by its calibrated antenna-factor table (frequency and
 * factor per row, lowest frequency first). The server's messages appear beside each field.
 */
import { useState, type FormEvent } from 'react'
import { EQUIPMENT_TYPE_LABELS, EQUIPMENT_TYPES, type EquipmentType } from '@shared/domain/equipment'
import type { EquipmentContentInput, EquipmentView } from '@shared/schemas/measurements'
import { withUnit } from '@shared/schemas/quantities'
import { Button } from '@/components/ui/button'
import { FieldError } from '@/components/ui/field'
import { FormAlert } from '@/components/ui/form-alert'
import { QuantityField, type QuantityValue } from '@/components/ui/quantity-field'
import { SelectField } from '@/components/ui/select-field'
import { SubmitButton } from '@/components/ui/submit-button'
import { TextAreaField } from '@/components/ui/text-area-field'
import { TextField } from '@/components/ui/text-field'
import { fieldIssues, unplacedIssues } from '@/lib/field-issues'
import { formProblem } from '@/lib/form-errors'
import { baseFigure, frequencyFigure } from '@/lib/quantity-figures'
import { useSaveEquipment } from '../api/save-equipment'

interface Row {
  key: number
  freq: QuantityValue
  af: QuantityValue
}

type AntennaBy = 'gain' | 'table' | 'unknown'

let rowKey = 0
const row = (freqHz?: number, af?: number): Row => ({ key: ++rowKey, freq: frequencyFigure(freqHz), af: baseFigure(af, 'dB/m') })

function initial(item?: EquipmentView) {
  return {
    name: item?.name ?? '',
    type: (item?.type ?? 'antenna') as EquipmentType,
    manufacturer: item?.manufacturer ?? '',
    model: item?.model ?? '',
    serial: item?.serial ?? '',
    antennaBy: (item?.antennaFactorTable ? 'table' : item?.antennaGainDbi !== null && item?.antennaGainDbi !== undefined ? 'gain' : item ? 'unknown' : 'table') as AntennaBy,
    gain: baseFigure(item?.antennaGainDbi, 'dBi'),
    table: item?.antennaFactorTable?.map((p) => row(p.freqHz, p.antennaFactorDbPerM)) ?? [row(), row()],
    cableLoss: baseFigure(item?.defaultCableLossDb, 'dB'),
    preampGain: baseFigure(item?.defaultPreampGainDb, 'dB'),
    minFreq: frequencyFigure(item?.minFreqHz),
    maxFreq: frequencyFigure(item?.maxFreqHz),
    maxInput: baseFigure(item?.maxInputDbm, 'dBm'),
    calibrationDueOn: item?.calibrationDueOn ?? '',
    notes: item?.notes ?? '',
    reason: '',
  }
}

const send = (q: QuantityValue) => withUnit(q.figure, q.unit) || undefined

export function EquipmentForm({ officeId, item, onDone }: { officeId: string; item?: EquipmentView; onDone: () => void }) {
  const [f, setF] = useState(() => initial(item))
  const save = useSaveEquipment()
  const set = <K extends keyof typeof f>(k: K, v: (typeof f)[K]) => setF((s) => ({ ...s, [k]: v }))
  const issues = fieldIssues(save.error, 'item')
  const isAntenna = f.type === 'antenna'

  function submit(e: FormEvent) {
    e.preventDefault()
    const content: EquipmentContentInput = {
      name: f.name,
      type: f.type,
      manufacturer: f.manufacturer || null,
      model: f.model || null,
      serial: f.serial || null,
      antennaGainDbi: isAntenna && f.antennaBy === 'gain' ? send(f.gain) : undefined,
      antennaFactorTable:
        isAntenna && f.antennaBy === 'table'
          ? f.table.filter((r) => r.freq.figure.trim() || r.af.figure.trim()).map((r) => ({ freqHz: withUnit(r.freq.figure, r.freq.unit), antennaFactorDbPerM: withUnit(r.af.figure, r.af.unit) }))
          : null,
      defaultCableLossDb: send(f.cableLoss),
      defaultPreampGainDb: send(f.preampGain),
      minFreqHz: send(f.minFreq),
      maxFreqHz: send(f.maxFreq),
      maxInputDbm: send(f.maxInput),
      calibrationDueOn: f.calibrationDueOn || null,
      notes: f.notes || null,
    }
    const s = item ? { kind: 'revise' as const, equipmentId: item.id, version: item.version, item: content, reason: f.reason || undefined } : { kind: 'add' as const, officeId, item: content }
    save.mutate(s, { onSuccess: onDone })
  }

  const placed = ['name', 'type', 'manufacturer', 'model', 'serial', 'antennaGainDbi', 'antennaFactorTable', 'defaultCableLossDb', 'defaultPreampGainDb', 'minFreqHz', 'maxFreqHz', 'maxInputDbm', 'calibrationDueOn', 'notes', 'reason']
  const problem = save.isError
    ? formProblem(save.error, { byCode: { validation_failed: 'Some fields need attention: see the messages beside them.' } })
    : null
  const leftOver = unplacedIssues(issues, placed)

  return (
    <form onSubmit={submit} noValidate aria-label={item ? `Edit ${item.name}` : 'Add an item'} className="flex min-w-0 flex-col gap-4 rounded-panel border border-rule bg-paper p-4 [&_input]:max-w-full [&_select]:max-w-full">
      <FormAlert problem={problem} />
      {leftOver.length > 0 && (
        <ul className="list-disc pl-5 text-sm text-danger">
          {leftOver.map((m) => (
            <li key={m}>{m}</li>
          ))}
        </ul>
      )}
      <TextField label="Name" name="name" value={f.name} onChange={(e) => set('name', e.target.value)} error={issues.name} hint="As written on the item’s label, e.g. “Log-periodic LP-1”." />
      <SelectField
        label="Type"
        name="type"
        value={f.type}
        onChange={(e) => set('type', e.target.value as EquipmentType)}
        options={EQUIPMENT_TYPES.map((t) => ({ value: t, label: EQUIPMENT_TYPE_LABELS[t] }))}
        error={issues.type}
      />
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-3">
        <TextField label="Manufacturer" name="manufacturer" value={f.manufacturer} onChange={(e) => set('manufacturer', e.target.value)} error={issues.manufacturer} />
        <TextField label="Model" name="model" value={f.model} onChange={(e) => set('model', e.target.value)} error={issues.model} />
        <TextField label="Serial number" name="serial" value={f.serial} onChange={(e) => set('serial', e.target.value)} error={issues.serial} />
      </div>
      {isAntenna && (
        <fieldset className="flex min-w-0 flex-col gap-3">
          <legend className="font-semibold">How the antenna is described</legend>
          <div className="flex flex-wrap gap-x-6 gap-y-2">
            {(
              [
                ['table', 'Antenna-factor table (from its calibration)'],
                ['gain', 'One gain in dBi'],
                ['unknown', 'Not known yet'],
              ] as const
            ).map(([v, label]) => (
              <label key={v} className="flex min-h-11 items-center gap-2">
                <input type="radio" name="antennaBy" value={v} checked={f.antennaBy === v} onChange={() => set('antennaBy', v)} className="h-5 w-5" />
                {label}
              </label>
            ))}
          </div>
          {f.antennaBy === 'gain' && <QuantityField label="Antenna gain" name="antennaGainDbi" kind="gain" value={f.gain} onChange={(v) => set('gain', v)} error={issues.antennaGainDbi} />}
          {f.antennaBy === 'table' && (
            <div className="flex flex-col gap-3">
              <p className="text-sm text-ink-muted">
                Lowest frequency first. Between two rows the factor is interpolated linearly in dB against the logarithm of frequency; outside the table a measurement is refused, never extrapolated.
              </p>
              <FieldError message={issues.antennaFactorTable} />
              <ol className="flex flex-col gap-3">
                {f.table.map((r, i) => (
                  <li key={r.key} className="grid grid-cols-1 items-end gap-2 border-b border-rule pb-3 sm:grid-cols-[minmax(0,1fr)_minmax(0,1fr)_auto]">
                    <QuantityField
                      label={`Row ${i + 1}: frequency`}
                      name={`af-freq-${i}`}
                      kind="frequency"
                      value={r.freq}
                      onChange={(v) => set('table', f.table.map((x) => (x.key === r.key ? { ...x, freq: v } : x)))}
                      error={issues[`antennaFactorTable.${i}.freqHz`]}
                    />
                    <QuantityField
                      label={`Row ${i + 1}: antenna factor`}
                      name={`af-value-${i}`}
                      kind="antennaFactor"
                      value={r.af}
                      onChange={(v) => set('table', f.table.map((x) => (x.key === r.key ? { ...x, af: v } : x)))}
                      error={issues[`antennaFactorTable.${i}.antennaFactorDbPerM`]}
                    />
                    <Button variant="quiet" onClick={() => set('table', f.table.filter((x) => x.key !== r.key))} aria-label={`Remove row ${i + 1}`}>
                      Remove
                    </Button>
                  </li>
                ))}
              </ol>
              <Button variant="secondary" className="self-start" onClick={() => set('table', [...f.table, row()])}>
                Add a row
              </Button>
            </div>
          )}
        </fieldset>
      )}
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <QuantityField label="Usual cable loss" name="defaultCableLossDb" kind="loss" value={f.cableLoss} onChange={(v) => set('cableLoss', v)} error={issues.defaultCableLossDb} hint="Filled into a measurement’s cable loss when this item is chosen." />
        <QuantityField label="Preamplifier gain" name="defaultPreampGainDb" kind="loss" value={f.preampGain} onChange={(v) => set('preampGain', v)} error={issues.defaultPreampGainDb} />
        <QuantityField label="Lowest frequency" name="minFreqHz" kind="frequency" value={f.minFreq} onChange={(v) => set('minFreq', v)} error={issues.minFreqHz} />
        <QuantityField label="Highest frequency" name="maxFreqHz" kind="frequency" value={f.maxFreq} onChange={(v) => set('maxFreq', v)} error={issues.maxFreqHz} />
        {(f.type === 'analyser' || f.type === 'receiver') && (
          <QuantityField label="Largest input level" name="maxInputDbm" kind="power" value={f.maxInput} onChange={(v) => set('maxInput', v)} error={issues.maxInputDbm} hint="A reading above it is refused." />
        )}
        <TextField label="Calibration due" name="calibrationDueOn" type="date" value={f.calibrationDueOn} onChange={(e) => set('calibrationDueOn', e.target.value)} error={issues.calibrationDueOn} hint="Measurements after this date carry a warning." />
      </div>
      <TextAreaField label="Notes" name="notes" rows={2} value={f.notes} onChange={(e) => set('notes', e.target.value)} error={issues.notes} />
      {item && <TextField label="Why it changes (optional)" name="reason" value={f.reason} onChange={(e) => set('reason', e.target.value)} error={issues.reason} />}
      <div className="flex flex-wrap gap-3">
        <SubmitButton submitting={save.isPending} pendingLabel="Saving…">
          {item ? 'Save the changes' : 'Add to the register'}
        </SubmitButton>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  )
}

/**
 * An office's register as cards (readable at phone width): what each item is, how the antenna
 * is described, its defaults and its calibration, an expired or missing calibration said in
 * words as well as colour. Managers add and edit items; everyone may open an item's history.
 */
import { useState } from 'react'
import { EQUIPMENT_TYPE_LABELS } from '@shared/domain/equipment'
import type { EquipmentView } from '@shared/schemas/measurements'
import { Button } from '@/components/ui/button'
import { formatFrequencyRangeHz } from '@/lib/frequency'
import { describeTable } from '../lib/describe-equipment'
import { EquipmentForm } from './equipment-form'
import { EquipmentHistory } from './equipment-history'

function CalibrationTag({ item }: { item: EquipmentView }) {
  if (item.calibrationState === 'ok') return <span className="rounded-control border border-ok bg-ok-soft px-2 py-0.5 text-sm font-semibold text-ok">Calibrated until {item.calibrationDueOn}</span>
  const text = item.calibrationState === 'expired' ? `⚠ Calibration ran out on ${item.calibrationDueOn}` : '⚠ No calibration date'
  return <span className="rounded-control border border-caution bg-caution-soft px-2 py-0.5 text-sm font-semibold text-caution">{text}</span>
}

function Item({ item, officeId, canManage }: { item: EquipmentView; officeId: string; canManage: boolean }) {
  const [editing, setEditing] = useState(false)
  const [historyOpen, setHistoryOpen] = useState(false)
  const headingId = `equipment-${item.id}`
  const facts: [string, string][] = []
  if (item.serial) facts.push(['Serial number', item.serial])
  if (item.manufacturer || item.model) facts.push(['Make', [item.manufacturer, item.model].filter(Boolean).join(' ')])
  if (item.type === 'antenna') facts.push(['Antenna', item.antennaFactorTable ? `Antenna-factor table: ${describeTable(item.antennaFactorTable)}` : item.antennaGainDbi !== null ? `Gain ${item.antennaGainDbi} dBi` : 'No gain or factor yet: readings through it give no field strength'])
  if (item.minFreqHz !== null && item.maxFreqHz !== null) facts.push(['Frequencies', formatFrequencyRangeHz({ lowHz: item.minFreqHz, highHz: item.maxFreqHz })])
  if (item.maxInputDbm !== null) facts.push(['Largest input', `${item.maxInputDbm} dBm`])
  if (item.defaultCableLossDb !== null) facts.push(['Usual cable loss', `${item.defaultCableLossDb} dB`])
  if (item.defaultPreampGainDb !== null) facts.push(['Preamplifier gain', `${item.defaultPreampGainDb} dB`])
  if (item.notes) facts.push(['Notes', item.notes])
  facts.push(['Last change', `${item.updatedBy ?? 'Set up with the office'}, ${new Date(item.updatedAt).toLocaleDateString('en-GB', { dateStyle: 'medium' })} (version ${item.version})`])
  return (
    <li>
      <article aria-labelledby={headingId} className="flex flex-col gap-3 rounded-panel border border-rule bg-surface p-4 sm:p-5">
        <header className="flex flex-col gap-2">
          <h2 id={headingId} className="text-lg font-semibold break-words">
            {item.name}
          </h2>
          <div className="flex flex-wrap items-center gap-2">
            <span className="text-ink-muted">{EQUIPMENT_TYPE_LABELS[item.type]}</span>
            <CalibrationTag item={item} />
          </div>
        </header>
        <dl className="grid gap-2 sm:grid-cols-[12rem_1fr]">
          {facts.map(([k, v]) => (
            <div key={k} className="contents">
              <dt className="font-semibold">{k}</dt>
              <dd className="break-words">{v}</dd>
            </div>
          ))}
        </dl>
        <div className="flex flex-wrap gap-3">
          {canManage && !editing && <Button onClick={() => setEditing(true)}>Edit</Button>}
          <Button variant="secondary" aria-expanded={historyOpen} onClick={() => setHistoryOpen((o) => !o)}>
            {historyOpen ? 'Hide history' : 'History'}
          </Button>
        </div>
        {editing && <EquipmentForm officeId={officeId} item={item} onDone={() => setEditing(false)} />}
        <EquipmentHistory equipmentId={item.id} open={historyOpen} />
      </article>
    </li>
  )
}

export function EquipmentList({ items, officeId, canManage }: { items: EquipmentView[]; officeId: string; canManage: boolean }) {
  const [adding, setAdding] = useState(false)
  const attention = items.filter((i) => i.calibrationState !== 'ok').length
  return (
    <div className="flex flex-col gap-4">
      <p>
        {items.length === 0 ? 'The register is empty.' : `${items.length} items${attention > 0 ? `, ${attention} without a calibration in date` : ''}.`} Measurements taken with an item whose calibration had run out, or has no date, carry a warning into every result.
      </p>
      {canManage && !adding && (
        <Button className="self-start" onClick={() => setAdding(true)}>
          Add an item
        </Button>
      )}
      {adding && <EquipmentForm officeId={officeId} onDone={() => setAdding(false)} />}
      <ul className="flex flex-col gap-4">
        {items.map((i) => (
          <Item key={i.id} item={i} officeId={officeId} canManage={canManage} />
        ))}
      </ul>
    </div>
  )
}

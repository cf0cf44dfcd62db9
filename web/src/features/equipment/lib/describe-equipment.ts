/** Words for an item's fields and values (the list and its history). */
import { EQUIPMENT_TYPE_LABELS, type EquipmentType } from '@shared/domain/equipment'
import { formatFrequencyHz, formatFrequencyRangeHz } from '@/lib/frequency'

export const EQUIPMENT_FIELD_LABELS: Record<string, string> = {
  name: 'Name',
  type: 'Type',
  manufacturer: 'Manufacturer',
  model: 'Model',
  serial: 'Serial number',
  antennaGainDbi: 'Antenna gain',
  antennaFactorTable: 'Antenna-factor table',
  defaultCableLossDb: 'Usual cable loss',
  defaultPreampGainDb: 'Preamplifier gain',
  minFreqHz: 'Lowest frequency',
  maxFreqHz: 'Highest frequency',
  maxInputDbm: 'Largest input level',
  calibrationDueOn: 'Calibration due',
  notes: 'Notes',
}

type Point = { freqHz: number; antennaFactorDbPerM: number }

export function describeTable(table: Point[]): string {
  const first = table[0]
  const last = table[table.length - 1]
  if (!first || !last) return '—'
  return `${table.length} points, ${formatFrequencyRangeHz({ lowHz: first.freqHz, highHz: last.freqHz })} (${first.antennaFactorDbPerM}–${last.antennaFactorDbPerM} dB/m)`
}

export function describeValue(field: string, value: unknown): string {
  if (value === null || value === undefined || value === '') return '—'
  switch (field) {
    case 'type':
      return EQUIPMENT_TYPE_LABELS[value as EquipmentType] ?? String(value)
    case 'antennaGainDbi':
      return `${String(value)} dBi`
    case 'antennaFactorTable':
      return describeTable(value as Point[])
    case 'defaultCableLossDb':
    case 'defaultPreampGainDb':
      return `${String(value)} dB`
    case 'minFreqHz':
    case 'maxFreqHz':
      return formatFrequencyHz(value as number)
    case 'maxInputDbm':
      return `${String(value)} dBm`
    default:
      return String(value)
  }
}

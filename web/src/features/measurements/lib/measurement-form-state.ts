/**
 * The measurement form's state (figures as typed, each with its unit), what it sends, and the
 * levels derived live from it in the browser with the same code the server runs
 * (shared/measurements/derive.ts) — for display only: the server recomputes and stores its own.
 */
import type { Detector, Polarisation, ReadingUnit } from '@shared/domain/equipment'
import { fromLocalInput, toLocalInput } from '@/lib/local-time'
import { deriveMeasurement, type DeriveAntenna, type DeriveEquipment, type DerivedMeasurement } from '@shared/measurements/derive'
import { READING_QUANTITY, type EquipmentView, type MeasurementContentInput, type MeasurementView } from '@shared/schemas/measurements'
import { readQuantity, withUnit } from '@shared/schemas/quantities'
import type { QuantityValue } from '@/components/ui/quantity-field'
import { bandwidthFigure, baseFigure, frequencyFigure } from '@/lib/quantity-figures'

/** The antenna choice: an item of the register (`register:<id>`), a typed gain or factor, or none. */
export type AntennaChoice = `register:${string}` | 'gain' | 'factor' | 'none'

export interface MeasurementFormState {
  /** `yyyy-mm-ddThh:mm` in the device's time zone (a datetime-local input). */
  takenAtLocal: string
  lat: QuantityValue
  lon: QuantityValue
  height: QuantityValue
  freq: QuantityValue
  measurementBandwidth: QuantityValue
  rbw: QuantityValue
  detector: Detector | ''
  readingUnit: ReadingUnit
  reading: QuantityValue
  antenna: AntennaChoice
  antennaGain: QuantityValue
  antennaFactor: QuantityValue
  instrumentId: string
  cableLoss: QuantityValue
  preampGain: QuantityValue
  polarisation: Polarisation | ''
  bearing: QuantityValue
  bearingSigma: QuantityValue
  notes: string
  /** The case's evidence file the reading comes from ('' for none). */
  evidenceFileId: string
}

/** The unit the reading field starts in for a kind of reading (its base unit). */
export const readingFieldUnit = (u: ReadingUnit): string => u

export function emptyForm(now: Date): MeasurementFormState {
  return {
    takenAtLocal: toLocalInput(now),
    lat: { figure: '', unit: '°' },
    lon: { figure: '', unit: '°' },
    height: { figure: '', unit: 'm' },
    freq: { figure: '', unit: 'MHz' },
    measurementBandwidth: { figure: '', unit: 'kHz' },
    rbw: { figure: '', unit: 'kHz' },
    detector: '',
    readingUnit: 'dBm',
    reading: { figure: '', unit: 'dBm' },
    antenna: 'none',
    antennaGain: { figure: '', unit: 'dBi' },
    antennaFactor: { figure: '', unit: 'dB/m' },
    instrumentId: '',
    cableLoss: { figure: '', unit: 'dB' },
    preampGain: { figure: '', unit: 'dB' },
    polarisation: '',
    bearing: { figure: '', unit: '°' },
    bearingSigma: { figure: '', unit: '°' },
    notes: '',
    evidenceFileId: '',
  }
}

/** A stored measurement as the form's first values (to edit or correct it). */
export function formFrom(m: MeasurementView): MeasurementFormState {
  const antenna: AntennaChoice = m.antenna.source === 'register' ? `register:${m.antenna.equipmentId}` : m.antenna.source
  return {
    takenAtLocal: toLocalInput(new Date(m.takenAt)),
    lat: baseFigure(m.latDeg, '°'),
    lon: baseFigure(m.lonDeg, '°'),
    height: baseFigure(m.heightM, 'm'),
    freq: frequencyFigure(m.freqHz),
    measurementBandwidth: bandwidthFigure(m.measurementBandwidthHz),
    rbw: bandwidthFigure(m.rbwHz),
    detector: m.detector ?? '',
    readingUnit: m.reading.unit,
    reading: baseFigure(m.reading.value, m.reading.unit),
    antenna,
    antennaGain: baseFigure(m.antenna.source === 'gain' ? m.antenna.antennaGainDbi : null, 'dBi'),
    antennaFactor: baseFigure(m.antenna.source === 'factor' ? m.antenna.antennaFactorDbPerM : null, 'dB/m'),
    instrumentId: m.instrumentId ?? '',
    cableLoss: baseFigure(m.cableLossDb, 'dB'),
    preampGain: baseFigure(m.preampGainDb, 'dB'),
    polarisation: m.polarisation ?? '',
    bearing: baseFigure(m.bearingDeg, '°'),
    bearingSigma: baseFigure(m.bearingSigmaDeg, '°'),
    notes: m.notes ?? '',
    evidenceFileId: m.evidenceFileId ?? '',
  }
}

const opt = (q: QuantityValue) => withUnit(q.figure, q.unit) || undefined

/** What the form sends: figures with their units (the server reads them strictly), never derived values. */
export function toRequest(s: MeasurementFormState): MeasurementContentInput {
  const antenna =
    s.antenna === 'gain'
      ? { source: 'gain' as const, antennaGainDbi: withUnit(s.antennaGain.figure, s.antennaGain.unit) }
      : s.antenna === 'factor'
        ? { source: 'factor' as const, antennaFactorDbPerM: withUnit(s.antennaFactor.figure, s.antennaFactor.unit) }
        : s.antenna === 'none'
          ? { source: 'none' as const }
          : { source: 'register' as const, equipmentId: s.antenna.slice('register:'.length) }
  return {
    takenAt: fromLocalInput(s.takenAtLocal) ?? s.takenAtLocal,
    latDeg: withUnit(s.lat.figure, s.lat.unit),
    lonDeg: withUnit(s.lon.figure, s.lon.unit),
    heightM: opt(s.height),
    freqHz: withUnit(s.freq.figure, s.freq.unit),
    measurementBandwidthHz: opt(s.measurementBandwidth),
    rbwHz: opt(s.rbw),
    detector: s.detector || undefined,
    reading: { unit: s.readingUnit, value: withUnit(s.reading.figure, s.reading.unit) },
    antenna,
    instrumentId: s.instrumentId || undefined,
    cableLossDb: opt(s.cableLoss),
    preampGainDb: opt(s.preampGain),
    polarisation: s.polarisation || undefined,
    bearingDeg: opt(s.bearing),
    bearingSigmaDeg: opt(s.bearingSigma),
    notes: s.notes || null,
    evidenceFileId: s.evidenceFileId || undefined,
  }
}

export interface LiveLevels {
  /** Null until the inputs the levels need are readable. */
  result: DerivedMeasurement | null
  /** What is still missing or unreadable, in words (for the live panel). */
  waitingFor: string[]
}

const asDerive = (e: EquipmentView): DeriveEquipment => e

/**
 * The levels as the investigator types: the figures are read with the same strict parser the
 * server uses, then derived with shared/measurements/derive.ts. Pure; a few microseconds.
 */
export function liveLevels(s: MeasurementFormState, equipment: readonly EquipmentView[]): LiveLevels {
  const waitingFor: string[] = []
  const freq = readQuantity(withUnit(s.freq.figure, s.freq.unit), 'frequency', { label: 'the centre frequency', min: 0, minExclusive: true, max: 3e12 })
  if (!freq.ok) waitingFor.push(freq.missing ? 'the centre frequency' : freq.message)
  const reading = readQuantity(withUnit(s.reading.figure, s.reading.unit), READING_QUANTITY[s.readingUnit], { label: 'the reading', min: -300, max: 300 })
  if (!reading.ok) waitingFor.push(reading.missing ? 'the reading' : reading.message)
  const optional = (q: QuantityValue, label: string) => {
    if (!q.figure.trim()) return undefined
    const r = readQuantity(withUnit(q.figure, q.unit), 'loss', { label, min: 0, max: 100 })
    if (!r.ok) waitingFor.push(r.message)
    return r.ok ? r.value : undefined
  }
  const cableLossDb = optional(s.cableLoss, 'the cable loss')
  const preampGainDb = optional(s.preampGain, 'the preamplifier gain')

  let antenna: DeriveAntenna = { source: 'none' }
  if (s.antenna === 'gain') {
    const g = readQuantity(withUnit(s.antennaGain.figure, s.antennaGain.unit), 'gain', { label: 'the antenna gain', min: -40, max: 60 })
    if (g.ok) antenna = { source: 'gain', antennaGainDbi: g.value }
    else waitingFor.push(g.missing ? 'the antenna gain' : g.message)
  } else if (s.antenna === 'factor') {
    const a = readQuantity(withUnit(s.antennaFactor.figure, s.antennaFactor.unit), 'antennaFactor', { label: 'the antenna factor', min: -60, max: 100 })
    if (a.ok) antenna = { source: 'factor', antennaFactorDbPerM: a.value }
    else waitingFor.push(a.missing ? 'the antenna factor' : a.message)
  } else if (s.antenna !== 'none') {
    const item = equipment.find((e) => e.id === s.antenna.slice('register:'.length))
    if (item) antenna = { source: 'register', item: asDerive(item) }
  }
  const instrument = equipment.find((e) => e.id === s.instrumentId)
  const takenAt = fromLocalInput(s.takenAtLocal)
  if (!takenAt) waitingFor.push('the time it was taken')
  if (!freq.ok || !reading.ok || !takenAt) return { result: null, waitingFor }
  const result = deriveMeasurement({
    takenAt,
    freqHz: freq.value,
    reading: { value: reading.value, unit: s.readingUnit },
    antenna,
    instrument: instrument && asDerive(instrument),
    cableLossDb,
    preampGainDb,
  })
  return { result, waitingFor }
}

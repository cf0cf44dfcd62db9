/**
 * A stored base-unit value as a quantity field's first value (figure and unit), for edit forms:
 * frequencies in the unit they read best in, other quantities in their base unit.
 */
import type { QuantityValue } from '@/components/ui/quantity-field'
import { bestUnitFor } from './frequency'

export function frequencyFigure(freqHz: number | null | undefined, fallbackUnit = 'MHz'): QuantityValue {
  if (freqHz === null || freqHz === undefined) return { figure: '', unit: fallbackUnit }
  const { unit, hz } = bestUnitFor(freqHz)
  return { figure: String(Number.parseFloat((freqHz / hz).toPrecision(12))), unit }
}

export function baseFigure(value: number | null | undefined, unit: string): QuantityValue {
  return { figure: value === null || value === undefined ? '' : String(value), unit }
}

/** A bandwidth in kHz below 1 MHz, in MHz above (the units its selector offers). */
export function bandwidthFigure(bandwidthHz: number | null | undefined): QuantityValue {
  if (bandwidthHz === null || bandwidthHz === undefined) return { figure: '', unit: 'kHz' }
  return bandwidthHz < 1e6 ? { figure: String(bandwidthHz / 1e3), unit: 'kHz' } : { figure: String(bandwidthHz / 1e6), unit: 'MHz' }
}

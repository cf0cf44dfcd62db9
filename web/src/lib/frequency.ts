/**
 * Frequencies as radio engineers read them: kHz below 1 MHz, MHz up to the top of the UHF
 * band (3 GHz: mobile bands read "1710–1785 MHz", Wi-Fi "2400–2483.5 MHz"), GHz above,
 * trailing zeros dropped. Pure; used by every case screen.
 */
import { FREQUENCY_UNITS, type FrequencyUnit } from '@shared/schemas/cases'

export type { FrequencyUnit }
export const FREQUENCY_UNIT_OPTIONS: readonly FrequencyUnit[] = ['kHz', 'MHz', 'GHz']

// each unit is used from `from` upwards; MHz stays until 3 GHz (ITU RR No. 2.1: band 9, UHF, ends at 3 GHz)
const STEPS: { unit: string; hz: number; from: number }[] = [
  { unit: 'THz', hz: 1e12, from: 1e12 },
  { unit: 'GHz', hz: 1e9, from: 3e9 },
  { unit: 'MHz', hz: 1e6, from: 1e6 },
  { unit: 'kHz', hz: 1e3, from: 1e3 },
  { unit: 'Hz', hz: 1, from: 0 },
]

/** A figure in a unit → Hz (e.g. 156.8 MHz → 156 800 000 Hz). */
export function frequencyToHz(options: { value: number; unit: FrequencyUnit }): number {
  return roundNoise(options.value * FREQUENCY_UNITS[options.unit])
}

/** Hz → a figure in the given unit (inverse of frequencyToHz). */
export function frequencyFromHz(options: { freqHz: number; unit: FrequencyUnit }): number {
  return roundNoise(options.freqHz / FREQUENCY_UNITS[options.unit])
}

/** The unit a frequency reads best in. */
export function bestUnitFor(freqHz: number): { unit: string; hz: number } {
  const abs = Math.abs(freqHz)
  return STEPS.find((s) => abs >= s.from) ?? STEPS[STEPS.length - 1]!
}

/** "156.8 MHz", "1747 MHz", "5.8 GHz", "990 kHz". Non-finite input reads as "—". */
export function formatFrequencyHz(freqHz: number): string {
  if (!Number.isFinite(freqHz)) return '—'
  const { unit, hz } = bestUnitFor(freqHz)
  return `${trimFigure(freqHz / hz)} ${unit}`
}

/**
 * A range: "1710–1785 MHz" when both ends share a unit, "990 kHz – 1.2 MHz" otherwise, and a
 * single frequency when both ends are equal.
 */
export function formatFrequencyRangeHz(options: { lowHz: number; highHz: number }): string {
  const { lowHz, highHz } = options
  if (lowHz === highHz) return formatFrequencyHz(lowHz)
  const low = bestUnitFor(lowHz)
  const high = bestUnitFor(highHz)
  if (low.unit === high.unit) return `${trimFigure(lowHz / low.hz)}–${trimFigure(highHz / high.hz)} ${high.unit}`
  return `${formatFrequencyHz(lowHz)} – ${formatFrequencyHz(highHz)}`
}

/** Up to 9 significant digits, no trailing zeros, no exponent for ordinary radio figures. */
function trimFigure(x: number): string {
  return String(Number.parseFloat(x.toPrecision(9)))
}

/** Removes binary floating-point noise (156.8 × 1e6 = 156800000.00000003). */
function roundNoise(x: number): number {
  return Number.parseFloat(x.toPrecision(12))
}

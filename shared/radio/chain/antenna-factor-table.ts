/**
 * The antenna factor at a frequency, from a calibrated table of (frequency, antenna factor)
 * points: a calibration certificate lists the factor at chosen frequencies and a measurement
 * between them needs a value in between.
 *
 * Method: straight-line interpolation of the factor in dB against the logarithm of frequency
 * between the two neighbouring points (an antenna factor grows by about 20 dB per decade of
 * frequency for a constant gain, see antenna.ts eq. (1), so it is close to a straight line on
 * that axis) — common practice, no source. At a listed frequency the listed value is returned
 * exactly. A frequency outside the table is refused (RangeError), never extrapolated.
 *
 * Equation:
 *   (1) AF(f) = AF_i + (AF_{i+1} − AF_i) · (log10 f − log10 f_i) / (log10 f_{i+1} − log10 f_i)   [dB/m]
 */
import { requireFinite, requirePositive } from '../guards'
import type { MethodRef, RadioResult } from '../types'

export const ANTENNA_FACTOR_TABLE_METHOD: MethodRef = {
  id: 'antenna-factor-table-log-frequency',
  source: 'Antenna factor interpolated linearly in dB against log10 frequency between the calibrated points of its table, never extrapolated (common practice, no source)',
}

/** One calibrated point of an antenna-factor table. */
export interface AntennaFactorTablePoint {
  freqHz: number
  antennaFactorDbPerM: number
}

const mhz = (hz: number): string => `${Number((hz / 1e6).toPrecision(6))} MHz`

/**
 * Checks a table: at least two points, finite factors, frequencies above zero and strictly
 * ascending. Returns the problem in words, or null.
 */
export function antennaFactorTableProblem(table: readonly AntennaFactorTablePoint[]): string | null {
  if (table.length < 2) return 'An antenna-factor table needs at least two calibrated points.'
  for (let i = 0; i < table.length; i++) {
    const p = table[i]!
    if (!(Number.isFinite(p.freqHz) && p.freqHz > 0)) return `Point ${i + 1} of the antenna-factor table needs a frequency above 0 Hz.`
    if (!Number.isFinite(p.antennaFactorDbPerM)) return `Point ${i + 1} of the antenna-factor table needs a finite antenna factor.`
    if (i > 0 && !(p.freqHz > table[i - 1]!.freqHz)) return `The antenna-factor table’s frequencies must rise from one point to the next (point ${i + 1} does not).`
  }
  return null
}

/**
 * The antenna factor at freqHz from a calibrated table (eq. (1)); a RangeError names the
 * table's range when freqHz is outside it.
 */
export function antennaFactorFromTableDbPerM(opts: { freqHz: number; table: readonly AntennaFactorTablePoint[] }): RadioResult<number> {
  const freqHz = requirePositive('freqHz', opts.freqHz)
  const problem = antennaFactorTableProblem(opts.table)
  if (problem) throw new RangeError(problem)
  const t = opts.table
  const low = t[0]!
  const high = t[t.length - 1]!
  if (freqHz < low.freqHz || freqHz > high.freqHz) {
    throw new RangeError(
      `The antenna-factor table covers ${mhz(low.freqHz)} to ${mhz(high.freqHz)}; ${mhz(freqHz)} is outside it, and the table is not extrapolated. Use an antenna calibrated at this frequency.`,
    )
  }
  let i = 0
  while (t[i + 1]!.freqHz < freqHz) i++
  const a = t[i]!
  const b = t[i + 1]!
  let value: number
  if (freqHz === a.freqHz) value = requireFinite('antennaFactorDbPerM', a.antennaFactorDbPerM)
  else if (freqHz === b.freqHz) value = requireFinite('antennaFactorDbPerM', b.antennaFactorDbPerM)
  else {
    const x = (Math.log10(freqHz) - Math.log10(a.freqHz)) / (Math.log10(b.freqHz) - Math.log10(a.freqHz))
    value = a.antennaFactorDbPerM + (b.antennaFactorDbPerM - a.antennaFactorDbPerM) * x // Eq. (1) [dB/m]
  }
  return { value, warnings: [], method: ANTENNA_FACTOR_TABLE_METHOD }
}

/**
 * RF exposure reference levels as data: ICNIRP (2020) "Guidelines for limiting exposure to
 * electromagnetic fields (100 kHz to 300 GHz)", Health Physics 118(5):483–524,
 * Table 5 (whole body, averaged over 30 min) and Table 6 (local, averaged over 6 min).
 *
 * Verification status of each row (the primary text was NOT read):
 *  - Table 6 (local, 6 min): every row [V-S], read in a textbook reproduction of the table
 *    ("Reproduced from ICNIRP, Health Physics 118:483–524, 2020").
 *  - Table 5 (whole body, 30 min): general public 400–2000 MHz fM/200 and 2–300 GHz 10 W/m²
 *    [V-S, weak] (a public note quoting Table 5); all other rows [M] — recalled; they agree with
 *    public calculator code (weak corroboration) and join the verified rows continuously.
 *
 * Where the table gives no power density (100 kHz–30 MHz: only E and H), the level used for
 * screening is the plane-wave equivalent of the E level, S = E²/Z0, and the result says so.
 *
 * Equations:
 *   (1) S_ref = a·f^b                  [W/m²]  f in MHz or GHz as the row states
 *   (2) S_ref = (a·f^b)²/Z0            [W/m²]  rows given as an E level [V/m]
 */
import { FREE_SPACE_IMPEDANCE_OHM } from '../constants'
import { requirePositive } from '../guards'

export type ExposurePopulation = 'general-public' | 'occupational'
export type ExposureAveraging = 'whole-body-30min' | 'local-6min'

export interface ReferenceLevelRow {
  population: ExposurePopulation
  averaging: ExposureAveraging
  /** Row applies for lowHz < f ≤ highHz (the first row from lowHz inclusive); highExclusive makes f < highHz. */
  lowHz: number
  highHz: number
  highExclusive?: boolean
  /** 'Sinc' = incident power density [W/m²]; 'Einc' = incident E field [V/m]. */
  quantity: 'Sinc' | 'Einc'
  coefficient: number
  exponent: number
  freqUnit: 'MHz' | 'GHz'
  /** The row as written in the table. */
  formula: string
  status: '[V-S]' | '[M]'
  statusNote: string
}

const MHZ = 1e6
const GHZ = 1e9
const T5 = 'ICNIRP (2020) Health Physics 118(5):483–524, Table 5'
const T6 = 'ICNIRP (2020) Health Physics 118(5):483–524, Table 6'
const T6_NOTE = `${T6} as reproduced in a textbook table [V-S].`
const T5_M_NOTE = `${T5}: recalled [M]; agrees with public calculator code (weak) and joins the verified rows continuously.`

export const ICNIRP_2020_REFERENCE_LEVELS: readonly ReferenceLevelRow[] = [
  // ── Table 5: whole body, 30 min ──
  { population: 'general-public', averaging: 'whole-body-30min', lowHz: 0.1 * MHZ, highHz: 30 * MHZ, quantity: 'Einc', coefficient: 300, exponent: -0.7, freqUnit: 'MHz', formula: 'Einc = 300/fM^0.7 V/m (Sinc not applicable)', status: '[M]', statusNote: `${T5}: recalled [M]; 300/30^0.7 = 27.8 V/m joins the 27.7 V/m of 30–400 MHz.` },
  { population: 'general-public', averaging: 'whole-body-30min', lowHz: 30 * MHZ, highHz: 400 * MHZ, quantity: 'Sinc', coefficient: 2, exponent: 0, freqUnit: 'MHz', formula: 'Sinc = 2 W/m²', status: '[M]', statusNote: T5_M_NOTE },
  { population: 'general-public', averaging: 'whole-body-30min', lowHz: 400 * MHZ, highHz: 2000 * MHZ, quantity: 'Sinc', coefficient: 1 / 200, exponent: 1, freqUnit: 'MHz', formula: 'Sinc = fM/200 W/m²', status: '[V-S]', statusNote: `${T5}: confirmed in a public note quoting Table 5 (weak secondary).` },
  { population: 'general-public', averaging: 'whole-body-30min', lowHz: 2 * GHZ, highHz: 300 * GHZ, quantity: 'Sinc', coefficient: 10, exponent: 0, freqUnit: 'GHz', formula: 'Sinc = 10 W/m²', status: '[V-S]', statusNote: `${T5}: confirmed in a public note quoting Table 5 (weak secondary).` },
  { population: 'occupational', averaging: 'whole-body-30min', lowHz: 0.1 * MHZ, highHz: 30 * MHZ, quantity: 'Einc', coefficient: 660, exponent: -0.7, freqUnit: 'MHz', formula: 'Einc = 660/fM^0.7 V/m (Sinc not applicable)', status: '[M]', statusNote: `${T5}: recalled [M]; 660/30^0.7 = 61.1 V/m joins the 61 V/m of 30–400 MHz.` },
  { population: 'occupational', averaging: 'whole-body-30min', lowHz: 30 * MHZ, highHz: 400 * MHZ, quantity: 'Sinc', coefficient: 10, exponent: 0, freqUnit: 'MHz', formula: 'Sinc = 10 W/m²', status: '[M]', statusNote: T5_M_NOTE },
  { population: 'occupational', averaging: 'whole-body-30min', lowHz: 400 * MHZ, highHz: 2000 * MHZ, quantity: 'Sinc', coefficient: 1 / 40, exponent: 1, freqUnit: 'MHz', formula: 'Sinc = fM/40 W/m²', status: '[M]', statusNote: T5_M_NOTE },
  { population: 'occupational', averaging: 'whole-body-30min', lowHz: 2 * GHZ, highHz: 300 * GHZ, quantity: 'Sinc', coefficient: 50, exponent: 0, freqUnit: 'GHz', formula: 'Sinc = 50 W/m²', status: '[M]', statusNote: T5_M_NOTE },
  // ── Table 6: local, 6 min ──
  { population: 'general-public', averaging: 'local-6min', lowHz: 0.1 * MHZ, highHz: 30 * MHZ, quantity: 'Einc', coefficient: 671, exponent: -0.7, freqUnit: 'MHz', formula: 'Einc = 671/fM^0.7 V/m (Sinc not applicable)', status: '[V-S]', statusNote: T6_NOTE },
  { population: 'general-public', averaging: 'local-6min', lowHz: 30 * MHZ, highHz: 400 * MHZ, quantity: 'Sinc', coefficient: 10, exponent: 0, freqUnit: 'MHz', formula: 'Sinc = 10 W/m²', status: '[V-S]', statusNote: T6_NOTE },
  { population: 'general-public', averaging: 'local-6min', lowHz: 400 * MHZ, highHz: 2000 * MHZ, quantity: 'Sinc', coefficient: 0.058, exponent: 0.86, freqUnit: 'MHz', formula: 'Sinc = 0.058·fM^0.86 W/m²', status: '[V-S]', statusNote: T6_NOTE },
  { population: 'general-public', averaging: 'local-6min', lowHz: 2 * GHZ, highHz: 6 * GHZ, quantity: 'Sinc', coefficient: 40, exponent: 0, freqUnit: 'GHz', formula: 'Sinc = 40 W/m²', status: '[V-S]', statusNote: T6_NOTE },
  { population: 'general-public', averaging: 'local-6min', lowHz: 6 * GHZ, highHz: 300 * GHZ, highExclusive: true, quantity: 'Sinc', coefficient: 55, exponent: -0.177, freqUnit: 'GHz', formula: 'Sinc = 55/fG^0.177 W/m²', status: '[V-S]', statusNote: T6_NOTE },
  { population: 'general-public', averaging: 'local-6min', lowHz: 300 * GHZ, highHz: 300 * GHZ, quantity: 'Sinc', coefficient: 20, exponent: 0, freqUnit: 'GHz', formula: 'Sinc = 20 W/m² (300 GHz)', status: '[V-S]', statusNote: T6_NOTE },
  { population: 'occupational', averaging: 'local-6min', lowHz: 0.1 * MHZ, highHz: 30 * MHZ, quantity: 'Einc', coefficient: 1504, exponent: -0.7, freqUnit: 'MHz', formula: 'Einc = 1504/fM^0.7 V/m (Sinc not applicable)', status: '[V-S]', statusNote: T6_NOTE },
  { population: 'occupational', averaging: 'local-6min', lowHz: 30 * MHZ, highHz: 400 * MHZ, quantity: 'Sinc', coefficient: 50, exponent: 0, freqUnit: 'MHz', formula: 'Sinc = 50 W/m²', status: '[V-S]', statusNote: T6_NOTE },
  { population: 'occupational', averaging: 'local-6min', lowHz: 400 * MHZ, highHz: 2000 * MHZ, quantity: 'Sinc', coefficient: 0.29, exponent: 0.86, freqUnit: 'MHz', formula: 'Sinc = 0.29·fM^0.86 W/m²', status: '[V-S]', statusNote: T6_NOTE },
  { population: 'occupational', averaging: 'local-6min', lowHz: 2 * GHZ, highHz: 6 * GHZ, quantity: 'Sinc', coefficient: 200, exponent: 0, freqUnit: 'GHz', formula: 'Sinc = 200 W/m²', status: '[V-S]', statusNote: T6_NOTE },
  { population: 'occupational', averaging: 'local-6min', lowHz: 6 * GHZ, highHz: 300 * GHZ, highExclusive: true, quantity: 'Sinc', coefficient: 275, exponent: -0.177, freqUnit: 'GHz', formula: 'Sinc = 275/fG^0.177 W/m²', status: '[V-S]', statusNote: T6_NOTE },
  { population: 'occupational', averaging: 'local-6min', lowHz: 300 * GHZ, highHz: 300 * GHZ, quantity: 'Sinc', coefficient: 100, exponent: 0, freqUnit: 'GHz', formula: 'Sinc = 100 W/m² (300 GHz)', status: '[V-S]', statusNote: T6_NOTE },
]

export const ICNIRP_2020_FREQUENCY_RANGE_HZ = { lowHz: 100e3, highHz: 300e9 } as const

export interface ReferenceLevel {
  /** Power density to compare with [W/m²]: Sinc, or the plane-wave equivalent of Einc. */
  powerDensityWPerM2: number
  basis: 'Sinc' | 'Einc plane-wave equivalent'
  /** The E level itself [V/m] for rows given as E. */
  fieldStrengthVPerM?: number
  row: ReferenceLevelRow
}

function rowApplies(r: ReferenceLevelRow, f: number, first: boolean): boolean {
  const aboveLow = first ? f >= r.lowHz : f > r.lowHz || (r.lowHz === r.highHz && f === r.lowHz)
  const belowHigh = r.highExclusive ? f < r.highHz : f <= r.highHz
  return aboveLow && belowHigh
}

/** ICNIRP 2020 reference level at a frequency for a population and averaging. */
export function icnirp2020ReferenceLevel(opts: {
  freqHz: number
  population: ExposurePopulation
  averaging?: ExposureAveraging
}): ReferenceLevel {
  const f = requirePositive('freqHz', opts.freqHz)
  const averaging = opts.averaging ?? 'whole-body-30min'
  const { lowHz, highHz } = ICNIRP_2020_FREQUENCY_RANGE_HZ
  if (f < lowHz || f > highHz) {
    throw new RangeError(`freqHz must be between ${lowHz} and ${highHz} Hz for ICNIRP 2020 RF reference levels (got ${f}).`)
  }
  const rows = ICNIRP_2020_REFERENCE_LEVELS.filter((r) => r.population === opts.population && r.averaging === averaging)
  if (rows.length === 0) {
    throw new RangeError(`population '${String(opts.population)}' with averaging '${String(averaging)}' has no reference levels.`)
  }
  const row = rows.find((r, i) => rowApplies(r, f, i === 0))
  if (!row) throw new RangeError(`No reference-level row covers freqHz = ${f}.`)
  const fUnit = row.freqUnit === 'MHz' ? f / MHZ : f / GHZ
  const level = row.coefficient * fUnit ** row.exponent // Eq. (1) [W/m² or V/m]
  if (row.quantity === 'Sinc') return { powerDensityWPerM2: level, basis: 'Sinc', row }
  return {
    powerDensityWPerM2: level ** 2 / FREE_SPACE_IMPEDANCE_OHM, // Eq. (2) [W/m²]
    basis: 'Einc plane-wave equivalent',
    fieldStrengthVPerM: level,
    row,
  }
}

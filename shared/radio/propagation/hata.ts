/**
 * Okumura–Hata (urban, suburban, open) and COST-231 Hata median path loss.
 *
 * Documents: M. Hata, "Empirical formula for propagation loss in land mobile radio services",
 * IEEE Trans. Veh. Technol. VT-29 (1980); COST 231 Final Report (1999) §4.4, eqs. (4.4.1)
 * (Hata urban) and (4.4.3) (COST-231 Hata) as cited by ns-3 `okumura-hata-propagation-loss-model.cc`
 * [V-I]; suburban and open corrections as in Lee, Lee & Lee, "Integrated Wireless Propagation
 * Models", §2.12.1 (open: eq. 2.12.1.8) [V-S]. The `Eq. (n)` tags refer to this list
 * (f [MHz], h_b, h_m [m], d [km]):
 *
 *  (1) L_u = 69.55 + 26.16·log f − 13.82·log h_b − a(h_m) + (44.9 − 6.55·log h_b)·log d   COST 231 (4.4.1)
 *  (2) a(h_m) small/medium city = (1.1·log f − 0.7)·h_m − (1.56·log f − 0.8)
 *  (3) a(h_m) large city = 8.29·(log 1.54·h_m)² − 1.1 for f ≤ 200 MHz;
 *                          3.2·(log 11.75·h_m)² − 4.97 for f > 200 MHz
 *  (4) L_su = L_u − 2·(log(f/28))² − 5.4
 *  (5) L_o = L_u − 4.78·(log f)² + 18.33·log f − 40.94                                      Lee (2.12.1.8)
 *  (6) L = 46.3 + 33.9·log f − 13.82·log h_b − a(h_m) + (44.9 − 6.55·log h_b)·log d + C_m     COST 231 (4.4.3)
 *      C_m = 0 dB (medium city, suburban) or 3 dB (metropolitan centre), or a number the caller gives
 *  (7) d = 10^((L − A)/B), B = 44.9 − 6.55·log h_b: the loss is linear in log d
 *
 * Large-city a(h_m) split: Hata gives the first form for f ≤ 200 MHz and the second for
 * f ≥ 400 MHz; texts split at 200 (ns-3, Wikipedia), 300 (Rappaport [M]) or 400 MHz. This
 * file splits at 200 MHz, as ns-3 does [V-I], and warns between 200 and 400 MHz.
 * Suburban and open areas use the small/medium-city a(h_m) unless told otherwise: Hata
 * derives both from the medium-city urban loss. COST-231 uses the small/medium-city a(h_m).
 *
 * Heights: the base-station antenna h_b is `txHeightM`, the mobile antenna h_m is `rxHeightM`
 * (the library's one naming for antenna heights).
 */
import { requireFinite, requirePositive } from '../guards'
import { checkValidity, type MethodRef, type ValidityRange } from '../types'
import type { PathDistanceResult, PathLossResult } from './model'

export type HataEnvironment = 'urban-small-medium' | 'urban-large' | 'suburban' | 'open'
export type Cost231Environment = 'medium-city' | 'metropolitan'
export type HataCitySize = 'small-medium' | 'large'

export const HATA_METHOD: MethodRef = {
  id: 'okumura-hata',
  source: 'Hata, IEEE Trans. VT-29 (1980); COST 231 Final Report §4.4 eq. (4.4.1); suburban/open corrections per Hata',
}
export const COST231_HATA_METHOD: MethodRef = {
  id: 'cost231-hata',
  source: 'COST 231 Final Report (1999) §4.4 eq. (4.4.3), COST-231 Hata',
}

/** Large-city a(h_m) switches form above this frequency [MHz] (ns-3; Wikipedia "Hata model"). */
export const HATA_LARGE_CITY_SPLIT_MHZ = 200
/** Hata states the high-frequency large-city a(h_m) from this frequency up [MHz]. */
export const HATA_LARGE_CITY_HIGH_FORM_FROM_MHZ = 400

/**
 * Validity of Okumura–Hata. Most texts give 150–1500 MHz; Hata's 1980 abstract states
 * 100–1500 MHz. This table uses 150–1500 MHz, so 100–150 MHz is flagged.
 */
export const HATA_VALIDITY: ValidityRange[] = [
  { quantity: 'freqMhz', min: 150, max: 1500, unit: 'MHz', source: 'Okumura–Hata; Hata (1980) abstract states 100–1500 MHz' },
  { quantity: 'txHeightM', min: 30, max: 200, unit: 'm', source: 'Okumura–Hata, Hata (1980): base-station height h_b' },
  { quantity: 'rxHeightM', min: 1, max: 10, unit: 'm', source: 'Okumura–Hata, Hata (1980): mobile height h_m' },
  { quantity: 'distanceKm', min: 1, max: 20, unit: 'km', source: 'Okumura–Hata, Hata (1980)' },
]

export const COST231_HATA_VALIDITY: ValidityRange[] = [
  { quantity: 'freqMhz', min: 1500, max: 2000, unit: 'MHz', source: 'COST 231 Final Report §4.4' },
  { quantity: 'txHeightM', min: 30, max: 200, unit: 'm', source: 'COST 231 Final Report §4.4: base-station height h_b' },
  { quantity: 'rxHeightM', min: 1, max: 10, unit: 'm', source: 'COST 231 Final Report §4.4: mobile height h_m' },
  { quantity: 'distanceKm', min: 1, max: 20, unit: 'km', source: 'COST 231 Final Report §4.4' },
]

export interface HataParams {
  freqHz: number
  /** Base-station (transmitter) antenna height h_b [m]. */
  txHeightM: number
  /** Mobile (receiver) antenna height h_m [m]. */
  rxHeightM: number
  environment: HataEnvironment
  /** a(h_m) used for suburban and open areas; small/medium city by default. */
  suburbanOpenCitySize?: HataCitySize
}

export interface Cost231HataParams {
  freqHz: number
  /** Base-station (transmitter) antenna height h_b [m]. */
  txHeightM: number
  /** Mobile (receiver) antenna height h_m [m]. */
  rxHeightM: number
  /** C_m by name: 0 dB medium city or suburban; 3 dB metropolitan centre. Give this or cityCorrectionDb. */
  environment?: Cost231Environment
  /** C_m as a number [dB]. Give this or environment. */
  cityCorrectionDb?: number
}

/** C_m of each named COST-231 environment [dB]. */
export const COST231_CITY_CORRECTION_DB: Record<Cost231Environment, number> = { 'medium-city': 0, metropolitan: 3 }

/** C_m [dB] from exactly one of environment or cityCorrectionDb. */
export function cost231CityCorrectionDb(opts: { environment?: Cost231Environment; cityCorrectionDb?: number }): number {
  const byName = opts.environment !== undefined
  const byNumber = opts.cityCorrectionDb !== undefined
  if (byName === byNumber) throw new RangeError('Give exactly one of environment or cityCorrectionDb (C_m).')
  if (byNumber) return requireFinite('cityCorrectionDb', opts.cityCorrectionDb!)
  const cm = COST231_CITY_CORRECTION_DB[opts.environment!]
  if (cm === undefined) throw new RangeError(`environment must be 'medium-city' or 'metropolitan' (got ${JSON.stringify(opts.environment)}).`)
  return cm
}

const log = Math.log10

/** Mobile antenna height correction a(h_m) [dB]. */
export function hataMobileCorrectionDb(opts: { freqHz: number; rxHeightM: number; citySize: HataCitySize }): number {
  const f = requirePositive('freqHz', opts.freqHz) / 1e6
  const hm = requirePositive('rxHeightM', opts.rxHeightM)
  if (opts.citySize === 'small-medium') return (1.1 * log(f) - 0.7) * hm - (1.56 * log(f) - 0.8) // Eq. (2) [dB]
  return f <= HATA_LARGE_CITY_SPLIT_MHZ
    ? 8.29 * log(1.54 * hm) ** 2 - 1.1 // Eq. (3) [dB]
    : 3.2 * log(11.75 * hm) ** 2 - 4.97 // Eq. (3) [dB]
}

/** Loss as A + B·log10(d_km): intercept A [dB] and slope B [dB/decade] of the chosen variant. */
interface LinearInLogD {
  interceptDb: number
  slopeDbPerDecade: number
  warnings: string[]
}

/** Base heights above 10^(44.9/6.55) m ≈ 7000 km would make the distance slope B non-positive. */
function requireGrowingWithDistance(hb: number): number {
  if (44.9 - 6.55 * log(hb) <= 0) throw new RangeError(`txHeightM = ${hb} m is beyond any physical mast height for Hata (slope 44.9 − 6.55·log h_b ≤ 0).`)
  return hb
}

function hataLine(p: HataParams): LinearInLogD {
  const freqHz = requirePositive('freqHz', p.freqHz)
  const hb = requireGrowingWithDistance(requirePositive('txHeightM', p.txHeightM))
  const hm = requirePositive('rxHeightM', p.rxHeightM)
  const f = freqHz / 1e6
  const citySize: HataCitySize =
    p.environment === 'urban-large'
      ? 'large'
      : p.environment === 'urban-small-medium'
        ? 'small-medium'
        : (p.suburbanOpenCitySize ?? 'small-medium')
  const a = hataMobileCorrectionDb({ freqHz, rxHeightM: hm, citySize })
  const urbanAt1Km = 69.55 + 26.16 * log(f) - 13.82 * log(hb) - a // Eq. (1) [dB]
  const correction =
    p.environment === 'suburban'
      ? -2 * log(f / 28) ** 2 - 5.4 // Eq. (4) [dB]
      : p.environment === 'open'
        ? -4.78 * log(f) ** 2 + 18.33 * log(f) - 40.94 // Eq. (5) [dB]
        : 0
  const warnings = checkValidity(HATA_VALIDITY, { freqMhz: f, txHeightM: hb, rxHeightM: hm })
  if (citySize === 'large' && f > HATA_LARGE_CITY_SPLIT_MHZ && f < HATA_LARGE_CITY_HIGH_FORM_FROM_MHZ) {
    warnings.push(
      `freqMhz = ${+f.toFixed(3)} MHz lies between Hata's two large-city a(h_m) forms (≤ 200 MHz and ≥ 400 MHz); ` +
        'the high-frequency form is used from 200 MHz (as in ns-3), but sources split at 200, 300 or 400 MHz.',
    )
  }
  return { interceptDb: urbanAt1Km + correction, slopeDbPerDecade: 44.9 - 6.55 * log(hb), warnings } // Eq. (1) [dB]
}

function cost231Line(p: Cost231HataParams): LinearInLogD {
  const freqHz = requirePositive('freqHz', p.freqHz)
  const hb = requireGrowingWithDistance(requirePositive('txHeightM', p.txHeightM))
  const hm = requirePositive('rxHeightM', p.rxHeightM)
  const f = freqHz / 1e6
  const a = hataMobileCorrectionDb({ freqHz, rxHeightM: hm, citySize: 'small-medium' })
  const cmDb = cost231CityCorrectionDb(p)
  return {
    interceptDb: 46.3 + 33.9 * log(f) - 13.82 * log(hb) - a + cmDb, // Eq. (6) [dB]
    slopeDbPerDecade: 44.9 - 6.55 * log(hb), // Eq. (6) [dB/decade]
    warnings: checkValidity(COST231_HATA_VALIDITY, { freqMhz: f, txHeightM: hb, rxHeightM: hm }),
  }
}

function lossFromLine(line: LinearInLogD, distanceM: number, ranges: ValidityRange[], method: MethodRef): PathLossResult {
  const dKm = requirePositive('distanceM', distanceM) / 1e3
  return {
    value: { lossDb: line.interceptDb + line.slopeDbPerDecade * log(dKm) }, // Eq. (1)/(6) [dB]
    warnings: [...line.warnings, ...checkValidity(ranges, { distanceKm: dKm })],
    method,
  }
}

function distanceFromLine(line: LinearInLogD, lossDb: number, ranges: ValidityRange[], method: MethodRef): PathDistanceResult {
  const target = requireFinite('lossDb', lossDb)
  const dKm = 10 ** ((target - line.interceptDb) / line.slopeDbPerDecade) // Eq. (7) [km]
  return { value: { distanceM: dKm * 1e3 }, warnings: [...line.warnings, ...checkValidity(ranges, { distanceKm: dKm })], method }
}

/** Okumura–Hata median loss at a ground distance [dB]. */
export function hataLossDb(opts: HataParams & { distanceM: number }): PathLossResult {
  return lossFromLine(hataLine(opts), opts.distanceM, HATA_VALIDITY, HATA_METHOD)
}
/** Distance at which the Okumura–Hata loss equals lossDb [m] (closed form). */
export function hataDistanceM(opts: HataParams & { lossDb: number }): PathDistanceResult {
  return distanceFromLine(hataLine(opts), opts.lossDb, HATA_VALIDITY, HATA_METHOD)
}
/** Slope of the Okumura–Hata loss, 44.9 − 6.55·log h_b [dB per decade]. */
export function hataSlopeDbPerDecade(opts: HataParams): number {
  return hataLine(opts).slopeDbPerDecade
}

/** COST-231 Hata median loss at a ground distance [dB]. */
export function cost231HataLossDb(opts: Cost231HataParams & { distanceM: number }): PathLossResult {
  return lossFromLine(cost231Line(opts), opts.distanceM, COST231_HATA_VALIDITY, COST231_HATA_METHOD)
}
/** Distance at which the COST-231 Hata loss equals lossDb [m] (closed form). */
export function cost231HataDistanceM(opts: Cost231HataParams & { lossDb: number }): PathDistanceResult {
  return distanceFromLine(cost231Line(opts), opts.lossDb, COST231_HATA_VALIDITY, COST231_HATA_METHOD)
}
/** Slope of the COST-231 Hata loss [dB per decade]. */
export function cost231HataSlopeDbPerDecade(opts: Cost231HataParams): number {
  return cost231Line(opts).slopeDbPerDecade
}

/**
 * 3GPP TR 38.901 path loss: RMa, UMa, UMi-Street Canyon and InH-Office, LOS and NLOS.
 *
 * Document: 3GPP TR 38.901 "Study on channel model for frequencies from 0.5 to 100 GHz",
 * §7.4.1, Table 7.4.1-1 and its Notes 1 and 5. The formulas were checked against two public
 * implementations that cite the table (ns-3 `three-gpp-propagation-loss-model.cc`, NVIDIA
 * Sionna `tr38901`) [V-I]; the TR text itself was not read. The `Eq. (n)` tags refer to this
 * list (f_c [GHz], distances and heights [m]):
 *
 *  (1) d3D = √(d2D² + (h_BS − h_UT)²)
 *  (2) RMa  d_BP = 2π·h_BS·h_UT·f_c/c (Note 5, actual heights)
 *  (3) RMa  PL1 = 20·log(40π·d3D·f_c/3) + min(0.03·h^1.72, 10)·log d3D − min(0.044·h^1.72, 14.77) + 0.002·log(h)·d3D
 *           PL2 = PL1(d_BP) + 40·log(d3D/d_BP)
 *  (4) RMa  PL′ = 161.04 − 7.1·log W + 7.5·log h − (24.37 − 3.7·(h/h_BS)²)·log h_BS
 *                 + (43.42 − 3.1·log h_BS)·(log d3D − 3) + 20·log f_c − (3.2·(log 11.75·h_UT)² − 4.97)
 *  (5) UMa/UMi d′_BP = 4·h′_BS·h′_UT·f_c/c, h′ = h − h_E, h_E = 1 m (Note 1)
 *  (6) UMa  PL1 = 28.0 + 22·log d3D + 20·log f_c;  PL2 = 28.0 + 40·log d3D + 20·log f_c − 9·log(d′_BP² + (h_BS − h_UT)²)
 *  (7) UMa  PL′ = 13.54 + 39.08·log d3D + 20·log f_c − 0.6·(h_UT − 1.5)
 *  (8) UMi  PL1 = 32.4 + 21·log d3D + 20·log f_c;  PL2 = 32.4 + 40·log d3D + 20·log f_c − 9.5·log(d′_BP² + (h_BS − h_UT)²)
 *  (9) UMi  PL′ = 35.3·log d3D + 22.4 + 21.3·log f_c − 0.3·(h_UT − 1.5)
 * (10) InH  PL_LOS = 32.4 + 17.3·log d3D + 20·log f_c;  PL′ = 38.3·log d3D + 17.30 + 24.9·log f_c
 * (11) NLOS = max(PL_LOS, PL′)
 *
 * c = 3.0·10⁸ m/s in the breakpoint distances, as TR 38.901 Note 1 and ns-3 use (the exact c
 * moves d′_BP by 0.07 %). UMa draws h_E at random when h_UT ≥ 13 m; this deterministic
 * library always uses h_E = 1 m and warns. The loss grows with d2D in every variant, so the
 * inverse is a bisection on d2D; it returns d3D too.
 *
 * Distances: the forward function takes the ground distance d2D (`distanceM`) or, as the table
 * defines InH on it, the 3D distance d3D (`distance3dM`), converted by eq. (1).
 * Heights: h_BS = `txHeightM`, h_UT = `rxHeightM`. "Breakpoint" (d_BP, d′_BP) is where the LOS
 * loss turns to its d⁻⁴ branch, the library's one meaning of the word.
 */
import { requireFinite, requirePositive } from '../guards'
import { checkValidity, type MethodRef, type ValidityRange } from '../types'
import type { PathDistanceResult, PathLossResult } from './model'
import { bisectIncreasing, bracketIncreasing } from './numeric'

export type Tr38901Scenario = 'RMa' | 'UMa' | 'UMi-street-canyon' | 'InH-office'
export type Tr38901Condition = 'LOS' | 'NLOS'

export interface Tr38901Params {
  freqHz: number
  scenario: Tr38901Scenario
  condition: Tr38901Condition
  /** Base-station (transmitter) antenna height h_BS [m]. */
  txHeightM: number
  /** User-terminal (receiver) antenna height h_UT [m]. */
  rxHeightM: number
  /** RMa only: average building height h [m], 5 m by default. */
  buildingHeightM?: number
  /** RMa only: average street width W [m], 20 m by default. */
  streetWidthM?: number
}

export const TR38901_METHOD: MethodRef = {
  id: 'tr38901-pathloss',
  source: '3GPP TR 38.901 §7.4.1 Table 7.4.1-1 (path loss models), Notes 1 and 5',
}

/** Speed of light as used in the breakpoint distances of TR 38.901 (Note 1) [m/s]. */
export const TR38901_SPEED_OF_LIGHT_M_PER_S = 3.0e8
/** Effective environment height h_E for UMa (h_UT < 13 m) and UMi [m]. */
export const TR38901_EFFECTIVE_ENVIRONMENT_HEIGHT_M = 1
export const RMA_DEFAULT_BUILDING_HEIGHT_M = 5
export const RMA_DEFAULT_STREET_WIDTH_M = 20

const TABLE = '3GPP TR 38.901 Table 7.4.1-1'
const FREQ_NOTE_M = '3GPP TR 38.901 title range 0.5–100 GHz [M]'

/** Validity ranges per scenario and condition, as data. */
export const TR38901_VALIDITY: Record<Tr38901Scenario, Record<Tr38901Condition, ValidityRange[]>> = {
  RMa: {
    LOS: ruralRanges(10_000),
    NLOS: ruralRanges(5_000),
  },
  UMa: {
    LOS: urbanRanges(25),
    NLOS: urbanRanges(25),
  },
  'UMi-street-canyon': {
    LOS: urbanRanges(10),
    NLOS: urbanRanges(10),
  },
  'InH-office': {
    LOS: indoorRanges(),
    NLOS: indoorRanges(),
  },
}

function ruralRanges(maxDistance2dM: number): ValidityRange[] {
  return [
    { quantity: 'freqGhz', min: 0.5, max: 30, unit: 'GHz', source: 'RMa 0.5–30 GHz (ns-3 assertion citing TR 38.901)' },
    { quantity: 'distance2dM', min: 10, max: maxDistance2dM, unit: 'm', source: TABLE },
    { quantity: 'txHeightM', min: 10, max: 150, unit: 'm', source: `${TABLE}: h_BS` },
    { quantity: 'rxHeightM', min: 1, max: 10, unit: 'm', source: `${TABLE}: h_UT` },
    { quantity: 'buildingHeightM', min: 5, max: 50, unit: 'm', source: TABLE },
    { quantity: 'streetWidthM', min: 5, max: 50, unit: 'm', source: TABLE },
  ]
}

function urbanRanges(txHeightM: number): ValidityRange[] {
  return [
    { quantity: 'freqGhz', min: 0.5, max: 100, unit: 'GHz', source: FREQ_NOTE_M },
    { quantity: 'distance2dM', min: 10, max: 5_000, unit: 'm', source: TABLE },
    { quantity: 'txHeightM', min: txHeightM, max: txHeightM, unit: 'm', source: `${TABLE}: h_BS` },
    { quantity: 'rxHeightM', min: 1.5, max: 22.5, unit: 'm', source: `${TABLE}: h_UT` },
  ]
}

function indoorRanges(): ValidityRange[] {
  return [
    { quantity: 'freqGhz', min: 0.5, max: 100, unit: 'GHz', source: FREQ_NOTE_M },
    { quantity: 'distance3dM', min: 1, max: 150, unit: 'm', source: TABLE },
  ]
}

/** Shadow-fading σ [dB] per scenario and condition (RMa LOS: PL1 / PL2), Table 7.4.1-1. */
export const TR38901_SHADOW_SIGMA_DB = {
  RMa: { LOS: [4, 6], NLOS: 8 },
  UMa: { LOS: 4, NLOS: 6 },
  'UMi-street-canyon': { LOS: 4, NLOS: 7.82 },
  'InH-office': { LOS: 3, NLOS: 8.03 },
} as const

const log = Math.log10

interface Checked {
  fGhz: number
  hBs: number
  hUt: number
  h: number
  w: number
}

function check(p: Tr38901Params): Checked {
  const fGhz = requirePositive('freqHz', p.freqHz) / 1e9
  const hBs = requirePositive('txHeightM', p.txHeightM)
  const hUt = requirePositive('rxHeightM', p.rxHeightM)
  const h = requirePositive('buildingHeightM', p.buildingHeightM ?? RMA_DEFAULT_BUILDING_HEIGHT_M)
  const w = requirePositive('streetWidthM', p.streetWidthM ?? RMA_DEFAULT_STREET_WIDTH_M)
  if ((p.scenario === 'UMa' || p.scenario === 'UMi-street-canyon') && Math.min(hBs, hUt) <= TR38901_EFFECTIVE_ENVIRONMENT_HEIGHT_M) {
    throw new RangeError(
      `txHeightM (h_BS) and rxHeightM (h_UT) must exceed the effective environment height h_E = 1 m for ${p.scenario} (got ${hBs} m and ${hUt} m).`,
    )
  }
  return { fGhz, hBs, hUt, h, w }
}

/** Breakpoint distance [m]: d_BP for RMa, d′_BP for UMa and UMi (h_E = 1 m); undefined for InH. */
export function tr38901BreakpointDistanceM(opts: Tr38901Params): number | undefined {
  return breakpointM(opts.scenario, check(opts))
}

function breakpointM(scenario: Tr38901Scenario, c: Checked): number | undefined {
  const fHz = c.fGhz * 1e9
  const hE = TR38901_EFFECTIVE_ENVIRONMENT_HEIGHT_M
  if (scenario === 'RMa') return (2 * Math.PI * c.hBs * c.hUt * fHz) / TR38901_SPEED_OF_LIGHT_M_PER_S // Eq. (2) [m]
  if (scenario === 'InH-office') return undefined
  return (4 * (c.hBs - hE) * (c.hUt - hE) * fHz) / TR38901_SPEED_OF_LIGHT_M_PER_S // Eq. (5) [m]
}

function rmaPl1(c: Checked, d3: number): number {
  return (
    20 * log((40 * Math.PI * d3 * c.fGhz) / 3) +
    Math.min(0.03 * c.h ** 1.72, 10) * log(d3) -
    Math.min(0.044 * c.h ** 1.72, 14.77) +
    0.002 * log(c.h) * d3
  ) // Eq. (3) [dB]
}

function losLossDb(scenario: Tr38901Scenario, c: Checked, d2: number, d3: number): number {
  const bp = breakpointM(scenario, c)
  const dh2 = (c.hBs - c.hUt) ** 2
  switch (scenario) {
    case 'RMa':
      return d2 <= bp! ? rmaPl1(c, d3) : rmaPl1(c, bp!) + 40 * log(d3 / bp!) // Eq. (3) [dB]
    case 'UMa':
      return d2 <= bp!
        ? 28.0 + 22 * log(d3) + 20 * log(c.fGhz) // Eq. (6) PL1 [dB]
        : 28.0 + 40 * log(d3) + 20 * log(c.fGhz) - 9 * log(bp! ** 2 + dh2) // Eq. (6) PL2 [dB]
    case 'UMi-street-canyon':
      return d2 <= bp!
        ? 32.4 + 21 * log(d3) + 20 * log(c.fGhz) // Eq. (8) PL1 [dB]
        : 32.4 + 40 * log(d3) + 20 * log(c.fGhz) - 9.5 * log(bp! ** 2 + dh2) // Eq. (8) PL2 [dB]
    case 'InH-office':
      return 32.4 + 17.3 * log(d3) + 20 * log(c.fGhz) // Eq. (10) [dB]
  }
}

function nlosPrimeDb(scenario: Tr38901Scenario, c: Checked, d3: number): number {
  switch (scenario) {
    case 'RMa':
      return (
        161.04 -
        7.1 * log(c.w) +
        7.5 * log(c.h) -
        (24.37 - 3.7 * (c.h / c.hBs) ** 2) * log(c.hBs) +
        (43.42 - 3.1 * log(c.hBs)) * (log(d3) - 3) +
        20 * log(c.fGhz) -
        (3.2 * log(11.75 * c.hUt) ** 2 - 4.97)
      ) // Eq. (4) [dB]
    case 'UMa':
      return 13.54 + 39.08 * log(d3) + 20 * log(c.fGhz) - 0.6 * (c.hUt - 1.5) // Eq. (7) [dB]
    case 'UMi-street-canyon':
      return 35.3 * log(d3) + 22.4 + 21.3 * log(c.fGhz) - 0.3 * (c.hUt - 1.5) // Eq. (9) [dB]
    case 'InH-office':
      return 38.3 * log(d3) + 17.3 + 24.9 * log(c.fGhz) // Eq. (10) [dB]
  }
}

function lossAt(p: Tr38901Params, c: Checked, d2: number): number {
  const d3 = Math.hypot(d2, c.hBs - c.hUt) // Eq. (1) [m]
  const los = losLossDb(p.scenario, c, d2, d3)
  return p.condition === 'LOS' ? los : Math.max(los, nlosPrimeDb(p.scenario, c, d3)) // Eq. (11) [dB]
}

function shadowSigmaDb(p: Tr38901Params, c: Checked, d2: number): number {
  if (p.scenario === 'RMa' && p.condition === 'LOS') {
    return d2 <= breakpointM('RMa', c)! ? TR38901_SHADOW_SIGMA_DB.RMa.LOS[0] : TR38901_SHADOW_SIGMA_DB.RMa.LOS[1]
  }
  if (p.scenario === 'RMa') return TR38901_SHADOW_SIGMA_DB.RMa.NLOS
  return TR38901_SHADOW_SIGMA_DB[p.scenario][p.condition]
}

function warningsAt(p: Tr38901Params, c: Checked, d2: number): string[] {
  const warnings = checkValidity(TR38901_VALIDITY[p.scenario][p.condition], {
    freqGhz: c.fGhz,
    distance2dM: d2,
    distance3dM: Math.hypot(d2, c.hBs - c.hUt),
    txHeightM: c.hBs,
    rxHeightM: c.hUt,
    ...(p.scenario === 'RMa' ? { buildingHeightM: c.h, streetWidthM: c.w } : {}),
  })
  if (p.scenario === 'UMa' && c.hUt >= 13) {
    warnings.push(
      `rxHeightM = ${c.hUt} m (h_UT): TR 38.901 draws the effective environment height h_E at random for h_UT ≥ 13 m; ` +
        'this deterministic model uses h_E = 1 m, which moves the LOS breakpoint outward.',
    )
  }
  return warnings
}

/** Ground distance d2D from exactly one of distanceM (d2D) or distance3dM (d3D, eq. (1) inverted) [m]. */
function groundDistanceM(opts: { distanceM?: number; distance3dM?: number }, c: Checked): number {
  const has2d = opts.distanceM !== undefined
  const has3d = opts.distance3dM !== undefined
  if (has2d === has3d) throw new RangeError('Give exactly one of distanceM (ground, d2D) or distance3dM (d3D).')
  if (has2d) return requirePositive('distanceM', opts.distanceM!)
  const d3 = requirePositive('distance3dM', opts.distance3dM!)
  const dh = Math.abs(c.hBs - c.hUt)
  if (d3 <= dh) {
    throw new RangeError(`distance3dM = ${d3} m must exceed the height difference |h_BS − h_UT| = ${dh} m.`)
  }
  return Math.sqrt(d3 * d3 - dh * dh) // Eq. (1) inverted [m]
}

/**
 * TR 38.901 path loss at a ground distance d2D (`distanceM`) or a 3D distance d3D
 * (`distance3dM`, the distance InH is defined on), with the scenario's shadow-fading σ [dB].
 */
export function tr38901LossDb(opts: Tr38901Params & { distanceM?: number; distance3dM?: number }): PathLossResult {
  const c = check(opts)
  const d2 = groundDistanceM(opts, c)
  return {
    value: { lossDb: lossAt(opts, c, d2), shadowSigmaDb: shadowSigmaDb(opts, c, d2) },
    warnings: warningsAt(opts, c, d2),
    method: TR38901_METHOD,
  }
}

const MIN_DISTANCE_M = 1e-6
const MAX_DISTANCE_M = 1e7

/** Ground distance d2D (and d3D) at which the TR 38.901 loss equals lossDb [m], by bisection (loss grows with d2D). */
export function tr38901DistanceM(opts: Tr38901Params & { lossDb: number }): PathDistanceResult {
  const c = check(opts)
  const lossDb = requireFinite('lossDb', opts.lossDb)
  const fn = (d2: number): number => lossAt(opts, c, d2)
  const bracket = bracketIncreasing({ fn, target: lossDb, startX: 100, minX: MIN_DISTANCE_M, maxX: MAX_DISTANCE_M })
  if (!bracket) {
    throw new RangeError(
      `lossDb = ${lossDb} dB is outside the losses this model gives for 2D distances ${MIN_DISTANCE_M}–${MAX_DISTANCE_M} m ` +
        `(${fn(MIN_DISTANCE_M).toFixed(2)}–${fn(MAX_DISTANCE_M).toFixed(2)} dB).`,
    )
  }
  const d2 = bisectIncreasing({ fn, target: lossDb, ...bracket })
  return { value: { distanceM: d2, distance3dM: Math.hypot(d2, c.hBs - c.hUt) }, warnings: warningsAt(opts, c, d2), method: TR38901_METHOD } // Eq. (1) [m]
}

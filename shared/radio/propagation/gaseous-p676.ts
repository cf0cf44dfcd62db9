/**
 * Specific attenuation by oxygen (dry air) and water vapour, line-by-line.
 *
 * Document: Recommendation ITU-R P.676-13 (08/2022), "Attenuation by atmospheric gases and
 * related effects", Annex 1 §1. Equation (1) is numbered as in the Recommendation (cited by
 * ITU-Rpy `itur/models/itu676.py`); the other tags refer to this list, in the order Annex 1
 * presents them (their numbers in the Recommendation were not verified [M]):
 *
 *  (1) γ = γ_o + γ_w = 0.1820·f·(N″_Ox(f) + N″_WV(f))                       [dB/km], f [GHz]
 *  (2) N″_Ox = Σ S_i·F_i + N″_D(f);  N″_WV = Σ S_i·F_i
 *  (3) S_i = a1·1e-7·p·θ³·exp(a2·(1 − θ))         oxygen line strength
 *      S_i = b1·1e-1·e·θ^3.5·exp(b2·(1 − θ))      water-vapour line strength
 *  (4) θ = 300/T;  e = ρ·T/216.7                                              e [hPa]
 *  (5) F_i = f/f_i·[(Δf − δ·(f_i − f))/((f_i − f)² + Δf²) + (Δf − δ·(f_i + f))/((f_i + f)² + Δf²)]
 *  (6) oxygen:  Δf = a3·1e-4·(p·θ^(0.8 − a4) + 1.1·e·θ), Zeeman-widened Δf = √(Δf² + 2.25e-6)
 *      water:   Δf = b3·1e-4·(p·θ^b4 + b5·e·θ^b6), Doppler-widened
 *               Δf = 0.535·Δf + √(0.217·Δf² + 2.1316e-12·f_i²/θ)
 *  (7) oxygen:  δ = (a5 + a6·θ)·1e-4·(p + e)·θ^0.8;   water: δ = 0
 *  (8) N″_D = f·p·θ²·[6.14e-5/(d·(1 + (f/d)²)) + 1.4e-12·p·θ^1.5/(1 + 1.9e-5·f^1.5)]
 *  (9) d = 5.6e-4·(p + e)·θ^0.8                                               [GHz]
 *
 * p is the dry-air pressure [hPa], T the temperature [K], ρ the water-vapour density [g/m³].
 * Line data: p676-lines.ts. Applicable 1–1000 GHz (Annex 1). [—] marks intermediate quantities
 * (line strengths, refractivities) in the units the Recommendation gives them.
 */
import { requireNonNegative, requirePositive } from '../guards'
import { checkValidity, type MethodRef, type RadioResult, type ValidityRange } from '../types'
import { OXYGEN_LINES, WATER_VAPOUR_LINES } from './p676-lines'

export const GASEOUS_P676_METHOD: MethodRef = {
  id: 'gaseous-p676-13',
  source: 'ITU-R P.676-13 (08/2022) Annex 1 §1, line-by-line specific attenuation, eq. (1)',
}

export const GASEOUS_P676_VALIDITY: ValidityRange[] = [
  { quantity: 'freqGhz', min: 1, max: 1000, unit: 'GHz', source: 'ITU-R P.676-13 Annex 1' },
]

/**
 * Atmosphere of the ITU-R SG3 validation examples for P.676-13 (sea level, mean annual
 * global reference atmosphere): 1013.25 hPa used as dry pressure, 288.15 K, 7.5 g/m³.
 */
export const P676_VALIDATION_ATMOSPHERE = {
  dryPressureHpa: 1013.25,
  temperatureK: 288.15,
  waterVapourDensityGPerM3: 7.5,
} as const

export interface Atmosphere {
  /** Dry-air pressure p [hPa] (total pressure minus water-vapour pressure). */
  dryPressureHpa: number
  temperatureK: number
  waterVapourDensityGPerM3: number
}

export interface GaseousSpecificAttenuation {
  oxygenDbPerKm: number
  waterVapourDbPerKm: number
  totalDbPerKm: number
}

interface State {
  fGhz: number
  p: number
  theta: number
  e: number
}

function state(opts: Atmosphere & { freqHz: number }): State {
  const fGhz = requirePositive('freqHz', opts.freqHz) / 1e9
  const p = requireNonNegative('dryPressureHpa', opts.dryPressureHpa)
  const t = requirePositive('temperatureK', opts.temperatureK)
  const rho = requireNonNegative('waterVapourDensityGPerM3', opts.waterVapourDensityGPerM3)
  return { fGhz, p, theta: 300 / t, e: (rho * t) / 216.7 } // Eq. (4) [hPa]
}

function oxygenRefractivity({ fGhz: f, p, theta, e }: State): number {
  let sum = 0
  for (const [fi, a1, a2, a3, a4, a5, a6] of OXYGEN_LINES) {
    const s = a1 * 1e-7 * p * theta ** 3 * Math.exp(a2 * (1 - theta)) // Eq. (3) [—]
    const df0 = a3 * 1e-4 * (p * theta ** (0.8 - a4) + 1.1 * e * theta) // Eq. (6) [GHz]
    const df = Math.sqrt(df0 * df0 + 2.25e-6) // Eq. (6) Zeeman [GHz]
    const delta = (a5 + a6 * theta) * 1e-4 * (p + e) * theta ** 0.8 // Eq. (7) [—]
    const shape =
      (f / fi) *
      ((df - delta * (fi - f)) / ((fi - f) ** 2 + df * df) + (df - delta * (fi + f)) / ((fi + f) ** 2 + df * df)) // Eq. (5) [1/GHz]
    sum += s * shape // Eq. (2) [—]
  }
  const d = 5.6e-4 * (p + e) * theta ** 0.8 // Eq. (9) [GHz]
  const dryContinuum =
    f * p * theta ** 2 * (6.14e-5 / (d * (1 + (f / d) ** 2)) + (1.4e-12 * p * theta ** 1.5) / (1 + 1.9e-5 * f ** 1.5)) // Eq. (8) [—]
  return sum + dryContinuum // Eq. (2) [—]
}

function waterVapourRefractivity({ fGhz: f, p, theta, e }: State): number {
  let sum = 0
  for (const [fi, b1, b2, b3, b4, b5, b6] of WATER_VAPOUR_LINES) {
    const s = b1 * 1e-1 * e * theta ** 3.5 * Math.exp(b2 * (1 - theta)) // Eq. (3) [—]
    const df0 = b3 * 1e-4 * (p * theta ** b4 + b5 * e * theta ** b6) // Eq. (6) [GHz]
    const df = 0.535 * df0 + Math.sqrt(0.217 * df0 * df0 + (2.1316e-12 * fi * fi) / theta) // Eq. (6) Doppler [GHz]
    const shape = (f / fi) * (df / ((fi - f) ** 2 + df * df) + df / ((fi + f) ** 2 + df * df)) // Eq. (5), δ = 0 [1/GHz]
    sum += s * shape // Eq. (2) [—]
  }
  return sum
}

/** Specific attenuation by oxygen γ_o and water vapour γ_w, and their sum [dB/km]. */
export function gaseousSpecificAttenuation(opts: Atmosphere & { freqHz: number }): RadioResult<GaseousSpecificAttenuation> {
  const st = state(opts)
  const oxygenDbPerKm = 0.182 * st.fGhz * oxygenRefractivity(st) // Eq. (1) [dB/km]
  const waterVapourDbPerKm = 0.182 * st.fGhz * waterVapourRefractivity(st) // Eq. (1) [dB/km]
  return {
    value: { oxygenDbPerKm, waterVapourDbPerKm, totalDbPerKm: oxygenDbPerKm + waterVapourDbPerKm }, // Eq. (1) [dB/km]
    warnings: checkValidity(GASEOUS_P676_VALIDITY, { freqGhz: st.fGhz }),
    method: GASEOUS_P676_METHOD,
  }
}

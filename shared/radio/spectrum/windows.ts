/**
 * Data windows for spectrum estimation, and their equivalent noise bandwidth (ENBW).
 *
 * Document: F. J. Harris, "On the use of windows for harmonic analysis with the discrete
 * Fourier transform", Proc. IEEE 66(1):51–83, January 1978 — §IV (equivalent noise bandwidth),
 * §V (the windows), Table I (figures of merit). Page range after 51 recalled [M].
 * The `Eq. (n)` tags in this file refer to the list below.
 *
 *  (1) w[n] = Σ_k (−1)^k · a_k · cos(2π·k·n/N),  n = 0 … N−1   generalised cosine window,
 *      periodic ("DFT-even") form: the spectral-analysis form of Harris §II, and the form a
 *      Welch estimate uses.
 *  (2) ENBW = N · Σ w[n]² / (Σ w[n])²   [bins]                  Harris §IV
 *  (3) ENBW = (a0² + ½·Σ_{k≥1} a_k²) / a0²   [bins]             closed form of (2) for (1),
 *      exact for periodic windows longer than twice the number of cosine terms [D]
 *
 * Coefficients used (a0, a1, …):
 *  - rectangular: 1                                   ENBW 1.0000 bins (Harris Table I: 1.00)
 *      (all Table I values here are recalled [M]; the ENBW the code uses is computed by (2))
 *  - hann: 0.5, 0.5                                   ENBW 1.5000 bins (Harris Table I: 1.50)
 *  - blackman-harris (4-term, −92 dB side lobes): 0.35875, 0.48829, 0.14128, 0.01168
 *      (Harris 1978, minimum 4-term Blackman-Harris [M for the section]; coefficients
 *      confirmed in secondary references [V-S]), ENBW 2.0044 bins from (3);
 *      Harris Table I rounds it to 2.00 [M for the table]
 *  - flattop (5-term): 0.21557895, 0.41663158, 0.277263158, 0.083578947, 0.006947368
 *      (G. D'Antona and A. Ferrero, "Digital Signal Processing for Measurement Systems",
 *      Springer 2006, p. 70 — as cited by the scipy.signal.windows.flattop documentation [V-S]),
 *      ENBW 3.7702 bins from (3)
 * The tests compare these window samples and their ENBW with scipy.signal.get_window.
 */
import { requireInRange } from '../guards'

export type WindowKind = 'hann' | 'rectangular' | 'blackman-harris' | 'flattop'

/** Cosine-series coefficients a0, a1, … of each window, as data (see the file header for sources). */
export const WINDOW_COEFFICIENTS: Readonly<Record<WindowKind, readonly number[]>> = {
  rectangular: [1],
  hann: [0.5, 0.5],
  'blackman-harris': [0.35875, 0.48829, 0.14128, 0.01168],
  flattop: [0.21557895, 0.41663158, 0.277263158, 0.083578947, 0.006947368],
}

export const WINDOW_KINDS = Object.keys(WINDOW_COEFFICIENTS) as WindowKind[]

/** Periodic (DFT-even) window samples of a given length. */
export function windowSamples(opts: { kind: WindowKind; length: number }): Float64Array {
  const coeffs = WINDOW_COEFFICIENTS[opts.kind]
  if (!coeffs) throw new RangeError(`window kind must be one of ${WINDOW_KINDS.join(', ')} (got ${String(opts.kind)}).`)
  const n = requireInRange('window length', opts.length, 1, 2 ** 26)
  if (!Number.isInteger(n)) throw new RangeError(`window length must be an integer (got ${n}).`)
  const w = new Float64Array(n)
  for (let i = 0; i < n; i++) {
    let v = 0
    for (let k = 0; k < coeffs.length; k++) {
      v += (k % 2 === 0 ? 1 : -1) * coeffs[k] * Math.cos((2 * Math.PI * k * i) / n) // Eq. (1) [1]
    }
    w[i] = v
  }
  return w
}

/** Sums a window needs for spectrum scaling: Σw (coherent gain) and Σw² (noise power gain). */
export function windowSums(samples: ArrayLike<number>): { sumW: number; sumW2: number } {
  let sumW = 0
  let sumW2 = 0
  for (let i = 0; i < samples.length; i++) {
    sumW += samples[i]
    sumW2 += samples[i] * samples[i]
  }
  return { sumW, sumW2 }
}

/** Equivalent noise bandwidth of a window computed from its samples [bins]. */
export function windowEnbwBins(samples: ArrayLike<number>): number {
  if (samples.length === 0) throw new RangeError('window samples must not be empty.')
  const { sumW, sumW2 } = windowSums(samples)
  if (!(sumW > 0)) throw new RangeError('window samples must have a positive sum.')
  return (samples.length * sumW2) / (sumW * sumW) // Eq. (2) [bins]
}

/** Closed-form ENBW of a cosine-series window (eq. 2 for any periodic length N > 2K) [bins]. */
export function windowEnbwBinsClosedForm(kind: WindowKind): number {
  const a = WINDOW_COEFFICIENTS[kind]
  let tail = 0
  for (let k = 1; k < a.length; k++) tail += a[k] * a[k]
  return (a[0] * a[0] + tail / 2) / (a[0] * a[0]) // Eq. (3) [bins]
}

/**
 * A Welch power spectrum seen as an analyser trace, so the same peak, noise-floor,
 * channel-power and occupied-bandwidth analysis serves analyser traces and I/Q recordings.
 *
 * Document: none beyond the scalings of welch-psd.ts [D]. The `Eq. (n)` tags refer to the list below.
 *
 * The trace reads each bin as a power in the window's noise bandwidth, as an analyser reads
 * power in its RBW filter: white noise of density S reads S·ENBW_Hz, and a bin-centred tone
 * reads its own power.
 *
 *  (1) 'spectrum' scaling: L_trace = L_bin                         [dBm or dBFS]
 *  (2) 'density' scaling:  L_trace = L_density + 10·log10(ENBW_Hz)  [dBm or dBFS]
 *  (3) enbwHz of the trace = ENBW_Hz of the window                  [Hz]
 */
import type { WelchPsd } from './welch-psd'

export interface PsdTrace {
  freqHz: Float64Array
  /** Power in the window's noise bandwidth at each bin: dBm, or dBFS when not calibrated (see levelUnit). */
  levelDbm: Float64Array
  /** Noise bandwidth each point is read in, for channelPower and occupiedBandwidth [Hz]. */
  enbwHz: number
  levelUnit: 'dBm' | 'dBFS'
  warnings: string[]
}

/** The trace view of a Welch spectrum; throws when a bin holds no power (−∞ dB). */
export function psdAsTrace(psd: WelchPsd): PsdTrace {
  const offsetDb = psd.scaling === 'density' ? 10 * Math.log10(psd.enbwHz) : 0
  const levelDbm = new Float64Array(psd.levelDb.length)
  for (let j = 0; j < psd.levelDb.length; j++) {
    if (!Number.isFinite(psd.levelDb[j])) {
      throw new RangeError(`PSD bin ${j} (${psd.freqHz[j]} Hz) has no finite level; a trace needs finite levels.`)
    }
    levelDbm[j] = psd.levelDb[j] + offsetDb // Eq. (1), (2) [dBm or dBFS]
  }
  const warnings: string[] = []
  if (psd.reference.kind === 'dBFS') {
    warnings.push('Levels are dB relative to full scale, not dBm: absolute results (peak levels, noise floor, channel power) are in dBFS.')
  }
  return {
    freqHz: psd.freqHz,
    levelDbm,
    enbwHz: psd.enbwHz, // Eq. (3) [Hz]
    levelUnit: psd.reference.kind === 'dBm' ? 'dBm' : 'dBFS',
    warnings,
  }
}

/**
 * Channel power from a trace read in a resolution bandwidth, with the noise-bandwidth
 * correction. A single reading of a flat, noise-like channel (and its inverse) is
 * chain/channel-power.ts rbwReadingToChannelPowerDbm / channelPowerToRbwReadingDbm.
 *
 * Document: Keysight Application Note 150, Spectrum Analysis Basics, ch. 5 (noise measurements)
 * (P_ch = PSD + 10·log B_ch; P_ch = P_read − 10·log B_N + 10·log B_ch with B_N the ENBW of
 * the RBW filter) [D]; check values in CHECK-VALUES.md §14 (register 14-1, 14-3). The `Eq. (n)` tags in this file refer to the list below.
 *
 * Each trace point is the power in the filter's noise bandwidth (ENBW) around its frequency;
 * the points are one bin spacing Δf apart. Summing the points counts every hertz Δf/ENBW
 * times, hence the correction. Each point stands for its cell (trace.ts eq. 1); a cell cut by a
 * band edge counts for the share inside, so a band of width B on a uniform grid counts exactly
 * B/Δf cells wherever the points fall.
 *
 *  (1) P_ch = 10·log10 Σ_i s_i·10^(L_i/10) + 10·log10(Δf / ENBW)      uniform grid   [dBm]
 *  (2) P_ch = 10·log10 Σ_i s_i·10^(L_i/10)·(Δf_i / ENBW)              any grid       [dBm]
 *      s_i = share of cell i inside [startHz, stopHz], Δf_i = width of cell i
 *
 * A density trace (dBm/Hz) becomes a trace read in its bin spacing by adding 10·log10(Δf)
 * and passing enbwHz = Δf; a Welch spectrum enters through psdAsTrace.
 */
import { requireFinite, requirePositive } from '../guards'
import type { MethodRef, RadioResult } from '../types'
import { cellEdgesHz, cellSharesInBand, requireTrace, spacingIrregularity, type Trace } from './trace'

export const CHANNEL_POWER_METHOD: MethodRef = {
  id: 'channel-power-enbw',
  source: 'Sum of trace powers with the RBW noise-bandwidth correction 10·log(Δf/ENBW) (Keysight AN 150 ch. 5; register 14-1, 14-3) [D]',
}

export interface ChannelPower {
  channelPowerDbm: number
  /** Mean bin spacing of the trace [Hz]. */
  binSpacingHz: number
  enbwHz: number
  /** 10·log10(Δf/ENBW) on the mean spacing [dB]. */
  enbwCorrectionDb: number
  /** Number of cells counted, including partial ones as fractions. */
  cellsCounted: number
}

export interface ChannelPowerOptions extends Trace {
  startHz: number
  stopHz: number
  /** Equivalent noise bandwidth of the filter each point was read in (≈ 1.06 × RBW for a Gaussian RBW filter) [Hz]. */
  enbwHz: number
}

/** Channel power in [startHz, stopHz] from a trace read in a noise bandwidth enbwHz [dBm]. */
export function channelPower(opts: ChannelPowerOptions): RadioResult<ChannelPower> {
  const n = requireTrace(opts)
  const startHz = requireFinite('startHz', opts.startHz)
  const stopHz = requireFinite('stopHz', opts.stopHz)
  if (!(stopHz > startHz)) throw new RangeError(`stopHz must be above startHz (got ${startHz} to ${stopHz}).`)
  const enbwHz = requirePositive('enbwHz', opts.enbwHz)
  if (n < 2) throw new RangeError('trace must have at least two points to define a bin spacing.')

  const edges = cellEdgesHz(opts.freqHz)
  const traceLowHz = edges.lowHz[0]
  const traceHighHz = edges.highHz[n - 1]
  if (stopHz <= traceLowHz || startHz >= traceHighHz) {
    throw new RangeError(`band ${startHz}–${stopHz} Hz lies outside the trace (${traceLowHz}–${traceHighHz} Hz).`)
  }
  const share = cellSharesInBand({ edges, startHz, stopHz })
  let sumMwHz = 0
  let cellsCounted = 0
  for (let i = 0; i < n; i++) {
    if (share[i] === 0) continue
    const widthHz = edges.highHz[i] - edges.lowHz[i]
    sumMwHz += share[i] * 10 ** (opts.levelDbm[i] / 10) * widthHz // Eq. (2) [mW·Hz]
    cellsCounted += share[i]
  }
  const channelPowerDbm = 10 * Math.log10(sumMwHz / enbwHz) // Eq. (2) [dBm]
  const binSpacingHz = (opts.freqHz[n - 1] - opts.freqHz[0]) / (n - 1)

  const warnings: string[] = []
  if (startHz < traceLowHz || stopHz > traceHighHz) {
    warnings.push(
      `The band ${startHz}–${stopHz} Hz extends beyond the trace (${traceLowHz}–${traceHighHz} Hz): only the measured part is counted, so the channel power reads low.`,
    )
  }
  if (binSpacingHz > enbwHz) {
    warnings.push(
      `Bin spacing ${binSpacingHz} Hz is wider than the noise bandwidth ${enbwHz} Hz: the trace does not cover every frequency and narrow signals between points are missed (spacing ≤ RBW is common practice, no source).`,
    )
  }
  if (cellsCounted < 5) {
    warnings.push(`Only ${cellsCounted.toFixed(2)} trace cells fall in the band: use a finer trace (common practice, no source).`)
  }
  if (spacingIrregularity(opts.freqHz) > 0.01) {
    warnings.push('Trace points are not evenly spaced: each point is weighted by its own cell width.')
  }
  return {
    value: {
      channelPowerDbm,
      binSpacingHz,
      enbwHz,
      enbwCorrectionDb: 10 * Math.log10(binSpacingHz / enbwHz), // Eq. (1) [dB]
      cellsCounted,
    },
    warnings,
    method: CHANNEL_POWER_METHOD,
  }
}

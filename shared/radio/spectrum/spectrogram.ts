/**
 * A spectrogram (time × frequency) of complex samples pushed block by block, with a bounded
 * number of rows: each row is the Welch average of consecutive segments, and when the rows
 * would exceed `maxRows` neighbouring rows are merged in pairs (their segment sums added), so
 * each row then averages twice as many segments. Any recording length fits in
 * maxRows × segmentLength cells.
 *
 * Document: the short-time Fourier transform averaged per row is Welch's estimate over that
 * row's segments (P. D. Welch, IEEE Trans. Audio Electroacoust. AU-15(2):70–73, 1967); the
 * scaling is welch-psd.ts eq. (3) ('density'), per row [D].
 *
 *  (1) row r holds segments m ∈ [r·S, (r+1)·S), S = segments per row (1, 2, 4, …)
 *  (2) P_r[k] = Σ_{m in row} |X_m[k]|² / (K_r · fs · Σw²)        [FS²/Hz]
 *  (3) L_r[j] = 10·log10 P_r[(j + N/2) mod N] + reference offset   [dBFS/Hz or dBm/Hz]
 *  (4) row r starts at t_r = (first sample of its first segment) / fs   [s]
 */
import { requirePositive } from '../guards'
import { levelReference, referenceOffsetDb, type LevelReference } from './iq'
import { SegmentCutter, SegmentTransformer } from './welch-accumulator'
import { welchSettings } from './welch-psd'
import { windowSums, type WindowKind } from './windows'

export interface SpectrogramOptions {
  sampleRateHz: number
  centerFreqHz?: number
  /** FFT length N = number of frequency columns: a power of two, 2 … 2^24 (512 is typical). */
  segmentLength: number
  /** Overlap between segments as a fraction of N; default 0 (each sample in one segment). */
  overlapFraction?: number
  /** Default 'hann'. */
  window?: WindowKind
  /** Largest number of rows kept: an even number ≥ 2; default 256. */
  maxRows?: number
  fullScaleDbm?: number
}

export interface Spectrogram {
  /** Column (bin) centre frequencies, ascending [Hz]. */
  freqHz: Float64Array
  rowCount: number
  columnCount: number
  /** Start time of each row from the first sample [s]. */
  rowStartS: Float64Array
  /** Segments averaged in each row (the last row may hold fewer). */
  rowSegmentCount: Int32Array
  /** Row-major levels, rowCount × columnCount, density per Hz in `levelUnit` [dB]. */
  levelDb: Float32Array
  levelUnit: 'dBFS/Hz' | 'dBm/Hz'
  reference: LevelReference
  /** Segments per full row (a power of two). */
  segmentsPerRow: number
  segmentLength: number
  overlapSamples: number
  sampleRateHz: number
  binSpacingHz: number
}

export interface SpectrogramAccumulator {
  push(iq: Float32Array | Float64Array): void
  readonly samplesPushed: number
  result(): Spectrogram
}

interface Row {
  sum: Float64Array
  segments: number
  startSample: number
}

/** A bounded spectrogram built from pushed blocks of interleaved I/Q samples. */
export function createSpectrogramAccumulator(opts: SpectrogramOptions): SpectrogramAccumulator {
  const settings = welchSettings({ ...opts, overlapFraction: opts.overlapFraction ?? 0, scaling: 'density', detrend: 'none' })
  const maxRows = opts.maxRows ?? 256
  if (!Number.isInteger(maxRows) || maxRows < 2 || maxRows % 2 !== 0) throw new RangeError(`maxRows must be an even integer ≥ 2 (got ${maxRows}).`)
  requirePositive('sampleRateHz', opts.sampleRateHz)
  const reference = levelReference(opts.fullScaleDbm)
  const n = settings.segmentLength
  const transformer = new SegmentTransformer({ segmentLength: n, window: settings.windowKind })
  const { sumW2 } = windowSums(transformer.window)
  const rows: Row[] = []
  let segmentsPerRow = 1

  const onSegment = (seg: Float64Array, startSample: number) => {
    let row = rows[rows.length - 1]
    if (!row || row.segments === segmentsPerRow) {
      if (rows.length === maxRows) {
        // Eq. (1): merge neighbouring full rows in pairs; each row now averages twice as many segments
        for (let r = 0; r < maxRows / 2; r++) {
          const a = rows[2 * r]
          const b = rows[2 * r + 1]
          for (let k = 0; k < n; k++) a.sum[k] += b.sum[k]
          a.segments += b.segments
          rows[r] = a
        }
        rows.length = maxRows / 2
        segmentsPerRow *= 2
      }
      row = { sum: new Float64Array(n), segments: 0, startSample }
      rows.push(row)
    }
    transformer.addPeriodogram(seg, row.sum, false)
    row.segments++
  }
  const cutter = new SegmentCutter(n, settings.overlapSamples, onSegment)

  return {
    push: (iq) => cutter.push(iq),
    get samplesPushed() {
      return cutter.samplesPushed
    },
    result() {
      if (rows.length === 0) {
        throw new RangeError(`segmentLength ${n} is longer than the recording (${cutter.samplesPushed} complex samples).`)
      }
      const fs = settings.sampleRateHz
      const offsetDb = referenceOffsetDb(reference)
      const half = n >> 1
      const binSpacingHz = fs / n
      const freqHz = new Float64Array(n)
      for (let j = 0; j < n; j++) freqHz[j] = settings.centerFreqHz + (j - half) * binSpacingHz
      const levelDb = new Float32Array(rows.length * n)
      const rowStartS = new Float64Array(rows.length)
      const rowSegmentCount = new Int32Array(rows.length)
      rows.forEach((row, r) => {
        const scale = 1 / (row.segments * fs * sumW2) // Eq. (2) [1/Hz]
        for (let j = 0; j < n; j++) {
          levelDb[r * n + j] = 10 * Math.log10(row.sum[(j + half) & (n - 1)] * scale) + offsetDb // Eq. (3) [dB]
        }
        rowStartS[r] = row.startSample / fs // Eq. (4) [s]
        rowSegmentCount[r] = row.segments
      })
      return {
        freqHz,
        rowCount: rows.length,
        columnCount: n,
        rowStartS,
        rowSegmentCount,
        levelDb,
        levelUnit: reference.kind === 'dBm' ? 'dBm/Hz' : 'dBFS/Hz',
        reference,
        segmentsPerRow,
        segmentLength: n,
        overlapSamples: settings.overlapSamples,
        sampleRateHz: fs,
        binSpacingHz,
      }
    },
  }
}

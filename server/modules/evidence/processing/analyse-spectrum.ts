/**
 * Reads a spectrum evidence file as a stream and turns it into a summary, a display trace and
 * a spectrogram, with the radio library's methods:
 *
 * - a SigMF archive (`.sigmf`, a tar file holding `<name>.sigmf-meta` and `<name>.sigmf-data`):
 *   the data member is decoded block by block (cf32_le, ci16_le, cu8) into the block-wise
 *   Welch accumulator and the spectrogram accumulator, never held whole in memory;
 * - an analyser trace as CSV (the library's parser) or JSON `{ freqHz[], levelDbm[], enbwHz? }`.
 *
 * Every refusal is an EvidenceProcessingError (or the library's SigmfError / TraceCsvError /
 * the tar reader's TarError) whose message says what is wrong with the file.
 */
import { availableParallelism } from 'node:os'
import {
  channelPower,
  CHANNEL_POWER_METHOD,
  checkSigmfDataLength,
  createSigmfBlockDecoder,
  createSpectrogramAccumulator,
  createWelchAccumulator,
  decimateTrace,
  findPeaks,
  noiseFloor,
  NOISE_FLOOR_METHOD,
  occupiedBandwidth,
  OCCUPIED_BANDWIDTH_METHOD,
  parseSigmfMetadata,
  parseTraceCsv,
  PEAKS_METHOD,
  psdAsTrace,
  requireTrace,
  WELCH_METHOD,
  type SigmfMetadata,
  type Spectrogram,
  type Trace,
} from '../../../../shared/radio/spectrum'
import type { MethodRef } from '../../../../shared/radio/types'
import type { DisplayTraceView, SpectrogramView, SpectrumSummary } from '../../../../shared/schemas/spectrum'
import { readTar, type TarMemberSink } from './tar-reader'
import { createParallelWelchAccumulator } from './parallel-welch'

export class EvidenceProcessingError extends Error {
  constructor(message: string) {
    super(message)
    this.name = 'EvidenceProcessingError'
  }
}

export interface SpectrumAnalysis {
  summary: SpectrumSummary
  displayTrace: DisplayTraceView
  spectrogram: SpectrogramView | null
}

export interface AnalyseOptions {
  /** Opens the stored object from its start (a SigMF archive may be read twice). */
  open: () => Promise<AsyncIterable<Uint8Array>>
  originalName: string
  contentType: string
  /** 0 … 1, awaited: the caller records it. */
  onProgress?: (progress: number) => Promise<void>
  /** Largest `.sigmf-data` member read [bytes]. */
  maxDataBytes?: number
}

/** Welch segment length for the summary PSD and the spectrogram's columns. */
export const PSD_SEGMENT_LENGTH = 4096
export const SPECTROGRAM_COLUMNS = 512
export const SPECTROGRAM_MAX_ROWS = 256
/** From this many complex samples (32 MiB of cf32) the summary PSD runs on every core (parallel-welch.ts). */
export const PARALLEL_WELCH_MIN_SAMPLES = 2 ** 22
const MAX_META_BYTES = 4 * 1024 * 1024
const MAX_TRACE_BYTES = 32 * 1024 * 1024
const DEFAULT_MAX_DATA_BYTES = 4 * 1024 * 1024 * 1024

type SourceKind = 'sigmf_archive' | 'sigmf_files' | 'trace_csv' | 'trace_json'

/** What the file is, from its stored content type (decided from its content on upload) and name. */
export function spectrumSourceOf(contentType: string, originalName: string): SourceKind {
  const name = originalName.toLowerCase()
  if (contentType === 'application/x-tar' || name.endsWith('.sigmf')) return 'sigmf_archive'
  if (contentType === 'text/csv' || name.endsWith('.csv')) return 'trace_csv'
  if (contentType === 'application/json' || name.endsWith('.json')) return 'trace_json'
  throw new EvidenceProcessingError(
    `This file (${contentType}) is not a spectrum trace or an I/Q recording that can be analysed: upload an analyser trace as CSV or JSON, or a recording as a SigMF archive (.sigmf).`,
  )
}

export async function analyseSpectrumFile(opts: AnalyseOptions): Promise<SpectrumAnalysis> {
  const kind = spectrumSourceOf(opts.contentType, opts.originalName)
  if (kind === 'sigmf_archive') return analyseSigmfArchive(opts)
  const text = await readText(await opts.open(), MAX_TRACE_BYTES)
  await opts.onProgress?.(0.5)
  return kind === 'trace_csv' ? analyseTraceCsv(text) : analyseTraceJson(text)
}

async function readText(source: AsyncIterable<Uint8Array>, maxBytes: number): Promise<string> {
  const chunks: Uint8Array[] = []
  let size = 0
  for await (const c of source) {
    size += c.length
    if (size > maxBytes) throw new EvidenceProcessingError(`The trace file is larger than ${maxBytes / (1024 * 1024)} MB; a trace is expected to be a few thousand points.`)
    chunks.push(c)
  }
  return new TextDecoder('utf-8').decode(Buffer.concat(chunks))
}

function analyseTraceCsv(text: string): SpectrumAnalysis {
  const parsed = parseTraceCsv({ csvText: text })
  return {
    summary: summarise({ trace: parsed, enbwHz: parsed.noiseBandwidthHz, levelUnit: 'dBm', source: 'trace_csv', recording: null, warnings: parsed.warnings, methods: [] }),
    displayTrace: displayTraceOf(parsed),
    spectrogram: null,
  }
}

function analyseTraceJson(text: string): SpectrumAnalysis {
  let doc: unknown
  try {
    doc = JSON.parse(text)
  } catch (e) {
    throw new EvidenceProcessingError(`The JSON trace cannot be read: ${(e as Error).message}.`)
  }
  const o = (typeof doc === 'object' && doc !== null ? doc : {}) as Record<string, unknown>
  if ('global' in o && 'captures' in o) {
    throw new EvidenceProcessingError('This is SigMF metadata without its samples: add its dataset (the .sigmf-data file of the same name) to the case as an I/Q recording, or upload the recording as a SigMF archive (.sigmf) holding both files.')
  }
  const freqHz = o.freqHz
  const levelDbm = o.levelDbm
  if (!Array.isArray(freqHz) || !Array.isArray(levelDbm) || ![...freqHz, ...levelDbm].every((v) => typeof v === 'number')) {
    throw new EvidenceProcessingError('A JSON trace must be an object { "freqHz": [numbers], "levelDbm": [numbers] } (optionally "enbwHz": the noise bandwidth in Hz).')
  }
  const enbwHz = o.enbwHz === undefined ? null : o.enbwHz
  if (enbwHz !== null && !(typeof enbwHz === 'number' && enbwHz > 0)) throw new EvidenceProcessingError('"enbwHz" must be a positive number of hertz.')
  const trace = { freqHz: freqHz as number[], levelDbm: levelDbm as number[] }
  requireTrace(trace)
  return {
    summary: summarise({ trace, enbwHz, levelUnit: 'dBm', source: 'trace_json', recording: null, warnings: [], methods: [] }),
    displayTrace: displayTraceOf(trace),
    spectrogram: null,
  }
}

const baseOf = (name: string, ext: string) => name.slice(0, -ext.length)

async function analyseSigmfArchive(opts: AnalyseOptions): Promise<SpectrumAnalysis> {
  const maxDataBytes = opts.maxDataBytes ?? DEFAULT_MAX_DATA_BYTES
  const maxMemberBytes = (name: string) => (name.endsWith('.sigmf-meta') ? MAX_META_BYTES : maxDataBytes)
  let meta: { base: string; metadata: SigmfMetadata } | undefined
  let dataBeforeMeta: string | undefined
  let result: SpectrumAnalysis | undefined
  const recordings = new Set<string>()

  const visitFirstPass = (m: { name: string; sizeBytes: number; kind: string }): TarMemberSink | undefined => {
    if (m.kind !== 'file') return undefined
    if (m.name.endsWith('.sigmf-meta')) {
      const base = baseOf(m.name, '.sigmf-meta')
      recordings.add(base)
      if (meta) return undefined
      const chunks: Uint8Array[] = []
      return {
        write: (c) => void chunks.push(Uint8Array.from(c)),
        end: () => {
          meta = { base, metadata: parseSigmfMetadata(new TextDecoder('utf-8').decode(Buffer.concat(chunks))) }
        },
      }
    }
    if (m.name.endsWith('.sigmf-data')) {
      const base = baseOf(m.name, '.sigmf-data')
      recordings.add(base)
      if (meta && meta.base === base && !result) return recordingSink(meta.metadata, m.sizeBytes, opts.onProgress, (r) => (result = r))
      if (!meta && dataBeforeMeta === undefined) dataBeforeMeta = base
    }
    return undefined
  }
  await readTar(await opts.open(), visitFirstPass, { maxMemberBytes })

  if (!meta) throw new EvidenceProcessingError('The archive holds no SigMF metadata file (.sigmf-meta): it is not a SigMF archive.')
  if (!result && dataBeforeMeta === meta.base) {
    // the data came before its metadata: read the archive again for the data only
    const known = meta
    await readTar(
      await opts.open(),
      (m) => (m.kind === 'file' && m.name === `${known.base}.sigmf-data` && !result ? recordingSink(known.metadata, m.sizeBytes, opts.onProgress, (r) => (result = r)) : undefined),
      { maxMemberBytes },
    )
  }
  if (!result) throw new EvidenceProcessingError(`The archive holds no dataset (${meta.base}.sigmf-data) for its metadata file ${meta.base}.sigmf-meta.`)
  if (recordings.size > 1) result.summary.warnings.push(`The archive holds ${recordings.size} recordings; only ${meta.base} was analysed.`)
  return result
}

const largestPowerOfTwoAtMost = (n: number) => 2 ** Math.floor(Math.log2(n))

/** The sink that reads a `.sigmf-data` member (or a dataset uploaded on its own: `source` 'sigmf_files') into the accumulators. */
export function recordingSink(
  metadata: SigmfMetadata,
  dataBytes: number,
  onProgress: AnalyseOptions['onProgress'],
  done: (r: SpectrumAnalysis) => void,
  source: 'sigmf_archive' | 'sigmf_files' = 'sigmf_archive',
): TarMemberSink {
  const sampleCount = checkSigmfDataLength({ metadata, dataBytes })
  const sampleRateHz = metadata.sampleRateHz
  if (sampleRateHz === undefined) throw new EvidenceProcessingError('global.core:sample_rate is missing from the metadata: the recording cannot be analysed without its sample rate.')
  if (sampleCount < 64) throw new EvidenceProcessingError(`The recording holds only ${sampleCount} samples; at least 64 are needed for a spectrum.`)
  const decoder = createSigmfBlockDecoder({ metadata })
  const centerFreqHz = metadata.captures[0].frequencyHz
  const warnings = [...metadata.warnings]
  if (new Set(metadata.captures.map((c) => c.frequencyHz)).size > 1) {
    warnings.push('The captures have different centre frequencies; the spectrum is drawn about the first capture\'s frequency.')
  }
  if (metadata.datatype.component === 'u8') warnings.push('Unsigned samples (cu8): mid-scale is taken as zero; SigMF does not define the zero of unsigned data.')
  if (centerFreqHz === undefined) warnings.push('The capture gives no core:frequency: frequencies are offsets from the centre.')
  // at least 8 segments for the summary PSD; 2 for the spectrogram
  const segmentLength = Math.min(PSD_SEGMENT_LENGTH, largestPowerOfTwoAtMost(sampleCount / 8))
  const columns = Math.min(SPECTROGRAM_COLUMNS, largestPowerOfTwoAtMost(sampleCount / 2))
  const welchOpts = { sampleRateHz, centerFreqHz, segmentLength, overlapFraction: 0.5, window: 'hann' as const }
  const parallel = sampleCount >= PARALLEL_WELCH_MIN_SAMPLES && availableParallelism() > 1 ? createParallelWelchAccumulator({ ...welchOpts, sampleCount }) : undefined
  const welch = parallel ?? createWelchAccumulator(welchOpts)
  const spectro = createSpectrogramAccumulator({ sampleRateHz, centerFreqHz, segmentLength: columns, maxRows: SPECTROGRAM_MAX_ROWS })
  let readBytes = 0
  let reported = 0
  return {
    async write(chunk) {
      const iq = decoder.decode(chunk)
      if (iq.length > 0) {
        welch.push(iq)
        spectro.push(iq)
        await parallel?.ready() // read on only as fast as the workers keep up
      }
      readBytes += chunk.length
      const progress = (0.95 * readBytes) / dataBytes
      if (onProgress && progress - reported >= 0.05) {
        reported = progress
        await onProgress(progress)
      }
    },
    async end() {
      decoder.finish()
      const psd = await welch.result()
      const trace = psdAsTrace(psd.value)
      const levelUnit = trace.levelUnit
      done({
        summary: summarise({
          trace,
          enbwHz: trace.enbwHz,
          levelUnit,
          source,
          recording: {
            datatype: metadata.datatype.text,
            sampleRateHz,
            centerFreqHz: centerFreqHz ?? null,
            sampleCount,
            durationS: sampleCount / sampleRateHz,
            capturesCount: metadata.captures.length,
            annotationsCount: metadata.annotations.length,
            segmentLength: psd.value.segmentLength,
            segmentCount: psd.value.segmentCount,
            window: psd.value.window,
          },
          warnings: [...warnings, ...psd.warnings.filter((w) => !w.startsWith('No calibration')), ...trace.warnings],
          methods: [WELCH_METHOD],
        }),
        displayTrace: displayTraceOf(trace),
        spectrogram: spectrogramView(spectro.result()),
      })
    },
  }
}

function summarise(opts: {
  trace: Trace
  enbwHz: number | null
  levelUnit: 'dBm' | 'dBFS'
  source: SourceKind
  recording: SpectrumSummary['recording']
  warnings: string[]
  methods: MethodRef[]
}): SpectrumSummary {
  const { trace, enbwHz } = opts
  const n = requireTrace(trace)
  if (n < 3) throw new EvidenceProcessingError(`The trace holds ${n} point(s); at least 3 are needed for an analysis.`)
  const warnings = [...opts.warnings]
  const methods = [...opts.methods]
  const floor = noiseFloor({ ...trace })
  warnings.push(...floor.warnings)
  const peaks = findPeaks({ ...trace, noiseFloorDbm: floor.value.noiseFloorDbm })
  warnings.push(...peaks.warnings)
  methods.push(NOISE_FLOOR_METHOD, PEAKS_METHOD)
  const startHz = trace.freqHz[0] - (trace.freqHz[1] - trace.freqHz[0]) / 2
  const stopHz = trace.freqHz[n - 1] + (trace.freqHz[n - 1] - trace.freqHz[n - 2]) / 2
  let obw: SpectrumSummary['occupiedBandwidth'] = null
  try {
    const r = occupiedBandwidth({ ...trace, ...(enbwHz ? { enbwHz } : {}) })
    obw = { bandwidthHz: r.value.occupiedBandwidthHz, lowerEdgeHz: r.value.lowerEdgeHz, upperEdgeHz: r.value.upperEdgeHz, betaPercent: r.value.betaPercent }
    warnings.push(...r.warnings.map((w) => `Occupied bandwidth: ${w}`))
    methods.push(OCCUPIED_BANDWIDTH_METHOD)
  } catch (e) {
    warnings.push(`Occupied bandwidth not computed: ${(e as Error).message}`)
  }
  let channelPowerDbm: number | null = null
  if (enbwHz) {
    const cp = channelPower({ ...trace, enbwHz, startHz, stopHz })
    channelPowerDbm = cp.value.channelPowerDbm
    warnings.push(...cp.warnings.map((w) => `Channel power: ${w}`))
    methods.push(CHANNEL_POWER_METHOD)
  } else {
    warnings.push('Channel power not computed: the trace does not state the noise bandwidth (RBW) its points were read in.')
  }
  return {
    source: opts.source,
    levelUnit: opts.levelUnit,
    recording: opts.recording,
    startHz,
    stopHz,
    pointCount: n,
    enbwHz,
    peaks: peaks.value.peaks.map((p) => ({ freqHz: p.freqHz, levelDbm: p.levelDbm, prominenceDb: p.prominenceDb, aboveNoiseDb: p.aboveNoiseDb })),
    noiseFloorDbm: floor.value.noiseFloorDbm,
    noiseFloorBasis: `${floor.value.percentile}th percentile of the trace levels`,
    occupiedBandwidth: obw,
    channelPowerDbm,
    warnings,
    methods,
  }
}

function displayTraceOf(trace: Trace): DisplayTraceView {
  const d = decimateTrace(trace)
  return { freqHz: Array.from(d.freqHz), levelDbm: Array.from(d.levelDbm), decimated: d.decimated, sourcePointCount: d.sourcePointCount }
}

/** Quantises the spectrogram's levels to one byte per cell between its lowest and highest finite level. */
export function spectrogramView(s: Spectrogram): SpectrogramView {
  let minDb = Infinity
  let maxDb = -Infinity
  for (const v of s.levelDb) {
    if (Number.isFinite(v)) {
      if (v < minDb) minDb = v
      if (v > maxDb) maxDb = v
    }
  }
  if (!Number.isFinite(minDb)) {
    minDb = -200
    maxDb = -199
  }
  if (maxDb === minDb) maxDb = minDb + 1
  const step = (maxDb - minDb) / 255
  const cells = new Uint8Array(s.levelDb.length)
  for (let k = 0; k < cells.length; k++) {
    const v = s.levelDb[k]
    cells[k] = Number.isFinite(v) ? Math.round((v - minDb) / step) : 0
  }
  return {
    rowCount: s.rowCount,
    columnCount: s.columnCount,
    firstColumnHz: s.freqHz[0],
    binSpacingHz: s.binSpacingHz,
    rowStartS: Array.from(s.rowStartS),
    segmentsPerRow: s.segmentsPerRow,
    levelUnit: s.levelUnit,
    encoding: 'u8-linear-db',
    minDb,
    maxDb,
    cellsBase64: Buffer.from(cells.buffer, cells.byteOffset, cells.byteLength).toString('base64'),
  }
}

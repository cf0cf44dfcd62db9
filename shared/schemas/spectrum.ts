/**
 * The analysis of a spectrum evidence file (GET /api/evidence/:id/analysis): its state, the
 * summary numbers, a display trace (≤ 4,096 points) and a spectrogram (≤ 256 × 512 cells,
 * quantised to bytes). Frequencies in Hz, levels in dBm (or dBFS for an uncalibrated
 * recording: see `levelUnit`), times in seconds.
 */
import { z } from 'zod'
import { EVIDENCE_PROCESSING_STATES } from '../domain/evidence'
import { readWrittenNumber } from './number-with-unit'
import { readQuantity, unitsOf } from './quantities'

const instant = z.iso.datetime()

/** `sigmf_files`: a SigMF recording uploaded as its two files (.sigmf-meta and .sigmf-data). */
export const SPECTRUM_SOURCE_KINDS = ['sigmf_archive', 'sigmf_files', 'trace_csv', 'trace_json'] as const

export const spectrumPeakSchema = z.object({
  freqHz: z.number(),
  levelDbm: z.number(),
  prominenceDb: z.number(),
  aboveNoiseDb: z.number(),
})

export const methodRefSchema = z.object({ id: z.string(), source: z.string() })

export const spectrumSummarySchema = z.object({
  source: z.enum(SPECTRUM_SOURCE_KINDS),
  /** dBm when calibrated (or a trace in dBm), dBFS for an uncalibrated recording. */
  levelUnit: z.enum(['dBm', 'dBFS']),
  /** I/Q recordings only. */
  recording: z
    .object({
      datatype: z.string(),
      sampleRateHz: z.number().positive(),
      centerFreqHz: z.number().nullable(),
      sampleCount: z.number().int().positive(),
      durationS: z.number().positive(),
      capturesCount: z.number().int().min(0),
      annotationsCount: z.number().int().min(0),
      segmentLength: z.number().int().positive(),
      segmentCount: z.number().int().positive(),
      window: z.string(),
    })
    .nullable(),
  startHz: z.number(),
  stopHz: z.number(),
  pointCount: z.number().int().positive(),
  /** Noise bandwidth each point is read in; null when the trace does not say (a CSV trace) [Hz]. */
  enbwHz: z.number().positive().nullable(),
  peaks: z.array(spectrumPeakSchema),
  noiseFloorDbm: z.number(),
  noiseFloorBasis: z.string(),
  occupiedBandwidth: z
    .object({ bandwidthHz: z.number().min(0), lowerEdgeHz: z.number(), upperEdgeHz: z.number(), betaPercent: z.number() })
    .nullable(),
  /** Power over the whole span; null when the noise bandwidth is not known. */
  channelPowerDbm: z.number().nullable(),
  warnings: z.array(z.string()),
  methods: z.array(methodRefSchema),
})
export type SpectrumSummary = z.infer<typeof spectrumSummarySchema>

export const displayTraceSchema = z.object({
  freqHz: z.array(z.number()).max(4096),
  levelDbm: z.array(z.number()).max(4096),
  /** True when points were dropped (min and max of each bucket kept). */
  decimated: z.boolean(),
  sourcePointCount: z.number().int().positive(),
})
export type DisplayTraceView = z.infer<typeof displayTraceSchema>

/**
 * Cells are row-major (rows = time, columns = frequency ascending), one byte each:
 * level = minDb + byte · (maxDb − minDb)/255, in `levelUnit` per Hz; base64 of the bytes.
 */
export const spectrogramViewSchema = z.object({
  rowCount: z.number().int().min(1).max(256),
  columnCount: z.number().int().min(2).max(512),
  firstColumnHz: z.number(),
  binSpacingHz: z.number().positive(),
  rowStartS: z.array(z.number()),
  segmentsPerRow: z.number().int().positive(),
  levelUnit: z.enum(['dBm/Hz', 'dBFS/Hz']),
  encoding: z.literal('u8-linear-db'),
  minDb: z.number(),
  maxDb: z.number(),
  cellsBase64: z.string(),
})
export type SpectrogramView = z.infer<typeof spectrogramViewSchema>

export const evidenceAnalysisViewSchema = z.object({
  evidenceId: z.uuid(),
  state: z.enum(EVIDENCE_PROCESSING_STATES),
  progress: z.number().min(0).max(1),
  /** Why processing failed, in words a person can act on. */
  message: z.string().nullable(),
  libraryVersion: z.string().nullable(),
  summary: spectrumSummarySchema.nullable(),
  displayTrace: displayTraceSchema.nullable(),
  spectrogram: spectrogramViewSchema.nullable(),
  updatedAt: instant.nullable(),
})
export type EvidenceAnalysisView = z.infer<typeof evidenceAnalysisViewSchema>

export const evidenceAnalysisResponseSchema = z.object({ analysis: evidenceAnalysisViewSchema })

// ---- a band of a stored analysis (POST /api/evidence/:id/band) -------------------------------

/** Highest frequency a band may name (above every trace the processing accepts) [Hz]. */
const MAX_BAND_FREQUENCY_HZ = 1e12

/**
 * One edge of a band: a JSON number is read in hertz (the key's unit); text must carry its unit
 * ("433.9 MHz"), read by the strict parser. Text without a unit is refused, not guessed.
 */
function bandEdge(label: string) {
  return z.unknown().transform((input, ctx) => {
    if (typeof input === 'string') {
      const written = readWrittenNumber(input, { label, units: Object.fromEntries(unitsOf('frequency').map((u) => [u, 1])) })
      if (written.ok && written.value.unit === null) {
        ctx.addIssue({ code: 'custom', message: `Write the unit with ${label} (for example 433.9 MHz), or send a number of hertz.` })
        return z.NEVER
      }
    }
    const r = readQuantity(input, 'frequency', { label, min: 0, minExclusive: true, max: MAX_BAND_FREQUENCY_HZ, defaultUnit: 'Hz', example: '433.9 MHz' })
    if (r.ok) return r.value
    ctx.addIssue({ code: 'custom', message: r.message })
    return z.NEVER
  })
}

export const bandRequestSchema = z
  .object({ lowFreqHz: bandEdge('the low edge of the band'), highFreqHz: bandEdge('the high edge of the band') })
  .strict()
  .superRefine((b, ctx) => {
    if (!(b.highFreqHz > b.lowFreqHz)) ctx.addIssue({ code: 'custom', path: ['highFreqHz'], message: 'The high edge of the band must be above its low edge.' })
  })
export type BandRequest = z.infer<typeof bandRequestSchema>

/**
 * Channel power and occupied bandwidth of a band, computed on the stored DISPLAY trace (≤ 4,096
 * points, min/max-decimated when the source had more): its resolution is `basis.binSpacingHz`.
 * The channel power is in the analysis' level unit: exactly one of `channelPowerDbm` and
 * `channelPowerDbfs` is set, or neither when the trace does not state its noise bandwidth.
 */
export const evidenceBandViewSchema = z.object({
  evidenceId: z.uuid(),
  lowFreqHz: z.number(),
  highFreqHz: z.number(),
  levelUnit: z.enum(['dBm', 'dBFS']),
  channelPowerDbm: z.number().nullable(),
  channelPowerDbfs: z.number().nullable(),
  /** Why the channel power is missing, in words; null when it is given. */
  channelPowerNote: z.string().nullable(),
  occupiedBandwidthHz: z.number().min(0).nullable(),
  occupiedLowerEdgeHz: z.number().nullable(),
  occupiedUpperEdgeHz: z.number().nullable(),
  betaPercent: z.number().nullable(),
  basis: z.object({
    trace: z.literal('display'),
    pointCount: z.number().int().positive(),
    pointsInBand: z.number().min(0),
    decimated: z.boolean(),
    sourcePointCount: z.number().int().positive(),
    binSpacingHz: z.number().positive(),
    enbwHz: z.number().positive().nullable(),
  }),
  warnings: z.array(z.string()),
  methods: z.array(methodRefSchema),
  libraryVersion: z.string(),
})
export type EvidenceBandView = z.infer<typeof evidenceBandViewSchema>

export const evidenceBandResponseSchema = z.object({ band: evidenceBandViewSchema })

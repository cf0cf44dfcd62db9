/**
 * The analysis of a spectrum evidence file (GET /api/evidence/:id/analysis): its state, the
 * summary numbers, a display trace (≤ 4,096 points) and a spectrogram (≤ 256 × 512 cells,
 * quantised to bytes). Frequencies in Hz, levels in dBm (or dBFS for an uncalibrated
 * recording: see `levelUnit`), times in seconds.
 */
import { z } from 'zod'
import { EVIDENCE_PROCESSING_STATES } from '../domain/evidence'

const instant = z.iso.datetime()

export const SPECTRUM_SOURCE_KINDS = ['sigmf_archive', 'trace_csv', 'trace_json'] as const

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

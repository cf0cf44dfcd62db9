/**
 * `candidate_sources`: which authorised stations of the licence register could be the source of
 * an interference — the stations of the register in force whose authorised range overlaps the
 * interference's, ranked by the level each would give at the victim at its authorised EIRP
 * (shared/stations/candidate-ranking.ts), or by distance to an estimated source position. The
 * record keeps copies of the ranked stations' rows and the register version, so a re-import of
 * the register never changes it; a recompute ranks the copies again.
 */
import { z } from 'zod'
import type { StationReference } from '../references'
import { CANDIDATE_ORDERS, rankCandidateStations, type CandidateQuery } from '../../stations/candidate-ranking'
import { dbi, freqHz, geoPoint, plain, propagationModelSpec } from '../inputs'
import { CalculationRefused, defineKind, f2, runLibrary, toJson, toJsonObject, type CalculationRun } from './common'
import { stationCopySchema } from './copies'

export const DEFAULT_CANDIDATE_LIMIT = 20

export const candidateSourcesInputSchema = z
  .strictObject({
    victimPosition: geoPoint('the victim'),
    /** The interference's frequency range (equal edges: one frequency). */
    lowFreqHz: freqHz('the low edge of the interference'),
    highFreqHz: freqHz('the high edge of the interference'),
    estimatedSourcePosition: geoPoint('the estimated source').optional(),
    /** Default: free space at the centre of the range. */
    model: propagationModelSpec.optional(),
    victimAntennaGainDbi: dbi('the victim antenna gain').optional(),
    /** How many candidates the record keeps (default 20). */
    limit: plain('the number of candidates', 1, 100).optional(),
    /** 'level' (default) or 'distance-to-estimate' (needs the estimated source). */
    order: z.enum(CANDIDATE_ORDERS).optional(),
  })
  .superRefine((v, ctx) => {
    if (v.highFreqHz < v.lowFreqHz) ctx.addIssue({ code: 'custom', path: ['highFreqHz'], message: 'The high edge of the interference must not be below its low edge.' })
    if (v.limit !== undefined && !Number.isInteger(v.limit)) ctx.addIssue({ code: 'custom', path: ['limit'], message: 'The number of candidates must be a whole number.' })
    if (v.order === 'distance-to-estimate' && !v.estimatedSourcePosition) {
      ctx.addIssue({ code: 'custom', path: ['order'], message: 'Ordering by distance to the estimate needs the estimated source position.' })
    }
  })
export type CandidateSourcesInputs = z.infer<typeof candidateSourcesInputSchema>

/** The ranking query the inputs describe. */
export function candidateQueryOf(inputs: CandidateSourcesInputs): CandidateQuery {
  return {
    victim: inputs.victimPosition,
    lowFreqHz: inputs.lowFreqHz,
    highFreqHz: inputs.highFreqHz,
    ...(inputs.estimatedSourcePosition ? { estimatedSource: inputs.estimatedSourcePosition } : {}),
    ...(inputs.model ? { model: inputs.model } : {}),
    victimAntennaGainDbi: inputs.victimAntennaGainDbi ?? 0,
    limit: inputs.limit ?? DEFAULT_CANDIDATE_LIMIT,
    order: inputs.order ?? 'level',
  }
}

/** What the record copies: the register version and the ranked stations' rows. */
const registerCopySchema = z.object({ version: z.number().int().nullable(), overlappingCount: z.number().int().min(0) })

/** What `outputs.value` of a `candidate_sources` record holds. */
export const candidateSourcesOutputSchema = z.object({
  registerVersion: z.number().int().nullable(),
  /** Stations of that version whose range overlaps the interference's (the candidates are the first `limit`). */
  overlappingCount: z.number().int(),
  candidates: z.array(
    z.object({
      rank: z.number().int(),
      stationId: z.string(),
      stationCode: z.string(),
      licensee: z.string(),
      service: z.string(),
      registerVersion: z.number().int(),
      lowFreqHz: z.number(),
      highFreqHz: z.number(),
      authorisedEirpDbm: z.number(),
      overlapHz: z.number(),
      overlapFraction: z.number(),
      distanceM: z.number(),
      pathLossDb: z.number().nullable(),
      predictedLevelDbm: z.number().nullable(),
      distanceToEstimateM: z.number().optional(),
      note: z.string().optional(),
    }),
  ),
  order: z.enum(CANDIDATE_ORDERS),
  victimAntennaGainDbi: z.number(),
  modelKind: z.string(),
})
export type CandidateSourcesOutput = z.infer<typeof candidateSourcesOutputSchema>

function runCandidateSources(inputs: CandidateSourcesInputs, references: Record<string, unknown>): CalculationRun {
  const register = registerCopySchema.safeParse(references.stationRegister)
  const stations = z.array(stationCopySchema).safeParse(references.stations)
  if (!register.success || !stations.success) throw new CalculationRefused('The record has no usable copy of the licence register rows it ranked.')
  const q = candidateQueryOf(inputs)
  const r = runLibrary(() => rankCandidateStations(stations.data as StationReference[], q))
  const value: CandidateSourcesOutput = {
    registerVersion: register.data.version,
    overlappingCount: register.data.overlappingCount,
    candidates: r.candidates,
    order: q.order!,
    victimAntennaGainDbi: q.victimAntennaGainDbi!,
    modelKind: r.model.kind,
  }
  const warnings = [...r.warnings]
  if (register.data.version === null) warnings.unshift('No licence register has been imported yet: there are no candidates.')
  const top = r.candidates[0]
  const lead = top ? `; first ${top.stationCode} (${top.licensee})${top.predictedLevelDbm !== null ? ` at ${f2(top.predictedLevelDbm)} dBm` : ''}` : ''
  return {
    outputs: { value: toJson(value) },
    warnings,
    methods: r.methods,
    summary: `${register.data.overlappingCount} authorised station(s) in ${f2(q.lowFreqHz / 1e6)}–${f2(q.highFreqHz / 1e6)} MHz (register version ${register.data.version ?? 'none'})${lead}`,
  }
}

export const candidateSourcesKind = defineKind({
  kind: 'candidate_sources',
  label: 'Candidate sources from the licence register',
  inputSchema: candidateSourcesInputSchema,
  // the stations are found by frequency, not named by id
  named: () => ({}),
  references(inputs, lookup) {
    if (!lookup.candidateStations) throw new CalculationRefused('The licence register is not available here: candidate sources are ranked by the server.')
    const q = candidateQueryOf(inputs)
    const overlapping = lookup.candidateStations({ lowFreqHz: q.lowFreqHz, highFreqHz: q.highFreqHz })
    const ranked = runLibrary(() => rankCandidateStations(overlapping, q))
    const byId = new Map(overlapping.map((s) => [s.id, s]))
    const version = lookup.stationRegisterVersion?.() ?? overlapping[0]?.registerVersion ?? null
    return toJsonObject({
      stationRegister: { version, overlappingCount: ranked.overlappingCount },
      stations: ranked.candidates.map((c) => byId.get(c.stationId)!),
    })
  },
  run: (inputs, references) => runCandidateSources(inputs, references),
})

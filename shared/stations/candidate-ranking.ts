/**
 * Ranking the licence register's stations as candidate sources of an interference: which
 * authorised stations transmit in the interference's frequency range, and how strongly each
 * would arrive at the victim at its authorised power.
 *
 * For each station whose authorised range overlaps the interference's range:
 *   overlap fraction  = |[fL, fH] ∩ [sL, sH]| / (fH − fL)      (for a single frequency fL = fH:
 *                        1 when it lies in [sL, sH], edges included, else 0)
 *   distance d        = geodesic distance victim → station (WGS84)
 *   predicted level   = EIRP_auth − L(d) + G_victim             [dBm, isotropic received power
 *                        when G_victim = 0 dBi]
 * with L the propagation model's basic transmission loss (default free space at the centre of
 * the interference's range). Stations are ordered by predicted level, highest first (ties: the
 * larger overlap, then the nearer station, then the station code), or, when asked and an
 * estimated source position is given, by distance to that estimate, nearest first (ties: the
 * higher level, then the station code). A station sharing only an edge frequency with a
 * range of positive width overlaps by 0 Hz and is not a candidate.
 *
 * The predicted level is an upper bound of what the licence allows (full authorised EIRP, the
 * whole of it counted whatever the overlap); it ranks, it does not prove.
 */
import { createPropagationModel, geodesicInverse, GEODESIC_METHOD, type GeoPoint, type MethodRef, type PropagationModelSpec } from '../radio'
import type { StationReference } from '../calculations/references'

export const CANDIDATE_ORDERS = ['level', 'distance-to-estimate'] as const
export type CandidateOrder = (typeof CANDIDATE_ORDERS)[number]

export interface CandidateQuery {
  victim: GeoPoint
  lowFreqHz: number
  highFreqHz: number
  estimatedSource?: GeoPoint
  /** The model to use; absent: free space at the centre of the range. */
  model?: PropagationModelSpec
  victimAntennaGainDbi?: number
  /** How many candidates to keep (the top N). */
  limit: number
  order?: CandidateOrder
}

export interface RankedCandidate {
  rank: number
  stationId: string
  stationCode: string
  licensee: string
  service: string
  registerVersion: number
  lowFreqHz: number
  highFreqHz: number
  authorisedEirpDbm: number
  overlapHz: number
  overlapFraction: number
  distanceM: number
  pathLossDb: number | null
  predictedLevelDbm: number | null
  distanceToEstimateM?: number
  /** Why a level is missing, or a distance was bounded. */
  note?: string
}

export interface CandidateRanking {
  candidates: RankedCandidate[]
  /** Stations whose range meets the query's (before the top N is taken). */
  overlappingCount: number
  model: PropagationModelSpec
  warnings: string[]
  methods: MethodRef[]
}

export const CANDIDATE_RANKING_METHOD: MethodRef = {
  id: 'candidate-ranking',
  source:
    'Frequency overlap of authorised and observed ranges; predicted level = authorised EIRP − basic transmission loss + receiving gain (link budget, common practice, no source); stations ordered by level',
}

/** The overlap of a station's authorised range with the interference's range, and its fraction of the latter. */
export function frequencyOverlap(station: { lowFreqHz: number; highFreqHz: number }, q: { lowFreqHz: number; highFreqHz: number }): { overlapHz: number; fraction: number } {
  const width = q.highFreqHz - q.lowFreqHz
  if (width === 0) {
    const inside = q.lowFreqHz >= station.lowFreqHz && q.lowFreqHz <= station.highFreqHz
    return { overlapHz: 0, fraction: inside ? 1 : 0 }
  }
  const overlapHz = Math.max(0, Math.min(station.highFreqHz, q.highFreqHz) - Math.max(station.lowFreqHz, q.lowFreqHz))
  return { overlapHz, fraction: overlapHz / width }
}

/** The default model: free space at the centre of the interference's range. */
export const defaultCandidateModel = (q: { lowFreqHz: number; highFreqHz: number }): PropagationModelSpec => ({ kind: 'free-space', freqHz: (q.lowFreqHz + q.highFreqHz) / 2 })

/** Below this the path loss is taken at 1 m (a station on the victim's own spot). */
const MIN_DISTANCE_M = 1

/** What the ranking reads of a station (a StationReference has it all). */
export type RankableStation = Pick<
  StationReference,
  'id' | 'registerVersion' | 'stationCode' | 'licensee' | 'service' | 'latitudeDeg' | 'longitudeDeg' | 'lowFreqHz' | 'highFreqHz' | 'authorisedEirpDbm'
>

/** Ranks the stations (any list: the server's overlapping rows, or a record's copies). */
export function rankCandidateStations(stations: readonly RankableStation[], q: CandidateQuery): CandidateRanking {
  if (!(q.highFreqHz >= q.lowFreqHz)) throw new RangeError('The high frequency must not be below the low frequency.')
  const model = q.model ?? defaultCandidateModel(q)
  const propagation = createPropagationModel(model)
  const gain = q.victimAntennaGainDbi ?? 0
  const warnings = new Set<string>()
  // a model's warnings differ by station (each names its distance): each goes to its station's
  // note, and the ranking says once how many stations had one
  let modelWarned = 0
  let modelWarningExample: string | undefined
  const all: Omit<RankedCandidate, 'rank'>[] = []
  for (const s of stations) {
    const { overlapHz, fraction } = frequencyOverlap(s, q)
    if (!(fraction > 0)) continue
    const distanceM = geodesicInverse({ from: q.victim, to: { latDeg: s.latitudeDeg, lonDeg: s.longitudeDeg } }).distanceM
    let pathLossDb: number | null = null
    let note: string | undefined
    try {
      const r = propagation.lossDb(Math.max(distanceM, MIN_DISTANCE_M))
      pathLossDb = r.value.lossDb
      const notes = distanceM < MIN_DISTANCE_M ? [`the station is within ${MIN_DISTANCE_M} m of the victim: loss taken at ${MIN_DISTANCE_M} m`] : []
      if (r.warnings.length > 0) {
        modelWarned += 1
        modelWarningExample ??= r.warnings[0]
        notes.push(...r.warnings)
      }
      if (notes.length > 0) note = notes.join(' ')
    } catch (e) {
      if (!(e instanceof RangeError)) throw e
      note = `no level: ${e.message}`
    }
    all.push({
      stationId: s.id,
      stationCode: s.stationCode,
      licensee: s.licensee,
      service: s.service,
      registerVersion: s.registerVersion,
      lowFreqHz: s.lowFreqHz,
      highFreqHz: s.highFreqHz,
      authorisedEirpDbm: s.authorisedEirpDbm,
      overlapHz,
      overlapFraction: fraction,
      distanceM,
      pathLossDb,
      predictedLevelDbm: pathLossDb === null ? null : s.authorisedEirpDbm - pathLossDb + gain,
      ...(q.estimatedSource ? { distanceToEstimateM: geodesicInverse({ from: q.estimatedSource, to: { latDeg: s.latitudeDeg, lonDeg: s.longitudeDeg } }).distanceM } : {}),
      ...(note ? { note } : {}),
    })
  }
  const level = (c: { predictedLevelDbm: number | null }) => c.predictedLevelDbm ?? -Infinity
  const byCode = (a: { stationCode: string }, b: { stationCode: string }) => (a.stationCode < b.stationCode ? -1 : a.stationCode > b.stationCode ? 1 : 0)
  const order = q.order === 'distance-to-estimate' && q.estimatedSource ? 'distance-to-estimate' : 'level'
  if (q.order === 'distance-to-estimate' && !q.estimatedSource) warnings.add('No estimated source position was given: the stations are ordered by predicted level.')
  all.sort(
    order === 'level'
      ? (a, b) => level(b) - level(a) || b.overlapFraction - a.overlapFraction || a.distanceM - b.distanceM || byCode(a, b)
      : (a, b) => a.distanceToEstimateM! - b.distanceToEstimateM! || level(b) - level(a) || byCode(a, b),
  )
  if (all.length === 0) warnings.add('No authorised station of the register transmits in this frequency range.')
  if (modelWarned > 0) warnings.add(`The propagation model warns for ${modelWarned} of the ${all.length} stations (each candidate's note says why), e.g.: ${modelWarningExample}`)
  return {
    candidates: all.slice(0, q.limit).map((c, i) => ({ rank: i + 1, ...c })),
    overlappingCount: all.length,
    model,
    warnings: [...warnings],
    methods: [CANDIDATE_RANKING_METHOD, propagation.method, GEODESIC_METHOD],
  }
}

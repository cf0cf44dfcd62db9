/**
 * Ranking authorised stations as candidate sources, on a small invented register worked by
 * hand, and the `candidate_sources` calculation kind's copies.
 *
 * The hand arithmetic: the victim is at (0°, 0°) and every station on the equator, where the
 * geodesic is the equator itself and its length is a·Δλ (a = 6 378 137 m, the WGS84 semi-major
 * axis, NIMA TR8350.2 §3), so a station at Δλ = d / a (radians) is d metres away. Free-space
 * loss at 900 MHz over 10 km is 111.53 dB (ITU-R P.525-4 §2.2, register row 1-2); over 1 km
 * it is 20 dB less (20·log10 10), 91.53 dB, and over 100 m 71.53 dB. The predicted level is
 * EIRP − loss + receiving gain (link budget: common practice, no source).
 */
import { describe, expect, it } from 'vitest'
import type { StationReference } from '../../shared/calculations/references'
import { CalculationRefused, candidateSourcesOutputSchema, newCalculationSchema, rerunStored, runNewCalculation, type ReferenceLookup } from '../../shared/calculations/kinds'
import { frequencyOverlap, rankCandidateStations } from '../../shared/stations/candidate-ranking'
import { cite } from '../fixtures/radio/check-row'

const A_M = 6_378_137
const lonAt = (distanceM: number) => ((distanceM / A_M) * 180) / Math.PI
const LOSS_10KM_900MHZ = { value: 111.53, tolerance: 0.01, source: cite('ITU-R P.525-4 §2.2, L_bf = 20·log10(4πdf/c)', '1-2') }

let n = 0
function station(code: string, lowMhz: number, highMhz: number, distanceM: number, eirpDbm: number): StationReference {
  n += 1
  return {
    id: `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`,
    registerVersion: 1,
    stationCode: code,
    licensee: `Licensee of ${code}`,
    service: 'PMR',
    latitudeDeg: 0,
    longitudeDeg: lonAt(distanceM),
    lowFreqHz: lowMhz * 1e6,
    highFreqHz: highMhz * 1e6,
    limit: { kind: 'eirp', eirpDbm },
    authorisedEirpDbm: eirpDbm,
    validFrom: null,
    validUntil: null,
  }
}

const REGISTER = [
  station('P-1', 899.9, 900.1, 1_000, 30), // overlap 0.1 of 0.2 MHz: 0.5;  30 − 91.53 = −61.53 dBm
  station('P-2', 900.0, 900.2, 10_000, 60), // overlap 1;                   60 − 111.53 = −51.53 dBm
  station('P-3', 900.15, 900.5, 1_000, 45), // overlap 0.05 / 0.2 = 0.25;  45 − 91.53 = −46.53 dBm
  station('P-4', 900.2, 900.4, 1_000, 50), // shares the edge 900.2 MHz only: 0 Hz, not a candidate
  station('P-5', 890, 895, 1_000, 50), // outside
  station('P-6', 900.05, 900.1, 100, 9), // overlap 0.25;                 9 − 71.53 = −62.53 dBm
]
const QUERY = { victim: { latDeg: 0, lonDeg: 0 }, lowFreqHz: 900e6, highFreqHz: 900.2e6, model: { kind: 'free-space' as const, freqHz: 900e6 }, limit: 20 }

describe('frequency overlap', () => {
  it('is the shared width over the interference range, 0 for a shared edge, and inclusive edges for one frequency', () => {
    const s = { lowFreqHz: 446.0e6, highFreqHz: 446.2e6 }
    expect(frequencyOverlap(s, { lowFreqHz: 446.1e6, highFreqHz: 446.3e6 }).overlapHz).toBeCloseTo(100e3, 3)
    expect(frequencyOverlap(s, { lowFreqHz: 446.1e6, highFreqHz: 446.3e6 }).fraction).toBeCloseTo(0.5, 9)
    expect(frequencyOverlap(s, { lowFreqHz: 445e6, highFreqHz: 447e6 }).fraction).toBeCloseTo(0.1, 9) // the station covers 0.2 of 2 MHz
    expect(frequencyOverlap(s, { lowFreqHz: 446.05e6, highFreqHz: 446.15e6 }).fraction).toBe(1)
    expect(frequencyOverlap(s, { lowFreqHz: 446.2e6, highFreqHz: 446.4e6 })).toEqual({ overlapHz: 0, fraction: 0 })
    expect(frequencyOverlap(s, { lowFreqHz: 445.8e6, highFreqHz: 446.0e6 })).toEqual({ overlapHz: 0, fraction: 0 })
    expect(frequencyOverlap(s, { lowFreqHz: 446.2e6, highFreqHz: 446.2e6 })).toEqual({ overlapHz: 0, fraction: 1 })
    expect(frequencyOverlap(s, { lowFreqHz: 446.0e6, highFreqHz: 446.0e6 })).toEqual({ overlapHz: 0, fraction: 1 })
    expect(frequencyOverlap(s, { lowFreqHz: 446.21e6, highFreqHz: 446.21e6 })).toEqual({ overlapHz: 0, fraction: 0 })
  })
})

describe('ranking by predicted level', () => {
  it('orders the hand-worked register: P-3, P-2, P-1, P-6, with the levels worked out by hand', () => {
    const r = rankCandidateStations(REGISTER, QUERY)
    expect(r.candidates.map((c) => c.stationCode)).toEqual(['P-3', 'P-2', 'P-1', 'P-6'])
    expect(r.overlappingCount).toBe(4)
    const byCode = Object.fromEntries(r.candidates.map((c) => [c.stationCode, c]))
    const L10 = LOSS_10KM_900MHZ.value
    const tol = LOSS_10KM_900MHZ.tolerance
    expect(Math.abs(byCode['P-2']!.pathLossDb! - L10), LOSS_10KM_900MHZ.source).toBeLessThan(tol)
    expect(Math.abs(byCode['P-3']!.predictedLevelDbm! - (45 - (L10 - 20)))).toBeLessThan(tol)
    expect(Math.abs(byCode['P-2']!.predictedLevelDbm! - (60 - L10))).toBeLessThan(tol)
    expect(Math.abs(byCode['P-1']!.predictedLevelDbm! - (30 - (L10 - 20)))).toBeLessThan(tol)
    expect(Math.abs(byCode['P-6']!.predictedLevelDbm! - (9 - (L10 - 40)))).toBeLessThan(tol)
    expect(byCode['P-1']!.distanceM).toBeCloseTo(1000, 6)
    expect(byCode['P-1']!.overlapFraction).toBeCloseTo(0.5, 9)
    expect(byCode['P-3']!.overlapFraction).toBeCloseTo(0.25, 9)
    expect(r.candidates.map((c) => c.rank)).toEqual([1, 2, 3, 4])
  })

  it('adds the victim antenna gain to every level, and keeps the top N only', () => {
    const plain = rankCandidateStations(REGISTER, QUERY)
    const r = rankCandidateStations(REGISTER, { ...QUERY, victimAntennaGainDbi: 2, limit: 2 })
    expect(r.candidates.map((c) => c.stationCode)).toEqual(['P-3', 'P-2'])
    expect(r.overlappingCount).toBe(4)
    expect(r.candidates[0]!.predictedLevelDbm! - plain.candidates[0]!.predictedLevelDbm!).toBeCloseTo(2, 12)
  })

  it('breaks a tie in level by the larger overlap, then by station code', () => {
    const tied = [station('Q-2', 900.1, 900.3, 1_000, 30), station('Q-1', 899, 901, 1_000, 30), station('Q-0', 900.1, 900.3, 1_000, 30)]
    expect(rankCandidateStations(tied, QUERY).candidates.map((c) => c.stationCode)).toEqual(['Q-1', 'Q-0', 'Q-2'])
  })

  it('uses free space at the centre of the range when no model is given', () => {
    const { model, ...q } = QUERY
    void model
    expect(rankCandidateStations(REGISTER, q).model).toEqual({ kind: 'free-space', freqHz: 900.1e6 })
  })

  it('takes the loss at 1 m for a station on the victim, and says so', () => {
    const r = rankCandidateStations([station('Z-0', 900, 900.2, 0, 30)], QUERY)
    expect(r.candidates[0]!.note).toMatch(/within 1 m/)
    expect(r.candidates[0]!.pathLossDb).toBeCloseTo(LOSS_10KM_900MHZ.value - 80, 1)
  })

  it("puts a model's warning on its station's note and counts the warned stations once", () => {
    const r = rankCandidateStations(REGISTER, { ...QUERY, model: { kind: 'hata', freqHz: 900e6, txHeightM: 30, rxHeightM: 1.5, environment: 'suburban' } })
    // Okumura–Hata holds from 1 to 20 km: P-6 at 100 m is outside, P-2 at 10 km inside (P-1 and P-3 sit on the 1 km edge)
    const byCode = Object.fromEntries(r.candidates.map((c) => [c.stationCode, c]))
    expect(byCode['P-6']!.note).toMatch(/outside the validity range/)
    expect(byCode['P-2']!.note).toBeUndefined()
    const warned = r.candidates.filter((c) => c.note).length
    expect(r.warnings.filter((w) => w.includes('model warns'))).toEqual([expect.stringMatching(new RegExp(`^The propagation model warns for ${warned} of the 4 stations`))])
  })

  it('says when no station overlaps', () => {
    const r = rankCandidateStations(REGISTER, { ...QUERY, lowFreqHz: 100e6, highFreqHz: 101e6 })
    expect(r.candidates).toEqual([])
    expect(r.warnings).toContain('No authorised station of the register transmits in this frequency range.')
  })
})

describe('ranking by distance to an estimated source', () => {
  it('puts the station at the estimate first, equal distances by level (P-2, P-3, P-1, P-6)', () => {
    const r = rankCandidateStations(REGISTER, { ...QUERY, estimatedSource: { latDeg: 0, lonDeg: lonAt(10_000) }, order: 'distance-to-estimate' })
    expect(r.candidates.map((c) => c.stationCode)).toEqual(['P-2', 'P-3', 'P-1', 'P-6'])
    expect(r.candidates[0]!.distanceToEstimateM).toBeCloseTo(0, 6)
    expect(r.candidates[1]!.distanceToEstimateM).toBeCloseTo(9_000, 6)
  })
})

describe('the candidate_sources calculation', () => {
  const inputs = { victimPosition: { latDeg: 0, lonDeg: 0 }, lowFreqHz: '900 MHz', highFreqHz: '900.2 MHz', model: { kind: 'free-space', freqHz: '900 MHz' }, limit: 2 }
  const parsed = newCalculationSchema.parse({ kind: 'candidate_sources', inputs })
  const lookupOf = (stations: StationReference[], version: number): ReferenceLookup => ({
    bandLimit: () => undefined,
    candidateStations: (q) => stations.filter((s) => s.highFreqHz >= q.lowFreqHz && s.lowFreqHz <= q.highFreqHz),
    stationRegisterVersion: () => version,
  })

  it('keeps copies of the ranked stations and the register version, and ranks the same from them again', () => {
    const { references, run } = runNewCalculation(parsed, lookupOf(REGISTER, 1))
    const value = candidateSourcesOutputSchema.parse(run.outputs.value)
    expect(value.candidates.map((c) => c.stationCode)).toEqual(['P-3', 'P-2'])
    expect(value).toMatchObject({ registerVersion: 1, overlappingCount: 4, order: 'level', modelKind: 'free-space' })
    expect(references.stationRegister).toEqual({ version: 1, overlappingCount: 4 })
    expect((references.stations as unknown as StationReference[]).map((s) => s.stationCode)).toEqual(['P-3', 'P-2'])

    // a re-import (version 2: P-3 gone, a new strong station) changes nothing in the record's rerun
    const reimported = [...REGISTER.filter((s) => s.stationCode !== 'P-3'), station('N-1', 900, 900.2, 100, 40)].map((s) => ({ ...s, registerVersion: 2 }))
    const again = rerunStored({ kind: 'candidate_sources', inputs: JSON.parse(JSON.stringify(parsed.inputs)), references })
    expect(again.outputs).toEqual(run.outputs)
    const fresh = candidateSourcesOutputSchema.parse(runNewCalculation(parsed, lookupOf(reimported, 2)).run.outputs.value)
    expect(fresh.candidates.map((c) => c.stationCode)).toEqual(['N-1', 'P-2'])
    expect(fresh.registerVersion).toBe(2)
  })

  it('is refused without the register (pure use), and a reversed range is refused by the schema', () => {
    expect(() => runNewCalculation(parsed)).toThrow(CalculationRefused)
    const bad = newCalculationSchema.safeParse({ kind: 'candidate_sources', inputs: { ...inputs, lowFreqHz: '901 MHz' } })
    expect(bad.success).toBe(false)
    expect(bad.error?.issues.map((i) => i.message)).toContain('The high edge of the interference must not be below its low edge.')
  })
})

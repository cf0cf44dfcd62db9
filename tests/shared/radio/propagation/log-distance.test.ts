import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  logDistanceDistanceM,
  logDistanceLossDb,
  logDistanceSlopeDbPerDecade,
  type LogDistanceParams,
} from '../../../../shared/radio/propagation/log-distance'
import { LOG_DISTANCE_ROWS } from '../../../fixtures/radio/propagation-log-distance'

const single = (freqHz: number, refDistanceM: number, exponent: number): LogDistanceParams => ({
  freqHz,
  refDistanceM,
  exponent,
})

/** Indoor-style profile with two exponent changes (values chosen for the test, not published). */
const THREE_SEGMENTS: LogDistanceParams = {
  freqHz: 2.4e9,
  refDistanceM: 1,
  exponent: 2,
  exponentChanges: [
    { fromDistanceM: 10, exponent: 3.5 },
    { fromDistanceM: 100, exponent: 5 },
  ],
}

describe('logDistanceLossDb', () => {
  for (const row of LOG_DISTANCE_ROWS) {
    const { freqHz, refDistanceM, exponent, distanceM } = row.inputs
    it(`matches ${row.id} within ${row.tolerance} dB [${row.status}] (${row.source})`, () => {
      const { value: { lossDb } } = logDistanceLossDb({ ...single(freqHz, refDistanceM, exponent), distanceM })
      expect(Math.abs(lossDb - row.expected)).toBeLessThanOrEqual(row.tolerance)
    })
  }

  it('uses a given PL(d0) instead of free space', () => {
    const { value: { lossDb } } = logDistanceLossDb({ ...single(2.4e9, 1, 3), refLossDb: 45, distanceM: 100 })
    expect(lossDb).toBeCloseTo(45 + 60, 9) // 10·3·log10(100) = 60 dB by the model's definition
  })

  it('is continuous at each exponent-change distance (within 1e-9 dB)', () => {
    for (const fromDistanceM of [10, 100]) {
      const below = logDistanceLossDb({ ...THREE_SEGMENTS, distanceM: fromDistanceM * (1 - 1e-12) }).value.lossDb
      const at = logDistanceLossDb({ ...THREE_SEGMENTS, distanceM: fromDistanceM }).value.lossDb
      expect(Math.abs(at - below)).toBeLessThan(1e-9)
    }
  })

  it('applies the exponent of each segment: +35 dB over 10–100 m and +50 dB per decade beyond', () => {
    const at = (distanceM: number) => logDistanceLossDb({ ...THREE_SEGMENTS, distanceM }).value.lossDb
    expect(at(100) - at(10)).toBeCloseTo(35, 9)
    expect(at(1000) - at(100)).toBeCloseTo(50, 9)
    expect(logDistanceSlopeDbPerDecade({ ...THREE_SEGMENTS, distanceM: 500 })).toBe(50)
  })

  it('warns below the reference distance d0 and not at d0', () => {
    expect(logDistanceLossDb({ ...single(2.4e9, 10, 3), distanceM: 5 }).warnings.join(' ')).toMatch(/below the reference distance/)
    expect(logDistanceLossDb({ ...single(2.4e9, 10, 3), distanceM: 10 }).warnings).toEqual([])
  })

  it('passes the shadow-fading σ through', () => {
    expect(logDistanceLossDb({ ...single(2.4e9, 1, 3), shadowSigmaDb: 8, distanceM: 20 }).value.shadowSigmaDb).toBe(8)
  })

  it.each([0, -5, Number.NaN])('throws a RangeError naming distanceM for distance %s', (distanceM) => {
    expect(() => logDistanceLossDb({ ...single(2.4e9, 1, 3), distanceM })).toThrow(RangeError)
    expect(() => logDistanceLossDb({ ...single(2.4e9, 1, 3), distanceM })).toThrow(/distanceM/)
  })

  it.each([0, -1, Number.NaN])('throws a RangeError naming freqHz for frequency %s', (freqHz) => {
    expect(() => logDistanceLossDb({ ...single(freqHz, 1, 3), distanceM: 10 })).toThrow(/freqHz/)
  })

  it('rejects an exponent change at or before d0, unordered exponent changes and non-positive exponents', () => {
    expect(() => logDistanceLossDb({ ...single(1e9, 1, 3), exponentChanges: [{ fromDistanceM: 1, exponent: 4 }], distanceM: 5 })).toThrow(/refDistanceM/)
    expect(() =>
      logDistanceLossDb({
        ...single(1e9, 1, 3),
        exponentChanges: [
          { fromDistanceM: 10, exponent: 2 },
          { fromDistanceM: 10, exponent: 3 },
        ],
        distanceM: 5,
      }),
    ).toThrow(/exponentChanges\[1\]\.fromDistanceM/)
    expect(() => logDistanceLossDb({ ...single(1e9, 1, 0), distanceM: 5 })).toThrow(/exponent/)
    expect(() => logDistanceLossDb({ ...single(1e9, 1, 3), exponentChanges: [{ fromDistanceM: 10, exponent: -1 }], distanceM: 5 })).toThrow(/exponentChanges\[0\]\.exponent/)
  })

  it('needs the frequency only when the loss at d0 is not given', () => {
    const { value } = logDistanceLossDb({ refDistanceM: 1, refLossDb: 45, exponent: 3, distanceM: 100 })
    expect(value.lossDb).toBeCloseTo(45 + 60, 9) // 10·3·log10(100) = 60 dB by the model's definition
    expect(() => logDistanceLossDb({ refDistanceM: 1, exponent: 3, distanceM: 100 })).toThrow(/refLossDb, or freqHz/)
  })
})

describe('logDistanceDistanceM', () => {
  it('round-trips with logDistanceLossDb within 1e-9 relative across exponent changes', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.1, max: 1e5, noNaN: true }), (distanceM) => {
        const { value: { lossDb } } = logDistanceLossDb({ ...THREE_SEGMENTS, distanceM })
        const back = logDistanceDistanceM({ ...THREE_SEGMENTS, lossDb }).value.distanceM
        expect(Math.abs(back - distanceM) / distanceM).toBeLessThan(1e-9)
      }),
    )
  })

  it('gives 50 m for the 6-2 loss of 91.02 dB with n = 3 within 0.1 m', () => {
    expect(Math.abs(logDistanceDistanceM({ ...single(2.4e9, 1, 3), lossDb: 91.0211 }).value.distanceM - 50)).toBeLessThan(0.1)
  })

  it('loss grows with distance for any positive exponents', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 1e4, noNaN: true }),
        fc.double({ min: 1.001, max: 50, noNaN: true }),
        (distanceM, factor) => {
          const a = logDistanceLossDb({ ...THREE_SEGMENTS, distanceM }).value.lossDb
          expect(logDistanceLossDb({ ...THREE_SEGMENTS, distanceM: distanceM * factor }).value.lossDb).toBeGreaterThan(a)
        },
      ),
    )
  })
})

import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  FREE_SPACE_EXACT_CONSTANT_DB,
  freeSpaceDistanceM,
  freeSpaceEirpFromFieldDbm,
  freeSpaceEirpFromPfdDbm,
  freeSpaceFieldStrengthDbuvPerM,
  freeSpaceLossDb,
  freeSpacePfdDbwPerM2,
} from '../../../../shared/radio/propagation/free-space-p525'
import { FREE_SPACE_FIELD_ROWS, FREE_SPACE_LOSS_ROWS, FREE_SPACE_PFD_ROWS } from '../../../fixtures/radio/propagation-free-space'

describe('freeSpaceLossDb', () => {
  for (const row of FREE_SPACE_LOSS_ROWS) {
    it(`matches ${row.id} within ${row.tolerance} dB [${row.status}] (${row.source})`, () => {
      expect(Math.abs(freeSpaceLossDb(row.inputs).value.lossDb - row.expected)).toBeLessThanOrEqual(row.tolerance)
    })
  }

  it('uses the exact constant 32.4478 dB (ITU-R P.525-4, register §1 [D]), 0.048 dB above the P.525 rounding', () => {
    expect(FREE_SPACE_EXACT_CONSTANT_DB).toBeCloseTo(32.4478, 4)
    const exact = freeSpaceLossDb({ freqHz: 1e9, distanceM: 1e3 }).value.lossDb
    const rounded = freeSpaceLossDb({ freqHz: 1e9, distanceM: 1e3, form: 'p525-rounded' }).value.lossDb
    expect(exact - rounded).toBeCloseTo(0.0478, 3)
  })

  it('names the method and the form it used', () => {
    expect(freeSpaceLossDb({ freqHz: 1e9, distanceM: 10 }).method.id).toBe('free-space-p525')
    expect(freeSpaceLossDb({ freqHz: 1e9, distanceM: 10, form: 'p525-rounded' }).method.id).toBe('free-space-p525-rounded')
  })

  it('warns inside ten wavelengths (near field) and not in the far field', () => {
    expect(freeSpaceLossDb({ freqHz: 100e6, distanceM: 20 }).warnings.join(' ')).toMatch(/distanceInWavelengths/)
    expect(freeSpaceLossDb({ freqHz: 100e6, distanceM: 1000 }).warnings).toEqual([])
  })

  it.each([0, -1, Number.NaN, Number.POSITIVE_INFINITY])('throws a RangeError naming distanceM for distance %s', (distanceM) => {
    expect(() => freeSpaceLossDb({ freqHz: 1e9, distanceM })).toThrow(RangeError)
    expect(() => freeSpaceLossDb({ freqHz: 1e9, distanceM })).toThrow(/distanceM/)
  })

  it.each([0, -1e6, Number.NaN])('throws a RangeError naming freqHz for frequency %s', (freqHz) => {
    expect(() => freeSpaceLossDb({ freqHz, distanceM: 100 })).toThrow(/freqHz/)
    expect(() => freeSpaceDistanceM({ freqHz, lossDb: 100 })).toThrow(RangeError)
  })

  it('throws a RangeError naming lossDb for a non-finite loss', () => {
    expect(() => freeSpaceDistanceM({ freqHz: 1e9, lossDb: Number.NaN })).toThrow(/lossDb/)
  })
})

describe('freeSpaceDistanceM', () => {
  it('round-trips with freeSpaceLossDb within 1e-9 relative, both forms', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e6, max: 1e12, noNaN: true }),
        fc.double({ min: 1e-2, max: 1e8, noNaN: true }),
        fc.constantFrom('exact' as const, 'p525-rounded' as const),
        (freqHz, distanceM, form) => {
          const { value: { lossDb } } = freeSpaceLossDb({ freqHz, distanceM, form })
          const back = freeSpaceDistanceM({ freqHz, lossDb, form }).value.distanceM
          expect(Math.abs(back - distanceM) / distanceM).toBeLessThan(1e-9)
        },
      ),
    )
  })

  it('gives 1 km for the 1-1 loss of 72.45 dB at 100 MHz within 0.2 m (0.01 dB ≈ 0.12 %)', () => {
    expect(Math.abs(freeSpaceDistanceM({ freqHz: 100e6, lossDb: 72.4478 }).value.distanceM - 1000)).toBeLessThan(0.2)
  })
})

describe('free-space loss (properties)', () => {
  it('grows with distance and with frequency', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e6, max: 1e11, noNaN: true }),
        fc.double({ min: 1, max: 1e6, noNaN: true }),
        fc.double({ min: 1.001, max: 100, noNaN: true }),
        (freqHz, distanceM, factor) => {
          const base = freeSpaceLossDb({ freqHz, distanceM }).value.lossDb
          expect(freeSpaceLossDb({ freqHz, distanceM: distanceM * factor }).value.lossDb).toBeGreaterThan(base)
          expect(freeSpaceLossDb({ freqHz: freqHz * factor, distanceM }).value.lossDb).toBeGreaterThan(base)
        },
      ),
    )
  })
})

describe('freeSpaceFieldStrengthDbuvPerM', () => {
  for (const row of FREE_SPACE_FIELD_ROWS) {
    it(`matches ${row.id} within ${row.tolerance} dB [${row.status}] (${row.source})`, () => {
      expect(Math.abs(freeSpaceFieldStrengthDbuvPerM(row.inputs) - row.expected)).toBeLessThanOrEqual(row.tolerance)
    })
  }
  it('throws a RangeError naming distanceM for zero distance', () => {
    expect(() => freeSpaceFieldStrengthDbuvPerM({ eirpDbm: 30, distanceM: 0 })).toThrow(/distanceM/)
  })
  it('throws a RangeError naming distanceM for a negative distance', () => {
    expect(() => freeSpaceFieldStrengthDbuvPerM({ eirpDbm: 30, distanceM: -1 })).toThrow(RangeError)
    expect(() => freeSpaceFieldStrengthDbuvPerM({ eirpDbm: 30, distanceM: -1 })).toThrow(/distanceM/)
  })
  it('EIRP → free-space field → EIRP returns the EIRP at any distance', () => {
    fc.assert(
      fc.property(fc.double({ min: -200, max: 200, noNaN: true }), fc.double({ min: 0.01, max: 1e7, noNaN: true }), (eirpDbm, distanceM) => {
        const e = freeSpaceFieldStrengthDbuvPerM({ eirpDbm, distanceM })
        expect(freeSpaceEirpFromFieldDbm({ fieldStrengthDbuvPerM: e, distanceM })).toBeCloseTo(eirpDbm, 9)
      }),
    )
  })
  it('gives back 30 dBm (0 dBW) from 74.77 dBµV/m at 1 km (ITU-R P.525-4, register 1-5 inverse, [D]) within 0.01 dB', () => {
    expect(Math.abs(freeSpaceEirpFromFieldDbm({ fieldStrengthDbuvPerM: 74.77, distanceM: 1000 }) - 30)).toBeLessThanOrEqual(0.01)
  })
})

describe('freeSpacePfdDbwPerM2', () => {
  for (const row of FREE_SPACE_PFD_ROWS) {
    it(`matches ${row.id} within ${row.tolerance} dB [${row.status}] (${row.source})`, () => {
      expect(Math.abs(freeSpacePfdDbwPerM2(row.inputs) - row.expected)).toBeLessThanOrEqual(row.tolerance)
    })
    it(`inverts ${row.id}: the pfd gives back ${row.inputs.eirpDbm} dBm within ${row.tolerance} dB [${row.status}]`, () => {
      expect(Math.abs(freeSpaceEirpFromPfdDbm({ pfdDbwPerM2: row.expected, distanceM: row.inputs.distanceM }) - row.inputs.eirpDbm)).toBeLessThanOrEqual(row.tolerance)
    })
  }
  it('EIRP → pfd → EIRP returns the EIRP at any distance', () => {
    fc.assert(
      fc.property(fc.double({ min: -200, max: 200, noNaN: true }), fc.double({ min: 0.01, max: 1e7, noNaN: true }), (eirpDbm, distanceM) => {
        const s = freeSpacePfdDbwPerM2({ eirpDbm, distanceM })
        expect(freeSpaceEirpFromPfdDbm({ pfdDbwPerM2: s, distanceM })).toBeCloseTo(eirpDbm, 9)
      }),
    )
  })
})

import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { freeSpaceLossDb } from '../../../../shared/radio/propagation/free-space-p525'
import { createPropagationModel } from '../../../../shared/radio/propagation/registry'
import {
  twoRayBreakpointSlopeDbPerDecade,
  twoRayCriticalDistanceM,
  twoRayCrossoverDistanceM,
  twoRayDistanceM,
  twoRayLossDb,
  twoRayMonotonicDistanceM,
} from '../../../../shared/radio/propagation/two-ray'
import { TWO_RAY_BREAKPOINT_ROWS, TWO_RAY_DISTANCE_ROWS, TWO_RAY_FREE_SPACE_ROWS, TWO_RAY_LOSS_ROWS } from '../../../fixtures/radio/propagation-two-ray'

const GEOMETRY = { freqHz: 900e6, txHeightM: 30, rxHeightM: 1.5 }

describe('twoRayCriticalDistanceM / twoRayCrossoverDistanceM', () => {
  for (const row of TWO_RAY_DISTANCE_ROWS) {
    it(`matches ${row.id} within ${row.tolerance} m [${row.status}] (${row.source})`, () => {
      const { quantity, ...g } = row.inputs
      const value = quantity === 'critical' ? twoRayCriticalDistanceM(g) : twoRayCrossoverDistanceM(g)
      expect(Math.abs(value - row.expected)).toBeLessThanOrEqual(row.tolerance)
    })
  }
})

describe('twoRayLossDb', () => {
  for (const row of TWO_RAY_LOSS_ROWS) {
    it(`matches ${row.id} within ${row.tolerance} dB [${row.status}] (${row.source})`, () => {
      expect(Math.abs(twoRayLossDb(row.inputs).value.lossDb - row.expected)).toBeLessThanOrEqual(row.tolerance)
    })
  }

  it('matches the free-space references it is compared with (ITU-R P.525-4, register 5-2 and 5-3 FSPL)', () => {
    for (const row of TWO_RAY_FREE_SPACE_ROWS) {
      expect(Math.abs(freeSpaceLossDb(row.inputs).value.lossDb - row.expected)).toBeLessThanOrEqual(row.tolerance)
    }
  })

  it('warns when the asymptote is used before the crossover d_x (5-3: it reads below free space there)', () => {
    const r = twoRayLossDb({ ...GEOMETRY, distanceM: 1000, form: 'asymptote' })
    expect(r.warnings.join(' ')).toMatch(/crossover distance d_x/)
    expect(twoRayLossDb({ ...GEOMETRY, distanceM: 5000, form: 'asymptote' }).warnings).toEqual([])
  })

  it('warns inside the critical distance d_c for the exact form, not beyond it', () => {
    expect(twoRayLossDb({ ...GEOMETRY, distanceM: 300 }).warnings.join(' ')).toMatch(/critical distance d_c/)
    expect(twoRayLossDb({ ...GEOMETRY, distanceM: 1000 }).warnings).toEqual([])
  })

  it('tends to the d⁻⁴ asymptote far beyond d_x (within 0.01 dB at 100 km)', () => {
    const exact = twoRayLossDb({ ...GEOMETRY, distanceM: 100_000 }).value.lossDb
    const asymptote = twoRayLossDb({ ...GEOMETRY, distanceM: 100_000, form: 'asymptote' }).value.lossDb
    expect(Math.abs(exact - asymptote)).toBeLessThan(0.01)
  })

  it('grows with distance beyond the critical distance', () => {
    const dc = twoRayCriticalDistanceM(GEOMETRY)
    fc.assert(
      fc.property(fc.double({ min: dc, max: 1e6, noNaN: true }), fc.double({ min: 1.001, max: 10, noNaN: true }), (d, k) => {
        expect(twoRayLossDb({ ...GEOMETRY, distanceM: d * k }).value.lossDb).toBeGreaterThan(twoRayLossDb({ ...GEOMETRY, distanceM: d }).value.lossDb)
      }),
    )
  })

  it.each([
    ['txHeightM', { txHeightM: -1 }],
    ['rxHeightM', { rxHeightM: -0.5 }],
    ['rxHeightM', { rxHeightM: 0 }],
    ['freqHz', { freqHz: 0 }],
    ['freqHz', { freqHz: Number.NaN }],
  ])('throws a RangeError naming %s', (name, patch) => {
    expect(() => twoRayLossDb({ ...GEOMETRY, ...patch, distanceM: 1000 })).toThrow(RangeError)
    expect(() => twoRayLossDb({ ...GEOMETRY, ...patch, distanceM: 1000 })).toThrow(new RegExp(name))
  })

  it.each([0, -10, Number.NaN])('throws a RangeError naming distanceM for distance %s', (distanceM) => {
    expect(() => twoRayLossDb({ ...GEOMETRY, distanceM })).toThrow(/distanceM/)
  })
})

describe('twoRayDistanceM', () => {
  it('inverts the asymptote in closed form: 114.89 dB gives 5 km within 2 m (5-2)', () => {
    const r = twoRayDistanceM({ ...GEOMETRY, lossDb: 114.8945, form: 'asymptote' })
    expect(Math.abs(r.value.distanceM - 5000)).toBeLessThan(2)
    expect(r.warnings).toEqual([])
  })

  it('round-trips the asymptote within 1e-9 relative', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 1e6, noNaN: true }), (distanceM) => {
        const { value: { lossDb } } = twoRayLossDb({ ...GEOMETRY, distanceM, form: 'asymptote' })
        const back = twoRayDistanceM({ ...GEOMETRY, lossDb, form: 'asymptote' }).value.distanceM
        expect(Math.abs(back - distanceM) / distanceM).toBeLessThan(1e-9)
      }),
    )
  })

  it('returns the smallest distance, inside the oscillating region, with a warning that names the monotonic-branch distance', () => {
    const r = twoRayDistanceM({ ...GEOMETRY, lossDb: 114.94 })
    expect(r.value.distanceM).toBeLessThan(twoRayCriticalDistanceM(GEOMETRY))
    expect(Math.abs(twoRayLossDb({ ...GEOMETRY, distanceM: r.value.distanceM }).value.lossDb - 114.94)).toBeLessThan(1e-6)
    expect(r.warnings.join(' ')).toMatch(/oscillates/)
    expect(r.warnings.join(' ')).toMatch(/500\d m on the monotonic branch/)
  })

  it('finds no smaller distance with the same loss (checked on a 0.05 m grid)', () => {
    const target = 100
    const r = twoRayDistanceM({ ...GEOMETRY, lossDb: target })
    for (let d = 0.05; d < r.value.distanceM - 0.05; d += 0.05) {
      expect(twoRayLossDb({ ...GEOMETRY, distanceM: d }).value.lossDb).toBeLessThan(target)
    }
  })

  it('round-trips the exact form in loss (1e-6 dB) wherever the distance lies', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 1e5, noNaN: true }), (distanceM) => {
        const { value: { lossDb } } = twoRayLossDb({ ...GEOMETRY, distanceM })
        const back = twoRayDistanceM({ ...GEOMETRY, lossDb }).value.distanceM
        expect(back).toBeLessThanOrEqual(distanceM * (1 + 1e-9))
        expect(Math.abs(twoRayLossDb({ ...GEOMETRY, distanceM: back }).value.lossDb - lossDb)).toBeLessThan(1e-6)
      }),
    )
  })

  it('round-trips the monotonic branch in distance within 1e-6 relative beyond d_c', () => {
    const dc = twoRayCriticalDistanceM(GEOMETRY)
    fc.assert(
      fc.property(fc.double({ min: dc * 1.01, max: 1e6, noNaN: true }), (distanceM) => {
        const { value: { lossDb } } = twoRayLossDb({ ...GEOMETRY, distanceM })
        const back = twoRayMonotonicDistanceM({ ...GEOMETRY, lossDb })
        expect(Math.abs(back.value.distanceM - distanceM) / distanceM).toBeLessThan(1e-6)
        expect(back.warnings).toEqual([])
      }),
    )
  })

  it('inverts low antennas that never oscillate (2·min(h) < λ/2) on a single monotonic branch', () => {
    const low = { freqHz: 100e6, txHeightM: 0.5, rxHeightM: 0.5 }
    fc.assert(
      fc.property(fc.double({ min: 0.1, max: 1e5, noNaN: true }), (distanceM) => {
        const { value: { lossDb } } = twoRayLossDb({ ...low, distanceM })
        expect(Math.abs(twoRayDistanceM({ ...low, lossDb }).value.distanceM - distanceM) / distanceM).toBeLessThan(1e-6)
      }),
    )
  })

  it('throws a RangeError when no distance gives so low a loss', () => {
    expect(() => twoRayDistanceM({ ...GEOMETRY, lossDb: 10 })).toThrow(RangeError)
  })

  it('throws a RangeError naming lossDb for a non-finite loss', () => {
    expect(() => twoRayDistanceM({ ...GEOMETRY, lossDb: Number.NaN })).toThrow(/lossDb/)
  })
})

describe('two-ray breakpoint form (free space up to d_x, then the d⁻⁴ asymptote)', () => {
  for (const row of TWO_RAY_BREAKPOINT_ROWS) {
    it(`matches ${row.id} within ${row.tolerance} dB [${row.status}] (${row.source})`, () => {
      const r = twoRayLossDb({ ...row.inputs, form: 'breakpoint' })
      expect(Math.abs(r.value.lossDb - row.expected)).toBeLessThanOrEqual(row.tolerance)
      expect(r.method.id).toBe('two-ray-breakpoint')
    })
  }

  it('is continuous at the crossover d_x (free space = asymptote there, [D]) and grows with distance', () => {
    const dx = twoRayCrossoverDistanceM(GEOMETRY)
    const below = twoRayLossDb({ ...GEOMETRY, distanceM: dx * (1 - 1e-9), form: 'breakpoint' }).value.lossDb
    const above = twoRayLossDb({ ...GEOMETRY, distanceM: dx * (1 + 1e-9), form: 'breakpoint' }).value.lossDb
    expect(Math.abs(above - below)).toBeLessThan(1e-6)
    fc.assert(
      fc.property(fc.double({ min: 1, max: 1e6, noNaN: true }), fc.double({ min: 1.001, max: 10, noNaN: true }), (d, k) => {
        const near = twoRayLossDb({ ...GEOMETRY, distanceM: d, form: 'breakpoint' }).value.lossDb
        expect(twoRayLossDb({ ...GEOMETRY, distanceM: d * k, form: 'breakpoint' }).value.lossDb).toBeGreaterThan(near)
      }),
    )
  })

  it('never reads below free space or below the asymptote (it is the larger of the two)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 1e6, noNaN: true }), (distanceM) => {
        const l = twoRayLossDb({ ...GEOMETRY, distanceM, form: 'breakpoint' }).value.lossDb
        expect(l).toBeGreaterThanOrEqual(freeSpaceLossDb({ freqHz: GEOMETRY.freqHz, distanceM }).value.lossDb - 1e-9)
        expect(l).toBeGreaterThanOrEqual(twoRayLossDb({ ...GEOMETRY, distanceM, form: 'asymptote' }).value.lossDb - 1e-9)
      }),
    )
  })

  it('round-trips in distance within 1e-9 relative on both sides of d_x', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 1e6, noNaN: true }), (distanceM) => {
        const { value: { lossDb } } = twoRayLossDb({ ...GEOMETRY, distanceM, form: 'breakpoint' })
        const back = twoRayDistanceM({ ...GEOMETRY, lossDb, form: 'breakpoint' })
        expect(Math.abs(back.value.distanceM - distanceM) / distanceM).toBeLessThan(1e-9)
        expect(back.method.id).toBe('two-ray-breakpoint')
      }),
    )
  })

  it('has slope 20 dB/decade up to d_x and 40 beyond, as the registry model states', () => {
    const dx = twoRayCrossoverDistanceM(GEOMETRY)
    expect(twoRayBreakpointSlopeDbPerDecade({ ...GEOMETRY, distanceM: dx / 2 })).toBe(20)
    expect(twoRayBreakpointSlopeDbPerDecade({ ...GEOMETRY, distanceM: dx * 2 })).toBe(40)
    const model = createPropagationModel({ kind: 'two-ray', ...GEOMETRY, form: 'breakpoint' })
    expect(model.method.id).toBe('two-ray-breakpoint')
    expect(model.slopeDbPerDecade(dx * 2)).toBe(40)
    expect(Math.abs(model.lossDb(5000).value.lossDb - 114.89)).toBeLessThanOrEqual(0.01) // flat-earth two-ray asymptote (Rappaport eq. 4.52), register 5-2 [D]
  })

  it('warns inside the critical distance d_c, where the real two-ray loss swings around this trend', () => {
    expect(twoRayLossDb({ ...GEOMETRY, distanceM: 300, form: 'breakpoint' }).warnings.join(' ')).toMatch(/critical distance d_c/)
    expect(twoRayLossDb({ ...GEOMETRY, distanceM: 1000, form: 'breakpoint' }).warnings).toEqual([])
  })
})

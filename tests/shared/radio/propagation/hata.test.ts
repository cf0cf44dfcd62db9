import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  cost231HataDistanceM,
  cost231HataLossDb,
  hataDistanceM,
  hataLossDb,
  hataMobileCorrectionDb,
  hataSlopeDbPerDecade,
  type HataEnvironment,
} from '../../../../shared/radio/propagation/hata'
import { COST231_ROWS, HATA_MOBILE_CORRECTION_ROWS, HATA_ROWS } from '../../../fixtures/radio/propagation-hata'

const ENVIRONMENTS: HataEnvironment[] = ['urban-small-medium', 'urban-large', 'suburban', 'open']
const BASE = { txHeightM: 30, rxHeightM: 1.5 }

describe('hataLossDb', () => {
  for (const row of HATA_ROWS) {
    it(`matches ${row.id} within ${row.tolerance} dB [${row.status}] (${row.source})`, () => {
      expect(Math.abs(hataLossDb(row.inputs).value.lossDb - row.expected)).toBeLessThanOrEqual(row.tolerance)
    })
  }

  it('has the published distance slope 44.9 − 6.55·log10(30) = 35.22 dB/decade at h_b = 30 m', () => {
    expect(hataSlopeDbPerDecade({ freqHz: 900e6, ...BASE, environment: 'urban-small-medium' })).toBeCloseTo(35.22, 2)
  })

  it('is inside its validity at 900 MHz, 30 m, 1.5 m, 1–20 km and warns on nothing there', () => {
    expect(hataLossDb({ freqHz: 900e6, ...BASE, environment: 'urban-large', distanceM: 5000 }).warnings).toEqual([])
  })

  it.each([
    ['freqMhz', { freqHz: 120e6 }],
    ['freqMhz', { freqHz: 1800e6 }],
    ['txHeightM', { txHeightM: 20 }],
    ['rxHeightM', { rxHeightM: 12 }],
    ['distanceKm', { distanceM: 500 }],
    ['distanceKm', { distanceM: 25_000 }],
  ])('warns when %s is outside its validity range', (quantity, patch) => {
    const r = hataLossDb({ freqHz: 900e6, ...BASE, environment: 'urban-small-medium', distanceM: 5000, ...patch })
    expect(r.warnings.join(' ')).toMatch(new RegExp(`${quantity} = .* outside the validity range`))
  })

  it('warns in the large-city a(h_m) gap between 200 and 400 MHz, not in the small-city model', () => {
    expect(hataLossDb({ freqHz: 300e6, ...BASE, environment: 'urban-large', distanceM: 5000 }).warnings.join(' ')).toMatch(/200, 300 or 400 MHz/)
    expect(hataLossDb({ freqHz: 300e6, ...BASE, environment: 'urban-small-medium', distanceM: 5000 }).warnings).toEqual([])
    expect(hataLossDb({ freqHz: 450e6, ...BASE, environment: 'urban-large', distanceM: 5000 }).warnings).toEqual([])
  })

  it.each([
    ['distanceM', { distanceM: 0 }],
    ['distanceM', { distanceM: -1000 }],
    ['distanceM', { distanceM: Number.NaN }],
    ['freqHz', { freqHz: 0 }],
    ['freqHz', { freqHz: Number.NaN }],
    ['txHeightM', { txHeightM: -30 }],
    ['rxHeightM', { rxHeightM: -1.5 }],
  ])('throws a RangeError naming %s', (name, patch) => {
    const call = () => hataLossDb({ freqHz: 900e6, ...BASE, environment: 'urban-small-medium', distanceM: 5000, ...patch })
    expect(call).toThrow(RangeError)
    expect(call).toThrow(new RegExp(name))
  })

  it('grows with distance in every environment', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...ENVIRONMENTS),
        fc.double({ min: 100, max: 1e5, noNaN: true }),
        fc.double({ min: 1.001, max: 10, noNaN: true }),
        (environment, d, k) => {
          const at = (distanceM: number) => hataLossDb({ freqHz: 900e6, ...BASE, environment, distanceM }).value.lossDb
          expect(at(d * k)).toBeGreaterThan(at(d))
        },
      ),
    )
  })

  it('grows with frequency over 150–1500 MHz (large city on each side of the 200 MHz split)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...ENVIRONMENTS),
        fc.double({ min: 150e6, max: 1450e6, noNaN: true }),
        fc.double({ min: 1.001, max: 1.03, noNaN: true }),
        fc.double({ min: 1, max: 10, noNaN: true }),
        (environment, freqHz, k, rxHeightM) => {
          const f2 = freqHz * k
          if (environment === 'urban-large' && freqHz <= 200e6 && f2 > 200e6) return
          const at = (f: number) => hataLossDb({ freqHz: f, txHeightM: 50, rxHeightM, environment, distanceM: 3000 }).value.lossDb
          expect(at(f2)).toBeGreaterThan(at(freqHz))
        },
      ),
    )
  })
})

describe('hataMobileCorrectionDb', () => {
  for (const row of HATA_MOBILE_CORRECTION_ROWS) {
    it(`matches ${row.id} within ${row.tolerance} dB [${row.status}] (${row.source})`, () => {
      expect(Math.abs(hataMobileCorrectionDb(row.inputs) - row.expected)).toBeLessThanOrEqual(row.tolerance)
    })
  }
})

describe('hataDistanceM', () => {
  it('gives 5 km for the 7-3 urban small/medium loss of 151.02 dB within 2 m', () => {
    const r = hataDistanceM({ freqHz: 900e6, ...BASE, environment: 'urban-small-medium', lossDb: 151.0244 })
    expect(Math.abs(r.value.distanceM - 5000)).toBeLessThan(2)
  })

  it('round-trips with hataLossDb within 1e-9 relative', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...ENVIRONMENTS),
        fc.double({ min: 10, max: 1e5, noNaN: true }),
        fc.double({ min: 150e6, max: 1500e6, noNaN: true }),
        (environment, distanceM, freqHz) => {
          const { value: { lossDb } } = hataLossDb({ freqHz, ...BASE, environment, distanceM })
          const back = hataDistanceM({ freqHz, ...BASE, environment, lossDb }).value.distanceM
          expect(Math.abs(back - distanceM) / distanceM).toBeLessThan(1e-9)
        },
      ),
    )
  })

  it('warns when the distance found lies outside 1–20 km', () => {
    expect(hataDistanceM({ freqHz: 900e6, ...BASE, environment: 'open', lossDb: 80 }).warnings.join(' ')).toMatch(/distanceKm/)
  })
})

describe('cost231HataLossDb', () => {
  for (const row of COST231_ROWS) {
    it(`matches ${row.id} within ${row.tolerance} dB [${row.status}] (${row.source})`, () => {
      expect(Math.abs(cost231HataLossDb(row.inputs).value.lossDb - row.expected)).toBeLessThanOrEqual(row.tolerance)
    })
  }

  it('warns at 2114 MHz, outside 1500–2000 MHz', () => {
    const r = cost231HataLossDb({ freqHz: 2114e6, ...BASE, environment: 'medium-city', distanceM: 2000 })
    expect(r.warnings.join(' ')).toMatch(/freqMhz = 2114 MHz is outside the validity range 1500–2000 MHz/)
  })

  it('throws a RangeError naming rxHeightM for a negative height', () => {
    expect(() => cost231HataLossDb({ freqHz: 1800e6, txHeightM: 30, rxHeightM: -1, environment: 'metropolitan', distanceM: 1000 })).toThrow(
      /rxHeightM/,
    )
  })

  it('round-trips with cost231HataDistanceM within 1e-9 relative and grows with distance and frequency', () => {
    fc.assert(
      fc.property(
        fc.constantFrom('medium-city' as const, 'metropolitan' as const),
        fc.double({ min: 10, max: 1e5, noNaN: true }),
        fc.double({ min: 1500e6, max: 2000e6, noNaN: true }),
        (environment, distanceM, freqHz) => {
          const p = { freqHz, ...BASE, environment }
          const { value: { lossDb } } = cost231HataLossDb({ ...p, distanceM })
          expect(Math.abs(cost231HataDistanceM({ ...p, lossDb }).value.distanceM - distanceM) / distanceM).toBeLessThan(1e-9)
          expect(cost231HataLossDb({ ...p, distanceM: distanceM * 1.1 }).value.lossDb).toBeGreaterThan(lossDb)
          expect(cost231HataLossDb({ ...p, freqHz: freqHz * 1.01, distanceM }).value.lossDb).toBeGreaterThan(lossDb)
        },
      ),
    )
  })
})

describe('COST-231 Hata city correction C_m as a number', () => {
  for (const row of COST231_ROWS.filter((r) => r.id.startsWith('7-'))) {
    const { environment, ...rest } = row.inputs
    const cityCorrectionDb = environment === 'metropolitan' ? 3 : 0
    it(`matches ${row.id} with C_m = ${cityCorrectionDb} dB given as a number, within ${row.tolerance} dB [${row.status}]`, () => {
      expect(Math.abs(cost231HataLossDb({ ...rest, cityCorrectionDb }).value.lossDb - row.expected)).toBeLessThanOrEqual(row.tolerance)
    })
  }

  it('adds any C_m in dB to the loss, and the inverse takes it too', () => {
    const base = { freqHz: 1800e6, txHeightM: 30, rxHeightM: 1.5 }
    const l0 = cost231HataLossDb({ ...base, cityCorrectionDb: 0, distanceM: 3000 }).value.lossDb
    expect(cost231HataLossDb({ ...base, cityCorrectionDb: 1.5, distanceM: 3000 }).value.lossDb - l0).toBeCloseTo(1.5, 9)
    expect(cost231HataDistanceM({ ...base, cityCorrectionDb: 1.5, lossDb: l0 + 1.5 }).value.distanceM).toBeCloseTo(3000, 6)
  })

  it('refuses both an environment and a number, or neither', () => {
    const base = { freqHz: 1800e6, txHeightM: 30, rxHeightM: 1.5, distanceM: 3000 }
    expect(() => cost231HataLossDb({ ...base, environment: 'metropolitan', cityCorrectionDb: 3 })).toThrow(/exactly one of environment or cityCorrectionDb/)
    expect(() => cost231HataLossDb(base)).toThrow(RangeError)
    expect(() => cost231HataLossDb({ ...base, cityCorrectionDb: Number.NaN })).toThrow(/cityCorrectionDb/)
  })
})

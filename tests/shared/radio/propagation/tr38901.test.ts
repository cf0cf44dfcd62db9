import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  TR38901_SHADOW_SIGMA_DB,
  tr38901BreakpointDistanceM,
  tr38901DistanceM,
  tr38901LossDb,
  type Tr38901Params,
  type Tr38901Scenario,
} from '../../../../shared/radio/propagation/tr38901'
import { TR38901_BREAKPOINT_ROWS, TR38901_NS3_ROWS, TR38901_WORKED_ROWS } from '../../../fixtures/radio/propagation-tr38901'

const TYPICAL: Record<Tr38901Scenario, Omit<Tr38901Params, 'condition'>> = {
  RMa: { freqHz: 3.5e9, scenario: 'RMa', baseHeightM: 35, ueHeightM: 1.5 },
  UMa: { freqHz: 3.5e9, scenario: 'UMa', baseHeightM: 25, ueHeightM: 1.5 },
  'UMi-street-canyon': { freqHz: 3.5e9, scenario: 'UMi-street-canyon', baseHeightM: 10, ueHeightM: 1.5 },
  'InH-office': { freqHz: 3.5e9, scenario: 'InH-office', baseHeightM: 3, ueHeightM: 1 },
}
const VARIANTS = (Object.keys(TYPICAL) as Tr38901Scenario[]).flatMap((s) =>
  (['LOS', 'NLOS'] as const).map((condition): Tr38901Params => ({ ...TYPICAL[s], condition })),
)

describe('tr38901LossDb', () => {
  for (const row of [...TR38901_NS3_ROWS, ...TR38901_WORKED_ROWS]) {
    it(`matches ${row.id} within ${row.tolerance} dB [${row.status}] (${row.source})`, () => {
      expect(Math.abs(tr38901LossDb(row.inputs).lossDb - row.expected)).toBeLessThanOrEqual(row.tolerance)
    })
  }

  it('returns the Table 7.4.1-1 shadow-fading σ per scenario and condition (ns-3 test suite values [V-I])', () => {
    const sigma = (p: Tr38901Params, distanceM: number) => tr38901LossDb({ ...p, distanceM }).shadowSigmaDb
    expect(sigma({ ...TYPICAL.RMa, condition: 'LOS' }, 500)).toBe(4)
    expect(sigma({ ...TYPICAL.RMa, condition: 'LOS' }, 5000)).toBe(6) // beyond d_BP = 2π·35·1.5·3.5e9/3e8 ≈ 3848 m
    expect(sigma({ ...TYPICAL.RMa, condition: 'NLOS' }, 500)).toBe(8)
    expect(sigma({ ...TYPICAL.UMa, condition: 'LOS' }, 500)).toBe(4)
    expect(sigma({ ...TYPICAL.UMa, condition: 'NLOS' }, 500)).toBe(6)
    expect(sigma({ ...TYPICAL['UMi-street-canyon'], condition: 'LOS' }, 500)).toBe(4)
    expect(sigma({ ...TYPICAL['UMi-street-canyon'], condition: 'NLOS' }, 500)).toBe(7.82)
    expect(sigma({ ...TYPICAL['InH-office'], condition: 'LOS' }, 20)).toBe(3)
    expect(sigma({ ...TYPICAL['InH-office'], condition: 'NLOS' }, 20)).toBe(8.03)
    expect(TR38901_SHADOW_SIGMA_DB.UMa.NLOS).toBe(6)
  })

  it('warns outside the validity ranges (UMa d2D > 5 km, h_BS ≠ 25 m; RMa above 30 GHz; InH beyond 150 m)', () => {
    expect(tr38901LossDb({ ...TYPICAL.UMa, condition: 'LOS', distanceM: 6000 }).warnings.join(' ')).toMatch(/distance2dM/)
    expect(tr38901LossDb({ ...TYPICAL.UMa, baseHeightM: 30, condition: 'LOS', distanceM: 600 }).warnings.join(' ')).toMatch(/baseHeightM/)
    expect(tr38901LossDb({ ...TYPICAL.RMa, freqHz: 40e9, condition: 'LOS', distanceM: 600 }).warnings.join(' ')).toMatch(/freqGhz/)
    expect(tr38901LossDb({ ...TYPICAL['InH-office'], condition: 'NLOS', distanceM: 200 }).warnings.join(' ')).toMatch(/distance3dM/)
    expect(tr38901LossDb({ ...TYPICAL.UMa, condition: 'NLOS', distanceM: 600 }).warnings).toEqual([])
  })

  it('warns that UMa uses h_E = 1 m when h_UT ≥ 13 m', () => {
    expect(tr38901LossDb({ ...TYPICAL.UMa, ueHeightM: 15, condition: 'LOS', distanceM: 300 }).warnings.join(' ')).toMatch(/h_E = 1 m/)
    expect(tr38901LossDb({ ...TYPICAL.UMa, ueHeightM: 12, condition: 'LOS', distanceM: 300 }).warnings).toEqual([])
  })

  it.each([
    ['distanceM', { distanceM: 0 }],
    ['distanceM', { distanceM: -10 }],
    ['distanceM', { distanceM: Number.NaN }],
    ['freqHz', { freqHz: 0 }],
    ['freqHz', { freqHz: Number.NaN }],
    ['baseHeightM', { baseHeightM: -25 }],
    ['ueHeightM', { ueHeightM: -1.5 }],
    ['h_E', { ueHeightM: 0.8 }],
  ])('throws a RangeError naming %s', (name, patch) => {
    const call = () => tr38901LossDb({ ...TYPICAL.UMa, condition: 'LOS', distanceM: 100, ...patch })
    expect(call).toThrow(RangeError)
    expect(call).toThrow(new RegExp(name))
  })

  it('grows with 2D distance in every scenario and condition', () => {
    fc.assert(
      fc.property(fc.constantFrom(...VARIANTS), fc.double({ min: 1, max: 2e4, noNaN: true }), fc.double({ min: 1.001, max: 10, noNaN: true }), (p, d, k) => {
        expect(tr38901LossDb({ ...p, distanceM: d * k }).lossDb).toBeGreaterThan(tr38901LossDb({ ...p, distanceM: d }).lossDb)
      }),
    )
  })

  it('gives NLOS at least LOS (NLOS = max(LOS, PL′))', () => {
    fc.assert(
      fc.property(fc.constantFrom(...(Object.keys(TYPICAL) as Tr38901Scenario[])), fc.double({ min: 10, max: 5000, noNaN: true }), (s, distanceM) => {
        const los = tr38901LossDb({ ...TYPICAL[s], condition: 'LOS', distanceM }).lossDb
        expect(tr38901LossDb({ ...TYPICAL[s], condition: 'NLOS', distanceM }).lossDb).toBeGreaterThanOrEqual(los)
      }),
    )
  })
})

describe('tr38901BreakpointDistanceM', () => {
  for (const row of TR38901_BREAKPOINT_ROWS) {
    it(`matches ${row.id} within ${row.tolerance} m [${row.status}] (${row.source})`, () => {
      expect(Math.abs(tr38901BreakpointDistanceM(row.inputs)! - row.expected)).toBeLessThanOrEqual(row.tolerance)
    })
  }
})

describe('tr38901DistanceM', () => {
  it('gives 1000 m for the ns-3 UMa LOS loss 109.7252 dB at 5 GHz within 0.05 m', () => {
    const r = tr38901DistanceM({ freqHz: 5e9, scenario: 'UMa', condition: 'LOS', baseHeightM: 25, ueHeightM: 1.5, lossDb: 109.7252 })
    expect(Math.abs(r.distanceM - 1000)).toBeLessThan(0.05)
  })

  it('round-trips with tr38901LossDb within 1e-6 relative over 10 m–5 km', () => {
    fc.assert(
      fc.property(fc.constantFrom(...VARIANTS), fc.double({ min: 10, max: 5000, noNaN: true }), (p, distanceM) => {
        const { lossDb } = tr38901LossDb({ ...p, distanceM })
        const back = tr38901DistanceM({ ...p, lossDb }).distanceM
        expect(Math.abs(back - distanceM) / distanceM).toBeLessThan(1e-6)
      }),
    )
  })

  it('throws a RangeError for a loss below what the model gives at zero distance', () => {
    expect(() => tr38901DistanceM({ ...TYPICAL.UMa, condition: 'LOS', lossDb: 20 })).toThrow(RangeError)
  })
})

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
  RMa: { freqHz: 3.5e9, scenario: 'RMa', txHeightM: 35, rxHeightM: 1.5 },
  UMa: { freqHz: 3.5e9, scenario: 'UMa', txHeightM: 25, rxHeightM: 1.5 },
  'UMi-street-canyon': { freqHz: 3.5e9, scenario: 'UMi-street-canyon', txHeightM: 10, rxHeightM: 1.5 },
  'InH-office': { freqHz: 3.5e9, scenario: 'InH-office', txHeightM: 3, rxHeightM: 1 },
}
const VARIANTS = (Object.keys(TYPICAL) as Tr38901Scenario[]).flatMap((s) =>
  (['LOS', 'NLOS'] as const).map((condition): Tr38901Params => ({ ...TYPICAL[s], condition })),
)

describe('tr38901LossDb', () => {
  for (const row of [...TR38901_NS3_ROWS, ...TR38901_WORKED_ROWS]) {
    it(`matches ${row.id} within ${row.tolerance} dB [${row.status}] (${row.source})`, () => {
      expect(Math.abs(tr38901LossDb(row.inputs).value.lossDb - row.expected)).toBeLessThanOrEqual(row.tolerance)
    })
  }

  it('returns the Table 7.4.1-1 shadow-fading σ per scenario and condition (ns-3 test suite values [V-I])', () => {
    const sigma = (p: Tr38901Params, distanceM: number) => tr38901LossDb({ ...p, distanceM }).value.shadowSigmaDb
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
    expect(tr38901LossDb({ ...TYPICAL.UMa, txHeightM: 30, condition: 'LOS', distanceM: 600 }).warnings.join(' ')).toMatch(/txHeightM/)
    expect(tr38901LossDb({ ...TYPICAL.RMa, freqHz: 40e9, condition: 'LOS', distanceM: 600 }).warnings.join(' ')).toMatch(/freqGhz/)
    expect(tr38901LossDb({ ...TYPICAL['InH-office'], condition: 'NLOS', distanceM: 200 }).warnings.join(' ')).toMatch(/distance3dM/)
    expect(tr38901LossDb({ ...TYPICAL.UMa, condition: 'NLOS', distanceM: 600 }).warnings).toEqual([])
  })

  it('warns that UMa uses h_E = 1 m when h_UT ≥ 13 m', () => {
    expect(tr38901LossDb({ ...TYPICAL.UMa, rxHeightM: 15, condition: 'LOS', distanceM: 300 }).warnings.join(' ')).toMatch(/h_E = 1 m/)
    expect(tr38901LossDb({ ...TYPICAL.UMa, rxHeightM: 12, condition: 'LOS', distanceM: 300 }).warnings).toEqual([])
  })

  it.each([
    ['distanceM', { distanceM: 0 }],
    ['distanceM', { distanceM: -10 }],
    ['distanceM', { distanceM: Number.NaN }],
    ['freqHz', { freqHz: 0 }],
    ['freqHz', { freqHz: Number.NaN }],
    ['txHeightM', { txHeightM: -25 }],
    ['rxHeightM', { rxHeightM: -1.5 }],
    ['h_E', { rxHeightM: 0.8 }],
  ])('throws a RangeError naming %s', (name, patch) => {
    const call = () => tr38901LossDb({ ...TYPICAL.UMa, condition: 'LOS', distanceM: 100, ...patch })
    expect(call).toThrow(RangeError)
    expect(call).toThrow(new RegExp(name))
  })

  it('grows with 2D distance in every scenario and condition', () => {
    fc.assert(
      fc.property(fc.constantFrom(...VARIANTS), fc.double({ min: 1, max: 2e4, noNaN: true }), fc.double({ min: 1.001, max: 10, noNaN: true }), (p, d, k) => {
        expect(tr38901LossDb({ ...p, distanceM: d * k }).value.lossDb).toBeGreaterThan(tr38901LossDb({ ...p, distanceM: d }).value.lossDb)
      }),
    )
  })

  it('gives NLOS at least LOS (NLOS = max(LOS, PL′))', () => {
    fc.assert(
      fc.property(fc.constantFrom(...(Object.keys(TYPICAL) as Tr38901Scenario[])), fc.double({ min: 10, max: 5000, noNaN: true }), (s, distanceM) => {
        const los = tr38901LossDb({ ...TYPICAL[s], condition: 'LOS', distanceM }).value.lossDb
        expect(tr38901LossDb({ ...TYPICAL[s], condition: 'NLOS', distanceM }).value.lossDb).toBeGreaterThanOrEqual(los)
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
    const r = tr38901DistanceM({ freqHz: 5e9, scenario: 'UMa', condition: 'LOS', txHeightM: 25, rxHeightM: 1.5, lossDb: 109.7252 })
    expect(Math.abs(r.value.distanceM - 1000)).toBeLessThan(0.05)
  })

  it('round-trips with tr38901LossDb within 1e-6 relative over 10 m–5 km', () => {
    fc.assert(
      fc.property(fc.constantFrom(...VARIANTS), fc.double({ min: 10, max: 5000, noNaN: true }), (p, distanceM) => {
        const { value: { lossDb } } = tr38901LossDb({ ...p, distanceM })
        const back = tr38901DistanceM({ ...p, lossDb }).value.distanceM
        expect(Math.abs(back - distanceM) / distanceM).toBeLessThan(1e-6)
      }),
    )
  })

  it('throws a RangeError for a loss below what the model gives at zero distance', () => {
    expect(() => tr38901DistanceM({ ...TYPICAL.UMa, condition: 'LOS', lossDb: 20 })).toThrow(RangeError)
  })
})

describe('tr38901LossDb on the 3D distance (the distance InH is defined on)', () => {
  const inhRows = TR38901_WORKED_ROWS.filter((row) => row.inputs.scenario === 'InH-office')

  it('covers the four register 8-4 rows', () => {
    expect(inhRows).toHaveLength(4)
  })

  for (const row of inhRows) {
    it(`matches ${row.id} within ${row.tolerance} dB from d3D with unequal heights (3 m and 1 m) [${row.status}]`, () => {
      const { distanceM: distance3dM, ...rest } = row.inputs
      const r = tr38901LossDb({ ...rest, txHeightM: 3, rxHeightM: 1, distance3dM })
      expect(Math.abs(r.value.lossDb - row.expected)).toBeLessThanOrEqual(row.tolerance)
    })
  }

  it('gives the same loss for a 3D distance as for the ground distance it stands for', () => {
    const uma: Tr38901Params = { ...TYPICAL.UMa, condition: 'NLOS' }
    const d3 = Math.hypot(400, 25 - 1.5)
    expect(tr38901LossDb({ ...uma, distance3dM: d3 }).value.lossDb).toBeCloseTo(tr38901LossDb({ ...uma, distanceM: 400 }).value.lossDb, 9)
  })

  it('returns both the ground and the 3D distance from the inverse', () => {
    const inh: Tr38901Params = { ...TYPICAL['InH-office'], condition: 'LOS' }
    const r = tr38901DistanceM({ ...inh, lossDb: 70 })
    expect(r.value.distance3dM).toBeCloseTo(Math.hypot(r.value.distanceM, 3 - 1), 9)
    expect(tr38901LossDb({ ...inh, distance3dM: r.value.distance3dM }).value.lossDb).toBeCloseTo(70, 6)
  })

  it('refuses both distances, neither, or a 3D distance shorter than the height difference', () => {
    const inh: Tr38901Params = { ...TYPICAL['InH-office'], condition: 'LOS' }
    expect(() => tr38901LossDb({ ...inh, distanceM: 10, distance3dM: 10 })).toThrow(/exactly one of distanceM/)
    expect(() => tr38901LossDb({ ...inh })).toThrow(RangeError)
    expect(() => tr38901LossDb({ ...inh, distance3dM: 1.5 })).toThrow(/distance3dM/)
  })
})

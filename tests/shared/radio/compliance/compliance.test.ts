import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { APPLIED_LIMIT_ROWS } from '../../../fixtures/radio/compliance-checks'
import {
  appliedLimitEirpDbm,
  assessCompliance,
  BAND_LIMITS,
  findBandLimits,
  GAIN_RULES,
  type LimitSpec,
} from '../../../../shared/radio/compliance'

const within = (actual: number, expected: number, tol: number) => expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tol)

function toSpec(raw: Record<string, unknown>): LimitSpec {
  const rule = raw.gainRule as keyof typeof GAIN_RULES | undefined
  return (rule ? { ...raw, gainRule: GAIN_RULES[rule] } : raw) as unknown as LimitSpec
}

describe('appliedLimitEirpDbm', () => {
  for (const row of APPLIED_LIMIT_ROWS) {
    it(`${row.id}: gives ${row.expected} dBm EIRP within ${row.tolerance} dB (${row.source}, ${row.status})`, () => {
      within(appliedLimitEirpDbm({ spec: toSpec(row.inputs.spec), ...row.inputs.facts }).value.limitEirpDbm, row.expected, row.tolerance)
    })
  }
  it('11-1: the dB-for-dB rule leaves 12 dBm conducted for a 24 dBi antenna, the point-to-point rule 24 dBm', () => {
    const ptmp = appliedLimitEirpDbm({ spec: { kind: 'conducted', conductedPowerDbm: 30, gainRule: GAIN_RULES.dbForDbAbove6Dbi }, antennaGainDbi: 24, feederLossDb: 0 })
    const ptp = appliedLimitEirpDbm({ spec: { kind: 'conducted', conductedPowerDbm: 30, gainRule: GAIN_RULES.onePerThreeAbove6DbiPointToPoint }, antennaGainDbi: 24, feederLossDb: 0 })
    expect(ptmp.value.limitEirpDbm - 24).toBeCloseTo(12, 12)
    expect(ptp.value.limitEirpDbm - 24).toBeCloseTo(24, 12)
    expect(ptmp.value.derivation.join(' ')).toContain('15.247(b)(4)')
  })
  it('applies no reduction at or below the 6 dBi threshold: EIRP limit = 30 dBm + G', () => {
    expect(appliedLimitEirpDbm({ spec: { kind: 'conducted', conductedPowerDbm: 30, gainRule: GAIN_RULES.dbForDbAbove6Dbi }, antennaGainDbi: 3, feederLossDb: 0 }).value.limitEirpDbm).toBe(33)
  })
  it('caps the dB-for-dB rule at 36 dBm EIRP for any gain above 6 dBi (47 CFR §15.247, register §11 15.247(b)(4) "EIRP cap 36 dBm")', () => {
    fc.assert(
      fc.property(fc.double({ min: 6, max: 50, noNaN: true }), (g) => {
        expect(appliedLimitEirpDbm({ spec: { kind: 'conducted', conductedPowerDbm: 30, gainRule: GAIN_RULES.dbForDbAbove6Dbi }, antennaGainDbi: g, feederLossDb: 0 }).value.limitEirpDbm).toBeCloseTo(36, 9)
      }),
    )
  })
  it('leaves the 60 GHz point-to-point limit at 82 dBm for gains of 51 dBi and above', () => {
    expect(appliedLimitEirpDbm({ spec: { kind: 'eirp', eirpDbm: 82, gainRule: GAIN_RULES.twoPerDbBelow51Dbi }, antennaGainDbi: 55 }).value.limitEirpDbm).toBe(82)
  })
  it('subtracts a given feeder loss from the EIRP equivalent of a conducted limit, and warns when none is given', () => {
    const spec: LimitSpec = { kind: 'conducted', conductedPowerDbm: 30, gainRule: GAIN_RULES.noReduction }
    expect(appliedLimitEirpDbm({ spec, antennaGainDbi: 6, feederLossDb: 2 }).value.limitEirpDbm).toBe(34)
    expect(appliedLimitEirpDbm({ spec, antennaGainDbi: 6 }).warnings.some((w) => /Feeder loss/.test(w))).toBe(true)
  })
  it('15.407(a)(2): takes the lesser of 250 mW and 11 dBm + 10 log B (B = 10 MHz → 21 dBm)', () => {
    const spec: LimitSpec = {
      kind: 'lesser-of',
      limits: [
        { kind: 'conducted', conductedPowerDbm: 10 * Math.log10(250), gainRule: GAIN_RULES.noReduction },
        { kind: 'conducted-density', conductedDensityDbm: 11, referenceBandwidthHz: 1e6, gainRule: GAIN_RULES.noReduction },
      ],
    }
    within(appliedLimitEirpDbm({ spec, antennaGainDbi: 0, feederLossDb: 0, emissionBandwidthHz: 10e6 }).value.limitEirpDbm, 21, 1e-9)
    within(appliedLimitEirpDbm({ spec, antennaGainDbi: 0, feederLossDb: 0, emissionBandwidthHz: 40e6 }).value.limitEirpDbm, 23.98, 0.01)
  })
  it('counts a narrow emission against one whole reference bandwidth of a density limit', () => {
    const r = appliedLimitEirpDbm({ spec: { kind: 'eirp-density', eirpDensityDbm: 10, referenceBandwidthHz: 1e6 }, emissionBandwidthHz: 200e3 })
    expect(r.value.limitEirpDbm).toBe(10)
    expect(r.warnings.some((w) => /narrower/.test(w))).toBe(true)
  })
  it('throws a RangeError naming antennaGainDbi when a conducted limit has no gain', () => {
    expect(() => appliedLimitEirpDbm({ spec: { kind: 'conducted', conductedPowerDbm: 30, gainRule: GAIN_RULES.noReduction } })).toThrow(/antennaGainDbi/)
  })
  it('throws a RangeError naming emissionBandwidthHz when a density limit has no bandwidth', () => {
    expect(() => appliedLimitEirpDbm({ spec: { kind: 'eirp-density', eirpDensityDbm: 10, referenceBandwidthHz: 1e6 } })).toThrow(/emissionBandwidthHz/)
  })
  it('says how the limit was applied: method applied-limit-eirp citing the gain rules and register §11', () => {
    const r = appliedLimitEirpDbm({ spec: { kind: 'erp', erpDbm: 27 } })
    expect(r.method.id).toBe('applied-limit-eirp')
    expect(r.method.source).toContain('1.161')
    expect(r.method.source).toContain('register 11-1')
    expect(r.value.derivation).toEqual(['ERP limit 27 dBm + 2.15 dB = 29.15 dBm EIRP'])
  })
  it('throws a RangeError for an empty lesser-of', () => {
    expect(() => appliedLimitEirpDbm({ spec: { kind: 'lesser-of', limits: [] } })).toThrow(/limits/)
  })
})

describe('assessCompliance', () => {
  const limit = { spec: { kind: 'eirp', eirpDbm: 20 } as LimitSpec, citation: 'ETSI EN 300 328 (V2.2.2), RF output power', status: '[V-S]' }
  it('finds 23 dBm EIRP 3 dB over a 20 dBm limit and carries the citation through', () => {
    const r = assessCompliance({ eirpDbm: 23, limit })
    expect(r.value.verdict).toBe('exceeds')
    expect(r.value.marginDb).toBeCloseTo(3, 12)
    expect(r.value.appliedLimitEirpDbm).toBe(20)
    expect(r.value.citation).toBe(limit.citation)
  })
  it('is within at exactly the limit and exceeds at the next representable level above it', () => {
    fc.assert(
      fc.property(fc.double({ min: -50, max: 90, noNaN: true }), (limitDbm) => {
        const l = { spec: { kind: 'eirp', eirpDbm: limitDbm } as LimitSpec, citation: 'test limit' }
        const above = limitDbm + Math.max(Number.EPSILON, Math.abs(limitDbm) * Number.EPSILON)
        expect(assessCompliance({ eirpDbm: limitDbm, limit: l }).value.verdict).toBe('within')
        expect(assessCompliance({ eirpDbm: above, limit: l }).value.verdict).toBe('exceeds')
      }),
    )
  })
  it('is inconclusive when the 95 % interval straddles the limit, with the margin interval as the result interval', () => {
    const r = assessCompliance({ eirpDbm: 21, eirpIntervalDbm: { lowDbm: 18, highDbm: 24 }, limit })
    expect(r.value.verdict).toBe('inconclusive')
    expect(r.interval).toEqual({ quantity: 'marginDb', low: -2, high: 4, basis: expect.any(String) })
  })
  it('exceeds only when the whole interval is above the limit, and is within only when the whole interval is at or below it', () => {
    expect(assessCompliance({ eirpDbm: 23, eirpIntervalDbm: { lowDbm: 20.5, highDbm: 25 }, limit }).value.verdict).toBe('exceeds')
    expect(assessCompliance({ eirpDbm: 17, eirpIntervalDbm: { lowDbm: 15, highDbm: 20 }, limit }).value.verdict).toBe('within')
    expect(assessCompliance({ eirpDbm: 19, eirpIntervalDbm: { lowDbm: 17, highDbm: 20.01 }, limit }).value.verdict).toBe('inconclusive')
  })
  it('11-5: judges 17 dBm EIRP over the 25 mW e.r.p. limit (16.13 dBm EIRP) by 0.87 dB', () => {
    const srd = BAND_LIMITS.find((e) => e.id === 'erc-rec-70-03-a1-868-0')!
    const r = assessCompliance({ eirpDbm: 17, limit: srd })
    within(r.value.appliedLimitEirpDbm, 16.13, 0.01)
    within(r.value.marginDb, 0.87, 0.01)
    expect(r.value.verdict).toBe('exceeds')
  })
  it('warns when the limit value is marked [M]', () => {
    const m = BAND_LIMITS.find((e) => e.id === 'cfr47-15-255-average')!
    expect(assessCompliance({ eirpDbm: 30, limit: m }).warnings.some((w) => /\[M\]/.test(w))).toBe(true)
  })
  it('throws a RangeError when the interval does not contain the EIRP', () => {
    expect(() => assessCompliance({ eirpDbm: 30, eirpIntervalDbm: { lowDbm: 10, highDbm: 20 }, limit })).toThrow(/eirpIntervalDbm/)
  })
  it('throws a RangeError naming eirpDbm for a NaN EIRP', () => {
    expect(() => assessCompliance({ eirpDbm: Number.NaN, limit })).toThrow(/eirpDbm/)
  })
  it('throws a RangeError when the limit carries no citation', () => {
    expect(() => assessCompliance({ eirpDbm: 10, limit: { spec: limit.spec, citation: '' } })).toThrow(/citation/)
  })
})

describe('band-limit reference', () => {
  it('gives every entry a unique id, a citation, a status tag and a non-empty band', () => {
    const ids = new Set<string>()
    for (const e of BAND_LIMITS) {
      expect(ids.has(e.id)).toBe(false)
      ids.add(e.id)
      expect(e.citation.length).toBeGreaterThan(10)
      expect(['[V-S]', '[M]']).toContain(e.status)
      expect(e.statusNote.length).toBeGreaterThan(0)
      for (const b of e.bandsHz) expect(b.highHz).toBeGreaterThan(b.lowHz)
    }
  })
  it('marks as [M] every entry whose status note says a part is recalled', () => {
    for (const e of BAND_LIMITS) {
      if (/recalled/i.test(e.statusNote)) expect(e.status).toBe('[M]')
    }
  })
  it('finds the EN 300 328 20 dBm EIRP limit at 2440 MHz, tagged [V-S]', () => {
    const e = findBandLimits({ freqHz: 2440e6 }).find((x) => x.id === 'en300328-2g4-eirp')!
    expect(e.status).toBe('[V-S]')
    expect(appliedLimitEirpDbm({ spec: e.spec }).value.limitEirpDbm).toBe(20)
  })
  it('gives 30 dBm for EN 301 893 5470–5725 MHz with TPC over 20 MHz (the 30.01 dBm density total is higher, EIRP density × bandwidth, register 11-4)', () => {
    const e = BAND_LIMITS.find((x) => x.id === 'en301893-5g47-tpc')!
    expect(appliedLimitEirpDbm({ spec: e.spec, emissionBandwidthHz: 20e6 }).value.limitEirpDbm).toBe(30)
  })
  it('gives 500 mW e.r.p. = 29.14 dBm EIRP for 869.4–869.65 MHz (ITU RR Nos. 1.161/1.162, register 3-3)', () => {
    const e = findBandLimits({ freqHz: 869.525e6 })[0]
    within(appliedLimitEirpDbm({ spec: e.spec }).value.limitEirpDbm, 29.14, 0.01)
  })
  it('throws a RangeError naming freqHz for a zero frequency', () => {
    expect(() => findBandLimits({ freqHz: 0 })).toThrow(/freqHz/)
  })
})

import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import type { PropagationModelKind, PropagationModelSpec } from '../../../../shared/radio/propagation/model'
import { P676_VALIDATION_ATMOSPHERE, gaseousSpecificAttenuation } from '../../../../shared/radio/propagation/gaseous-p676'
import { PROPAGATION_MODEL_DESCRIPTORS, createPropagationModel } from '../../../../shared/radio/propagation/registry'
import { centralSlopeDbPerDecade } from '../../../../shared/radio/propagation/numeric'

const GAMMA_60_GHZ = gaseousSpecificAttenuation({ freqHz: 60e9, ...P676_VALIDATION_ATMOSPHERE }).value.totalDbPerKm

/** One spec per kind, with a published check value at a distance (source in the name). */
const CASES: { name: string; spec: PropagationModelSpec; id: string; distanceM: number; expectedDb: number; tolDb: number }[] = [
  { name: 'free space, ITU-R P.525-4, register 1-2 [D]', spec: { kind: 'free-space', freqHz: 900e6 }, id: 'free-space-p525', distanceM: 10_000, expectedDb: 111.53, tolDb: 0.01 },
  {
    name: 'free space P.525 form, ITU-R P.525-4, register 1-2 [D]',
    spec: { kind: 'free-space', freqHz: 900e6, form: 'p525-rounded' },
    id: 'free-space-p525-rounded',
    distanceM: 10_000,
    expectedDb: 111.48,
    tolDb: 0.01,
  },
  {
    name: 'log-distance n = 3.5, log-distance model (Rappaport §4.9.1), register 6-2 [D]',
    spec: { kind: 'log-distance', freqHz: 2.4e9, refDistanceM: 1, exponent: 3.5 },
    id: 'log-distance',
    distanceM: 50,
    expectedDb: 99.52,
    tolDb: 0.01,
  },
  {
    name: 'two-ray exact, flat-earth two-ray (Goldsmith eq. 2.12, Rappaport eq. 4.52), register 5-2 [D]',
    spec: { kind: 'two-ray', freqHz: 900e6, txHeightM: 30, rxHeightM: 1.5 },
    id: 'two-ray-exact',
    distanceM: 5000,
    expectedDb: 114.94,
    tolDb: 0.01,
  },
  {
    name: 'two-ray asymptote, flat-earth two-ray (Goldsmith eq. 2.12, Rappaport eq. 4.52), register 5-2 [D]',
    spec: { kind: 'two-ray', freqHz: 900e6, txHeightM: 30, rxHeightM: 1.5, form: 'asymptote' },
    id: 'two-ray-asymptote',
    distanceM: 5000,
    expectedDb: 114.89,
    tolDb: 0.01,
  },
  {
    name: 'Hata urban small/medium, Hata (1980), COST 231, register 7-3 [D]',
    spec: { kind: 'hata', freqHz: 900e6, txHeightM: 30, rxHeightM: 1.5, environment: 'urban-small-medium' },
    id: 'okumura-hata',
    distanceM: 5000,
    expectedDb: 151.02,
    tolDb: 0.01,
  },
  {
    name: 'COST-231 Hata metropolitan, Hata (1980), COST 231, register 7-4 [D]',
    spec: { kind: 'cost231-hata', freqHz: 1800e6, txHeightM: 30, rxHeightM: 1.5, environment: 'metropolitan' },
    id: 'cost231-hata',
    distanceM: 1000,
    expectedDb: 139.2,
    tolDb: 0.01,
  },
  {
    name: 'TR 38.901 UMa LOS 1 km at 5 GHz, ns-3 test vector [V-I]',
    spec: { kind: 'tr38901', freqHz: 5e9, scenario: 'UMa', condition: 'LOS', txHeightM: 25, rxHeightM: 1.5 },
    id: 'tr38901-pathloss',
    distanceM: 1000,
    expectedDb: 109.73,
    tolDb: 0.005,
  },
  {
    name: 'TR 38.901 RMa NLOS 1 km at 5 GHz, ns-3 test vector [V-I]',
    spec: { kind: 'tr38901', freqHz: 5e9, scenario: 'RMa', condition: 'NLOS', txHeightM: 35, rxHeightM: 1.5 },
    id: 'tr38901-pathloss',
    distanceM: 1000,
    expectedDb: 133.52,
    tolDb: 0.005,
  },
  {
    name: 'free space + P.676 oxygen at 60 GHz, 100 m: FSPL + 1.48 dB, ITU-R P.676-13, register 4-1 [D from V-P]',
    spec: { kind: 'absorbing', base: { kind: 'free-space', freqHz: 60e9 }, absorptionDbPerKm: GAMMA_60_GHZ },
    id: 'free-space-p525+absorption',
    distanceM: 100,
    // 20·log10(4π·100·60e9/c) = 108.0 dB is computed by the free-space case above; only the 1.48 dB is published.
    expectedDb: createPropagationModel({ kind: 'free-space', freqHz: 60e9 }).lossDb(100).value.lossDb + 1.48,
    tolDb: 0.01,
  },
]

describe('createPropagationModel', () => {
  for (const c of CASES) {
    it(`matches ${c.name} within ${c.tolDb} dB and reports method id '${c.id}'`, () => {
      const model = createPropagationModel(c.spec)
      const r = model.lossDb(c.distanceM)
      expect(Math.abs(r.value.lossDb - c.expectedDb)).toBeLessThanOrEqual(c.tolDb)
      expect(model.method.id).toBe(c.id)
      expect(r.method.id).toBe(c.id)
      expect(model.spec).toBe(c.spec)
    })
  }

  it('round-trips every monotonic model through distanceM within 1e-6 relative', () => {
    const monotonic = CASES.filter((c) => c.id !== 'two-ray-exact')
    fc.assert(
      fc.property(fc.constantFrom(...monotonic), fc.double({ min: 1, max: 20_000, noNaN: true }), (c, distanceM) => {
        const model = createPropagationModel(c.spec)
        const { value: { lossDb } } = model.lossDb(distanceM)
        const back = model.distanceM(lossDb).value.distanceM
        expect(Math.abs(back - distanceM) / distanceM).toBeLessThan(1e-6)
      }),
    )
  })

  it('inverts the exact two-ray to the smallest distance with the same loss (within 1e-6 dB)', () => {
    const model = createPropagationModel(CASES[3].spec)
    fc.assert(
      fc.property(fc.double({ min: 1, max: 20_000, noNaN: true }), (distanceM) => {
        const { value: { lossDb } } = model.lossDb(distanceM)
        const back = model.distanceM(lossDb).value.distanceM
        expect(back).toBeLessThanOrEqual(distanceM * (1 + 1e-9))
        expect(Math.abs(model.lossDb(back).value.lossDb - lossDb)).toBeLessThan(1e-6)
      }),
    )
  })

  it('gives the analytic slopes of power laws: 20, 10·n, 40 and Hata 44.9 − 6.55·log h_b', () => {
    expect(createPropagationModel(CASES[0].spec).slopeDbPerDecade(1234)).toBe(20)
    expect(createPropagationModel(CASES[2].spec).slopeDbPerDecade(40)).toBe(35)
    expect(createPropagationModel(CASES[4].spec).slopeDbPerDecade(9000)).toBe(40)
    expect(createPropagationModel(CASES[5].spec).slopeDbPerDecade(3000)).toBeCloseTo(35.22, 2)
  })

  it('gives the Table 7.4.1-1 distance coefficients of InH as numerical slopes (17.3 LOS, 38.3 NLOS) within 1e-4', () => {
    const inh = (condition: 'LOS' | 'NLOS') =>
      createPropagationModel({ kind: 'tr38901', freqHz: 3.5e9, scenario: 'InH-office', condition, txHeightM: 1.5, rxHeightM: 1.5 })
    expect(inh('LOS').slopeDbPerDecade(20)).toBeCloseTo(17.3, 4)
    expect(inh('NLOS').slopeDbPerDecade(20)).toBeCloseTo(38.3, 4)
  })

  it('gives the exact two-ray a slope near 40 dB/decade far beyond the crossover', () => {
    expect(Math.abs(createPropagationModel(CASES[3].spec).slopeDbPerDecade(100_000) - 40)).toBeLessThan(0.01)
  })

  it('gives the absorbing model the base slope plus γ·d·ln 10, matching a central difference within 1e-6', () => {
    const model = createPropagationModel(CASES[9].spec)
    const numeric = centralSlopeDbPerDecade((d) => model.lossDb(d).value.lossDb, 800)
    expect(Math.abs(model.slopeDbPerDecade(800) - numeric)).toBeLessThan(1e-6)
    expect(model.slopeDbPerDecade(800)).toBeCloseTo(20 + GAMMA_60_GHZ * 0.8 * Math.LN10, 9)
  })

  it('carries the field-coefficient warning of an absorbing spec into every result', () => {
    const model = createPropagationModel({ kind: 'absorbing', base: { kind: 'free-space', freqHz: 60e9 }, fieldAttenuationPerKm: 1.3 })
    expect(model.lossDb(100).warnings.join(' ')).toMatch(/field coefficient/)
    expect(model.distanceM(120).warnings.join(' ')).toMatch(/field coefficient/)
  })

  it('returns the shadow-fading σ of TR 38.901 and of a log-distance spec', () => {
    expect(createPropagationModel(CASES[7].spec).lossDb(1000).value.shadowSigmaDb).toBe(4)
    const ld = createPropagationModel({ kind: 'log-distance', freqHz: 1e9, refDistanceM: 1, exponent: 3, shadowSigmaDb: 7 })
    expect(ld.lossDb(100).value.shadowSigmaDb).toBe(7)
  })

  it.each<[string, PropagationModelSpec]>([
    ['freqHz', { kind: 'free-space', freqHz: -1 }],
    ['txHeightM', { kind: 'two-ray', freqHz: 1e9, txHeightM: -3, rxHeightM: 1.5 }],
    ['txHeightM', { kind: 'hata', freqHz: 900e6, txHeightM: Number.NaN, rxHeightM: 1.5, environment: 'open' }],
    ['rxHeightM', { kind: 'tr38901', freqHz: 3.5e9, scenario: 'RMa', condition: 'LOS', txHeightM: 35, rxHeightM: -1 }],
    ['absorptionDbPerKm', { kind: 'absorbing', base: { kind: 'free-space', freqHz: 60e9 }, absorptionDbPerKm: -1 }],
  ])('throws a RangeError naming %s when the spec is built', (name, spec) => {
    expect(() => createPropagationModel(spec)).toThrow(RangeError)
    expect(() => createPropagationModel(spec)).toThrow(new RegExp(name))
  })

  it('throws a RangeError naming distanceM for zero, negative or NaN distance in every model', () => {
    for (const c of CASES) {
      const model = createPropagationModel(c.spec)
      for (const d of [0, -1, Number.NaN]) expect(() => model.lossDb(d)).toThrow(/distanceM/)
    }
  })
})

describe('PROPAGATION_MODEL_DESCRIPTORS', () => {
  const KINDS: PropagationModelKind[] = ['free-space', 'log-distance', 'two-ray', 'absorbing', 'hata', 'cost231-hata', 'tr38901']

  it('describes every kind of spec once, with a plain label, a summary and a source', () => {
    expect(PROPAGATION_MODEL_DESCRIPTORS.map((d) => d.kind).sort()).toEqual([...KINDS].sort())
    for (const d of PROPAGATION_MODEL_DESCRIPTORS) {
      expect(d.label.length).toBeGreaterThan(3)
      expect(d.summary.length).toBeGreaterThan(20)
      expect(d.source.length).toBeGreaterThan(10)
      expect(d.parameters.length).toBeGreaterThan(0)
    }
  })

  it('lists the method ids the models actually report', () => {
    const all = PROPAGATION_MODEL_DESCRIPTORS.flatMap((d) => d.methodIds)
    for (const c of CASES) expect(all).toContain(createPropagationModel(c.spec).method.id)
    expect(new Set(all).size).toBe(all.length)
  })

  it('gives the Hata validity as data: 150–1500 MHz, 30–200 m, 1–10 m, 1–20 km', () => {
    const hata = PROPAGATION_MODEL_DESCRIPTORS.find((d) => d.kind === 'hata')!
    expect(hata.validity.map((v) => [v.quantity, v.min, v.max])).toEqual([
      ['freqMhz', 150, 1500],
      ['txHeightM', 30, 200],
      ['rxHeightM', 1, 10],
      ['distanceKm', 1, 20],
    ])
  })

  it('gives TR 38.901 validity per scenario and condition', () => {
    const tr = PROPAGATION_MODEL_DESCRIPTORS.find((d) => d.kind === 'tr38901')!
    expect(Object.keys(tr.validityByVariant ?? {})).toHaveLength(8)
    expect(tr.validityByVariant!['RMa/LOS'].find((v) => v.quantity === 'distance2dM')?.max).toBe(10_000)
  })
})

describe('createPropagationModel: inputs only where they change the result', () => {
  it('builds a log-distance model without a frequency when the loss at d0 is given', () => {
    const model = createPropagationModel({ kind: 'log-distance', refDistanceM: 1, refLossDb: 40, exponent: 3 })
    expect(model.lossDb(100).value.lossDb).toBeCloseTo(40 + 60, 9) // 10·3·log10(100) = 60 dB by the model's definition
    expect(() => createPropagationModel({ kind: 'log-distance', refDistanceM: 1, exponent: 3 })).toThrow(/refLossDb, or freqHz/)
  })

  it('builds COST-231 Hata from a numeric C_m equal to the named environment', () => {
    const common = { kind: 'cost231-hata', freqHz: 1800e6, txHeightM: 30, rxHeightM: 1.5 } as const
    const byName = createPropagationModel({ ...common, environment: 'metropolitan' }).lossDb(5000).value.lossDb
    const byNumber = createPropagationModel({ ...common, cityCorrectionDb: 3 }).lossDb(5000).value.lossDb
    expect(byNumber).toBe(byName)
  })

  it('names antenna heights txHeightM and rxHeightM in every descriptor', () => {
    const keys = PROPAGATION_MODEL_DESCRIPTORS.flatMap((d) => d.parameters.map((p) => p.key)).filter((k) => /height/i.test(k) && k !== 'buildingHeightM')
    expect(new Set(keys)).toEqual(new Set(['txHeightM', 'rxHeightM']))
  })
})

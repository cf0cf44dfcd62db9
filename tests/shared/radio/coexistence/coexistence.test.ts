import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { DESENSITISATION_ROWS, LINK_BUDGET_ROWS, MAX_INTERFERENCE_ROWS, NOISE_FLOOR_ROWS } from '../../../fixtures/radio/coexistence-checks'
import {
  assessCoexistence,
  bandwidthOverlapLossDb,
  DEFAULT_PROTECTION_CRITERION,
  desensitisationDb,
  inrForDesensitisationDb,
  interferencePowerDbm,
  interferenceToNoiseDb,
  maxInterferencePowerDbmForInr,
  noiseBandwidthHz,
  noiseFloorDbm,
  PROTECTION_CRITERIA,
  separationDistanceM,
  thermalNoiseDensityDbmPerHz,
} from '../../../../shared/radio/coexistence'
import { createPropagationModel } from '../../../../shared/radio/propagation/registry'
import { powerLawModel } from './power-law-model'

const within = (actual: number, expected: number, tol: number) => expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tol)

describe('noiseFloorDbm', () => {
  for (const row of NOISE_FLOOR_ROWS) {
    it(`${row.id}: matches the exact kT0B value ${row.expected.exactDbm} dBm within ${row.tolerance.exactDb} dB (${row.source}, ${row.status})`, () => {
      within(noiseFloorDbm(row.inputs).value.noiseDbm, row.expected.exactDbm, row.tolerance.exactDb)
    })
    it(`${row.id}: matches the "−174 dBm/Hz" value ${row.expected.rounded174Dbm} dBm within ${row.tolerance.rounded174Db} dB (rounded constant)`, () => {
      within(noiseFloorDbm(row.inputs).value.noiseDbm, row.expected.rounded174Dbm, row.tolerance.rounded174Db)
    })
  }
  it('gives kT at 300 K as −173.83 dBm/Hz, not the 290 K value (kT0B, register §9 trap, [D])', () => {
    within(thermalNoiseDensityDbmPerHz({ temperatureK: 300 }), -173.83, 0.01)
  })
  it('warns when the reference temperature is not 290 K', () => {
    expect(noiseFloorDbm({ bandwidthHz: 1e6, temperatureK: 300 }).warnings.length).toBe(1)
    expect(noiseFloorDbm({ bandwidthHz: 1e6 }).warnings).toEqual([])
  })
  it('bandwidth → noise floor → bandwidth returns the bandwidth', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 1e10, noNaN: true }), fc.double({ min: 0, max: 30, noNaN: true }), (bandwidthHz, noiseFigureDb) => {
        const n = noiseFloorDbm({ bandwidthHz, noiseFigureDb }).value.noiseDbm
        expect(noiseBandwidthHz({ noiseDbm: n, noiseFigureDb }).value.bandwidthHz / bandwidthHz).toBeCloseTo(1, 9)
      }),
    )
  })
  it('throws a RangeError naming bandwidthHz for a zero bandwidth', () => {
    expect(() => noiseFloorDbm({ bandwidthHz: 0 })).toThrow(/bandwidthHz/)
  })
  it('throws a RangeError naming noiseFigureDb for a negative noise figure', () => {
    expect(() => noiseFloorDbm({ bandwidthHz: 1e6, noiseFigureDb: -1 })).toThrow(/noiseFigureDb/)
  })
})

describe('desensitisationDb', () => {
  for (const row of DESENSITISATION_ROWS) {
    it(`${row.id}: I/N ${row.inputs.inrDb} dB gives ${row.expected} dB within ${row.tolerance} dB (${row.source}, ${row.status})`, () => {
      within(desensitisationDb(row.inputs).value.desensitisationDb, row.expected, row.tolerance)
    })
  }
  it('I/N → desensitisation → I/N returns the I/N', () => {
    fc.assert(
      fc.property(fc.double({ min: -60, max: 60, noNaN: true }), (inr) => {
        const desensitisation = desensitisationDb({ inrDb: inr }).value.desensitisationDb
        expect(inrForDesensitisationDb({ desensitisationDb: desensitisation }).value.inrDb).toBeCloseTo(inr, 6)
      }),
    )
  })
})

describe('maxInterferencePowerDbmForInr', () => {
  for (const row of MAX_INTERFERENCE_ROWS) {
    it(`${row.id}: gives ${row.expected.maxInterferenceDbm} dBm within ${row.tolerance} dB for I/N ${row.inputs.inrDb} dB (${row.source}, ${row.status})`, () => {
      const r = maxInterferencePowerDbmForInr({ victimNoise: row.inputs.victimNoise, criterion: { inrDb: row.inputs.inrDb } })
      within(r.value.maxInterferenceDbm, row.expected.maxInterferenceDbm, row.tolerance)
      expect(r.method.id).toBe('interference-to-noise-ratio')
      expect(r.method.source).toContain('CX-3')
    })
  }
  it('uses the −6 dB preset when no criterion is given', () => {
    const r = maxInterferencePowerDbmForInr({ victimNoise: { noiseDbm: -95 } }).value
    expect(r.maxInterferenceDbm).toBe(-101)
    expect(r.criterionDescription).toContain('[M]')
  })
  it('meets the criterion exactly when its answer is fed back into interferenceToNoiseDb, for any noise and criterion', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 1e10, noNaN: true }),
        fc.double({ min: 0, max: 30, noNaN: true }),
        fc.double({ min: -40, max: 20, noNaN: true }),
        (bandwidthHz, noiseFigureDb, inrDb) => {
          const r = maxInterferencePowerDbmForInr({ victimNoise: { bandwidthHz, noiseFigureDb }, criterion: { inrDb } }).value
          const back = interferenceToNoiseDb({ interferenceDbm: r.maxInterferenceDbm, noiseDbm: r.noiseDbm }).value.inrDb
          expect(back).toBeCloseTo(inrDb, 9)
        },
      ),
    )
  })
  it('passes on the warning of a noise referred to a temperature other than 290 K', () => {
    const r = maxInterferencePowerDbmForInr({ victimNoise: { bandwidthHz: 1e6, temperatureK: 300 } })
    expect(r.warnings.some((w) => /300 K/.test(w))).toBe(true)
  })
  it('throws a RangeError naming victimNoise.noiseDbm for a noise floor that is not a number', () => {
    expect(() => maxInterferencePowerDbmForInr({ victimNoise: { noiseDbm: Number.NaN } })).toThrow(/victimNoise\.noiseDbm/)
  })
})

describe('protection criteria', () => {
  it('defaults to I/N = −6 dB', () => {
    expect(PROTECTION_CRITERIA[DEFAULT_PROTECTION_CRITERION].inrDb).toBe(-6)
  })
  it('offers −6, −10 and −20 dB presets, each marked [M] in its description', () => {
    expect(Object.values(PROTECTION_CRITERIA).map((c) => c.inrDb)).toEqual([-6, -10, -20])
    for (const c of Object.values(PROTECTION_CRITERIA)) {
      expect(c.status).toBe('[M]')
      expect(c.description).toContain('[M]')
    }
  })
})

describe('interferencePowerDbm and assessCoexistence', () => {
  const [row, row2] = LINK_BUDGET_ROWS as [(typeof LINK_BUDGET_ROWS)[number], (typeof LINK_BUDGET_ROWS)[number]]
  const i = row.inputs
  const opts = {
    interfererEirpDbm: i.interfererEirpDbm,
    model: powerLawModel({ freqHz: i.freqHz }),
    victimAntennaGainDbi: i.victimAntennaGainDbi,
    victimFeederLossDb: i.victimFeederLossDb,
    victimNoise: { bandwidthHz: i.bandwidthHz, noiseFigureDb: i.noiseFigureDb },
    distanceM: i.distanceM,
  }
  it(`${row.id}: matches the worked link budget within ${row.tolerance.db} dB (${row.source}, ${row.status})`, () => {
    const r = assessCoexistence(opts).value
    const e = row.expected
    const tol = row.tolerance.db
    within(interferencePowerDbm(opts).value.pathLossDb, e.pathLossDb!, tol)
    within(r.interferenceDbm, e.interferenceDbm, tol)
    within(r.noiseDbm, e.noiseDbm!, tol)
    within(r.inrDb, e.inrDb, tol)
    within(r.desensitisationDb, e.desensitisationDb!, tol)
    within(r.marginDb, e.marginDbAgainstMinus6!, tol)
    within(r.eirpReductionDb, e.marginDbAgainstMinus6!, tol)
    within(r.requiredPathLossDb, e.requiredPathLossDb!, tol)
    expect(Math.abs(r.separationDistanceM / e.separationDistanceM! - 1)).toBeLessThanOrEqual(row.tolerance.distanceRelative!)
    expect(r.meetsCriterion).toBe(false)
  })
  it(`${row2.id}: applies bandwidth overlap and frequency-dependent rejection (${row2.source}, ${row2.status})`, () => {
    const j = row2.inputs
    const r = assessCoexistence({
      ...opts,
      bandwidthOverlap: { overlapBandwidthHz: j.overlapBandwidthHz!, interfererBandwidthHz: j.interfererBandwidthHz! },
      frequencyDependentRejectionDb: j.frequencyDependentRejectionDb!,
    }).value
    within(r.interferenceDbm, row2.expected.interferenceDbm, row2.tolerance.db)
    within(r.inrDb, row2.expected.inrDb, row2.tolerance.db)
  })
  it('meets the criterion with zero EIRP reduction when I/N is below it', () => {
    const r = assessCoexistence({ ...opts, distanceM: 500e3 }).value
    expect(r.meetsCriterion).toBe(true)
    expect(r.eirpReductionDb).toBe(0)
    expect(r.marginDb).toBeLessThan(0)
  })
  it('uses the −10 dB preset when asked, 4 dB stricter than the default', () => {
    const a = assessCoexistence(opts).value
    const b = assessCoexistence({ ...opts, criterion: 'i-n-minus-10' }).value
    expect(b.marginDb - a.marginDb).toBeCloseTo(4, 12)
    expect(b.criterionDescription).toContain('[M]')
  })
  it('accepts a custom criterion and a victim noise given directly', () => {
    const r = assessCoexistence({ ...opts, victimNoise: { noiseDbm: -100 }, criterion: { inrDb: 0 } }).value
    expect(r.noiseDbm).toBe(-100)
    expect(r.criterionInrDb).toBe(0)
  })
  it('puts I/N exactly at the criterion when the separation distance is fed back, for any power-law model', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 80, noNaN: true }),
        fc.double({ min: 30e6, max: 60e9, noNaN: true }),
        fc.double({ min: 1.6, max: 5, noNaN: true }),
        fc.double({ min: -10, max: 40, noNaN: true }),
        fc.constantFrom('i-n-minus-6', 'i-n-minus-10', 'i-n-minus-20' as const),
        (eirp, freqHz, exponent, gainDbi, criterion) => {
          const base = {
            interfererEirpDbm: eirp,
            model: powerLawModel({ freqHz, exponent }),
            victimAntennaGainDbi: gainDbi,
            victimFeederLossDb: 1,
            victimNoise: { bandwidthHz: 1e6, noiseFigureDb: 6 },
            criterion,
          }
          const d = separationDistanceM(base).value.separationDistanceM
          const back = assessCoexistence({ ...base, distanceM: d }).value
          expect(back.inrDb).toBeCloseTo(PROTECTION_CRITERIA[criterion].inrDb, 6)
          expect(back.marginDb).toBeCloseTo(0, 6)
        },
      ),
    )
  })
  it('gives the same separation distance with the library free-space model as with the exact free-space formula', () => {
    const viaRegistry = separationDistanceM({ ...opts, model: createPropagationModel({ kind: 'free-space', freqHz: i.freqHz }) })
    const viaFormula = separationDistanceM(opts)
    expect(viaRegistry.value.separationDistanceM / viaFormula.value.separationDistanceM).toBeCloseTo(1, 9)
  })
  it('meets the criterion after the EIRP reduction it asks for', () => {
    const r = assessCoexistence(opts).value
    const after = assessCoexistence({ ...opts, interfererEirpDbm: opts.interfererEirpDbm - r.eirpReductionDb }).value
    expect(after.inrDb).toBeCloseTo(-6, 9)
    expect(r.maxEirpDbm).toBeCloseTo(opts.interfererEirpDbm - r.eirpReductionDb, 9)
  })
  it('gives a bandwidth-overlap loss of 3.01 dB for half the interferer bandwidth (10 log 2, [D])', () => {
    within(bandwidthOverlapLossDb({ overlapBandwidthHz: 5e6, interfererBandwidthHz: 10e6 }), 3.01, 0.01)
    expect(bandwidthOverlapLossDb(undefined)).toBe(0)
  })
  it('throws a RangeError when the overlap is wider than the interferer', () => {
    expect(() => bandwidthOverlapLossDb({ overlapBandwidthHz: 20e6, interfererBandwidthHz: 10e6 })).toThrow(/overlapBandwidthHz/)
  })
  it('throws a RangeError naming distanceM for a zero distance', () => {
    expect(() => assessCoexistence({ ...opts, distanceM: 0 })).toThrow(/distanceM/)
  })
  it('throws a RangeError naming victimFeederLossDb for a negative feeder loss', () => {
    expect(() => interferencePowerDbm({ ...opts, victimFeederLossDb: -2 })).toThrow(/victimFeederLossDb/)
  })
  it('throws a RangeError for an unknown criterion preset', () => {
    const criterion = 'i-n-minus-3' as unknown as 'i-n-minus-6'
    expect(() => assessCoexistence({ ...opts, criterion })).toThrow(/criterion/)
  })
})

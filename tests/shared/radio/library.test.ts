import { describe, expect, it } from 'vitest'
import * as radio from '../../../shared/radio'
import {
  RADIO_LIBRARY_VERSION,
  absorbingLossDb,
  appliedLimitEirpDbm,
  assessCoexistence,
  assessCompliance,
  channelPower,
  channelPowerToRbwReadingDbm,
  combineUncertainty,
  conductedFromEirpDbm,
  cost231HataDistanceM,
  cost231HataLossDb,
  createPropagationModel,
  desensitisationDb,
  eirpAndErp,
  eirpFromConductedDbm,
  eirpFromMeasurement,
  exposureComplianceDistanceM,
  fieldToReading,
  findPeaks,
  fitEirpAndExponent,
  fitEirpFixedExponent,
  freeSpaceDistanceM,
  freeSpaceLossDb,
  gaseousSpecificAttenuation,
  geodesicDirect,
  geodesicInverse,
  hataDistanceM,
  hataLossDb,
  inrForDesensitisationDb,
  interferencePowerDbm,
  interferenceToNoiseDb,
  locateSource,
  logDistanceDistanceM,
  logDistanceLossDb,
  maxInterferencePowerDbmForInr,
  noiseBandwidthHz,
  nearestOffice,
  noiseFloor,
  noiseFloorDbm,
  occupiedBandwidth,
  P676_VALIDATION_ATMOSPHERE,
  predictMeasurementFromEirp,
  propagateMonteCarlo,
  rbwReadingToChannelPowerDbm,
  readingToField,
  screenExposure,
  separationDistanceM,
  tr38901DistanceM,
  tr38901LossDb,
  twoRayDistanceM,
  twoRayLossDb,
  twoRayMonotonicDistanceM,
  welchPsd,
  type MethodRef,
  type RadioResult,
} from '../../../shared/radio'

// Semantic Versioning 2.0.0, the regular expression published on semver.org ("Is there a
// suggested regular expression (RegEx) to check a SemVer string?").
const SEMVER =
  /^(0|[1-9]\d*)\.(0|[1-9]\d*)\.(0|[1-9]\d*)(?:-((?:0|[1-9]\d*|\d*[a-zA-Z-][0-9a-zA-Z-]*)(?:\.(?:0|[1-9]\d*|\d*[a-zA-Z-][0-9a-zA-Z-]*))*))?(?:\+([0-9a-zA-Z-]+(?:\.[0-9a-zA-Z-]+)*))?$/

const freeSpace900 = createPropagationModel({ kind: 'free-space', freqHz: 900e6 })
const trace = {
  freqHz: Array.from({ length: 201 }, (_, i) => 99e6 + i * 10e3),
  levelDbm: Array.from({ length: 201 }, (_, i) => (i >= 90 && i <= 110 ? -40 : -90)),
}
const tone = (() => {
  const n = 1024
  const iq = new Float64Array(2 * n)
  for (let k = 0; k < n; k++) {
    iq[2 * k] = Math.cos((2 * Math.PI * 64 * k) / 256)
    iq[2 * k + 1] = Math.sin((2 * Math.PI * 64 * k) / 256)
  }
  return iq
})()
const station = (latDeg: number, lonDeg: number, receivedPowerDbm: number) => ({ latDeg, lonDeg, receivedPowerDbm, sigmaDb: 1 })
const coexistencePath = { interfererEirpDbm: 30, model: freeSpace900, victimNoise: { bandwidthHz: 1e6, noiseFigureDb: 5 } }
const limit = { spec: { kind: 'eirp' as const, eirpDbm: 20 }, citation: 'ETSI EN 300 328 (V2.2.2), RF output power' }

/** A representative call of every result-producing method, by topic. Each must carry its method. */
const RESULTS: Record<string, Record<string, () => { method: MethodRef }>> = {
  chain: {
    readingToField: () => readingToField({ freqHz: 100e6, antenna: { antennaFactorDbPerM: 20 }, reading: { readingDbuv: 40 } }),
    fieldToReading: () => fieldToReading({ freqHz: 100e6, antenna: { antennaGainDbi: 0 }, fieldStrengthDbuvPerM: 60 }),
    rbwReadingToChannelPowerDbm: () => rbwReadingToChannelPowerDbm({ readingDbm: -60, rbwHz: 100e3, channelBandwidthHz: 1e6 }),
    channelPowerToRbwReadingDbm: () => channelPowerToRbwReadingDbm({ channelPowerDbm: -50, rbwHz: 100e3, channelBandwidthHz: 1e6 }),
    eirpAndErp: () => eirpAndErp({ eirpDbm: 20 }),
    eirpFromConductedDbm: () => eirpFromConductedDbm({ conductedPowerDbm: 20, antennaGainDbi: 6, feederLossDb: 1 }),
    conductedFromEirpDbm: () => conductedFromEirpDbm({ eirpDbm: 36, antennaGainDbi: 24 }),
  },
  propagation: {
    freeSpaceLossDb: () => freeSpaceLossDb({ freqHz: 900e6, distanceM: 1000 }),
    freeSpaceDistanceM: () => freeSpaceDistanceM({ freqHz: 900e6, lossDb: 100 }),
    logDistanceLossDb: () => logDistanceLossDb({ freqHz: 2.4e9, refDistanceM: 1, exponent: 2, exponentChanges: [{ fromDistanceM: 100, exponent: 3.5 }], distanceM: 500 }),
    logDistanceDistanceM: () => logDistanceDistanceM({ freqHz: 2.4e9, refDistanceM: 1, exponent: 3, lossDb: 100 }),
    twoRayLossDb: () => twoRayLossDb({ freqHz: 900e6, txHeightM: 30, rxHeightM: 1.5, distanceM: 5000 }),
    twoRayDistanceM: () => twoRayDistanceM({ freqHz: 900e6, txHeightM: 30, rxHeightM: 1.5, lossDb: 114.94 }),
    twoRayMonotonicDistanceM: () => twoRayMonotonicDistanceM({ freqHz: 900e6, txHeightM: 30, rxHeightM: 1.5, lossDb: 114.94 }),
    absorbingLossDb: () => absorbingLossDb({ base: freeSpace900, absorptionDbPerKm: 1, distanceM: 100 }),
    gaseousSpecificAttenuation: () => gaseousSpecificAttenuation({ freqHz: 60e9, ...P676_VALIDATION_ATMOSPHERE }),
    hataLossDb: () => hataLossDb({ freqHz: 900e6, txHeightM: 30, rxHeightM: 1.5, environment: 'suburban', distanceM: 5000 }),
    hataDistanceM: () => hataDistanceM({ freqHz: 900e6, txHeightM: 30, rxHeightM: 1.5, environment: 'open', lossDb: 120 }),
    cost231HataLossDb: () => cost231HataLossDb({ freqHz: 1800e6, txHeightM: 30, rxHeightM: 1.5, environment: 'metropolitan', distanceM: 5000 }),
    cost231HataDistanceM: () => cost231HataDistanceM({ freqHz: 1800e6, txHeightM: 30, rxHeightM: 1.5, environment: 'medium-city', lossDb: 150 }),
    tr38901LossDb: () => tr38901LossDb({ freqHz: 3.5e9, scenario: 'UMi-street-canyon', condition: 'NLOS', txHeightM: 10, rxHeightM: 1.5, distanceM: 200 }),
    tr38901DistanceM: () => tr38901DistanceM({ freqHz: 3.5e9, scenario: 'UMa', condition: 'LOS', txHeightM: 25, rxHeightM: 1.5, lossDb: 110 }),
    'createPropagationModel(…).lossDb': () => createPropagationModel({ kind: 'hata', freqHz: 900e6, txHeightM: 30, rxHeightM: 1.5, environment: 'urban-large' }).lossDb(2000),
  },
  estimation: {
    eirpFromMeasurement: () => eirpFromMeasurement({ measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: 80, freqHz: 900e6 }, distanceM: 100, model: freeSpace900 }),
    predictMeasurementFromEirp: () => predictMeasurementFromEirp({ eirpDbm: 30, distanceM: 100, model: freeSpace900, freqHz: 900e6 }),
    fitEirpAndExponent: () => fitEirpAndExponent({ readings: [10, 30, 100, 300].map((d, i) => ({ distanceM: d, receivedPowerDbm: -30 - 30 * Math.log10(d) + [0.5, -0.4, 0.2, -0.3][i] })), refDistanceM: 1, freqHz: 900e6 }),
    fitEirpFixedExponent: () => fitEirpFixedExponent({ readings: [{ distanceM: 10, receivedPowerDbm: -60 }, { distanceM: 100, receivedPowerDbm: -91 }], refDistanceM: 1, freqHz: 900e6, exponent: 3 }),
    locateSource: () =>
      locateSource({
        levels: [station(51.5, -0.12, -60), station(51.51, -0.12, -65), station(51.5, -0.1, -70), station(51.49, -0.11, -62)],
        pathLoss: { freqHz: 900e6, exponent: 3 },
      }),
  },
  uncertainty: {
    combineUncertainty: () => combineUncertainty({ contributions: [{ name: 'antenna factor', distribution: { kind: 'normal', expandedUncertainty: 1, coverageFactor: 2 } }] }),
    propagateMonteCarlo: () => propagateMonteCarlo({ inputs: [{ name: 'x', value: 0, distribution: { kind: 'rectangular', halfWidth: 1 } }], measurementFunction: ([x]) => x, trials: 1000, seed: 7 }),
  },
  geo: {
    geodesicInverse: () => geodesicInverse({ from: { latDeg: 0, lonDeg: 0 }, to: { latDeg: 0, lonDeg: 0.01 } }),
    geodesicDirect: () => geodesicDirect({ from: { latDeg: 0, lonDeg: 0 }, bearingDeg: 90, distanceM: 1000 }),
    nearestOffice: () => nearestOffice({ point: { latDeg: 51.5, lonDeg: -0.12 }, offices: [{ id: 'north', latDeg: 52, lonDeg: 0 }, { id: 'south', latDeg: 51, lonDeg: 0 }] }),
  },
  compliance: {
    assessCompliance: () => assessCompliance({ eirpDbm: 21, eirpIntervalDbm: { lowDbm: 18, highDbm: 24 }, limit }),
    appliedLimitEirpDbm: () => appliedLimitEirpDbm({ spec: { kind: 'erp', erpDbm: 27 } }),
  },
  coexistence: {
    noiseFloorDbm: () => noiseFloorDbm({ bandwidthHz: 1e6, noiseFigureDb: 5 }),
    noiseBandwidthHz: () => noiseBandwidthHz({ noiseDbm: -109, noiseFigureDb: 5 }),
    desensitisationDb: () => desensitisationDb({ inrDb: -6 }),
    inrForDesensitisationDb: () => inrForDesensitisationDb({ desensitisationDb: 1 }),
    interferenceToNoiseDb: () => interferenceToNoiseDb({ interferenceDbm: -115, noiseDbm: -109 }),
    maxInterferencePowerDbmForInr: () => maxInterferencePowerDbmForInr({ victimNoise: { noiseDbm: -109 }, criterion: 'i-n-minus-10' }),
    interferencePowerDbm: () => interferencePowerDbm({ ...coexistencePath, distanceM: 1000 }),
    separationDistanceM: () => separationDistanceM(coexistencePath),
    assessCoexistence: () => assessCoexistence({ ...coexistencePath, distanceM: 1000 }),
  },
  exposure: {
    screenExposure: () => screenExposure({ eirpDbm: 60, freqHz: 900e6, population: 'general-public', distanceM: 10 }),
    exposureComplianceDistanceM: () => exposureComplianceDistanceM({ eirpDbm: 60, freqHz: 900e6, population: 'occupational' }),
  },
  spectrum: {
    welchPsd: () => welchPsd({ iq: tone, sampleRateHz: 1e6, segmentLength: 256 }),
    noiseFloor: () => noiseFloor(trace),
    findPeaks: () => findPeaks(trace),
    channelPower: () => channelPower({ ...trace, startHz: 99.5e6, stopHz: 100.5e6, enbwHz: 10e3 }),
    occupiedBandwidth: () => occupiedBandwidth(trace),
  },
}

describe('radio library entry point (shared/radio/index.ts)', () => {
  it('exports a semantic version string (semver.org 2.0.0 pattern)', () => {
    expect(typeof RADIO_LIBRARY_VERSION).toBe('string')
    expect(RADIO_LIBRARY_VERSION).toMatch(SEMVER)
    expect(radio.RADIO_LIBRARY_VERSION).toBe(RADIO_LIBRARY_VERSION)
  })

  it('rejects strings that are not semantic versions (the pattern can fail)', () => {
    for (const bad of ['1.0', 'v1.0.0', '01.0.0', '1.0.0.0', '']) expect(bad).not.toMatch(SEMVER)
  })

  it('re-exports every topic: one function or constant from each is reachable from the entry point', () => {
    for (const name of ['wavelengthM', 'SPEED_OF_LIGHT_M_PER_S', 'requirePositive', 'checkValidity', 'readingToField', 'createPropagationModel',
      'eirpFromMeasurement', 'combineUncertainty', 'geodesicInverse', 'assessCompliance', 'assessCoexistence', 'screenExposure', 'welchPsd']) {
      expect(typeof (radio as Record<string, unknown>)[name], name).not.toBe('undefined')
    }
  })

  for (const [topic, calls] of Object.entries(RESULTS)) {
    describe(topic, () => {
      for (const [name, call] of Object.entries(calls)) {
        it(`${name} result carries a non-empty method.id and method.source`, () => {
          const r = call()
          expect(typeof r.method.id).toBe('string')
          expect(r.method.id.trim().length).toBeGreaterThan(0)
          expect(typeof r.method.source).toBe('string')
          expect(r.method.source.trim().length).toBeGreaterThan(0)
        })
      }
    })
  }
})

describe('coverage intervals: absolute bounds of a named quantity in its own unit', () => {
  const withIntervals: Record<string, () => RadioResult<Record<string, unknown>>> = {
    eirpFromMeasurement: () =>
      eirpFromMeasurement({
        measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: 80, freqHz: 900e6 },
        distanceM: 100,
        model: freeSpace900,
        measurementContributions: [{ name: 'antenna factor', distribution: { kind: 'normal', expandedUncertainty: 1, coverageFactor: 2 } }],
      }) as unknown as RadioResult<Record<string, unknown>>,
    fitEirpAndExponent: () => RESULTS.estimation.fitEirpAndExponent() as unknown as RadioResult<Record<string, unknown>>,
    assessCompliance: () => RESULTS.compliance.assessCompliance() as unknown as RadioResult<Record<string, unknown>>,
  }
  for (const [name, call] of Object.entries(withIntervals)) {
    it(`${name}: the interval names a numeric key of the value and brackets it`, () => {
      const r = call()
      const i = r.interval!
      expect(i).toBeDefined()
      const centre = r.value[i.quantity]
      expect(typeof centre).toBe('number')
      expect(i.low).toBeLessThanOrEqual(centre as number)
      expect(i.high).toBeGreaterThanOrEqual(centre as number)
      expect(i.high).toBeGreaterThan(i.low)
      expect(i.basis.length).toBeGreaterThan(0)
    })
  }
  it('eirpFromMeasurement: bounds are EIRP ± U in dBm, not the half-width U (1 dB at k = 2 around the EIRP)', () => {
    const r = withIntervals.eirpFromMeasurement()
    const eirpDbm = r.value.eirpDbm as number
    expect(r.interval!.low).toBeCloseTo(eirpDbm - 1, 12)
    expect(r.interval!.high).toBeCloseTo(eirpDbm + 1, 12)
  })
  it('assessCompliance: bounds are the margins 18 − 20 and 24 − 20 dB (EIRP interval minus the limit)', () => {
    const r = withIntervals.assessCompliance()
    expect(r.interval).toEqual({ quantity: 'marginDb', low: -2, high: 4, basis: expect.any(String) })
  })
})

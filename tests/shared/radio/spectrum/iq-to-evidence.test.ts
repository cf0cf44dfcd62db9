import { describe, expect, it } from 'vitest'
import {
  channelPower,
  decodeSigmfSamples,
  findPeaks,
  meanPowerDb,
  occupiedBandwidth,
  parseSigmfMetadata,
  psdAsTrace,
  welchPsd,
} from '../../../../shared/radio/spectrum'
import { complexNoise, complexTone } from './seeded-random'

describe('psdAsTrace', () => {
  const iq = complexNoise({ sampleCount: 1 << 14, powerFs: 0.02, seed: 99 })
  it("gives the same trace from 'density' and 'spectrum' scaling (density + 10·log ENBW = power per bin) [D]", () => {
    const a = psdAsTrace(welchPsd({ iq, sampleRateHz: 1e6, segmentLength: 256, scaling: 'density' }).value)
    const b = psdAsTrace(welchPsd({ iq, sampleRateHz: 1e6, segmentLength: 256, scaling: 'spectrum' }).value)
    expect(a.enbwHz).toBeCloseTo(1.5 * (1e6 / 256), 9)
    for (let j = 0; j < 256; j++) expect(a.levelDbm[j]).toBeCloseTo(b.levelDbm[j], 9)
    expect(a.levelUnit).toBe('dBFS')
    expect(a.warnings.join(' ')).toMatch(/dBFS/)
  })
  it('gives a noiseless bin-centred tone under a Hann window an occupied bandwidth of exactly 2.94 bins [D]', () => {
    const tone = complexTone({ sampleCount: 1 << 14, amplitudeFs: 0.5, cyclesPerSample: 40 / 512 })
    const t = psdAsTrace(welchPsd({ iq: tone, sampleRateHz: 512e3, segmentLength: 512 }).value)
    const obw = occupiedBandwidth({ ...t, startHz: 30e3, stopHz: 50e3 })
    expect(obw.value.occupiedBandwidthHz).toBeCloseTo(2940, 6)
    expect(obw.value.centreHz).toBeCloseTo(40e3, 6)
  })
  it('throws RangeError for a spectrum with a bin of zero power', () => {
    const zeros = new Float64Array(2 * 256)
    const psd = welchPsd({ iq: zeros, sampleRateHz: 1e6, segmentLength: 64 })
    expect(psd.warnings.join(' ')).toMatch(/zero power/)
    expect(() => psdAsTrace(psd.value)).toThrow(RangeError)
  })
})

describe('an I/Q recording carried through to spectrum evidence', () => {
  // A ci16_le recording at 2.048 MS/s tuned to 156.8 MHz: a tone 100 kHz above the centre at
  // amplitude 0.25 (−12.04 dBFS) over complex noise of power 1e-4 (−40 dBFS). Calibration:
  // full scale = −10 dBm. Expected values follow from these numbers [D].
  const sampleRateHz = 2.048e6
  const n = 1 << 16
  const tone = complexTone({ sampleCount: n, amplitudeFs: 0.25, cyclesPerSample: 100e3 / sampleRateHz })
  const noise = complexNoise({ sampleCount: n, powerFs: 1e-4, seed: 4242 })
  const bytes = new DataView(new ArrayBuffer(4 * n))
  for (let k = 0; k < 2 * n; k++) bytes.setInt16(2 * k, Math.round((tone[k] + noise[k]) * 32768), true)
  const metadata = parseSigmfMetadata({
    global: { 'core:datatype': 'ci16_le', 'core:version': '1.2.6', 'core:sample_rate': sampleRateHz },
    captures: [{ 'core:sample_start': 0, 'core:frequency': 156.8e6 }],
    annotations: [],
  })
  const decoded = decodeSigmfSamples({ metadata, data: bytes.buffer })
  const psd = welchPsd({
    iq: decoded.iq,
    sampleRateHz: decoded.sampleRateHz!,
    centerFreqHz: decoded.centerFreqHz,
    segmentLength: 1024,
    fullScaleDbm: -10,
  })
  const trace = psdAsTrace(psd.value)

  it('finds the tone as the strongest peak at 156.9 MHz and −22.04 dBm within 0.1 dB [D]', () => {
    const peaks = findPeaks(trace).value.peaks
    expect(peaks[0].freqHz).toBe(156.9e6)
    expect(Math.abs(peaks[0].levelDbm - (20 * Math.log10(0.25) - 10))).toBeLessThan(0.1)
  })

  it('measures the whole-band channel power equal to the recording mean power within 1 % (Parseval) [D]', () => {
    const cp = channelPower({ ...trace, startHz: trace.freqHz[0] - 1000, stopHz: trace.freqHz[1023] + 1000, enbwHz: trace.enbwHz })
    const mean = meanPowerDb({ iq: decoded.iq, fullScaleDbm: -10 })
    expect(Math.abs(cp.value.channelPowerDbm - mean)).toBeLessThan(10 * Math.log10(1.01))
    expect(Math.abs(mean - 10 * Math.log10(0.0625 + 1e-4) + 10)).toBeLessThan(0.05)
  })

  it('measures the noise in a 200 kHz band away from the tone as 1e-4·(200 kHz / 2.048 MHz) → −60.1 dBm within 0.3 dB [D]', () => {
    const cp = channelPower({ ...trace, startHz: 156.4e6, stopHz: 156.6e6, enbwHz: trace.enbwHz })
    const expectedDbm = 10 * Math.log10(1e-4 * (200e3 / sampleRateHz)) - 10
    expect(Math.abs(cp.value.channelPowerDbm - expectedDbm)).toBeLessThan(0.3)
  })

  // Under a Hann window a bin-centred tone spreads its power 1 : ¼ : ¼ over three bins (|X| = N/2,
  // N/4, N/4), so each β/2 edge lies 0.005·1.5/0.25 = 0.03 bin inside the outer cell: OBW = 2.94
  // bins = 5880 Hz at 2 kHz spacing [D]. The noise moves it by well under 2 %.
  it('gives the tone an occupied bandwidth of 2.94 bins = 5880 Hz within 2 % under the Hann window [D]', () => {
    const obw = occupiedBandwidth({ ...trace, startHz: 156.88e6, stopHz: 156.92e6, enbwHz: trace.enbwHz })
    expect(Math.abs(obw.value.occupiedBandwidthHz / 5880 - 1)).toBeLessThan(0.02)
    expect(Math.abs(obw.value.centreHz - 156.9e6)).toBeLessThan(100)
    expect(obw.warnings.join(' ')).toMatch(/less than 10 noise bandwidths/)
  })
})

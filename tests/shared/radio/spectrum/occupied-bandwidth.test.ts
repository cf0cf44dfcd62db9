import { describe, expect, it } from 'vitest'
import { occupiedBandwidth } from '../../../../shared/radio/spectrum'

// Φ⁻¹(0.995) = 2.5758293035489 and Φ⁻¹(0.95) = 1.6448536269515 (scipy.stats.norm.ppf).
const Z_0995 = 2.5758293035489
const Z_095 = 1.6448536269515

/** Points at cell centres every spacingHz across [startHz, stopHz). */
function grid(startHz: number, stopHz: number, spacingHz: number): number[] {
  const n = Math.round((stopHz - startHz) / spacingHz)
  return Array.from({ length: n }, (_, i) => startHz + (i + 0.5) * spacingHz)
}

describe('occupiedBandwidth by the β/2 method (ITU RR No. 1.153, β/2 = 0.5 %)', () => {
  it('gives 0.99·B for a flat rectangular spectrum of width B = 1 MHz [D]', () => {
    const freqHz = grid(98e6, 102e6, 1e3)
    const levelDbm = freqHz.map((f) => (Math.abs(f - 100e6) < 0.5e6 ? -50 : -300))
    const r = occupiedBandwidth({ freqHz, levelDbm })
    expect(Math.abs(r.value.occupiedBandwidthHz / 0.99e6 - 1)).toBeLessThan(1e-9)
    expect(r.value.lowerEdgeHz).toBeCloseTo(100e6 - 0.495e6, 3)
    expect(r.value.upperEdgeHz).toBeCloseTo(100e6 + 0.495e6, 3)
    expect(r.value.betaPercent).toBe(1)
    expect(r.warnings).toEqual([])
  })

  it('gives 2·2.5758·σ for a Gaussian PSD of σ = 50 kHz within 0.01 % (Φ⁻¹(0.995) from scipy.stats.norm.ppf) [D]', () => {
    const sigmaHz = 50e3
    const freqHz = grid(446e6 - 8 * sigmaHz, 446e6 + 8 * sigmaHz, sigmaHz / 100)
    const levelDbm = freqHz.map((f) => -30 + 10 * Math.log10(Math.exp(-((f - 446e6) ** 2) / (2 * sigmaHz ** 2))))
    const r = occupiedBandwidth({ freqHz, levelDbm })
    expect(Math.abs(r.value.occupiedBandwidthHz / (2 * Z_0995 * sigmaHz) - 1)).toBeLessThan(1e-4)
    expect(r.value.centreHz).toBeCloseTo(446e6, 1)
  })

  it('gives 2·1.6449·σ for the same Gaussian with β = 10 % (Φ⁻¹(0.95) from scipy.stats.norm.ppf) [D]', () => {
    const sigmaHz = 50e3
    const freqHz = grid(-8 * sigmaHz, 8 * sigmaHz, sigmaHz / 100)
    const levelDbm = freqHz.map((f) => 10 * Math.log10(Math.exp(-(f ** 2) / (2 * sigmaHz ** 2))))
    const r = occupiedBandwidth({ freqHz, levelDbm, betaPercent: 10 })
    expect(Math.abs(r.value.occupiedBandwidthHz / (2 * Z_095 * sigmaHz) - 1)).toBeLessThan(1e-4)
  })

  it('ignores what lies outside a given span: a strong neighbour outside [start, stop] does not widen the result [D]', () => {
    const freqHz = grid(98e6, 104e6, 1e3)
    const levelDbm = freqHz.map((f) => (Math.abs(f - 100e6) < 0.5e6 ? -50 : Math.abs(f - 103e6) < 0.2e6 ? -20 : -300))
    const r = occupiedBandwidth({ freqHz, levelDbm, startHz: 98e6, stopHz: 102e6 })
    expect(Math.abs(r.value.occupiedBandwidthHz / 0.99e6 - 1)).toBeLessThan(1e-9)
  })

  it('reports the total power in the span when the ENBW is given: 1000 cells at −50 dBm, ENBW = spacing → −20 dBm [D]', () => {
    const freqHz = grid(98e6, 102e6, 1e3)
    const levelDbm = freqHz.map((f) => (Math.abs(f - 100e6) < 0.5e6 ? -50 : -300))
    const r = occupiedBandwidth({ freqHz, levelDbm, enbwHz: 1e3 })
    expect(r.value.totalPowerDbm).toBeCloseTo(-20, 9)
  })

  it('warns when noise fills the span, when the emission reaches the span edge, and when the RBW is too wide', () => {
    const freqHz = grid(99e6, 101e6, 1e3)
    const noisy = occupiedBandwidth({ freqHz, levelDbm: freqHz.map((f) => (Math.abs(f - 100e6) < 0.05e6 ? -50 : -70)) })
    expect(noisy.warnings.join(' ')).toMatch(/Noise in the span/)
    const clipped = occupiedBandwidth({ freqHz, levelDbm: freqHz.map(() => -50) })
    expect(clipped.warnings.join(' ')).toMatch(/extend beyond the span/)
    const coarse = occupiedBandwidth({ freqHz, levelDbm: freqHz.map((f) => (Math.abs(f - 100e6) < 0.05e6 ? -50 : -300)), enbwHz: 30e3 })
    expect(coarse.warnings.join(' ')).toMatch(/less than 10 noise bandwidths/)
  })

  it('throws RangeError for a bad β, an empty span or a bad trace', () => {
    const freqHz = grid(99e6, 101e6, 1e3)
    const levelDbm = freqHz.map(() => -50)
    expect(() => occupiedBandwidth({ freqHz, levelDbm, betaPercent: 0 })).toThrow(RangeError)
    expect(() => occupiedBandwidth({ freqHz, levelDbm, betaPercent: 100 })).toThrow(RangeError)
    expect(() => occupiedBandwidth({ freqHz, levelDbm, startHz: 200e6, stopHz: 201e6 })).toThrow(/no trace point/)
    expect(() => occupiedBandwidth({ freqHz: [1], levelDbm: [1] })).toThrow(RangeError)
    expect(() => occupiedBandwidth({ freqHz: [1, 2], levelDbm: [1] })).toThrow(RangeError)
  })
})

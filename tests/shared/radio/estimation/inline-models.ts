/**
 * Small propagation models written out in the tests themselves, so that estimation tests do
 * not depend on the propagation module's internals. Free space: L = 20·log10(4π d f / c)
 * (ITU-R P.525-4 §2.2 exact form, register §1 [D]); power law: L = L(d0) + 10 n log10(d/d0) (log-distance model (Rappaport §4.9.1), register §6).
 */
import type { PropagationModel } from '../../../../shared/radio/propagation/model'

const C = 299_792_458

export function inlineFreeSpace(freqHz: number): PropagationModel {
  const loss = (d: number) => 20 * Math.log10((4 * Math.PI * d * freqHz) / C)
  return {
    spec: { kind: 'free-space', freqHz },
    method: { id: 'test-free-space', source: 'ITU-R P.525 exact form (test copy)' },
    lossDb: (distanceM) => ({ value: { lossDb: loss(distanceM) }, warnings: [], method: { id: 'test-free-space', source: 'test' } }),
    distanceM: (lossDb) => ({ value: { distanceM: (C * 10 ** (lossDb / 20)) / (4 * Math.PI * freqHz) }, warnings: [], method: { id: 'test-free-space', source: 'test' } }),
    slopeDbPerDecade: () => 20,
  }
}

export function inlinePowerLaw(opts: { freqHz: number; exponent: number; refDistanceM?: number; shadowSigmaDb?: number }): PropagationModel {
  const d0 = opts.refDistanceM ?? 1
  const l0 = 20 * Math.log10((4 * Math.PI * d0 * opts.freqHz) / C)
  const n = opts.exponent
  const method = { id: 'test-power-law', source: 'log-distance (test copy)' }
  return {
    spec: { kind: 'log-distance', freqHz: opts.freqHz, refDistanceM: d0, exponent: n, shadowSigmaDb: opts.shadowSigmaDb },
    method,
    lossDb: (d) => ({ value: { lossDb: l0 + 10 * n * Math.log10(d / d0), ...(opts.shadowSigmaDb ? { shadowSigmaDb: opts.shadowSigmaDb } : {}) }, warnings: [], method }),
    distanceM: (lossDb) => ({ value: { distanceM: d0 * 10 ** ((lossDb - l0) / (10 * n)) }, warnings: [], method }),
    slopeDbPerDecade: () => 10 * n,
  }
}

/**
 * A tiny power-law PropagationModel for tests, so coexistence is checked against the model
 * interface alone: L(d) = 20 log10(4π d0 f/c) + 10 n log10(d/d0). With n = 2 and d0 = 1 m this
 * is exactly free space, 20 log10(4π d f/c) (ITU-R P.525-4 exact form, [D]).
 */
import type { PropagationModel } from '../../../../shared/radio/propagation/model'

const C = 299_792_458

export function powerLawModel(opts: { freqHz: number; exponent?: number; refDistanceM?: number }): PropagationModel {
  const n = opts.exponent ?? 2
  const d0 = opts.refDistanceM ?? 1
  const l0 = 20 * Math.log10((4 * Math.PI * d0 * opts.freqHz) / C)
  const method = { id: 'test-power-law', source: `test model: free space at ${d0} m, then n = ${n}` }
  return {
    spec: { kind: 'log-distance', freqHz: opts.freqHz, refDistanceM: d0, exponent: n },
    method,
    lossDb: (distanceM) => ({ value: { lossDb: l0 + 10 * n * Math.log10(distanceM / d0) }, warnings: [], method }),
    distanceM: (lossDb) => ({ value: { distanceM: d0 * 10 ** ((lossDb - l0) / (10 * n)) }, warnings: [], method }),
    slopeDbPerDecade: () => 10 * n,
  }
}

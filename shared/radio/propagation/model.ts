/**
 * The common face of every propagation model, so that EIRP back-calculation, fits,
 * coexistence and separation distances work with any of them.
 *
 * Loss is the basic transmission loss between isotropic antennas [dB], positive.
 * Each model gives the forward direction (loss at a distance) and the inverse
 * (distance for a loss); the inverse of a model that is not monotonic returns the
 * smallest distance at which the loss is reached, with a warning.
 */
import type { MethodRef } from '../types'

export interface PathLoss {
  lossDb: number
  warnings: string[]
  method: MethodRef
  /** Shadow-fading standard deviation of the model at this distance [dB], if the model states one. */
  shadowSigmaDb?: number
}

export interface PathDistance {
  distanceM: number
  warnings: string[]
  method: MethodRef
}

export interface PropagationModel {
  readonly spec: PropagationModelSpec
  readonly method: MethodRef
  /** Basic transmission loss at a (horizontal, ground) distance [dB]. */
  lossDb(distanceM: number): PathLoss
  /** Distance at which the loss reaches lossDb [m]. */
  distanceM(lossDb: number): PathDistance
  /**
   * Local slope dL/d(log10 d) at a distance [dB per decade] = 10·n for a power law.
   * Used for the sensitivity of EIRP to distance in the uncertainty budget.
   */
  slopeDbPerDecade(distanceM: number): number
}

/** Serializable description of a model and its parameters (stored with results). */
export type PropagationModelSpec =
  | { kind: 'free-space'; freqHz: number; form?: 'exact' | 'p525-rounded' }
  | {
      kind: 'log-distance'
      freqHz: number
      /** Reference distance d0 [m]; loss at d0 is free space unless refLossDb is given. */
      refDistanceM: number
      refLossDb?: number
      /** Piecewise exponents: segment i applies from its startM (first startM = refDistanceM). */
      segments: { startM: number; exponent: number }[]
      shadowSigmaDb?: number
    }
  | { kind: 'two-ray'; freqHz: number; txHeightM: number; rxHeightM: number; form?: 'exact' | 'asymptote' | 'breakpoint' }
  | {
      kind: 'absorbing'
      /** The model the absorption is added to. */
      base: Exclude<PropagationModelSpec, { kind: 'absorbing' }>
      /** Specific attenuation [dB/km], or give the field amplitude coefficient α [1/km] instead. */
      absorptionDbPerKm?: number
      fieldAttenuationPerKm?: number
    }
  | {
      kind: 'hata'
      freqHz: number
      baseHeightM: number
      mobileHeightM: number
      environment: 'urban-small-medium' | 'urban-large' | 'suburban' | 'open'
    }
  | {
      kind: 'cost231-hata'
      freqHz: number
      baseHeightM: number
      mobileHeightM: number
      /** 0 dB medium city / suburban, 3 dB metropolitan centre. */
      environment: 'medium-city' | 'metropolitan'
    }
  | {
      kind: 'tr38901'
      freqHz: number
      scenario: 'RMa' | 'UMa' | 'UMi-street-canyon' | 'InH-office'
      condition: 'LOS' | 'NLOS'
      baseHeightM: number
      ueHeightM: number
      /** RMa only: average building height h [m] and street width W [m]. */
      buildingHeightM?: number
      streetWidthM?: number
    }

export type PropagationModelKind = PropagationModelSpec['kind']

/**
 * The common face of every propagation model, so that EIRP back-calculation, fits,
 * coexistence and separation distances work with any of them.
 *
 * Loss is the basic transmission loss between isotropic antennas [dB], positive.
 * Each model gives the forward direction (loss at a distance) and the inverse
 * (distance for a loss); the inverse of a model that is not monotonic returns the
 * smallest distance at which the loss is reached, with a warning.
 *
 * Conventions for every model: results are `RadioResult`s (`value.lossDb` [dB],
 * `value.distanceM` [m]); antenna heights are `txHeightM` (base station) and `rxHeightM`
 * (mobile, user terminal); "breakpoint" is only the distance where a ground-reflection model
 * turns to its d⁻⁴ branch; frequency is an input only where it changes the result.
 */
import type { MethodRef, RadioResult } from '../types'

/** Value of a forward model result. */
export interface PathLossValue {
  /** Basic transmission loss [dB], positive. */
  lossDb: number
  /** Shadow-fading standard deviation of the model at this distance [dB], if the model states one. */
  shadowSigmaDb?: number
}

/** Value of an inverse model result. */
export interface PathDistanceValue {
  /** Horizontal ground distance [m]. */
  distanceM: number
  /** Straight-line (3D) distance between the antennas [m], for models defined on it (TR 38.901). */
  distance3dM?: number
}

/** What every model's forward function returns: `value.lossDb` [dB] with warnings and method. */
export type PathLossResult = RadioResult<PathLossValue>
/** What every model's inverse function returns: `value.distanceM` [m] with warnings and method. */
export type PathDistanceResult = RadioResult<PathDistanceValue>

export interface PropagationModel {
  readonly spec: PropagationModelSpec
  readonly method: MethodRef
  /** Basic transmission loss at a (horizontal, ground) distance [dB]. */
  lossDb(distanceM: number): PathLossResult
  /** Distance at which the loss reaches lossDb [m]. */
  distanceM(lossDb: number): PathDistanceResult
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
      /** Needed only when refLossDb is omitted (free space at d0) [Hz]. */
      freqHz?: number
      /** Reference distance d0 [m]; loss at d0 is free space unless refLossDb is given. */
      refDistanceM: number
      refLossDb?: number
      /** Path-loss exponent n from d0. */
      exponent: number
      /** Later exponents, each from its exponent-change distance (not a "breakpoint", see log-distance.ts). */
      exponentChanges?: { fromDistanceM: number; exponent: number }[]
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
      /** Base-station (transmitter) antenna height h_b [m]. */
      txHeightM: number
      /** Mobile (receiver) antenna height h_m [m]. */
      rxHeightM: number
      environment: 'urban-small-medium' | 'urban-large' | 'suburban' | 'open'
    }
  | {
      kind: 'cost231-hata'
      freqHz: number
      /** Base-station (transmitter) antenna height h_b [m]. */
      txHeightM: number
      /** Mobile (receiver) antenna height h_m [m]. */
      rxHeightM: number
      /** C_m by name: 0 dB medium city / suburban, 3 dB metropolitan centre. Give this or cityCorrectionDb. */
      environment?: 'medium-city' | 'metropolitan'
      /** C_m as a number [dB]. Give this or environment. */
      cityCorrectionDb?: number
    }
  | {
      kind: 'tr38901'
      freqHz: number
      scenario: 'RMa' | 'UMa' | 'UMi-street-canyon' | 'InH-office'
      condition: 'LOS' | 'NLOS'
      /** Base-station (transmitter) antenna height h_BS [m]. */
      txHeightM: number
      /** User-terminal (receiver) antenna height h_UT [m]. */
      rxHeightM: number
      /** RMa only: average building height h [m] and street width W [m]. */
      buildingHeightM?: number
      streetWidthM?: number
    }

export type PropagationModelKind = PropagationModelSpec['kind']

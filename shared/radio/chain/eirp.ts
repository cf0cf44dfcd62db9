/**
 * EIRP and ERP side by side, EIRP from conducted power, and the free-space field of an EIRP.
 *
 * Document: ITU Radio Regulations Nos. 1.161 (e.i.r.p.) and 1.162 (e.r.p., half-wave dipole
 * reference), EIRP = ERP + 2.15 dB [M for the RR wording]; ITU-R P.525-4 §2 free-space field
 * E = P − 20 log d + 74.8 (P dBW e.i.r.p., d km), implemented exactly as S = EIRP/(4πd²),
 * E = √(S·Z0) with Z0 = 120π (constant 74.77) [D].
 *
 * Equations:
 *   (1) ERP = EIRP − 2.15                                [dBm]
 *   (2) EIRP = P_cond − L_feeder + G                     [dBm]
 *   (3) S = EIRP − 30 − 10 log10(4π d²)                  [dBW/m²]
 *   (4) EIRP = S + 30 + 10 log10(4π d²)                  [dBm]
 */
import { DIPOLE_GAIN_DBI } from '../constants'
import { requireFinite, requireNonNegative, requirePositive } from '../guards'
import type { MethodRef, RadioResult } from '../types'
import { dbmToWatts, eirpToErpDb, erpToEirpDb, fieldToPfdDbwPerM2, pfdToFieldDbuvPerM } from '../units'

const log10 = Math.log10

export const EIRP_ERP_METHOD: MethodRef = {
  id: 'eirp-erp-dipole',
  source: 'ITU Radio Regulations Nos. 1.161 and 1.162; ITU-R BS.561 Annex 1 §2: EIRP = ERP + 2.15 dB [M for the wording]',
}

export const FREE_SPACE_FIELD_METHOD: MethodRef = {
  id: 'free-space-field-p525',
  source: 'ITU-R P.525-4 §2: E = P_eirp − 20 log d + 74.8 (exact 74.77 with Z0 = 120π) [V-I]',
}

export interface EirpErp {
  eirpDbm: number
  erpDbm: number
  eirpW: number
  erpW: number
}

/** Both EIRP and ERP from either one (ERP is referred to a half-wave dipole of 2.15 dBi). */
export function eirpAndErp(opts: { eirpDbm: number } | { erpDbm: number }): RadioResult<EirpErp> {
  const given = 'eirpDbm' in opts ? 'eirp' : 'erp'
  if (('eirpDbm' in opts) === ('erpDbm' in opts)) throw new RangeError('Give exactly one of eirpDbm or erpDbm.')
  const eirpDbm = 'eirpDbm' in opts ? requireFinite('eirpDbm', opts.eirpDbm) : erpToEirpDb(opts.erpDbm)
  const erpDbm = 'erpDbm' in opts ? requireFinite('erpDbm', opts.erpDbm) : eirpToErpDb(eirpDbm) // Eq. (1) [dBm]
  return {
    value: { eirpDbm, erpDbm, eirpW: dbmToWatts(eirpDbm), erpW: dbmToWatts(erpDbm) },
    warnings: [`${given === 'eirp' ? 'ERP' : 'EIRP'} derived with the half-wave dipole gain ${DIPOLE_GAIN_DBI} dBi.`],
    method: EIRP_ERP_METHOD,
  }
}

/** EIRP of a transmitter from its conducted power, feeder loss and antenna gain [dBm]. */
export function eirpFromConductedDbm(opts: { conductedPowerDbm: number; antennaGainDbi: number; feederLossDb?: number }): number {
  const p = requireFinite('conductedPowerDbm', opts.conductedPowerDbm)
  const g = requireFinite('antennaGainDbi', opts.antennaGainDbi)
  const l = requireNonNegative('feederLossDb', opts.feederLossDb ?? 0)
  return p - l + g // Eq. (2) [dBm]
}

/** Conducted power that gives an EIRP through the feeder and antenna [dBm] (inverse). */
export function conductedFromEirpDbm(opts: { eirpDbm: number; antennaGainDbi: number; feederLossDb?: number }): number {
  const e = requireFinite('eirpDbm', opts.eirpDbm)
  const g = requireFinite('antennaGainDbi', opts.antennaGainDbi)
  const l = requireNonNegative('feederLossDb', opts.feederLossDb ?? 0)
  return e + l - g // Eq. (2) [dBm]
}

/** Free-space field strength and power flux density at a distance from an EIRP (far field). */
export function freeSpaceFieldFromEirp(opts: {
  eirpDbm: number
  distanceM: number
}): RadioResult<{ fieldStrengthDbuvPerM: number; pfdDbwPerM2: number }> {
  const eirpDbm = requireFinite('eirpDbm', opts.eirpDbm)
  const d = requirePositive('distanceM', opts.distanceM)
  const pfdDbwPerM2 = eirpDbm - 30 - 10 * log10(4 * Math.PI * d ** 2) // Eq. (3) [dBW/m²]
  return {
    value: { fieldStrengthDbuvPerM: pfdToFieldDbuvPerM(pfdDbwPerM2), pfdDbwPerM2 },
    warnings: [],
    method: FREE_SPACE_FIELD_METHOD,
  }
}

/** EIRP (and ERP) that gives a field strength at a distance in free space (inverse). */
export function eirpFromFreeSpaceField(opts: { fieldStrengthDbuvPerM: number; distanceM: number }): RadioResult<EirpErp> {
  const pfd = fieldToPfdDbwPerM2(requireFinite('fieldStrengthDbuvPerM', opts.fieldStrengthDbuvPerM))
  const d = requirePositive('distanceM', opts.distanceM)
  const eirpDbm = pfd + 30 + 10 * log10(4 * Math.PI * d ** 2) // Eq. (4) [dBm]
  const pair = eirpAndErp({ eirpDbm })
  return { value: pair.value, warnings: ['Free space assumed: no ground, clutter or absorption.'], method: FREE_SPACE_FIELD_METHOD }
}

/**
 * EIRP and ERP side by side, and EIRP from conducted power.
 *
 * Document: ITU Radio Regulations Nos. 1.161 (e.i.r.p.) and 1.162 (e.r.p., half-wave dipole
 * reference), EIRP = ERP + 2.15 dB [M for the RR wording]. The free-space field and power flux
 * density of an EIRP, and their inverse, are in propagation/free-space-p525.ts; EIRP from a
 * measurement through any propagation model is in estimation/eirp-from-measurement.ts.
 *
 * Equations:
 *   (1) ERP = EIRP − 2.15                                [dBm]
 *   (2) EIRP = P_cond − L_feeder + G                     [dBm]
 */
import { DIPOLE_GAIN_DBI } from '../constants'
import { requireFinite, requireNonNegative } from '../guards'
import type { MethodRef, RadioResult } from '../types'
import { dbmToWatts, eirpToErpDb, erpToEirpDb } from '../units'

export const EIRP_ERP_METHOD: MethodRef = {
  id: 'eirp-erp-dipole',
  source: 'ITU Radio Regulations Nos. 1.161 and 1.162; ITU-R BS.561 Annex 1 §2: EIRP = ERP + 2.15 dB [M for the wording] — register 3-1…3-3',
}

export const EIRP_FROM_CONDUCTED_METHOD: MethodRef = {
  id: 'eirp-from-conducted',
  source:
    'EIRP = P − L_feeder + G, exact [D]; e.i.r.p. as defined in ITU Radio Regulations No. 1.161 (power supplied to the antenna × gain) [M for the wording] — register 11-1',
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
export function eirpFromConductedDbm(opts: { conductedPowerDbm: number; antennaGainDbi: number; feederLossDb?: number }): RadioResult<{ eirpDbm: number }> {
  const p = requireFinite('conductedPowerDbm', opts.conductedPowerDbm)
  const g = requireFinite('antennaGainDbi', opts.antennaGainDbi)
  const l = requireNonNegative('feederLossDb', opts.feederLossDb ?? 0)
  return { value: { eirpDbm: p - l + g }, warnings: feederWarnings(opts.feederLossDb), method: EIRP_FROM_CONDUCTED_METHOD } // Eq. (2) [dBm]
}

/** Conducted power that gives an EIRP through the feeder and antenna [dBm] (inverse). */
export function conductedFromEirpDbm(opts: { eirpDbm: number; antennaGainDbi: number; feederLossDb?: number }): RadioResult<{ conductedPowerDbm: number }> {
  const e = requireFinite('eirpDbm', opts.eirpDbm)
  const g = requireFinite('antennaGainDbi', opts.antennaGainDbi)
  const l = requireNonNegative('feederLossDb', opts.feederLossDb ?? 0)
  return { value: { conductedPowerDbm: e + l - g }, warnings: feederWarnings(opts.feederLossDb), method: EIRP_FROM_CONDUCTED_METHOD } // Eq. (2) [dBm]
}

function feederWarnings(feederLossDb: number | undefined): string[] {
  return feederLossDb === undefined ? ['Feeder loss taken as 0 dB: give feederLossDb when the cable and connectors are known.'] : []
}

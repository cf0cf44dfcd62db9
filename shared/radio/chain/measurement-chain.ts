/**
 * Measurement chain: analyser reading → field strength, power flux density and isotropically
 * received power, and the inverse.
 *
 * Document: field-strength measurement with a calibrated antenna, E = V + AF + losses,
 * ITU Handbook on Spectrum Monitoring, edition 2011, field-strength measurement chapter
 * [clause number M]; dBµV = dBm + 10 log R + 90 and S = E²/Z0 are exact identities [D];
 * isotropic received power per ITU-R P.525-4 §3 (see received-power.ts).
 *
 * The losses between the antenna and the analyser (cable, attenuator) are positive dB and are
 * added back; a preamplifier's gain is taken off. Either an antenna factor or an antenna gain
 * describes the antenna; the other is derived for a matched load (antenna.ts).
 *
 * Equations:
 *   (1) P_port = P_read + L_cable + L_att − G_preamp          [dBm]  level at the antenna port
 *   (2) V_port = P_port + 10 log10 R + 90                      [dBµV]
 *   (3) E = V_port + AF                                        [dBµV/m]
 *   (4) P_read = E − AF − 10 log10 R − 90 − L_cable − L_att + G_preamp   [dBm]  inverse
 */
import { RECEIVER_IMPEDANCE_OHM } from '../constants'
import { requireFinite, requireNonNegative, requirePositive } from '../guards'
import type { MethodRef, RadioResult } from '../types'
import { dbmToDbuv, dbuvPerMToVPerM, dbuvToDbm, dbwPerM2ToWPerM2, fieldToPfdDbwPerM2 } from '../units'
import { antennaFactorFromGainDbPerM, antennaGainFromFactorDbi } from './antenna'
import { farFieldWarnings } from './far-field'
import { fieldToReceivedPowerDbm } from './received-power'

export const MEASUREMENT_CHAIN_METHOD: MethodRef = {
  id: 'measurement-chain-af',
  source:
    'ITU Handbook on Spectrum Monitoring (2011), field-strength measurement: E = V + AF + losses [clause M]; ' +
    'dBµV = dBm + 10 log R + 90 and S = E²/Z0 [D]; ITU-R P.525-4 §3 isotropic received power',
}

/** What the analyser showed: a power (dBm) or a voltage (dBµV) at its input. */
export type AnalyserReading = { readingDbm: number } | { readingDbuv: number }
/** The receiving antenna, by its calibrated antenna factor or by its gain. */
export type ReceivingAntenna = { antennaFactorDbPerM: number } | { antennaGainDbi: number }

/** Everything between the field and the analyser input. */
export interface ChainCorrections {
  freqHz: number
  antenna: ReceivingAntenna
  /** Cable loss between antenna and analyser [dB], positive. */
  cableLossDb?: number
  /** External attenuator [dB], positive. */
  attenuatorDb?: number
  /** Preamplifier gain [dB]; its noise figure is not needed for the level correction. */
  preampGainDb?: number
  /** Analyser input impedance [Ω], 50 Ω unless given. */
  impedanceOhm?: number
  /** Distance to the source [m]: enables the far-field warnings. */
  distanceM?: number
  /** Largest dimension of the larger antenna (source or measuring) [m]: enables the 2D²/λ warning. */
  antennaSizeM?: number
}

export interface FieldFromReading {
  fieldStrengthDbuvPerM: number
  fieldStrengthVPerM: number
  pfdDbwPerM2: number
  pfdWPerM2: number
  /** Power an isotropic antenna would receive in this field [dBm]. */
  isotropicReceivedPowerDbm: number
  /** Level at the antenna port after the chain corrections [dBm] and [dBµV]. */
  antennaPortPowerDbm: number
  antennaPortVoltageDbuv: number
  antennaFactorDbPerM: number
  antennaGainDbi: number
}

interface ResolvedChain {
  freqHz: number
  impedanceOhm: number
  chainLossDb: number
  antennaFactorDbPerM: number
  antennaGainDbi: number
  warnings: string[]
}

function resolveChain(opts: ChainCorrections): ResolvedChain {
  const freqHz = requirePositive('freqHz', opts.freqHz)
  const impedanceOhm = requirePositive('impedanceOhm', opts.impedanceOhm ?? RECEIVER_IMPEDANCE_OHM)
  const cable = requireNonNegative('cableLossDb', opts.cableLossDb ?? 0)
  const att = requireNonNegative('attenuatorDb', opts.attenuatorDb ?? 0)
  const preamp = requireNonNegative('preampGainDb', opts.preampGainDb ?? 0)
  const a = opts.antenna
  if (!a || ('antennaFactorDbPerM' in a) === ('antennaGainDbi' in a)) {
    throw new RangeError('antenna must give exactly one of antennaFactorDbPerM or antennaGainDbi.')
  }
  let antennaFactorDbPerM: number
  let antennaGainDbi: number
  if ('antennaFactorDbPerM' in a) {
    antennaFactorDbPerM = requireFinite('antennaFactorDbPerM', a.antennaFactorDbPerM)
    antennaGainDbi = antennaGainFromFactorDbi({ freqHz, antennaFactorDbPerM, impedanceOhm })
  } else {
    antennaGainDbi = requireFinite('antennaGainDbi', a.antennaGainDbi)
    antennaFactorDbPerM = antennaFactorFromGainDbPerM({ freqHz, antennaGainDbi, impedanceOhm })
  }
  const warnings =
    opts.distanceM === undefined ? [] : farFieldWarnings({ freqHz, distanceM: opts.distanceM, antennaSizeM: opts.antennaSizeM })
  return { freqHz, impedanceOhm, chainLossDb: cable + att - preamp, antennaFactorDbPerM, antennaGainDbi, warnings }
}

/** Field strength, power flux density and isotropic received power from an analyser reading. */
export function readingToField(opts: ChainCorrections & { reading: AnalyserReading }): RadioResult<FieldFromReading> {
  const chain = resolveChain(opts)
  const r = opts.reading
  if (!r || ('readingDbm' in r) === ('readingDbuv' in r)) {
    throw new RangeError('reading must give exactly one of readingDbm or readingDbuv.')
  }
  const readingDbm =
    'readingDbm' in r
      ? requireFinite('readingDbm', r.readingDbm)
      : dbuvToDbm({ voltageDbuv: requireFinite('readingDbuv', r.readingDbuv), impedanceOhm: chain.impedanceOhm })
  const antennaPortPowerDbm = readingDbm + chain.chainLossDb // Eq. (1) [dBm]
  const antennaPortVoltageDbuv = dbmToDbuv({ powerDbm: antennaPortPowerDbm, impedanceOhm: chain.impedanceOhm }) // Eq. (2) [dBµV]
  const fieldStrengthDbuvPerM = antennaPortVoltageDbuv + chain.antennaFactorDbPerM // Eq. (3) [dBµV/m]
  const pfdDbwPerM2 = fieldToPfdDbwPerM2(fieldStrengthDbuvPerM)
  return {
    value: {
      fieldStrengthDbuvPerM,
      fieldStrengthVPerM: dbuvPerMToVPerM(fieldStrengthDbuvPerM),
      pfdDbwPerM2,
      pfdWPerM2: dbwPerM2ToWPerM2(pfdDbwPerM2),
      isotropicReceivedPowerDbm: fieldToReceivedPowerDbm({ fieldStrengthDbuvPerM, freqHz: chain.freqHz }),
      antennaPortPowerDbm,
      antennaPortVoltageDbuv,
      antennaFactorDbPerM: chain.antennaFactorDbPerM,
      antennaGainDbi: chain.antennaGainDbi,
    },
    warnings: chain.warnings,
    method: MEASUREMENT_CHAIN_METHOD,
  }
}

/** The analyser reading a field strength would produce through the same chain (inverse). */
export function fieldToReading(
  opts: ChainCorrections & { fieldStrengthDbuvPerM: number },
): RadioResult<{ readingDbm: number; readingDbuv: number }> {
  const chain = resolveChain(opts)
  const e = requireFinite('fieldStrengthDbuvPerM', opts.fieldStrengthDbuvPerM)
  const portDbuv = e - chain.antennaFactorDbPerM
  const readingDbm = dbuvToDbm({ voltageDbuv: portDbuv, impedanceOhm: chain.impedanceOhm }) - chain.chainLossDb // Eq. (4) [dBm]
  return {
    value: { readingDbm, readingDbuv: dbmToDbuv({ powerDbm: readingDbm, impedanceOhm: chain.impedanceOhm }) },
    warnings: chain.warnings,
    method: MEASUREMENT_CHAIN_METHOD,
  }
}

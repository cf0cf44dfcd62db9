/**
 * A band of a processed trace kept as a measurement of the case: the server measures the band
 * on the stored display trace itself (measureEvidenceBand) and stores its channel power in dBm
 * as the reading, through the measurements service, with the evidence file linked. The client
 * gives only the band's edges and when and where the file was recorded.
 *
 * Who: the ability to record a measurement on the case (the assigned investigator or the office's
 * supervisor, while the case is worked), over a file the actor may read as staff of the case's
 * office. Another office's file is not found; a removed file, a trace not in dBm, or a band whose
 * channel power could not be computed are refused (409) before anything is stored.
 */
import type { BandMeasurementRequest, BandMeasurementResponse } from '../../../../shared/schemas/band-measurement'
import type { EvidenceBandView } from '../../../../shared/schemas/spectrum'
import { CHANNEL_POWER_METHOD } from '../../../../shared/radio/spectrum/channel-power'
import type { ServiceContext } from '../../../context'
import { conflict, forbidden } from '../../../http/errors'
import { mayWriteMeasurements, measurementsAllowedIn } from '../../../policy/equipment-policy'
import { mayDownloadEvidence, maySeeEvidence } from '../../../policy/evidence-policy'
import type { Actor } from '../../../policy/policy'
import { findCase } from '../../cases/cases.repo'
import { recordMeasurement } from '../../measurements/measurements.service'
import { findEvidence } from '../evidence.repo'
import { evidenceNotFound } from './analysis.service'
import { measureEvidenceBand } from './band.service'

const mhz = (hz: number) => `${(hz / 1e6).toFixed(6).replace(/\.?0+$/, '')} MHz`

/** The basis of the figure in words, kept in the measurement's notes (the record has no basis field). */
export function bandBasisText(fileName: string, band: EvidenceBandView): string {
  const b = band.basis
  const parts = [
    `${b.pointCount} points`,
    `${b.binSpacingHz.toPrecision(4)} Hz apart`,
    b.decimated ? `decimated from ${b.sourcePointCount} points (each bucket's lowest and highest level kept)` : 'not decimated',
    `noise bandwidth (ENBW) ${b.enbwHz} Hz`,
    `${b.pointsInBand.toFixed(2)} points in the band`,
  ]
  return `Channel power of ${fileName} from ${mhz(band.lowFreqHz)} to ${mhz(band.highFreqHz)}, computed by the server on the file's display trace (${parts.join(', ')}); method ${CHANNEL_POWER_METHOD.id}; radio library ${band.libraryVersion}.`
}

export async function recordBandMeasurement(ctx: ServiceContext, actor: Actor, evidenceId: string, req: BandMeasurementRequest): Promise<BandMeasurementResponse> {
  const evidence = await findEvidence(ctx.db, evidenceId)
  const c = evidence && (await findCase(ctx.db, evidence.caseId))
  if (!evidence || !c || !maySeeEvidence(actor, c, evidence)) throw evidenceNotFound()
  if (!mayDownloadEvidence(actor, c, evidence)) throw forbidden()
  if (!mayWriteMeasurements(actor, c)) throw forbidden('Only the assigned investigator or the office supervisor can record measurements on this case.')
  if (!measurementsAllowedIn(c.status)) throw conflict('invalid_state', 'Measurements are recorded while the case is being worked (assigned, in field work or sent back).')
  if (evidence.removedAt) throw conflict('evidence_removed', `The evidence file ${evidence.displayName} was removed from the case: a measurement cannot be taken from it.`)

  const band = await measureEvidenceBand(ctx, actor, evidenceId, { lowFreqHz: req.lowFreqHz, highFreqHz: req.highFreqHz })
  if (band.levelUnit !== 'dBm') {
    throw conflict('trace_not_calibrated', 'This trace is in dBFS (an uncalibrated recording): its channel power is not a level in dBm and cannot be kept as a measurement.')
  }
  if (band.channelPowerDbm === null) {
    throw conflict('channel_power_unavailable', `The channel power of this band could not be computed${band.channelPowerNote ? `: ${band.channelPowerNote}` : '.'}`)
  }

  const basis = bandBasisText(evidence.displayName, band)
  const measurement = await recordMeasurement(
    ctx,
    actor,
    c.id,
    {
      takenAt: req.takenAt,
      latDeg: req.latDeg,
      lonDeg: req.lonDeg,
      freqHz: (band.lowFreqHz + band.highFreqHz) / 2,
      measurementBandwidthHz: band.highFreqHz - band.lowFreqHz,
      heightM: undefined,
      rbwHz: undefined,
      detector: undefined,
      reading: { unit: 'dBm', value: band.channelPowerDbm },
      antenna: { source: 'none' },
      instrumentId: undefined,
      cableLossDb: undefined,
      preampGainDb: undefined,
      polarisation: undefined,
      bearingDeg: undefined,
      bearingSigmaDeg: undefined,
      evidenceFileId: evidenceId,
      notes: req.notes ? `${req.notes}\n\n${basis}` : basis,
    },
    { method: CHANNEL_POWER_METHOD, warnings: band.warnings.filter((w) => !w.startsWith('Occupied bandwidth')) },
  )
  return { measurement, band }
}

/**
 * A band of a stored analysis: channel power and occupied bandwidth between two frequencies,
 * computed from the stored display trace by the radio library (no file is read again). Staff of
 * the case's office; another office's file is not found, as for the analysis itself.
 */
import { RADIO_LIBRARY_VERSION } from '../../../../shared/radio'
import { channelPower, CHANNEL_POWER_METHOD } from '../../../../shared/radio/spectrum/channel-power'
import { occupiedBandwidth, OCCUPIED_BANDWIDTH_METHOD } from '../../../../shared/radio/spectrum/occupied-bandwidth'
import { cellEdgesHz, cellSharesInBand } from '../../../../shared/radio/spectrum/trace'
import type { BandRequest, EvidenceBandView } from '../../../../shared/schemas/spectrum'
import type { ServiceContext } from '../../../context'
import { badRequest, conflict, forbidden } from '../../../http/errors'
import type { CaseActor } from '../../../policy/case-policy'
import { mayDownloadEvidence, maySeeEvidence } from '../../../policy/evidence-policy'
import { findCase } from '../../cases/cases.repo'
import { findEvidence } from '../evidence.repo'
import { findAnalysis } from './analyses.repo'
import { evidenceNotFound } from './analysis.service'

const mhz = (hz: number) => `${(hz / 1e6).toFixed(6).replace(/\.?0+$/, '')} MHz`

export async function measureEvidenceBand(ctx: ServiceContext, actor: CaseActor, evidenceId: string, band: BandRequest): Promise<EvidenceBandView> {
  const evidence = await findEvidence(ctx.db, evidenceId)
  const c = evidence && (await findCase(ctx.db, evidence.caseId))
  if (!evidence || !c || !maySeeEvidence(actor, c, evidence)) throw evidenceNotFound()
  if (!mayDownloadEvidence(actor, c, evidence)) throw forbidden()
  const analysis = await findAnalysis(ctx.db, evidenceId)
  const trace = analysis?.displayTrace
  const summary = analysis?.summary
  if (!analysis || analysis.state !== 'done' || !trace || !summary) {
    throw conflict('analysis_not_ready', 'This file has no finished spectrum analysis to measure a band on.')
  }
  const n = trace.freqHz.length
  if (n < 2) throw conflict('analysis_not_ready', 'The stored trace has too few points to measure a band on.')

  // the band must lie within the trace's cells: every edge outside is listed
  const edges = cellEdgesHz(trace.freqHz)
  const traceLowHz = edges.lowHz[0]!
  const traceHighHz = edges.highHz[n - 1]!
  const span = `the trace runs from ${mhz(traceLowHz)} to ${mhz(traceHighHz)}`
  const problems: { path: string; message: string }[] = []
  if (band.lowFreqHz < traceLowHz || band.lowFreqHz >= traceHighHz) problems.push({ path: 'lowFreqHz', message: `The low edge ${mhz(band.lowFreqHz)} is outside the trace: ${span}.` })
  if (band.highFreqHz > traceHighHz || band.highFreqHz <= traceLowHz) problems.push({ path: 'highFreqHz', message: `The high edge ${mhz(band.highFreqHz)} is outside the trace: ${span}.` })
  if (problems.length > 0) throw badRequest('validation_failed', 'Some fields need attention.', problems)

  const points = { freqHz: trace.freqHz, levelDbm: trace.levelDbm }
  const binSpacingHz = (trace.freqHz[n - 1]! - trace.freqHz[0]!) / (n - 1)
  const pointsInBand = cellSharesInBand({ edges, startHz: band.lowFreqHz, stopHz: band.highFreqHz }).reduce((a, s) => a + s, 0)
  const warnings: string[] = [
    `Computed on the display trace (${n} points, about ${binSpacingHz.toPrecision(4)} Hz apart${trace.decimated ? `, reduced from ${trace.sourcePointCount} points keeping each bucket's lowest and highest level` : ''}), not on the full recording.`,
  ]
  if (trace.decimated) warnings.push('The display trace is decimated: the channel power weights each kept point by its own cell and is an approximation of the full-resolution sum.')
  const methods = []

  let channelPowerLevel: number | null = null
  let channelPowerNote: string | null = null
  if (summary.enbwHz) {
    const cp = channelPower({ ...points, startHz: band.lowFreqHz, stopHz: band.highFreqHz, enbwHz: summary.enbwHz })
    channelPowerLevel = cp.value.channelPowerDbm
    warnings.push(...cp.warnings.map((w) => `Channel power: ${w}`))
    methods.push(CHANNEL_POWER_METHOD)
  } else {
    channelPowerNote = 'Not computed: the trace does not state the noise bandwidth (RBW) its points were read in.'
  }

  let obw: Pick<EvidenceBandView, 'occupiedBandwidthHz' | 'occupiedLowerEdgeHz' | 'occupiedUpperEdgeHz' | 'betaPercent'> = {
    occupiedBandwidthHz: null,
    occupiedLowerEdgeHz: null,
    occupiedUpperEdgeHz: null,
    betaPercent: null,
  }
  try {
    const r = occupiedBandwidth({ ...points, startHz: band.lowFreqHz, stopHz: band.highFreqHz, ...(summary.enbwHz ? { enbwHz: summary.enbwHz } : {}) })
    obw = { occupiedBandwidthHz: r.value.occupiedBandwidthHz, occupiedLowerEdgeHz: r.value.lowerEdgeHz, occupiedUpperEdgeHz: r.value.upperEdgeHz, betaPercent: r.value.betaPercent }
    warnings.push(...r.warnings.map((w) => `Occupied bandwidth: ${w}`))
    methods.push(OCCUPIED_BANDWIDTH_METHOD)
  } catch (e) {
    warnings.push(`Occupied bandwidth not computed: ${(e as Error).message}`)
  }

  return {
    evidenceId,
    lowFreqHz: band.lowFreqHz,
    highFreqHz: band.highFreqHz,
    levelUnit: summary.levelUnit,
    channelPowerDbm: summary.levelUnit === 'dBm' ? channelPowerLevel : null,
    channelPowerDbfs: summary.levelUnit === 'dBFS' ? channelPowerLevel : null,
    channelPowerNote,
    ...obw,
    basis: { trace: 'display', pointCount: n, pointsInBand, decimated: trace.decimated, sourcePointCount: trace.sourcePointCount, binSpacingHz, enbwHz: summary.enbwHz },
    warnings,
    methods,
    libraryVersion: RADIO_LIBRARY_VERSION,
  }
}

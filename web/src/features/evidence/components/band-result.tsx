/**
 * A band's channel power and occupied bandwidth as the server computed them, with what they were
 * computed on (the display trace and its resolution), their warnings and, for a trace in dBm,
 * the form that keeps the channel power as a measurement of the case.
 */
import type { EvidenceBandView } from '@shared/schemas/spectrum'
import { EstimateCaution } from '@/components/cautions/estimate-caution'
import { SaveBandForm } from './save-band-form'
import { hzWords, mhz } from './spectrum-format'

export function BandResult({ caseId, result }: { caseId: string; result: EvidenceBandView }) {
  const channelPower = result.channelPowerDbm ?? result.channelPowerDbfs
  return (
    <div aria-live="polite" className="flex flex-col gap-2">
      <dl className="grid grid-cols-[10rem_minmax(0,1fr)] gap-x-4 gap-y-1 text-sm">
        <dt className="font-semibold">Band</dt>
        <dd>
          {mhz(result.lowFreqHz)} to {mhz(result.highFreqHz)}
        </dd>
        <dt className="font-semibold">Channel power</dt>
        <dd>{channelPower === null ? (result.channelPowerNote ?? 'Not computed.') : `${channelPower.toFixed(2)} ${result.levelUnit}`}</dd>
        <dt className="font-semibold">Occupied bandwidth</dt>
        <dd>
          {result.occupiedBandwidthHz === null
            ? 'Not computed.'
            : `${hzWords(result.occupiedBandwidthHz)} (${result.betaPercent ?? 1} % of the power outside, half each side; ${mhz(result.occupiedLowerEdgeHz ?? 0)} to ${mhz(result.occupiedUpperEdgeHz ?? 0)})`}
        </dd>
        <dt className="font-semibold">Computed on</dt>
        <dd>
          The display trace, not the full recording: {result.basis.pointCount} points about {hzWords(result.basis.binSpacingHz)} apart
          {result.basis.decimated ? ` (reduced from ${result.basis.sourcePointCount})` : ''}, {result.basis.pointsInBand.toFixed(1)} of them in the band
          {result.basis.enbwHz ? `, each read in a noise bandwidth of ${hzWords(result.basis.enbwHz)}` : ''}. Radio library {result.libraryVersion}; methods{' '}
          {result.methods.map((m) => m.id).join(', ')}.
        </dd>
      </dl>
      {result.warnings.length > 0 && (
        <ul className="list-disc pl-5 text-sm">
          {result.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      )}
      {result.channelPowerDbm !== null ? (
        <SaveBandForm key={`${result.lowFreqHz}-${result.highFreqHz}`} caseId={caseId} band={result} />
      ) : (
        <p className="text-sm text-ink-muted">
          {result.levelUnit === 'dBFS'
            ? 'Not offered as a measurement: a level in dBFS is relative to the recorder’s full scale, and a measurement needs a calibrated absolute level.'
            : 'Not offered as a measurement: the channel power could not be computed.'}
        </p>
      )}
      <EstimateCaution />
    </div>
  )
}

/** Coexistence: I/N against the criterion, the desensitisation, and what would meet the criterion. */
import type { CoexistenceOutput } from '@shared/calculations'
import { fmt, fmtM } from '../lib/units'
import { Figure } from './result-parts'

export function CoexistenceResult({ value }: { value: CoexistenceOutput }) {
  return (
    <div className="flex min-w-0 flex-col gap-4">
      <div className={`rounded-control border-l-4 px-4 py-3 ${value.meetsCriterion ? 'border-ok bg-ok-soft' : 'border-danger bg-danger-soft'}`}>
        <p className="text-2xl font-bold">I/N {fmt(value.inrDb, 'dB')}</p>
        <p>
          {value.meetsCriterion
            ? `Meets the criterion of ${fmt(value.criterionInrDb, 'dB')} I/N, ${fmt(-value.marginDb, 'dB')} below it.`
            : `Exceeds the criterion of ${fmt(value.criterionInrDb, 'dB')} I/N by ${fmt(value.marginDb, 'dB')}.`}
        </p>
      </div>
      <dl className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        <Figure label="Interference at the receiver input">{fmt(value.interferenceDbm, 'dBm')}</Figure>
        <Figure label="Receiver noise">{fmt(value.noiseDbm, 'dBm')}</Figure>
        <Figure label="Desensitisation (rise of the noise floor)">{fmt(value.desensitisationDb, 'dB')}</Figure>
        <Figure label="EIRP reduction needed">{value.eirpReductionDb > 0 ? fmt(value.eirpReductionDb, 'dB') : 'None'}</Figure>
        <Figure label="Highest EIRP meeting the criterion">{fmt(value.maxEirpDbm, 'dBm')}</Figure>
        <Figure label="Separation meeting it at the present EIRP">{fmtM(value.separationDistanceM)}</Figure>
        <Figure label="Interferer's EIRP used">{fmt(value.interfererEirpDbm, 'dBm')}</Figure>
        <Figure label="Distance used">{fmtM(value.distanceM)}</Figure>
        <Figure label="Path loss needed">{fmt(value.requiredPathLossDb, 'dB')}</Figure>
      </dl>
      <p className="text-sm break-words">
        <span className="font-semibold">Criterion:</span> {value.criterionDescription}
      </p>
    </div>
  )
}

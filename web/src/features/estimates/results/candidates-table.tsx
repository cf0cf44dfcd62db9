/**
 * Authorised stations that may be the source, ranked (a `candidate_sources` record): each with
 * its licensee, authorised band and EIRP, the overlap with the interference and the level it
 * would give at the victim. "Use this licence as the limit" opens the verdict form with that
 * station's licence as the limit.
 */
import type { CandidateSourcesOutput } from '@shared/calculations'
import { Button } from '@/components/ui/button'
import { fmt, fmtHz, fmtM } from '../lib/units'

export type Candidate = CandidateSourcesOutput['candidates'][number]

export function CandidatesTable({ value, onUseLicence }: { value: CandidateSourcesOutput; onUseLicence?: (c: Candidate) => void }) {
  const order = value.order === 'level' ? 'by the level each would give at the victim' : 'by distance to the estimated source'
  return (
    <div className="flex min-w-0 flex-col gap-3">
      <p>
        {value.overlappingCount} authorised station{value.overlappingCount === 1 ? '' : 's'} of the licence register (version {value.registerVersion ?? 'none'}) overlap the
        interference; the first {value.candidates.length} ranked {order} ({value.modelKind} model, victim antenna {fmt(value.victimAntennaGainDbi, 'dBi')}).
      </p>
      {value.candidates.length === 0 ? (
        <p>No authorised station overlaps the interference.</p>
      ) : (
        <ol aria-label="Candidate stations, most likely first" className="flex flex-col gap-3">
          {value.candidates.map((c) => (
            <li key={c.stationId} className="flex min-w-0 flex-col gap-2 rounded-control border border-rule p-3 md:flex-row md:items-center md:justify-between">
              <div className="min-w-0">
                <p className="font-semibold break-words">
                  {c.rank}. {c.stationCode} — {c.licensee}
                </p>
                <p className="text-sm break-words">
                  {c.service}; authorised {fmtHz(c.lowFreqHz)} to {fmtHz(c.highFreqHz)} at {fmt(c.authorisedEirpDbm, 'dBm')} EIRP
                </p>
                <p className="text-sm text-ink-muted break-words">
                  Overlap {fmtHz(c.overlapHz)} ({fmt(c.overlapFraction * 100, '%', 0)}); {fmtM(c.distanceM)} from the victim
                  {c.predictedLevelDbm !== null ? `; would give ${fmt(c.predictedLevelDbm, 'dBm')} there` : ''}
                  {c.distanceToEstimateM !== undefined ? `; ${fmtM(c.distanceToEstimateM)} from the estimated source` : ''}
                  {c.note ? `; ${c.note}` : ''}
                </p>
              </div>
              {onUseLicence && (
                <Button variant="secondary" className="shrink-0" onClick={() => onUseLicence(c)} aria-label={`Use the licence of ${c.stationCode} as the limit`}>
                  Use this licence as the limit
                </Button>
              )}
            </li>
          ))}
        </ol>
      )}
    </div>
  )
}

/**
 * Candidate sources: the authorised stations of the licence register whose range overlaps the
 * interference, ranked by the level each would give at the victim (or by distance to an
 * estimated source). Needs the server's register, so it runs on a case only.
 */
import { Button } from '@/components/ui/button'
import { compact, quantityInput, textInput, type FormState } from '../lib/form-state'
import { U } from '../lib/units'
import { ChoiceField, FieldGroup, QField, useEstimateForm } from '../components/form-controls'
import { ModelChooser, modelInputs } from '../components/model-chooser'
import type { EstimateSources, KindForm } from './kind-form'

const point = (s: FormState, path: string) => {
  const latDeg = quantityInput(s, `${path}.latDeg`, U.angle)
  const lonDeg = quantityInput(s, `${path}.lonDeg`, U.angle)
  return latDeg === undefined && lonDeg === undefined ? undefined : { latDeg, lonDeg }
}

/** The case's victim position and frequency range as the form's entries. */
function fromCase(s: FormState, v: NonNullable<EstimateSources['victim']>): FormState {
  return {
    ...s,
    'victimPosition.latDeg': String(v.latDeg),
    'victimPosition.lonDeg': String(v.lonDeg),
    lowFreqHz: String(v.lowFreqHz / 1e6),
    'lowFreqHz~unit': 'MHz',
    highFreqHz: String(v.highFreqHz / 1e6),
    'highFreqHz~unit': 'MHz',
  }
}

function Fields({ sources }: { sources: EstimateSources }) {
  const { state, onChange } = useEstimateForm()
  const ownModel = state.modelChoice === 'chosen'
  return (
    <>
      <FieldGroup title="The interference">
        {sources.victim && (
          <div className="md:col-span-2">
            <Button variant="secondary" onClick={() => onChange(fromCase(state, sources.victim!))}>
              Use the case's position and frequency range
            </Button>
          </div>
        )}
        <QField path="victimPosition.latDeg" label="Latitude of the victim receiver (north +)" kind="angle" units={U.angle} />
        <QField path="victimPosition.lonDeg" label="Longitude of the victim receiver (east +)" kind="angle" units={U.angle} />
        <QField path="lowFreqHz" label="Low edge of the interference" kind="frequency" units={U.freq} />
        <QField path="highFreqHz" label="High edge of the interference" kind="frequency" units={U.freq} hint="The same as the low edge for one frequency." />
        <QField path="victimAntennaGainDbi" label="Victim antenna gain" kind="gain" units={U.dbi} optional hint="Default 0 dBi." />
      </FieldGroup>
      <FieldGroup title="Ranking">
        <ChoiceField
          path="order"
          label="Rank by"
          options={[
            { value: '', label: 'The level each station would give at the victim' },
            { value: 'distance-to-estimate', label: 'Distance to the estimated source' },
          ]}
        />
        <QField path="limit" label="Candidates to keep" kind="loss" units={U.plain} optional hint="Default 20, at most 100." />
        <QField path="estimatedSourcePosition.latDeg" label="Latitude of the estimated source" kind="angle" units={U.angle} optional />
        <QField path="estimatedSourcePosition.lonDeg" label="Longitude of the estimated source" kind="angle" units={U.angle} optional />
        <ChoiceField
          path="modelChoice"
          label="Propagation model for the predicted levels"
          options={[
            { value: '', label: 'Default: free space at the centre of the range' },
            { value: 'chosen', label: 'Choose a model' },
          ]}
        />
        {ownModel && <ModelChooser prefix="model" />}
      </FieldGroup>
    </>
  )
}

export const candidateSourcesForm: KindForm = {
  kind: 'candidate_sources',
  label: 'Candidate sources from the licence register',
  purpose: 'Ranks the authorised stations whose licence overlaps the interference; one of them can give the verdict its limit.',
  needsServer: true,
  initial: {},
  Fields,
  toInputs: (s) =>
    compact({
      victimPosition: point(s, 'victimPosition') ?? {},
      lowFreqHz: quantityInput(s, 'lowFreqHz', U.freq),
      highFreqHz: quantityInput(s, 'highFreqHz', U.freq),
      estimatedSourcePosition: point(s, 'estimatedSourcePosition'),
      model: s.modelChoice === 'chosen' ? modelInputs(s, 'model', (p, u) => quantityInput(s, p, u)) : undefined,
      victimAntennaGainDbi: quantityInput(s, 'victimAntennaGainDbi', U.dbi),
      limit: quantityInput(s, 'limit', U.plain),
      order: textInput(s, 'order'),
    }),
}

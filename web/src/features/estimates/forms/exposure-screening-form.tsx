/** RF exposure screening: the power density at points near a source against the published reference levels (screening values, with a caution). */
import { compact, quantityInput, textInput, type FormState } from '../lib/form-state'
import { U } from '../lib/units'
import { ChoiceField, FieldGroup, QField, useEstimateForm } from '../components/form-controls'
import { RowsEditor, rowsInputs } from '../components/rows-editor'
import type { EstimateSources, KindForm } from './kind-form'
import { EirpSourceFields, PointsFromField, PositionFields, eirpSourceInputs, fromMeasurements, positionInputs } from './shared-fields'

function Fields({ sources }: { sources: EstimateSources }) {
  const { state } = useEstimateForm()
  const stored = fromMeasurements(state, sources)
  return (
    <>
      <FieldGroup title="The source" hint="The time-averaged EIRP toward the points.">
        <EirpSourceFields sources={sources} path="eirpDbm" label="EIRP" />
        <QField path="freqHz" label="Frequency" kind="frequency" units={U.freq} />
        <QField path="dutyCycle" label="Duty cycle (fraction of the time on, 0 to 1)" kind="loss" units={U.plain} optional hint="Continuous (1) when empty." />
      </FieldGroup>
      <FieldGroup title="Reference levels">
        <ChoiceField
          path="population"
          label="Who is exposed"
          options={[
            { value: 'general-public', label: 'The general public' },
            { value: 'occupational', label: 'Workers (occupational)' },
          ]}
        />
        <ChoiceField
          path="averaging"
          label="Averaging"
          options={[
            { value: '', label: 'Default for the frequency' },
            { value: 'whole-body-30min', label: 'Whole body, 30 minutes' },
            { value: 'local-6min', label: 'Local, 6 minutes' },
          ]}
        />
        <ChoiceField
          path="groundReflection"
          label="Ground reflection"
          options={[
            { value: 'yes', label: 'Allow for it (× 2.56, reflection adding in phase)' },
            { value: 'no', label: 'Leave it out (direct path only)' },
          ]}
        />
      </FieldGroup>
      <FieldGroup title="Where">
        <PointsFromField sources={sources} what="Points" />
        {stored ? (
          <PositionFields path="sourcePosition" what="the source" />
        ) : (
          <RowsEditor path="distances" title="Distances from the antenna" empty="Add the distances to check." addLabel="Add a distance" rowName="distance">
            {(row) => <QField path={`${row}.m`} label="Distance from the antenna" kind="distance" units={U.distance} />}
          </RowsEditor>
        )}
      </FieldGroup>
    </>
  )
}

function pointsInputs(s: FormState, sources: EstimateSources): Record<string, unknown> {
  if (fromMeasurements(s, sources)) return { source: 'measurements', measurementIds: sources.measurements!.map((m) => m.id), sourcePosition: positionInputs(s, 'sourcePosition') ?? {} }
  return { source: 'typed', distancesM: rowsInputs(s, 'distances', (r) => quantityInput(s, `${r}.m`, U.distance)) ?? [] }
}

export const exposureScreeningForm: KindForm = {
  kind: 'exposure_screening',
  label: 'RF exposure screening',
  purpose: 'Power density at points near the source as a fraction of the RF exposure reference level: a screening value, not an assessment.',
  initial: { population: 'general-public', groundReflection: 'yes', 'distances#rows': '1' },
  Fields,
  toInputs: (s, sources) =>
    compact({
      ...eirpSourceInputs(s, 'eirpDbm'),
      freqHz: quantityInput(s, 'freqHz', U.freq),
      population: textInput(s, 'population') ?? 'general-public',
      averaging: textInput(s, 'averaging'),
      groundReflection: (s.groundReflection ?? 'yes') === 'yes',
      dutyCycle: quantityInput(s, 'dutyCycle', U.plain),
      points: pointsInputs(s, sources),
    }),
}

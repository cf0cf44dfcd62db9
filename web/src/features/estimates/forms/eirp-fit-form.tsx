/** EIRP and path-loss exponent fitted to several levels at known distances (least squares), with intervals and residuals. */
import { compact, quantityInput, type FormState } from '../lib/form-state'
import { U } from '../lib/units'
import { ChoiceField, FieldGroup, QField, useEstimateForm } from '../components/form-controls'
import { RowsEditor, rowsInputs } from '../components/rows-editor'
import type { EstimateSources, KindForm } from './kind-form'
import { PointsFromField, PositionFields, fromMeasurements, positionInputs } from './shared-fields'

function Fields({ sources }: { sources: EstimateSources }) {
  const { state } = useEstimateForm()
  const stored = fromMeasurements(state, sources)
  return (
    <>
      <FieldGroup title="The readings" hint="Isotropic received power (antenna removed) or field strength, each at its distance from the source.">
        <PointsFromField sources={sources} what="Readings" />
        {stored ? (
          <PositionFields path="sourcePosition" what="the source (each distance is measured from it)" />
        ) : (
          <RowsEditor path="points" title="Readings" empty="Add two or more readings at different distances." addLabel="Add a reading" rowName="reading" newRow={(r) => ({ [`${r}.level`]: 'power' })}>
            {(row) => <ReadingRow row={row} />}
          </RowsEditor>
        )}
      </FieldGroup>
      <FieldGroup title="The path-loss law" hint="P_r(d) = EIRP − L(d0) − 10·n·log10(d/d0).">
        <ChoiceField
          path="exponent.kind"
          label="Path-loss exponent n"
          options={[
            { value: 'free', label: 'Fit it with the EIRP (needs three readings or more)' },
            { value: 'fixed', label: 'Fix it (e.g. 2 for free space)' },
          ]}
        />
        {state['exponent.kind'] === 'fixed' && <QField path="exponent.exponent" label="Fixed exponent n" kind="loss" units={U.plain} hint="About 2 in the open, 3 to 5 in built-up areas." />}
        <QField path="refDistanceM" label="Reference distance d0" kind="distance" units={U.distance} hint="Usually 1 m." />
        <QField path="refLossDb" label="Loss at d0" kind="loss" units={U.db} optional hint="Free space at d0 when empty (then the frequency is needed)." />
        <QField path="freqHz" label="Frequency" kind="frequency" units={U.freq} optional hint="Needed for field strengths and for free space at d0." />
      </FieldGroup>
    </>
  )
}

function ReadingRow({ row }: { row: string }) {
  const { state } = useEstimateForm()
  const level = state[`${row}.level`] ?? 'power'
  return (
    <>
      <QField path={`${row}.distanceM`} label="Distance from the source" kind="distance" units={U.distance} />
      <ChoiceField
        path={`${row}.level`}
        label="Level given as"
        options={[
          { value: 'power', label: 'Isotropic received power' },
          { value: 'field', label: 'Field strength' },
        ]}
      />
      {level === 'field' ? (
        <QField path={`${row}.fieldStrengthDbuvPerM`} label="Field strength" kind="fieldStrength" units={U.fieldStrength} />
      ) : (
        <QField path={`${row}.receivedPowerDbm`} label="Isotropic received power" kind="power" units={U.dbm} />
      )}
    </>
  )
}

function readingsInputs(s: FormState, sources: EstimateSources): Record<string, unknown> {
  if (fromMeasurements(s, sources)) return { source: 'measurements', measurementIds: sources.measurements!.map((m) => m.id), sourcePosition: positionInputs(s, 'sourcePosition') ?? {} }
  return {
    source: 'typed',
    points:
      rowsInputs(s, 'points', (r) =>
        compact({
          distanceM: quantityInput(s, `${r}.distanceM`, U.distance),
          ...((s[`${r}.level`] ?? 'power') === 'field'
            ? { fieldStrengthDbuvPerM: quantityInput(s, `${r}.fieldStrengthDbuvPerM`, U.fieldStrength) }
            : { receivedPowerDbm: quantityInput(s, `${r}.receivedPowerDbm`, U.dbm) }),
        }),
      ) ?? [],
  }
}

export const eirpFitForm: KindForm = {
  kind: 'eirp_fit',
  label: 'EIRP and exponent fitted to several levels',
  purpose: 'Fits the EIRP (and the path-loss exponent) to levels measured at several distances, with 95 % intervals, R² and residuals.',
  initial: { 'exponent.kind': 'free', refDistanceM: '1' },
  Fields,
  toInputs: (s, sources) =>
    compact({
      readings: readingsInputs(s, sources),
      exponent: s['exponent.kind'] === 'fixed' ? { kind: 'fixed', exponent: quantityInput(s, 'exponent.exponent', U.plain) } : { kind: 'free' },
      refDistanceM: quantityInput(s, 'refDistanceM', U.distance),
      refLossDb: quantityInput(s, 'refLossDb', U.db),
      freqHz: quantityInput(s, 'freqHz', U.freq),
    }),
}

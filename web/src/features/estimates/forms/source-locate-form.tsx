/** Locating the source from received levels at known points and/or bearings, with its 95 % ellipse. */
import { compact, quantityInput, textInput, type FormState } from '../lib/form-state'
import { U } from '../lib/units'
import { ChoiceField, FieldGroup, QField, useEstimateForm } from '../components/form-controls'
import { RowsEditor, rowsInputs } from '../components/rows-editor'
import type { EstimateSources, KindForm } from './kind-form'
import { PointsFromField, PositionFields, fromMeasurements } from './shared-fields'

function Fields({ sources }: { sources: EstimateSources }) {
  const { state } = useEstimateForm()
  const stored = fromMeasurements(state, sources)
  return (
    <>
      <FieldGroup title="The observations">
        <PointsFromField sources={sources} what="Observations" />
        {stored ? (
          <ChoiceField
            path="use"
            label="Use their"
            options={[
              { value: 'levels-and-bearings', label: 'Levels and bearings' },
              { value: 'levels', label: 'Levels only' },
              { value: 'bearings', label: 'Bearings only' },
            ]}
          />
        ) : (
          <>
            <RowsEditor path="levels" title="Levels at known points" empty="None: bearings alone." addLabel="Add a level" rowName="level">
              {(row) => (
                <>
                  <PositionFields path={row} what="the point" />
                  <QField path={`${row}.receivedPowerDbm`} label="Isotropic received power" kind="power" units={U.dbm} />
                </>
              )}
            </RowsEditor>
            <RowsEditor path="bearings" title="Bearings from known points" empty="None: levels alone." addLabel="Add a bearing" rowName="bearing">
              {(row) => (
                <>
                  <PositionFields path={row} what="the point" />
                  <QField path={`${row}.bearingDeg`} label="Bearing to the source (clockwise from true north)" kind="angle" units={U.angle} />
                </>
              )}
            </RowsEditor>
          </>
        )}
      </FieldGroup>
      <FieldGroup title="Spread of the observations">
        <QField path="levelSigmaDb" label="Standard deviation of a level" kind="loss" units={U.db} optional hint="Measurement and shadowing together; often 4 to 8 dB. Needed with levels." />
        <QField path="bearingSigmaDeg" label="Standard deviation of a bearing" kind="angle" units={U.angle} optional hint="e.g. 5°; a stored measurement's own is used when empty." />
      </FieldGroup>
      <FieldGroup title="Path loss for the levels" hint="Needed with levels: L(d) = L(d0) + 10·n·log10(d/d0).">
        <QField path="pathLoss.refDistanceM" label="Reference distance d0" kind="distance" units={U.distance} optional />
        <QField path="pathLoss.exponent" label="Path-loss exponent n" kind="loss" units={U.plain} optional hint="Fitted with the position when empty." />
        <QField path="pathLoss.refLossDb" label="Loss at d0" kind="loss" units={U.db} optional hint="Free space at d0 when empty (then the frequency is needed)." />
        <QField path="pathLoss.freqHz" label="Frequency" kind="frequency" units={U.freq} optional />
      </FieldGroup>
    </>
  )
}

const point = (s: FormState, r: string) => compact({ latDeg: quantityInput(s, `${r}.latDeg`, U.angle), lonDeg: quantityInput(s, `${r}.lonDeg`, U.angle) })

function observationsInputs(s: FormState, sources: EstimateSources): Record<string, unknown> {
  if (fromMeasurements(s, sources)) return { source: 'measurements', measurementIds: sources.measurements!.map((m) => m.id), use: textInput(s, 'use') ?? 'levels-and-bearings' }
  return compact({
    source: 'typed',
    levels: rowsInputs(s, 'levels', (r) => compact({ ...point(s, r), receivedPowerDbm: quantityInput(s, `${r}.receivedPowerDbm`, U.dbm) })),
    bearings: rowsInputs(s, 'bearings', (r) => compact({ ...point(s, r), bearingDeg: quantityInput(s, `${r}.bearingDeg`, U.angle) })),
  })
}

function pathLossInputs(s: FormState): Record<string, unknown> | undefined {
  const p = compact({
    refDistanceM: quantityInput(s, 'pathLoss.refDistanceM', U.distance),
    exponent: quantityInput(s, 'pathLoss.exponent', U.plain),
    refLossDb: quantityInput(s, 'pathLoss.refLossDb', U.db),
    freqHz: quantityInput(s, 'pathLoss.freqHz', U.freq),
  })
  return Object.keys(p).length === 0 ? undefined : p
}

export const sourceLocateForm: KindForm = {
  kind: 'source_locate',
  label: 'Source position from levels and bearings',
  purpose: 'Finds the most likely source position from levels at known points and/or bearings, with its 95 % ellipse.',
  initial: { use: 'levels-and-bearings', 'pathLoss.refDistanceM': '1' },
  Fields,
  toInputs: (s, sources) =>
    compact({
      observations: observationsInputs(s, sources),
      levelSigmaDb: quantityInput(s, 'levelSigmaDb', U.db),
      bearingSigmaDeg: quantityInput(s, 'bearingSigmaDeg', U.angle),
      pathLoss: pathLossInputs(s),
    }),
}

/** EIRP from one measured level at a known distance: the level, the distance, the model, the uncertainty. */
import { compact, quantityInput, textInput, type FormState } from '../lib/form-state'
import { U } from '../lib/units'
import { ChoiceField, FieldGroup, QField, useEstimateForm } from '../components/form-controls'
import { ModelChooser, modelInputs } from '../components/model-chooser'
import { ContributionsEditor, DistanceUncertaintyFields, contributionsInputs, distanceUncertaintyInputs } from '../components/uncertainty-inputs'
import type { EstimateSources, KindForm } from './kind-form'

const LEVEL_KINDS = [
  { value: 'field-strength', label: 'Field strength E (dBµV/m)' },
  { value: 'pfd', label: 'Power flux-density S (dBW/m²)' },
  { value: 'isotropic-power', label: 'Isotropic received power (dBm, antenna already removed)' },
  { value: 'received-power', label: 'Received power at the antenna port and its gain (dBm, dBi)' },
]

function measurementInputs(s: FormState): Record<string, unknown> {
  const kind = s['measurement.kind'] ?? 'field-strength'
  const q = (p: string, u: readonly string[]) => quantityInput(s, `measurement.${p}`, u)
  switch (kind) {
    case 'pfd':
      return compact({ kind, pfdDbwPerM2: q('pfdDbwPerM2', U.pfd), freqHz: q('freqHz', U.freq) })
    case 'isotropic-power':
      return compact({ kind, receivedPowerDbm: q('receivedPowerDbm', U.dbm) })
    case 'received-power':
      return compact({ kind, receivedPowerDbm: q('receivedPowerDbm', U.dbm), antennaGainDbi: q('antennaGainDbi', U.dbi) })
    default:
      return compact({ kind, fieldStrengthDbuvPerM: q('fieldStrengthDbuvPerM', U.fieldStrength), freqHz: q('freqHz', U.freq) })
  }
}

/** The level comes from a ticked measurement (only offered on a case with some ticked). */
const usesStored = (s: FormState, sources: EstimateSources) => (sources.measurements?.length ?? 0) > 0 && s.levelFrom === 'stored'

function Fields({ sources }: { sources: EstimateSources }) {
  const { state } = useEstimateForm()
  const kind = state['measurement.kind'] ?? 'field-strength'
  const chosen = sources.measurements ?? []
  const from = chosen.length > 0 ? (state.levelFrom ?? 'typed') : 'typed'
  const distanceFrom = from === 'stored' ? (state.distanceFrom ?? 'typed') : 'typed'
  return (
    <>
      <FieldGroup title="The measured level" hint="Already corrected for antenna factor, cable and preamplifier.">
        {chosen.length > 0 && (
          <ChoiceField
            path="levelFrom"
            label="Level from"
            options={[
              { value: 'typed', label: 'Typed below' },
              { value: 'stored', label: 'A measurement of this case' },
            ]}
          />
        )}
        {from === 'stored' ? (
          <>
            <ChoiceField path="measurementId" alsoErrorsOf={['measurement']} label="Measurement" options={[{ value: '', label: 'Choose one of those ticked' }, ...chosen.map((m) => ({ value: m.id, label: m.label }))]} />
            <ChoiceField
              path="measurementLevel"
              label="Which of its levels"
              options={[
                { value: '', label: 'Field strength, else flux-density, else isotropic power' },
                { value: 'field-strength', label: 'Field strength' },
                { value: 'pfd', label: 'Power flux-density' },
                { value: 'isotropic-power', label: 'Isotropic received power' },
              ]}
            />
          </>
        ) : (
          <>
            <ChoiceField path="measurement.kind" label="What was measured" options={LEVEL_KINDS} />
            {kind === 'field-strength' && <QField path="measurement.fieldStrengthDbuvPerM" label="Field strength" kind="fieldStrength" units={U.fieldStrength} />}
            {kind === 'pfd' && <QField path="measurement.pfdDbwPerM2" label="Power flux-density" kind="pfd" units={U.pfd} />}
            {(kind === 'isotropic-power' || kind === 'received-power') && <QField path="measurement.receivedPowerDbm" label="Received power" kind="power" units={U.dbm} />}
            {kind === 'received-power' && <QField path="measurement.antennaGainDbi" label="Receiving antenna gain" kind="gain" units={U.dbi} />}
            {(kind === 'field-strength' || kind === 'pfd') && <QField path="measurement.freqHz" label="Measured frequency" kind="frequency" units={U.freq} />}
          </>
        )}
      </FieldGroup>
      <FieldGroup title="Distance to the source">
        {from === 'stored' && (
          <ChoiceField
            path="distanceFrom"
            label="Distance from"
            options={[
              { value: 'typed', label: 'Typed below' },
              { value: 'position', label: "The source's position (geodesic distance from the measuring point)" },
            ]}
          />
        )}
        {distanceFrom === 'position' ? (
          <>
            <QField path="sourcePosition.latDeg" label="Latitude of the source (north +)" kind="angle" units={U.angle} />
            <QField path="sourcePosition.lonDeg" label="Longitude of the source (east +)" kind="angle" units={U.angle} />
          </>
        ) : (
          <QField path="distanceM" label="Distance from the source to the measuring point" kind="distance" units={U.distance} />
        )}
        <DistanceUncertaintyFields path="distanceUncertainty" />
      </FieldGroup>
      <FieldGroup title="Propagation model">
        <ModelChooser prefix="model" />
      </FieldGroup>
      <FieldGroup title="Uncertainty of the measurement" hint="Each contribution in dB; combined after JCGM 100:2008 into a 95 % interval.">
        <ContributionsEditor path="measurementContributions" title="Contributions" />
      </FieldGroup>
    </>
  )
}

function levelInputs(s: FormState, sources: EstimateSources): Record<string, unknown> {
  if (!usesStored(s, sources)) return { measurement: measurementInputs(s), distanceM: quantityInput(s, 'distanceM', U.distance) }
  const byPosition = s.distanceFrom === 'position'
  return compact({
    measurementId: textInput(s, 'measurementId'),
    measurementLevel: textInput(s, 'measurementLevel'),
    ...(byPosition
      ? { sourcePosition: { latDeg: quantityInput(s, 'sourcePosition.latDeg', U.angle), lonDeg: quantityInput(s, 'sourcePosition.lonDeg', U.angle) } }
      : { distanceM: quantityInput(s, 'distanceM', U.distance) }),
  })
}

export const eirpSinglePointForm: KindForm = {
  kind: 'eirp_single_point',
  label: 'EIRP from one measured level',
  purpose: 'Back-calculates the EIRP (and ERP) from one level measured at a known distance.',
  initial: { 'measurement.kind': 'field-strength', 'model.kind': 'free-space' },
  Fields,
  toInputs: (s, sources) =>
    compact({
      ...levelInputs(s, sources),
      model: modelInputs(s, 'model', (p, u) => quantityInput(s, p, u)),
      measurementContributions: contributionsInputs(s, 'measurementContributions'),
      distanceUncertainty: distanceUncertaintyInputs(s, 'distanceUncertainty'),
    }),
}


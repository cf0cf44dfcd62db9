/** Coexistence: the interference at the victim receiver, I/N against a protection criterion, and the reduction or separation that would meet it. */
import { PROTECTION_CRITERIA } from '@shared/radio'
import { compact, quantityInput, textInput, type FormState } from '../lib/form-state'
import { U } from '../lib/units'
import { ChoiceField, FieldGroup, QField, TextInputField, useEstimateForm } from '../components/form-controls'
import { ModelChooser, modelInputs } from '../components/model-chooser'
import type { EstimateSources, KindForm } from './kind-form'
import { EirpSourceFields, PositionFields, eirpSourceInputs, positionInputs } from './shared-fields'

const CRITERIA = Object.values(PROTECTION_CRITERIA).map((c) => ({ value: c.id, label: c.description }))

function Fields({ sources }: { sources: EstimateSources }) {
  const { state } = useEstimateForm()
  const byPositions = state.distanceFrom === 'positions'
  const overlap = state['bandwidthOverlap.kind'] ?? ''
  const noise = state['victimNoise.kind'] ?? 'noise-figure'
  const criterion = state['criterion.kind'] ?? 'named'
  return (
    <>
      <FieldGroup title="The interferer">
        <EirpSourceFields sources={sources} path="interfererEirpDbm" label="Interferer's EIRP" />
        <ChoiceField
          path="distanceFrom"
          label="Distance to the victim from"
          options={[
            { value: 'typed', label: 'Typed below' },
            { value: 'positions', label: 'The two positions (geodesic distance)' },
          ]}
        />
        {byPositions ? (
          <>
            <PositionFields path="victimPosition" what="the victim receiver" />
            <PositionFields path="sourcePosition" what="the interferer" />
          </>
        ) : (
          <QField path="distanceM" label="Distance from the interferer to the victim" kind="distance" units={U.distance} />
        )}
      </FieldGroup>
      <FieldGroup title="Propagation model">
        <ModelChooser prefix="model" />
      </FieldGroup>
      <FieldGroup title="The victim receiver">
        <QField path="victimAntennaGainDbi" label="Antenna gain toward the interferer" kind="gain" units={U.dbi} optional hint="Default 0 dBi." />
        <QField path="victimFeederLossDb" label="Feeder loss" kind="loss" units={U.db} optional />
        <ChoiceField
          path="victimNoise.kind"
          label="Noise of the receiver"
          options={[
            { value: 'noise-figure', label: 'From its bandwidth and noise figure (kTB + NF)' },
            { value: 'noise-power', label: 'A noise power' },
          ]}
        />
        {noise === 'noise-power' ? (
          <QField path="victimNoise.noiseDbm" label="Noise power" kind="power" units={U.dbm} />
        ) : (
          <>
            <QField path="victimNoise.bandwidthHz" label="Noise bandwidth" kind="bandwidth" units={U.bandwidth} />
            <QField path="victimNoise.noiseFigureDb" label="Noise figure" kind="loss" units={U.db} />
          </>
        )}
        <ChoiceField
          path="bandwidthOverlap.kind"
          label="Part of the interferer's power in the victim's channel"
          options={[
            { value: '', label: 'All of it' },
            { value: 'bandwidths', label: 'From the overlapping and the interferer’s bandwidths' },
            { value: 'loss', label: 'As a loss in dB' },
          ]}
        />
        {overlap === 'bandwidths' && (
          <>
            <QField path="bandwidthOverlap.overlapBandwidthHz" label="Overlapping bandwidth" kind="bandwidth" units={U.bandwidth} />
            <QField path="bandwidthOverlap.interfererBandwidthHz" label="Interferer's bandwidth" kind="bandwidth" units={U.bandwidth} />
          </>
        )}
        {overlap === 'loss' && <QField path="bandwidthOverlap.overlapLossDb" label="Bandwidth-overlap loss" kind="loss" units={U.db} />}
        <QField path="frequencyDependentRejectionDb" label="Frequency-dependent rejection" kind="loss" units={U.db} optional />
      </FieldGroup>
      <FieldGroup title="Protection criterion">
        <ChoiceField
          path="criterion.kind"
          label="Criterion"
          options={[
            { value: 'named', label: 'A named I/N criterion' },
            { value: 'inr', label: 'An I/N value of my own' },
          ]}
        />
        {criterion === 'inr' ? (
          <>
            <QField path="criterion.inrDb" label="I/N criterion" kind="loss" units={U.db} />
            <TextInputField path="criterion.description" label="Where it comes from" optional />
          </>
        ) : (
          <ChoiceField path="criterion.id" label="Named criterion" options={CRITERIA} />
        )}
      </FieldGroup>
    </>
  )
}

function overlapInputs(s: FormState): Record<string, unknown> | undefined {
  const k = s['bandwidthOverlap.kind']
  if (k === 'bandwidths')
    return compact({ kind: k, overlapBandwidthHz: quantityInput(s, 'bandwidthOverlap.overlapBandwidthHz', U.bandwidth), interfererBandwidthHz: quantityInput(s, 'bandwidthOverlap.interfererBandwidthHz', U.bandwidth) })
  if (k === 'loss') return compact({ kind: k, overlapLossDb: quantityInput(s, 'bandwidthOverlap.overlapLossDb', U.db) })
  return undefined
}

export const coexistenceForm: KindForm = {
  kind: 'coexistence',
  label: 'Coexistence: I/N at the victim receiver',
  purpose: 'Interference and I/N at the victim, desensitisation, and the EIRP reduction or separation that would meet the criterion.',
  initial: { 'model.kind': 'free-space', 'victimNoise.kind': 'noise-figure', 'criterion.kind': 'named', distanceFrom: 'typed' },
  Fields,
  toInputs: (s) =>
    compact({
      ...eirpSourceInputs(s, 'interfererEirpDbm'),
      ...(s.distanceFrom === 'positions'
        ? { victimPosition: positionInputs(s, 'victimPosition'), sourcePosition: positionInputs(s, 'sourcePosition') }
        : { distanceM: quantityInput(s, 'distanceM', U.distance) }),
      model: modelInputs(s, 'model', (p, u) => quantityInput(s, p, u)),
      victimAntennaGainDbi: quantityInput(s, 'victimAntennaGainDbi', U.dbi),
      victimFeederLossDb: quantityInput(s, 'victimFeederLossDb', U.db),
      bandwidthOverlap: overlapInputs(s),
      frequencyDependentRejectionDb: quantityInput(s, 'frequencyDependentRejectionDb', U.db),
      victimNoise:
        (s['victimNoise.kind'] ?? 'noise-figure') === 'noise-power'
          ? compact({ kind: 'noise-power', noiseDbm: quantityInput(s, 'victimNoise.noiseDbm', U.dbm) })
          : compact({ kind: 'noise-figure', bandwidthHz: quantityInput(s, 'victimNoise.bandwidthHz', U.bandwidth), noiseFigureDb: quantityInput(s, 'victimNoise.noiseFigureDb', U.db) }),
      criterion:
        (s['criterion.kind'] ?? 'named') === 'inr'
          ? compact({ kind: 'inr', inrDb: quantityInput(s, 'criterion.inrDb', U.db), description: textInput(s, 'criterion.description') })
          : { kind: 'named', id: textInput(s, 'criterion.id') ?? CRITERIA[0]!.value },
    }),
}

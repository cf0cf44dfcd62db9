/**
 * Compliance verdict: an EIRP (with its 95 % interval) against a limit — an entry of the
 * band-limit reference, or a limit stated with its citation (a station's licence).
 */
import { BAND_LIMITS } from '@shared/radio'
import { compact, quantityInput, textInput, type FormState } from '../lib/form-state'
import { U } from '../lib/units'
import { ChoiceField, FieldGroup, QField, TextInputField, useEstimateForm } from '../components/form-controls'
import type { EstimateSources, KindForm } from './kind-form'

const STATED_KINDS = [
  { value: 'eirp', label: 'EIRP' },
  { value: 'erp', label: 'ERP (EIRP − 2.15 dB)' },
  { value: 'conducted', label: 'Conducted power (plus the antenna gain)' },
]

function limitInputs(s: FormState): Record<string, unknown> {
  if (s['limit.source'] === 'station') return compact({ source: 'station', stationId: textInput(s, 'limit.stationId') })
  if ((s['limit.source'] ?? 'band-limit') === 'band-limit') return compact({ source: 'band-limit', bandLimitId: textInput(s, 'limit.bandLimitId') ?? BAND_LIMITS[0]?.id })
  const kind = s['limit.spec.kind'] ?? 'eirp'
  const spec =
    kind === 'erp'
      ? compact({ kind, erpDbm: quantityInput(s, 'limit.spec.erpDbm', U.dbm) })
      : kind === 'conducted'
        ? compact({ kind, conductedPowerDbm: quantityInput(s, 'limit.spec.conductedPowerDbm', U.dbm), gainRule: { kind: 'no-reduction' } })
        : compact({ kind, eirpDbm: quantityInput(s, 'limit.spec.eirpDbm', U.dbm) })
  return compact({ source: 'stated', spec, citation: textInput(s, 'limit.citation'), status: textInput(s, 'limit.status') })
}

function eirpInputs(s: FormState): Record<string, unknown> {
  const stored = textInput(s, 'eirpCalculationId')
  if (stored) return { eirpCalculationId: stored }
  return compact({ eirpDbm: quantityInput(s, 'eirpDbm', U.dbm), eirpIntervalDbm: intervalInputs(s) })
}

function intervalInputs(s: FormState): Record<string, unknown> | undefined {
  const low = quantityInput(s, 'eirpIntervalDbm.lowDbm', U.dbm)
  const high = quantityInput(s, 'eirpIntervalDbm.highDbm', U.dbm)
  return low === undefined && high === undefined ? undefined : { lowDbm: low, highDbm: high }
}

/** A licensed station (a candidate source) whose licence becomes the verdict's limit. */
export interface LicenceChoice {
  stationId: string
  stationCode: string
  licensee: string
}

/** The verdict form's entries with a station's licence as its limit (the record keeps a copy of the station's row). */
export function withLicenceLimit(state: FormState, station: LicenceChoice): FormState {
  return { ...state, 'limit.source': 'station', 'limit.stationId': station.stationId, 'limit.stationLabel': `${station.stationCode} (${station.licensee})` }
}

function Fields({ sources }: { sources: EstimateSources }) {
  const { state } = useEstimateForm()
  const source = state['limit.source'] ?? 'band-limit'
  const specKind = state['limit.spec.kind'] ?? 'eirp'
  const estimates = sources.eirpEstimates ?? []
  const fromStored = Boolean(state.eirpCalculationId)
  const stationLabel = state['limit.stationLabel']
  return (
    <>
      <FieldGroup title="The estimated EIRP">
        {estimates.length > 0 && (
          <div className="md:col-span-2">
            <ChoiceField
              path="eirpCalculationId"
              label="EIRP from"
              options={[{ value: '', label: 'Typed below' }, ...estimates.map((e) => ({ value: e.id, label: `Stored estimate: ${e.label}` }))]}
              hint="A stored estimate brings its own 95 % interval; the verdict keeps a copy of it."
            />
          </div>
        )}
        {!fromStored && (
          <>
        <QField path="eirpDbm" label="Estimated EIRP" kind="power" units={U.dbm} />
        <div className="hidden md:block" />
        <QField path="eirpIntervalDbm.lowDbm" label="95 % interval of the EIRP: low end" kind="power" units={U.dbm} optional />
        <QField path="eirpIntervalDbm.highDbm" label="95 % interval of the EIRP: high end" kind="power" units={U.dbm} optional />
          </>
        )}
      </FieldGroup>
      <FieldGroup title="The limit">
        <ChoiceField
          path="limit.source"
          label="Judge against"
          options={[
            { value: 'band-limit', label: 'An entry of the band-limit reference' },
            { value: 'stated', label: 'A limit stated with its citation (a licence)' },
            ...(state['limit.stationId'] ? [{ value: 'station', label: `The licence of station ${stationLabel ?? ''}`.trim() }] : []),
          ]}
        />
        {source === 'station' ? (
          <p className="self-end text-sm md:pb-3">
            The licence register's row for {stationLabel ?? 'the station'} gives the limit; the verdict keeps a copy of it.
          </p>
        ) : source === 'band-limit' ? (
          <ChoiceField
            path="limit.bandLimitId"
            label="Band-limit entry"
            options={BAND_LIMITS.map((b) => ({ value: b.id, label: `${b.title}${b.status.includes('[M]') ? ' [M] unverified' : ''}` }))}
          />
        ) : (
          <>
            <ChoiceField path="limit.spec.kind" label="The limit is on" options={STATED_KINDS} />
            {specKind === 'eirp' && <QField path="limit.spec.eirpDbm" label="EIRP limit" kind="power" units={U.dbm} />}
            {specKind === 'erp' && <QField path="limit.spec.erpDbm" label="ERP limit" kind="power" units={U.dbm} />}
            {specKind === 'conducted' && <QField path="limit.spec.conductedPowerDbm" label="Conducted power limit" kind="power" units={U.dbm} />}
            <TextInputField path="limit.citation" label="Citation of the limit" hint="The licence or regulation, with its clause." />
          </>
        )}
      </FieldGroup>
      <FieldGroup title="The installation" hint="Needed for limits on conducted power or spectral density.">
        <QField path="antennaGainDbi" label="Transmitting antenna gain" kind="gain" units={U.dbi} optional />
        <QField path="feederLossDb" label="Feeder loss" kind="loss" units={U.db} optional />
        <QField path="emissionBandwidthHz" label="Emission bandwidth" kind="bandwidth" units={U.bandwidth} optional />
      </FieldGroup>
    </>
  )
}

export const complianceVerdictForm: KindForm = {
  kind: 'compliance_verdict',
  label: 'Compliance verdict against a limit',
  purpose: 'Says whether an estimated EIRP exceeds a limit, is within it, or the interval cannot tell.',
  initial: { 'limit.source': 'band-limit' },
  Fields,
  toInputs: (s) =>
    compact({
      ...eirpInputs(s),
      limit: limitInputs(s),
      antennaGainDbi: quantityInput(s, 'antennaGainDbi', U.dbi),
      emissionBandwidthHz: quantityInput(s, 'emissionBandwidthHz', U.bandwidth),
      feederLossDb: quantityInput(s, 'feederLossDb', U.db),
    }),
}

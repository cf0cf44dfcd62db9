/** Field groups several kinds share: the EIRP typed or from a stored estimate, and points from measurements or typed. */
import { compact, quantityInput, textInput, type FormState } from '../lib/form-state'
import { U } from '../lib/units'
import { ChoiceField, QField, useEstimateForm } from '../components/form-controls'
import type { EstimateSources } from './kind-form'

/** The EIRP: a stored estimate of the case by id (the record keeps a copy), or typed. */
export function EirpSourceFields({ sources, path, label }: { sources: EstimateSources; path: string; label: string }) {
  const { state } = useEstimateForm()
  const estimates = sources.eirpEstimates ?? []
  return (
    <>
      {estimates.length > 0 && (
        <div className="md:col-span-2">
          <ChoiceField
            path="eirpCalculationId"
            label="EIRP from"
            options={[{ value: '', label: 'Typed below' }, ...estimates.map((e) => ({ value: e.id, label: `Stored estimate: ${e.label}` }))]}
          />
        </div>
      )}
      {!state.eirpCalculationId && <QField path={path} label={label} kind="power" units={U.dbm} />}
    </>
  )
}

export function eirpSourceInputs(s: FormState, key: string): Record<string, unknown> {
  const stored = textInput(s, 'eirpCalculationId')
  return stored ? { eirpCalculationId: stored } : compact({ [key]: quantityInput(s, key, U.dbm) })
}

/**
 * Whether the points come from the ticked measurements: yes as soon as some are ticked, unless
 * the investigator chose to type them (ticking measurements says which to use).
 */
export const fromMeasurements = (s: FormState, sources: EstimateSources) => (sources.measurements?.length ?? 0) > 0 && s.pointsFrom !== 'typed'

export function PointsFromField({ sources, what }: { sources: EstimateSources; what: string }) {
  const n = sources.measurements?.length ?? 0
  if (n === 0) return null
  return (
    <div className="md:col-span-2">
      <ChoiceField
        path="pointsFrom"
        label={`${what} from`}
        fallback="measurements"
        options={[
          { value: 'measurements', label: `The ${n} ticked measurement${n === 1 ? '' : 's'} of this case` },
          { value: 'typed', label: 'Typed below' },
        ]}
      />
    </div>
  )
}

export function PositionFields({ path, what, optional }: { path: string; what: string; optional?: boolean }) {
  return (
    <>
      <QField path={`${path}.latDeg`} label={`Latitude of ${what} (north +)`} kind="angle" units={U.angle} optional={optional} />
      <QField path={`${path}.lonDeg`} label={`Longitude of ${what} (east +)`} kind="angle" units={U.angle} optional={optional} />
    </>
  )
}

export function positionInputs(s: FormState, path: string): { latDeg?: string; lonDeg?: string } | undefined {
  const latDeg = quantityInput(s, `${path}.latDeg`, U.angle)
  const lonDeg = quantityInput(s, `${path}.lonDeg`, U.angle)
  return latDeg === undefined && lonDeg === undefined ? undefined : compact({ latDeg, lonDeg })
}

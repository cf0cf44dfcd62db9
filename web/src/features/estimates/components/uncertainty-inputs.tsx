/**
 * Uncertainty of the measurement (a budget of contributions in dB, after JCGM 100:2008) and of
 * the distance. Rows are kept in the form state as `<path>.<i>.…`, their count in `<path>#rows`.
 */
import { Button } from '@/components/ui/button'
import { quantityInput, textInput, type FormState } from '../lib/form-state'
import { removeRow, rowCount } from './rows-editor'
import { U } from '../lib/units'
import { ChoiceField, QField, TextInputField, useEstimateForm, FIELD_GRID } from './form-controls'

const DISTRIBUTIONS = [
  { value: 'normal', label: 'Normal: expanded uncertainty U and coverage factor k' },
  { value: 'rectangular', label: 'Rectangular: half-width a (u = a/√3)' },
  { value: 'u-shaped', label: 'U-shaped: half-width a (u = a/√2), e.g. mismatch' },
  { value: 'standard', label: 'Standard uncertainty u given directly' },
]


export function contributionsInputs(state: FormState, path: string): Record<string, unknown>[] | undefined {
  const n = rowCount(state, path)
  if (n === 0) return undefined
  return Array.from({ length: n }, (_, i) => {
    const row = `${path}.${i}`
    const kind = state[`${row}.distribution.kind`] ?? 'normal'
    const d = `${row}.distribution`
    const distribution =
      kind === 'normal'
        ? { kind, expandedUncertainty: quantityInput(state, `${d}.expandedUncertainty`, U.db), coverageFactor: quantityInput(state, `${d}.coverageFactor`, U.plain) }
        : kind === 'standard'
          ? { kind, standardUncertainty: quantityInput(state, `${d}.standardUncertainty`, U.db) }
          : { kind, halfWidth: quantityInput(state, `${d}.halfWidth`, U.db) }
    return { name: textInput(state, `${row}.name`), distribution }
  })
}

export function distanceUncertaintyInputs(state: FormState, path: string): Record<string, unknown> | undefined {
  const kind = state[`${path}.kind`] ?? ''
  if (kind === 'normal') return { kind, expandedUncertainty: quantityInput(state, `${path}.expandedUncertainty`, U.distance), coverageFactor: quantityInput(state, `${path}.coverageFactor`, U.plain) }
  if (kind === 'rectangular') return { kind, halfWidth: quantityInput(state, `${path}.halfWidth`, U.distance) }
  return undefined
}

function ContributionRow({ path, index, onRemove }: { path: string; index: number; onRemove: () => void }) {
  const { state } = useEstimateForm()
  const row = `${path}.${index}`
  const d = `${row}.distribution`
  const kind = state[`${d}.kind`] ?? 'normal'
  return (
    <li className="flex min-w-0 flex-col gap-3 rounded-control border border-rule p-3">
      <div className={FIELD_GRID}>
        <TextInputField path={`${row}.name`} label={`Contribution ${index + 1}: name`} hint="e.g. Receiver calibration, antenna factor, site" />
        <ChoiceField path={`${d}.kind`} label="Distribution" options={DISTRIBUTIONS} />
        {kind === 'normal' && (
          <>
            <QField path={`${d}.expandedUncertainty`} label="Expanded uncertainty U" kind="loss" units={U.db} hint="As the calibration certificate states it." />
            <QField path={`${d}.coverageFactor`} label="Coverage factor k" kind="loss" units={U.plain} hint="Usually 2 (about 95 %)." />
          </>
        )}
        {(kind === 'rectangular' || kind === 'u-shaped') && <QField path={`${d}.halfWidth`} label="Half-width a" kind="loss" units={U.db} />}
        {kind === 'standard' && <QField path={`${d}.standardUncertainty`} label="Standard uncertainty u" kind="loss" units={U.db} />}
      </div>
      <div>
        <Button variant="quiet" onClick={onRemove}>
          Remove contribution {index + 1}
        </Button>
      </div>
    </li>
  )
}

export function ContributionsEditor({ path, title }: { path: string; title: string }) {
  const { state, onChange } = useEstimateForm()
  const n = rowCount(state, path)
  return (
    <div className="flex min-w-0 flex-col gap-3 md:col-span-2">
      <p className="font-semibold">{title}</p>
      {n === 0 && <p className="text-sm text-ink-muted">None given: the result then has no interval, and says so.</p>}
      <ol className="flex flex-col gap-3">
        {Array.from({ length: n }, (_, i) => (
          <ContributionRow key={i} path={path} index={i} onRemove={() => onChange(removeRow(state, path, i))} />
        ))}
      </ol>
      <div>
        <Button variant="secondary" onClick={() => onChange({ ...state, [`${path}#rows`]: String(n + 1), [`${path}.${n}.distribution.kind`]: 'normal' })}>
          Add an uncertainty contribution
        </Button>
      </div>
    </div>
  )
}

export function DistanceUncertaintyFields({ path }: { path: string }) {
  const { state } = useEstimateForm()
  const kind = state[`${path}.kind`] ?? ''
  return (
    <>
      <ChoiceField
        path={`${path}.kind`}
        label="Uncertainty of the distance"
        options={[
          { value: '', label: 'Not given' },
          { value: 'normal', label: 'Normal: expanded uncertainty and k (e.g. GNSS)' },
          { value: 'rectangular', label: 'Rectangular: ± half-width (e.g. read off a map)' },
        ]}
      />
      {kind === 'normal' && (
        <>
          <QField path={`${path}.expandedUncertainty`} label="Expanded uncertainty of the distance" kind="distance" units={U.distance} />
          <QField path={`${path}.coverageFactor`} label="Coverage factor k of the distance" kind="loss" units={U.plain} hint="Usually 2." />
        </>
      )}
      {kind === 'rectangular' && <QField path={`${path}.halfWidth`} label="Half-width of the distance" kind="distance" units={U.distance} />}
    </>
  )
}

/**
 * Controls bound to an estimate form's flat state by input path: each shows the error the
 * schema (or the server) gives for its own path beside it.
 */
import { createContext, use, type ReactNode } from 'react'
import type { QuantityKind } from '@shared/schemas/quantities'
import { QuantityField } from '@/components/ui/quantity-field'
import { SelectField } from '@/components/ui/select-field'
import { TextField } from '@/components/ui/text-field'
import { quantityAt, withQuantity, type FieldErrors, type FormState } from '../lib/form-state'

export interface EstimateFormContext {
  state: FormState
  onChange: (next: FormState) => void
  errors: FieldErrors
  /** Prefix of every control's id and name, so two forms on a page never share an id. */
  idPrefix: string
  /** The paths of the controls rendered this time, so errors no control shows are listed apart. */
  shown: Set<string>
}

const Ctx = createContext<EstimateFormContext | null>(null)

export function EstimateFormProvider({ value, children }: { value: EstimateFormContext; children: ReactNode }) {
  return <Ctx value={value}>{children}</Ctx>
}

export function useEstimateForm(): EstimateFormContext {
  const c = use(Ctx)
  if (!c) throw new Error('An estimate control is outside its form.')
  return c
}

/** An error at this path, or the first one under it (a list row, a nested object). */
export function errorAt(errors: FieldErrors, path: string): string | undefined {
  return errors[path] ?? Object.entries(errors).find(([k]) => k.startsWith(`${path}.`))?.[1]
}

const fieldName = (prefix: string, path: string) => `${prefix}-${path.replace(/[^a-zA-Z0-9]+/g, '-')}`

export function QField(props: { path: string; label: string; kind: QuantityKind; units: readonly string[]; hint?: string; optional?: boolean }) {
  const { state, onChange, errors, idPrefix, shown } = useEstimateForm()
  shown.add(props.path)
  const label = props.optional ? `${props.label} (optional)` : props.label
  return (
    <QuantityField
      label={label}
      name={fieldName(idPrefix, props.path)}
      kind={props.kind}
      units={[...props.units]}
      value={quantityAt(state, props.path, props.units)}
      onChange={(v) => onChange(withQuantity(state, props.path, v))}
      hint={props.hint}
      error={errors[props.path]}
    />
  )
}

export function ChoiceField(props: {
  path: string
  label: string
  options: { value: string; label: string }[]
  hint?: string
  fallback?: string
  onPick?: (value: string) => FormState
  /** Other paths whose errors belong beside this control (the schema names the input the choice replaces). */
  alsoErrorsOf?: string[]
}) {
  const { state, onChange, errors, idPrefix, shown } = useEstimateForm()
  shown.add(props.path)
  for (const p of props.alsoErrorsOf ?? []) shown.add(p)
  return (
    <SelectField
      label={props.label}
      name={fieldName(idPrefix, props.path)}
      options={props.options}
      hint={props.hint}
      error={errorAt(errors, props.path) ?? props.alsoErrorsOf?.map((p) => errors[p]).find(Boolean)}
      value={state[props.path] ?? props.fallback ?? props.options[0]?.value ?? ''}
      onChange={(e) => onChange(props.onPick ? props.onPick(e.target.value) : { ...state, [props.path]: e.target.value })}
    />
  )
}

export function TextInputField(props: { path: string; label: string; hint?: string; optional?: boolean }) {
  const { state, onChange, errors, idPrefix, shown } = useEstimateForm()
  shown.add(props.path)
  return (
    <TextField
      label={props.optional ? `${props.label} (optional)` : props.label}
      name={fieldName(idPrefix, props.path)}
      hint={props.hint}
      error={errors[props.path]}
      value={state[props.path] ?? ''}
      autoComplete="off"
      onChange={(e) => onChange({ ...state, [props.path]: e.target.value })}
    />
  )
}

/**
 * The grid of a group of fields: one column on phones, two from md. Its items may shrink below
 * their content (a select's longest option would otherwise widen the page), selects fill them.
 */
export const FIELD_GRID = 'grid min-w-0 grid-cols-1 gap-4 md:grid-cols-2 [&>*]:min-w-0 [&_.flex-col>select]:w-full [&_.flex-col>select]:min-w-0'

/** A titled group of fields: two columns on wide screens, one on phones. */
export function FieldGroup({ title, children, hint }: { title: string; children: ReactNode; hint?: ReactNode }) {
  return (
    <fieldset className="flex min-w-0 flex-col gap-3 border-t border-rule pt-4">
      <legend className="pr-2 text-lg font-semibold">{title}</legend>
      {hint && <div className="text-sm text-ink-muted">{hint}</div>}
      <div className={FIELD_GRID}>{children}</div>
    </fieldset>
  )
}

/** Errors no rendered control shows (a path the form has no field for): listed in words, never dropped. */
export function UnplacedErrors() {
  const { errors, shown } = useEstimateForm()
  const placed = (path: string) => [...shown].some((p) => p === path || path.startsWith(`${p}.`))
  const rest = Object.entries(errors).filter(([path]) => !placed(path))
  if (rest.length === 0) return null
  return (
    <ul aria-label="Other problems with the inputs" className="list-disc rounded-control border-l-4 border-danger bg-danger-soft py-2 pr-3 pl-8 text-sm">
      {rest.map(([path, message]) => (
        <li key={path}>{message}</li>
      ))}
    </ul>
  )
}

/**
 * A number with its unit: the figure typed, and a unit selector beside it offering the units of
 * the quantity (shared/schemas/quantities.ts). The form sends `withUnit(figure, unit)` ("2 W"),
 * and the same strict reading runs in the browser (live values) and on the server (stored ones).
 * A unit typed after the figure wins over the selector, as the parser reads it.
 */
import type { Ref } from 'react'
import { unitsOf, type QuantityKind } from '@shared/schemas/quantities'
import { Field, controlAria, controlClass } from './field'

export interface QuantityValue {
  figure: string
  unit: string
}

export interface QuantityFieldProps {
  label: string
  name: string
  kind: QuantityKind
  value: QuantityValue
  onChange: (next: QuantityValue) => void
  hint?: string
  error?: string
  /** Units to offer instead of all of the quantity's (e.g. only dBm and W). */
  units?: string[]
  placeholder?: string
  disabled?: boolean
  ref?: Ref<HTMLInputElement>
}

/** The first value of a quantity field: empty, in the quantity's usual unit. */
export const emptyQuantity = (kind: QuantityKind, unit?: string): QuantityValue => ({ figure: '', unit: unit ?? unitsOf(kind)[0]! })

export function QuantityField({ label, name, kind, value, onChange, hint, error, units, placeholder, disabled, ref }: QuantityFieldProps) {
  const inputId = `field-${name}`
  const offered = units ?? unitsOf(kind)
  return (
    <Field id={inputId} label={label} hint={hint} error={error}>
      <div className="flex min-w-0 gap-2">
        <input
          ref={ref}
          id={inputId}
          name={name}
          inputMode="decimal"
          autoComplete="off"
          spellCheck={false}
          placeholder={placeholder}
          disabled={disabled}
          value={value.figure}
          onChange={(e) => onChange({ ...value, figure: e.target.value })}
          {...controlAria(inputId, hint, error)}
          className={`min-h-11 min-w-0 flex-1 ${controlClass(error)}`}
        />
        {offered.length > 1 ? (
          <select
            aria-label={`Unit of ${label.toLowerCase()}`}
            name={`${name}-unit`}
            disabled={disabled}
            value={value.unit}
            onChange={(e) => onChange({ ...value, unit: e.target.value })}
            className={`min-h-11 w-28 shrink-0 ${controlClass()}`}
          >
            {offered.map((u) => (
              <option key={u} value={u}>
                {u}
              </option>
            ))}
          </select>
        ) : (
          <span className="flex min-h-11 w-28 shrink-0 items-center px-1 text-ink-muted" aria-hidden="true">
            {offered[0]}
          </span>
        )}
      </div>
    </Field>
  )
}

/** A labelled native select (native: keyboard and screen-reader behaviour for free). */
import type { Ref, SelectHTMLAttributes } from 'react'
import { FieldError } from './text-field'

export interface SelectFieldProps extends SelectHTMLAttributes<HTMLSelectElement> {
  label: string
  name: string
  options: { value: string; label: string }[]
  hint?: string
  error?: string
  ref?: Ref<HTMLSelectElement>
}

export function SelectField({ label, name, options, hint, error, id, ref, ...rest }: SelectFieldProps) {
  const selectId = id ?? `field-${name}`
  const hintId = hint ? `${selectId}-hint` : undefined
  const errorId = error ? `${selectId}-error` : undefined
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={selectId} className="font-semibold">
        {label}
      </label>
      {hint && (
        <p id={hintId} className="text-sm text-ink-muted">
          {hint}
        </p>
      )}
      <select
        ref={ref}
        id={selectId}
        name={name}
        aria-invalid={error ? true : undefined}
        aria-describedby={[hintId, errorId].filter(Boolean).join(' ') || undefined}
        className={`min-h-11 rounded-control border bg-surface px-3 py-2 text-ink ${error ? 'border-danger border-2' : 'border-field'}`}
        {...rest}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      <FieldError id={errorId} message={error} />
    </div>
  )
}

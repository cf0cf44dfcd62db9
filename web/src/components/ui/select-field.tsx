/** A labelled native select (native: keyboard and screen-reader behaviour for free). */
import type { Ref, SelectHTMLAttributes } from 'react'
import { Field, controlAria, controlClass } from './field'

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
  return (
    <Field id={selectId} label={label} hint={hint} error={error}>
      <select
        ref={ref}
        id={selectId}
        name={name}
        {...controlAria(selectId, hint, error)}
        className={`min-h-11 ${controlClass(error)}`}
        {...rest}
      >
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </Field>
  )
}

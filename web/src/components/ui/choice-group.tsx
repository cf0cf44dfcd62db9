/**
 * A group of radio buttons or check boxes under one legend, with the group's error.
 * `inputProps` is react-hook-form's register() result (or plain name/onChange for filters).
 */
import type { InputHTMLAttributes, ReactNode, Ref } from 'react'
import { FieldError, FieldHint, describedBy } from './field'

export interface ChoiceGroupProps {
  legend: string
  name: string
  type: 'radio' | 'checkbox'
  options: { value: string; label: ReactNode }[]
  inputProps?: Omit<InputHTMLAttributes<HTMLInputElement>, 'type' | 'value'> & { ref?: Ref<HTMLInputElement> }
  /** For uncontrolled use outside react-hook-form: which values start checked. */
  defaultChecked?: readonly string[]
  hint?: string
  error?: string
  columns?: 1 | 2 | 3 | 4
}

export function ChoiceGroup({ legend, name, type, options, inputProps, defaultChecked, hint, error, columns = 1 }: ChoiceGroupProps) {
  const base = `field-${name}`
  const grid = columns === 4 ? 'sm:grid-cols-2 xl:grid-cols-4' : columns === 3 ? 'sm:grid-cols-3' : columns === 2 ? 'sm:grid-cols-2' : ''
  return (
    <fieldset aria-describedby={describedBy(base, hint, error)} className="flex flex-col gap-1">
      <legend className="mb-1 font-semibold">{legend}</legend>
      <FieldHint id={base} hint={hint} />
      <div className={`grid gap-x-4 gap-y-1 ${grid}`}>
        {options.map((o) => {
          const id = `${base}-${o.value}`
          return (
            <div key={o.value} className="flex min-h-11 items-center gap-3">
              <input
                id={id}
                type={type}
                value={o.value}
                name={name}
                defaultChecked={defaultChecked?.includes(o.value)}
                aria-invalid={error ? true : undefined}
                className="h-5 w-5 shrink-0 accent-signal"
                {...inputProps}
              />
              <label htmlFor={id}>{o.label}</label>
            </div>
          )
        })}
      </div>
      <FieldError id={`${base}-error`} message={error} />
    </fieldset>
  )
}

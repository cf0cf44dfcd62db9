/** A labelled input with its hint and its error tied to it for screen readers. */
import type { InputHTMLAttributes, Ref } from 'react'
import { Field, controlAria, controlClass } from './field'

export interface TextFieldProps extends InputHTMLAttributes<HTMLInputElement> {
  label: string
  name: string
  hint?: string
  error?: string
  ref?: Ref<HTMLInputElement>
}

export function TextField({ label, name, hint, error, id, ref, className = '', ...rest }: TextFieldProps) {
  const inputId = id ?? `field-${name}`
  return (
    <Field id={inputId} label={label} hint={hint} error={error}>
      <input
        ref={ref}
        id={inputId}
        name={name}
        {...controlAria(inputId, hint, error)}
        className={`min-h-11 ${controlClass(error)} ${className}`}
        {...rest}
      />
    </Field>
  )
}

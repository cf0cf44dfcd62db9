/** A labelled multi-line field, tied to its hint and error like TextField. */
import type { Ref, TextareaHTMLAttributes } from 'react'
import { Field, controlAria, controlClass } from './field'

export interface TextAreaFieldProps extends TextareaHTMLAttributes<HTMLTextAreaElement> {
  label: string
  name: string
  hint?: string
  error?: string
  ref?: Ref<HTMLTextAreaElement>
}

export function TextAreaField({ label, name, hint, error, id, ref, rows = 4, className = '', ...rest }: TextAreaFieldProps) {
  const fieldId = id ?? `field-${name}`
  return (
    <Field id={fieldId} label={label} hint={hint} error={error}>
      <textarea
        ref={ref}
        id={fieldId}
        name={name}
        rows={rows}
        {...controlAria(fieldId, hint, error)}
        className={`${controlClass(error)} ${className}`}
        {...rest}
      />
    </Field>
  )
}

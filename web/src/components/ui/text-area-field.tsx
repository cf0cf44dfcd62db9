/** A labelled multi-line field, tied to its hint and error like the shell's TextField. */
import type { Ref, TextareaHTMLAttributes } from 'react'
import { FieldError } from './text-field'

export interface TextAreaFieldProps extends TextareaHTMLAttributes<HTMLTextAreaElement> {
  label: string
  name: string
  hint?: string
  error?: string
  ref?: Ref<HTMLTextAreaElement>
}

export function TextAreaField({ label, name, hint, error, id, ref, rows = 4, className = '', ...rest }: TextAreaFieldProps) {
  const fieldId = id ?? `field-${name}`
  const hintId = hint ? `${fieldId}-hint` : undefined
  const errorId = error ? `${fieldId}-error` : undefined
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={fieldId} className="font-semibold">
        {label}
      </label>
      {hint && (
        <p id={hintId} className="text-sm text-ink-muted">
          {hint}
        </p>
      )}
      <textarea
        ref={ref}
        id={fieldId}
        name={name}
        rows={rows}
        aria-invalid={error ? true : undefined}
        aria-describedby={[hintId, errorId].filter(Boolean).join(' ') || undefined}
        className={`rounded-control border bg-surface px-3 py-2 text-ink ${error ? 'border-2 border-danger' : 'border-field'} ${className}`}
        {...rest}
      />
      <FieldError id={errorId} message={error} />
    </div>
  )
}

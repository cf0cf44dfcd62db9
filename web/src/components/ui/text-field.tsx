/** A labelled input with its hint and its error tied to it for screen readers. */
import type { InputHTMLAttributes, Ref } from 'react'
import { Sign } from './sign'

export interface TextFieldProps extends InputHTMLAttributes<HTMLInputElement> {
  label: string
  name: string
  hint?: string
  error?: string
  ref?: Ref<HTMLInputElement>
}

export function TextField({ label, name, hint, error, id, ref, className = '', ...rest }: TextFieldProps) {
  const inputId = id ?? `field-${name}`
  const hintId = hint ? `${inputId}-hint` : undefined
  const errorId = error ? `${inputId}-error` : undefined
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={inputId} className="font-semibold">
        {label}
      </label>
      {hint && (
        <p id={hintId} className="text-sm text-ink-muted">
          {hint}
        </p>
      )}
      <input
        ref={ref}
        id={inputId}
        name={name}
        aria-invalid={error ? true : undefined}
        aria-describedby={[hintId, errorId].filter(Boolean).join(' ') || undefined}
        className={`min-h-11 rounded-control border bg-surface px-3 py-2 text-ink ${error ? 'border-danger border-2' : 'border-field'} ${className}`}
        {...rest}
      />
      <FieldError id={errorId} message={error} />
    </div>
  )
}

/** Field error: announced as it appears, marked with a sign as well as colour. */
export function FieldError({ id, message }: { id?: string; message?: string }) {
  if (!message) return null
  return (
    <p id={id} role="alert" className="flex items-start gap-1.5 text-sm font-semibold text-danger">
      <Sign kind="danger" sizePx={16} />
      {message}
    </p>
  )
}

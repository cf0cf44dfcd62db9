/**
 * What every labelled control shares: the label, an optional hint, the error, and the ids that
 * tie hint and error to the control so screen readers read them with it.
 */
import type { ReactNode } from 'react'
import { Sign } from './sign'

/** The control's aria-describedby: its hint and its error, when there are any. */
export function describedBy(id: string, hint?: string, error?: string): string | undefined {
  return [hint && `${id}-hint`, error && `${id}-error`].filter(Boolean).join(' ') || undefined
}

/** A control's aria-*: invalid while it holds an error, described by its hint and error. */
export const controlAria = (id: string, hint?: string, error?: string) => ({
  'aria-invalid': error ? true : undefined,
  'aria-describedby': describedBy(id, hint, error),
})

/** Border of a text control: thicker and red while it holds an error. */
export const controlClass = (error?: string) =>
  `min-w-0 max-w-full rounded-control border bg-surface px-3 py-2 text-ink ${error ? 'border-2 border-danger' : 'border-field'}`

export function Field({ id, label, hint, error, children }: { id: string; label: string; hint?: string; error?: string; children: ReactNode }) {
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={id} className="font-semibold">
        {label}
      </label>
      <FieldHint id={id} hint={hint} />
      {children}
      <FieldError id={`${id}-error`} message={error} />
    </div>
  )
}

export function FieldHint({ id, hint }: { id: string; hint?: string }) {
  if (!hint) return null
  return (
    <p id={`${id}-hint`} className="text-sm text-ink-muted">
      {hint}
    </p>
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

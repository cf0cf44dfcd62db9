/**
 * Runs one action form's submit: sends the move with the case's current version, puts the
 * server's field errors beside the fields, keeps any other error for <MoveProblem>, and
 * announces success.
 */
import { useState } from 'react'
import type { FieldValues, Path, UseFormSetError } from 'react-hook-form'
import { applyFieldErrors } from '@/lib/form-errors'
import { useCaseActionContext } from './case-action-context'

export type CaseActionForm = ReturnType<typeof useCaseActionForm>

export function useCaseActionForm() {
  const ctx = useCaseActionContext()
  const [error, setError] = useState<unknown>(null)

  async function run<T extends FieldValues>(options: {
    send: (version: number) => Promise<unknown>
    success: string
    setFieldError?: UseFormSetError<T>
    fields?: readonly Path<T>[]
    after?: () => void
  }): Promise<void> {
    setError(null)
    try {
      await options.send(ctx.detail.version)
      options.after?.()
      ctx.announce(options.success)
    } catch (e) {
      if (options.setFieldError && options.fields && applyFieldErrors({ error: e, setError: options.setFieldError, fields: options.fields })) return
      setError(e)
    }
  }

  const reload = () => {
    setError(null)
    ctx.reload()
  }

  return { ...ctx, error, run, reload }
}

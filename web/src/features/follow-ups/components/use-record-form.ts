/**
 * A small form's state for these records: its values, the server's field errors (400
 * validation_failed, placed beside the fields) and its own problem for anything else.
 */
import { useState } from 'react'
import { isApiError } from '@/lib/api-client'
import { formProblem, type FormProblem } from '@/lib/form-errors'

export function useRecordForm<V extends Record<string, string>>(initial: V) {
  const [values, setValues] = useState<V>(initial)
  const [errors, setErrors] = useState<Partial<Record<keyof V, string>>>({})
  const [problem, setProblem] = useState<FormProblem | null>(null)
  const [submitting, setSubmitting] = useState(false)
  const field = (name: keyof V & string) => ({
    name,
    value: values[name],
    error: errors[name],
    onChange: (e: { target: { value: string } }) => setValues((v) => ({ ...v, [name]: e.target.value })),
  })
  /** Sends; on a 400 puts each issue beside its field (or in the form's alert when no field has it). */
  const submit = async (send: (v: V) => Promise<unknown>, after?: () => void) => {
    setSubmitting(true)
    setProblem(null)
    setErrors({})
    try {
      await send(values)
      setValues(initial)
      after?.()
    } catch (error) {
      const fieldErrors: Partial<Record<keyof V, string>> = {}
      const loose: string[] = []
      if (isApiError(error)) {
        for (const d of error.details) {
          if (d.path in initial) fieldErrors[d.path as keyof V] ??= d.message
          else loose.push(d.message)
        }
      }
      setErrors(fieldErrors)
      if (Object.keys(fieldErrors).length === 0 || loose.length > 0) setProblem(loose.length > 0 ? { message: loose.join(' '), requestId: null } : formProblem(error))
    } finally {
      setSubmitting(false)
    }
  }
  return { values, field, submit, problem, submitting }
}

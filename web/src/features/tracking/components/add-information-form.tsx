/** The complainant adds what they noticed since (new times, places, recordings described). */
import { zodResolver } from '@hookform/resolvers/zod'
import { useRef, useState } from 'react'
import { useForm } from 'react-hook-form'
import type { z } from 'zod'
import { complainantInfoSchema } from '@shared/schemas/cases'
import { FormAlert } from '@/components/ui/form-alert'
import { SubmitButton } from '@/components/ui/submit-button'
import { applyFieldErrors, formProblem, type FormProblem } from '@/lib/form-errors'
import { TextAreaField } from '@/components/ui/text-area-field'
import { useAddInformation } from '../api/add-information'
import type { ReportSource } from '../api/get-complainant-report'

type Input = z.input<typeof complainantInfoSchema>

export function AddInformationForm({ source }: { source: ReportSource }) {
  const { register, handleSubmit, setError, reset, formState } = useForm<Input>({ resolver: zodResolver(complainantInfoSchema), defaultValues: { body: '' } })
  const add = useAddInformation(source)
  const [problem, setProblem] = useState<FormProblem | null>(null)
  const [done, setDone] = useState(false)
  const doneRef = useRef<HTMLParagraphElement>(null)

  const onSubmit = handleSubmit(async ({ body }) => {
    setProblem(null)
    setDone(false)
    try {
      await add.mutateAsync(body)
      reset()
      setDone(true)
      requestAnimationFrame(() => doneRef.current?.focus())
    } catch (error) {
      if (applyFieldErrors({ error, setError, fields: ['body'] })) return
      setProblem(formProblem(error))
    }
  })

  return (
    <form noValidate onSubmit={onSubmit} className="flex flex-col gap-4">
      <TextAreaField
        label="Information to add"
        hint="For example: new times it happened, other places where you notice it, what changed. The office reads it with your report."
        error={formState.errors.body?.message}
        {...register('body')}
      />
      <FormAlert problem={problem} />
      <div className="flex flex-wrap items-center gap-4">
        <SubmitButton submitting={formState.isSubmitting} pendingLabel="Adding…">
          Add information
        </SubmitButton>
        <p ref={doneRef} tabIndex={-1} role="status" className="font-semibold text-ok focus:outline-none">
          {done ? 'Added. The office can read it now.' : ''}
        </p>
      </div>
    </form>
  )
}

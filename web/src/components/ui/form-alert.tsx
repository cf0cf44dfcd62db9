/** The form's own problem (not tied to one field), announced when it appears. */
import type { FormProblem } from '@/lib/form-errors'
import { Notice } from './notice'
import { RequestId } from './request-id'

export function FormAlert({ problem }: { problem: FormProblem | null }) {
  if (!problem) return null
  return (
    <Notice tone="danger" live>
      <p className="font-semibold">{problem.message}</p>
      <RequestId id={problem.requestId} />
    </Notice>
  )
}

/**
 * Why a move did not go through. A stale version gets its own words and a reload button;
 * a move the state no longer allows shows the server's message; anything else, plainly.
 */
import { Button } from '@/components/ui/button'
import { Notice } from '@/components/ui/notice'
import { RequestId } from '@/components/ui/request-id'
import { isApiError } from '@/lib/api-client'
import { formProblem } from '@/lib/form-errors'

export function MoveProblem({ error, onReload, reloading }: { error: unknown; onReload: () => void; reloading: boolean }) {
  if (!error) return null
  if (isApiError(error) && error.code === 'stale_version') {
    return (
      <Notice tone="caution" title="Someone else changed this case a moment ago." live>
        <p>Reload it to see their change, then decide again.</p>
        <div>
          <Button variant="secondary" onClick={onReload} disabled={reloading}>
            {reloading ? 'Reloading…' : 'Reload case'}
          </Button>
        </div>
      </Notice>
    )
  }
  const problem = formProblem(error)
  return (
    <Notice tone="danger" title={isApiError(error) && (error.code === 'invalid_transition' || error.code === 'holds_merged_reports') ? 'Not possible now.' : 'That did not go through.'} live>
      <p>{problem.message}</p>
      <RequestId id={problem.requestId} />
    </Notice>
  )
}

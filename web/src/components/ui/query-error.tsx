/** What a page shows when its data could not be loaded: the server's words, its request id, a retry. */
import { isApiError } from '@/lib/api-client'
import { Button } from './button'
import { Notice } from './notice'
import { RequestId } from './request-id'

export function QueryError({ error, what, title, onRetry }: { error: unknown; what: string; title?: string; onRetry?: () => void }) {
  const message = error instanceof Error ? error.message : 'Unknown error.'
  return (
    <Notice tone="danger" title={title ?? `Could not load ${what}.`} live>
      <p>{message}</p>
      <RequestId id={isApiError(error) ? error.requestId : null} />
      {onRetry && (
        <div>
          <Button variant="secondary" onClick={onRetry}>
            Try again
          </Button>
        </div>
      )}
    </Notice>
  )
}

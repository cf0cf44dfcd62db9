/**
 * Route error boundary. `standalone` is the outermost one, used only if the frame itself
 * fails; it draws its own minimal frame.
 */
import { Link, isRouteErrorResponse, useRouteError } from 'react-router-dom'
import { buttonClass } from '@/components/ui/button'
import { PageHeader } from '@/components/ui/page-header'
import { RequestId } from '@/components/ui/request-id'
import { isApiError } from '@/lib/api-client'
import { paths } from '@/lib/paths'

export function RouteError({ standalone = false }: { standalone?: boolean }) {
  const error = useRouteError()
  const content = isRouteErrorResponse(error) && error.status === 404 ? <NotFoundContent /> : <ErrorContent error={error} />
  if (!standalone) return content
  return (
    <div className="flex flex-1 flex-col">
      <div className="bg-ink px-4 py-3 text-xl font-bold text-paper">Quietband</div>
      <main className="mx-auto w-full max-w-page px-4 py-8">{content}</main>
    </div>
  )
}

function ErrorContent({ error }: { error: unknown }) {
  const requestId = isApiError(error) ? error.requestId : ((error as { requestId?: unknown } | null)?.requestId ?? null)
  // After a new release, an old page may ask for code that no longer exists: a reload fixes it.
  const staleCode = error instanceof TypeError && /dynamically imported module|Importing a module script failed/i.test(error.message)
  return (
    <div className="max-w-2xl">
      <PageHeader
        title="Something went wrong on this page"
        lead={
          <p>
            {staleCode
              ? 'Quietband has been updated since this page was opened. Reload to get the new version.'
              : 'Reload the page, or go back to the start. If it happens again, tell your administrator and quote the request id if one is shown below.'}
          </p>
        }
      />
      <div className="mb-5">
        <RequestId id={typeof requestId === 'string' ? requestId : null} />
      </div>
      <div className="flex flex-wrap gap-3">
        <button type="button" className={buttonClass('primary')} onClick={() => window.location.reload()}>
          Reload the page
        </button>
        <Link to={paths.home.href()} className={buttonClass('secondary')}>
          Go to the start
        </Link>
      </div>
    </div>
  )
}

export function NotFoundContent() {
  return (
    <div className="max-w-2xl">
      <PageHeader title="Page not found" lead={<p>There is no page at this address. It may have been mistyped, or the link is out of date.</p>} />
      <Link to={paths.home.href()} className={buttonClass('secondary')}>
        Go to the start
      </Link>
    </div>
  )
}

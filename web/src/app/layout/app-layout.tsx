/** The frame around every page: header with nav and account, the page, the caution footer. */
import { Link, Outlet, ScrollRestoration, useMatches, useNavigation } from 'react-router-dom'
import { EstimateCaution } from '@/components/cautions/estimate-caution'
import { paths } from '@/lib/paths'
import { useAbilities, useMe } from '@/features/auth/api/get-me'
import { AccountArea } from './account-area'
import { MainNav } from './main-nav'
import { Wordmark } from './wordmark'

export function AppLayout() {
  const me = useMe()
  // If /api/me fails (server down), the site still works as for an anonymous visitor.
  const user = me.data ?? null
  const abilities = useAbilities().data
  const navigating = useNavigation().state === 'loading'
  // lists use the whole width of the screen (a route says so with `handle = { wide: true }`)
  const wide = useMatches().some((m) => (m.handle as { wide?: boolean } | undefined)?.wide === true)
  return (
    <>
      <SkipLink />
      <header className="on-ink bg-ink text-paper">
        <div
          aria-hidden="true"
          className={`h-1 bg-signal-soft transition-opacity ${navigating ? 'animate-pulse opacity-100' : 'opacity-0'}`}
        />
        <div className="mx-auto flex max-w-page flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2">
          <Wordmark />
          <MainNav abilities={user && abilities ? abilities : null} pending={me.isPending} />
          {user && (
            <div className="ml-auto">
              <AccountArea user={user} />
            </div>
          )}
        </div>
      </header>
      <main id="main" tabIndex={-1} className={`mx-auto w-full flex-1 px-4 py-8 focus:outline-none ${wide ? 'max-w-none lg:px-8' : 'max-w-page'}`}>
        <Outlet />
      </main>
      <Footer />
      <ScrollRestoration />
    </>
  )
}

function SkipLink() {
  return (
    <a
      href="#main"
      className="sr-only z-10 bg-surface px-4 py-2 font-semibold focus:not-sr-only focus:absolute focus:left-2 focus:top-2"
    >
      Skip to content
    </a>
  )
}

function Footer() {
  return (
    <footer className="border-t border-rule bg-surface text-ink">
      <div className="mx-auto flex max-w-page flex-col gap-3 px-4 py-5">
        <EstimateCaution variant="footer" />
        <p className="text-sm text-ink-muted">Quietband — harmful-interference complaints, from first report to a closed case.</p>
        <p className="text-sm">
          <Link to={paths.apiReference.href()}>API reference for integrators</Link>
        </p>
      </div>
    </footer>
  )
}

/** Shown for the moment before the first page's code arrives. */
export function ShellFallback() {
  return (
    <div className="flex flex-1 flex-col">
      <div className="h-14 bg-ink" />
      <p role="status" className="mx-auto w-full max-w-page px-4 py-8 text-ink-muted">
        Loading Quietband…
      </p>
    </div>
  )
}

/**
 * Renders a page of the web app as the browser would: the app's QueryClient (made by the
 * app's own factory, fresh for each render) and a data router in memory starting at a given
 * URL. The router is returned so a test can read the URL the page wrote, and `settled()`
 * waits until no query is loading, so a test can say what is *not* on the page once it has
 * everything it asked for.
 */
import { QueryClientProvider } from '@tanstack/react-query'
import { render, waitFor } from '@testing-library/react'
import userEvent from '@testing-library/user-event'
import type { ComponentType } from 'react'
import { createMemoryRouter, RouterProvider } from 'react-router-dom'
import { expect } from 'vitest'
import { createQueryClient } from '@/lib/query-client'

export interface PageRoute {
  /** The route pattern, e.g. `/cases/:id`. */
  path: string
  Component: ComponentType
}

export function renderPage(options: { url: string; routes: PageRoute[] }) {
  const router = createMemoryRouter(
    options.routes.map((r) => ({ path: r.path, Component: r.Component })),
    { initialEntries: [options.url] },
  )
  const queryClient = createQueryClient()
  // no pause between keystrokes: the forms react to each one all the same
  const user = userEvent.setup({ delay: null })
  const view = render(
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>,
  )
  /** The current URL's path and query, as the address bar would show them. */
  const currentUrl = () => `${router.state.location.pathname}${router.state.location.search}`
  const settled = () => waitFor(() => expect(queryClient.isFetching()).toBe(0))
  return { ...view, user, router, queryClient, currentUrl, settled }
}

import { screen, within } from '@testing-library/react'
import { afterEach, describe, expect, it, vi } from 'vitest'
import { Component as CasesPage } from '@/app/routes/cases'
import { paths } from '@/lib/paths'
import { answer } from '../support/msw-server'
import { caseListItem, casePage, officesResponse, staffResponse } from '../support/msw-views'
import { renderPage } from '../support/web-render'

/** A screen of the given width, as far as CSS media queries are concerned. */
function screenWidthPx(widthPx: number) {
  vi.stubGlobal('matchMedia', (query: string) => {
    const min = /min-width:\s*(\d+)px/.exec(query)
    return { matches: min ? widthPx >= Number(min[1]) : false, media: query, addEventListener: () => {}, removeEventListener: () => {} }
  })
}

function serveTheList() {
  answer('get', '/api/offices', officesResponse())
  answer('get', '/api/staff', staffResponse())
  answer('get', '/api/me/saved-views', { views: [] })
  answer('get', '/api/cases', () => casePage([caseListItem({ overdue: true }), caseListItem({ id: '00000000-0000-4000-8000-0000000000c2', reference: 'QB-26-000413', priority: 1 })], { total: 2 }))
}

afterEach(() => vi.unstubAllGlobals())

describe('the case list on a phone', () => {
  it('shows one card per case instead of a table, with the reference, harm class and due time', async () => {
    screenWidthPx(390)
    serveTheList()
    renderPage({ url: '/cases', routes: [{ path: paths.cases.path, Component: CasesPage }] })

    const cards = await screen.findByRole('list', { name: 'Cases' })
    expect(screen.queryByRole('table')).toBeNull()
    const items = within(cards).getAllByRole('listitem')
    expect(items).toHaveLength(2)
    expect(within(items[0]!).getByRole('link', { name: 'QB-26-000412' })).toHaveAttribute('href', paths.case.href(caseListItem().id))
    expect(items[0]).toHaveTextContent('Service lost')
    expect(items[0]).toHaveTextContent(/Overdue/)
    expect(items[1]).toHaveTextContent('Safety of life')
    expect(items[1]).not.toHaveTextContent(/Overdue/)
  })

  it('keeps the filters in a closed drawer above the results, and lists the active ones in words', async () => {
    screenWidthPx(390)
    serveTheList()
    const { user } = renderPage({ url: '/cases?open=true&priority=1', routes: [{ path: paths.cases.path, Component: CasesPage }] })

    await screen.findByRole('list', { name: 'Cases' })
    const toggle = screen.getByRole('button', { name: /^Filters/ })
    expect(toggle).toHaveAttribute('aria-expanded', 'false')
    expect(toggle).toHaveTextContent('2')
    expect(screen.queryByRole('search', { name: 'Filter cases' })).toBeNull()
    expect(screen.getByText(/Showing:/).parentElement).toHaveTextContent('Safety of life · Open only')

    await user.click(toggle)
    expect(toggle).toHaveAttribute('aria-expanded', 'true')
    expect(screen.getByRole('search', { name: 'Filter cases' })).toBeInTheDocument()
  })

  it('shows the table from 640 px up', async () => {
    screenWidthPx(640)
    serveTheList()
    renderPage({ url: '/cases', routes: [{ path: paths.cases.path, Component: CasesPage }] })
    expect(await screen.findByRole('table', { name: /^Cases\./ })).toBeInTheDocument()
    expect(screen.queryByRole('list', { name: 'Cases' })).toBeNull()
  })
})

describe('saved views of the case list', () => {
  it('saves the list as it is under a name, then offers it as a link to the same filters', async () => {
    screenWidthPx(1440)
    answer('get', '/api/offices', officesResponse())
    answer('get', '/api/staff', staffResponse())
    answer('get', '/api/cases', () => casePage([caseListItem()], { total: 1 }))
    const stored: { id: string; name: string; listQuery: string; createdAt: string }[] = []
    answer('get', '/api/me/saved-views', () => ({ views: stored }))
    const posts = answer(
      'post',
      '/api/me/saved-views',
      (req) => {
        const body = req.body as { name: string; listQuery: string }
        const view = { id: '00000000-0000-4000-8000-00000000a001', ...body, createdAt: '2026-12-05T06:00:00.000Z' }
        stored.push(view)
        return { view }
      },
      { status: 201 },
    )
    const { user } = renderPage({ url: '/cases?overdue=true&sort=dueAt&dir=asc&page=3', routes: [{ path: paths.cases.path, Component: CasesPage }] })
    await screen.findByRole('table', { name: /^Cases\./ })
    await user.click(screen.getByRole('button', { name: /^Filters/ }))
    expect(await screen.findByText(/None yet/)).toBeInTheDocument()

    await user.click(screen.getByRole('button', { name: 'Save this view' }))
    expect(await screen.findByText('Give the view a name.')).toBeInTheDocument()
    expect(posts).toHaveLength(0)

    await user.type(screen.getByRole('textbox', { name: 'Name of this view' }), 'Late, oldest first')
    await user.click(screen.getByRole('button', { name: 'Save this view' }))

    // the view keeps the filters and the sort, and starts on the first page
    expect(await screen.findByRole('status')).toHaveTextContent('Saved as “Late, oldest first”.')
    expect(posts[0]!.body).toEqual({ name: 'Late, oldest first', listQuery: 'overdue=true&sort=dueAt&dir=asc' })
    expect(await screen.findByRole('link', { name: 'Late, oldest first' })).toHaveAttribute('href', '/cases?overdue=true&sort=dueAt&dir=asc')
    expect(screen.getByRole('button', { name: 'Remove the view Late, oldest first' })).toBeInTheDocument()
  })
})

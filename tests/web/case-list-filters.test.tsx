import { act, screen, waitFor } from '@testing-library/react'
import { describe, expect, it } from 'vitest'
import { CASE_STATE_LABELS } from '../../shared/domain/case-lifecycle'
import { caseListQuerySchema } from '../../shared/schemas/cases'
import { Component as CasesPage } from '@/app/routes/cases'
import { paths } from '@/lib/paths'
import { answer, type SeenRequest } from '../support/msw-server'
import { caseListItem, casePage, IDS, officesResponse, staffResponse } from '../support/msw-views'
import { renderPage } from '../support/web-render'

/** Serves the list page: one office, its staff, and one page of cases (`total` of them in all). */
function serveTheList(options: { total?: number } = {}) {
  answer('get', '/api/offices', officesResponse())
  answer('get', '/api/staff', staffResponse())
  answer('get', '/api/me/saved-views', { views: [] })
  return answer('get', '/api/cases', (request) => {
    const page = Number(request.url.searchParams.get('page') ?? 1)
    return casePage([caseListItem()], { page, total: options.total ?? 1 })
  })
}

async function openTheList(url: string) {
  const page = renderPage({ url, routes: [{ path: paths.cases.path, Component: CasesPage }] })
  await screen.findByRole('table', { name: /^Cases\./ })
  // the filters sit in a drawer above the results
  await page.user.click(screen.getByRole('button', { name: /^Filters/ }))
  return page
}

/** A URL's query as a plain object. */
const queryOf = (url: string) => Object.fromEntries(new URL(url, 'http://localhost').searchParams)

/** What the server reads from a request to the case list, through the server's own parser. */
const serverReads = (request: SeenRequest) => caseListQuerySchema.parse(Object.fromEntries(request.url.searchParams))

const last = <T,>(list: T[]) => list[list.length - 1]!

describe('the case list’s filters', () => {
  it('write the chosen filters to the URL, and the list asks the API for them', async () => {
    const requests = serveTheList()
    const { user, currentUrl } = await openTheList('/cases')

    await user.type(screen.getByRole('searchbox', { name: 'Search' }), 'harbour')
    await user.click(screen.getByRole('checkbox', { name: CASE_STATE_LABELS.assigned }))
    await user.click(screen.getByRole('checkbox', { name: CASE_STATE_LABELS.field_work }))
    await user.click(screen.getByRole('checkbox', { name: 'Safety of life' }))
    await user.selectOptions(screen.getByRole('combobox', { name: 'Service' }), 'maritime')
    await user.selectOptions(screen.getByRole('combobox', { name: 'Investigator' }), 'Ilse Brannock')
    await user.selectOptions(screen.getByRole('combobox', { name: 'Open or closed' }), 'Open only')
    await user.type(screen.getByRole('textbox', { name: 'Frequency from' }), '156')
    await user.type(screen.getByRole('textbox', { name: 'Frequency to' }), '157,5')
    await user.click(screen.getByRole('button', { name: 'Apply filters' }))

    await waitFor(() => expect(currentUrl()).not.toBe('/cases'))
    expect(queryOf(currentUrl())).toEqual({
      q: 'harbour',
      status: 'assigned,field_work',
      priority: '1',
      service: 'maritime',
      investigatorId: IDS.investigatorIlse,
      open: 'true',
      freqFrom: '156',
      freqTo: '157.5',
    })
    await waitFor(() => expect(requests.length).toBe(2))
    expect(serverReads(last(requests))).toEqual({
      page: 1,
      pageSize: 25,
      sort: 'receivedAt',
      dir: 'desc',
      q: 'harbour',
      status: ['assigned', 'field_work'],
      priority: [1],
      service: ['maritime'],
      investigatorId: IDS.investigatorIlse,
      open: true,
      freqFromHz: 156_000_000,
      freqToHz: 157_500_000,
    })
  })

  it('are restored from a URL, and the list asks the API for the same', async () => {
    const requests = serveTheList({ total: 60 })
    await openTheList('/cases?q=mast&status=returned&priority=1,2&service=amateur&overdue=true&freqFrom=7&freqTo=7.2&sort=dueAt&dir=asc&page=2')

    expect(screen.getByRole('searchbox', { name: 'Search' })).toHaveValue('mast')
    expect(screen.getByRole('checkbox', { name: CASE_STATE_LABELS.returned })).toBeChecked()
    expect(screen.getByRole('checkbox', { name: CASE_STATE_LABELS.assigned })).not.toBeChecked()
    expect(screen.getByRole('checkbox', { name: 'Safety of life' })).toBeChecked()
    expect(screen.getByRole('checkbox', { name: 'Service lost' })).toBeChecked()
    expect(screen.getByRole('checkbox', { name: 'Service degraded' })).not.toBeChecked()
    expect(screen.getByRole('combobox', { name: 'Service' })).toHaveValue('amateur')
    expect(screen.getByRole('combobox', { name: 'Overdue' })).toHaveValue('true')
    expect(screen.getByRole('combobox', { name: 'Open or closed' })).toHaveValue('')
    expect(screen.getByRole('textbox', { name: 'Frequency from' })).toHaveValue('7')
    expect(screen.getByRole('textbox', { name: 'Frequency to' })).toHaveValue('7.2')
    expect(screen.getByText(/Page 2 of 3/)).toBeInTheDocument()

    expect(requests).toHaveLength(1)
    expect(serverReads(requests[0]!)).toEqual({
      page: 2,
      pageSize: 25,
      sort: 'dueAt',
      dir: 'asc',
      q: 'mast',
      status: ['returned'],
      priority: [1, 2],
      service: ['amateur'],
      overdue: true,
      freqFromHz: 7_000_000,
      freqToHz: 7_200_000,
    })
  })

  it('start again from the first page when they change, keeping the sort', async () => {
    const requests = serveTheList({ total: 60 })
    const { user, currentUrl } = await openTheList('/cases?sort=priority&dir=asc&page=3')

    await user.click(screen.getByRole('checkbox', { name: CASE_STATE_LABELS.received }))
    await user.click(screen.getByRole('button', { name: 'Apply filters' }))

    await waitFor(() => expect(queryOf(currentUrl())).toEqual({ status: 'received', sort: 'priority', dir: 'asc' }))
    await waitFor(() => expect(requests.length).toBe(2))
    expect(serverReads(last(requests))).toMatchObject({ page: 1, sort: 'priority', dir: 'asc', status: ['received'] })
  })

  it('leave out of the API query what a hand-edited URL gets wrong', async () => {
    const requests = serveTheList()
    await openTheList('/cases?status=lost&priority=9&service=amateur,telepathy&investigatorId=somebody&page=-4')

    expect(requests).toHaveLength(1)
    expect(queryOf(requests[0]!.url.href)).toEqual({ page: '1', pageSize: '25', sort: 'receivedAt', dir: 'desc', service: 'amateur' })
    expect(screen.getByRole('combobox', { name: 'Service' })).toHaveValue('amateur')
  })

  it('are all cleared by "Clear filters", which empties the URL and the query', async () => {
    const requests = serveTheList()
    const { user, currentUrl } = await openTheList('/cases?status=closed&q=mast')

    await user.click(screen.getByRole('link', { name: 'Clear filters' }))

    await waitFor(() => expect(currentUrl()).toBe('/cases'))
    await waitFor(() => expect(requests.length).toBe(2))
    expect(queryOf(last(requests).url.href)).toEqual({ page: '1', pageSize: '25', sort: 'receivedAt', dir: 'desc' })
    expect(screen.getByRole('checkbox', { name: CASE_STATE_LABELS.closed })).not.toBeChecked()
    expect(screen.getByRole('searchbox', { name: 'Search' })).toHaveValue('')
  })

  it('follow the browser back to the filters of the previous URL', async () => {
    serveTheList()
    const { user, router, currentUrl } = await openTheList('/cases?status=assigned')

    await user.click(screen.getByRole('checkbox', { name: CASE_STATE_LABELS.assigned }))
    await user.click(screen.getByRole('checkbox', { name: CASE_STATE_LABELS.closed }))
    await user.click(screen.getByRole('button', { name: 'Apply filters' }))
    await waitFor(() => expect(queryOf(currentUrl())).toEqual({ status: 'closed' }))
    expect(screen.getByRole('checkbox', { name: CASE_STATE_LABELS.closed })).toBeChecked()

    await act(() => router.navigate(-1))

    expect(queryOf(currentUrl())).toEqual({ status: 'assigned' })
    expect(screen.getByRole('checkbox', { name: CASE_STATE_LABELS.assigned })).toBeChecked()
    expect(screen.getByRole('checkbox', { name: CASE_STATE_LABELS.closed })).not.toBeChecked()
  })
})

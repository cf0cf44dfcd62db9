/**
 * The dashboard page: it shows the API's figures, each a link to the case list filtered to
 * exactly the cases it counts (the filters of shared/domain/dashboard-figures.ts, as the list
 * reads its address); an administrator's office filter asks again for one office and keeps it
 * in the address. The uPlot canvas is replaced (jsdom draws no canvas); its props are recorded.
 */
import { screen, waitFor, within } from '@testing-library/react'
import { describe, expect, it, vi } from 'vitest'
import { dashboardViewSchema, type DashboardView } from '../../shared/schemas/dashboard'
import { meResponseSchema, NO_ACCOUNT_ABILITIES } from '../../shared/schemas/auth'
import { OPEN_STATES } from '../../shared/domain/case-lifecycle'
import type { PerformanceChartProps } from '@/components/charts'
import { Component as DashboardPage } from '@/app/routes/dashboard'
import { parseListState } from '@/lib/case-list-query'
import { paths } from '@/lib/paths'
import { answer } from '../support/msw-server'
import { regionMapResponse } from '../support/msw-views'
import { renderPage } from '../support/web-render'

const charts: PerformanceChartProps[] = []
vi.mock('@/components/charts/uplot/performance-chart', () => ({
  default: (props: PerformanceChartProps) => {
    charts.push(props)
    return <div data-testid="performance-chart">{props.title}</div>
  },
}))

const OFFICE = '00000000-0000-4000-8000-000000000001'
const OTHER = '00000000-0000-4000-8000-000000000002'
const INV = '00000000-0000-4000-8000-0000000000b1'

function view(officeId: string | null): DashboardView {
  const offices = [
    { id: OFFICE, name: 'Harrowmere Field Office', timeZone: 'Atlantic/Azores', centreLatDeg: 48.1, centreLonDeg: -31.4, area: null, firstResponseTargetsHours: { p1: 1, p2: 8, p3: 24, p4: 72 }, resolutionTargetsHours: { p1: 4, p2: 24, p3: 72, p4: 240 } },
    { id: OTHER, name: 'Kestrel Bay Field Office', timeZone: 'Atlantic/Azores', centreLatDeg: 48.4, centreLonDeg: -30.9, area: null, firstResponseTargetsHours: { p1: 2, p2: 8, p3: 24, p4: 72 }, resolutionTargetsHours: { p1: 4, p2: 24, p3: 72, p4: 240 } },
  ].filter((o) => !officeId || o.id === officeId)
  return dashboardViewSchema.parse({
    asOf: '2026-12-05T10:00:00.000Z',
    officeId,
    offices,
    officeChoices: [
      { id: OFFICE, name: 'Harrowmere Field Office' },
      { id: OTHER, name: 'Kestrel Bay Field Office' },
    ],
    openByStatePriority: OPEN_STATES.flatMap((status) => [1, 2, 3, 4].map((priority) => ({ status, priority, count: status === 'received' && priority === 2 ? 3 : status === 'field_work' && priority === 1 ? 2 : 0 }))),
    clocks: { overdue: 4, dueSoon: 6, firstResponseOverdue: 1, receivedToday: 2 },
    workload: [{ investigatorId: INV, name: 'Ilse Brannock', officeName: 'Harrowmere Field Office', open: 2, overdue: 1 }],
    unassigned: { open: 3, overdue: 0 },
    followUps: { due: 1, overdue: 2 },
    performance: [30, 90].flatMap((windowDays) =>
      (['firstResponse', 'resolution'] as const).flatMap((clock) =>
        [1, 2, 3, 4].map((priority) => ({ windowDays, clock, priority, count: priority === 2 ? 5 : 0, medianHours: priority === 2 ? 7 : null, p90Hours: priority === 2 ? 22.4 : null, metTarget: priority === 2 ? 2 : 0 })),
      ),
    ),
    map: { cases: [{ id: '00000000-0000-4000-8000-0000000000c1', reference: 'QB-26-000101', latDeg: 48.11, lonDeg: -31.39, priority: 1, status: 'field_work', overdue: true }], truncated: false },
  })
}

/** GET /api/me for a supervisor (or an administrator). */
function signedInAs(role: 'supervisor' | 'admin') {
  answer(
    'get',
    '/api/me',
    meResponseSchema.parse({
      user: { id: '00000000-0000-4000-8000-0000000000aa', email: 's@quietband.test', name: 'Sade Okafor', role, officeId: role === 'admin' ? null : OFFICE, officeName: role === 'admin' ? null : 'Harrowmere' },
      abilities: { ...NO_ACCOUNT_ABILITIES, readDashboard: true, readCases: true, runOfficeQueue: role === 'supervisor', manageOffices: role === 'admin' },
    }),
  )
}

/** The case-list filters a link opens (read as the list reads its address). */
const filtersOf = (link: HTMLElement) => {
  const url = new URL(link.getAttribute('href')!, 'http://x')
  expect(url.pathname).toBe(paths.cases.path)
  return Object.fromEntries(url.searchParams)
}

describe('the dashboard page', () => {
  it('shows every figure as a link to exactly the cases it counts', async () => {
    answer('get', '/api/region', regionMapResponse())
    signedInAs('supervisor')
    answer('get', '/api/dashboard', view(null))
    renderPage({ url: paths.dashboard.href(), routes: [{ path: paths.dashboard.path, Component: DashboardPage }] })
    const overdue = await screen.findByRole('link', { name: /^4\s*Overdue/ })
    expect(filtersOf(overdue)).toEqual({ overdue: 'true' })
    // a supervisor sets the targets on the office's settings page
    expect(await screen.findByRole('link', { name: 'office settings' })).toHaveAttribute('href', paths.officeSettings.href())
    expect(filtersOf(screen.getByRole('link', { name: /Due in the next 24 hours/ }))).toEqual({ dueSoon: 'true' })
    expect(filtersOf(screen.getByRole('link', { name: /First response overdue/ }))).toEqual({ firstResponseOverdue: 'true' })
    expect(filtersOf(screen.getByRole('link', { name: /Received today/ }))).toEqual({ receivedToday: 'true' })
    // the open-work grid: a cell, a state's total and the grand total
    const grid = screen.getByRole('table', { name: 'Open cases by state and harm class' })
    expect(filtersOf(within(grid).getByRole('link', { name: '3 new report, service lost' }))).toEqual({ open: 'true', status: 'received', priority: '2' })
    expect(filtersOf(within(grid).getByRole('link', { name: '5 open cases' }))).toEqual({ open: 'true' })
    // workload: the investigator's open and overdue cases, and the unassigned ones
    const load = screen.getByRole('table', { name: 'Open cases per investigator' })
    expect(filtersOf(within(load).getByRole('link', { name: '2 open cases: Ilse Brannock' }))).toEqual({ investigatorId: INV, open: 'true' })
    expect(filtersOf(within(load).getByRole('link', { name: '1 overdue: Ilse Brannock' }))).toEqual({ investigatorId: INV, open: 'true', overdue: 'true' })
    expect(filtersOf(within(load).getByRole('link', { name: '3 open cases: No investigator yet' }))).toEqual({ investigatorId: 'none', open: 'true' })
    // performance: the 30-day window first, the closing chart's count links to cases closed in it
    expect(filtersOf(screen.getByRole('link', { name: '5 cases closed, service lost, last 30 days' }))).toEqual({ closedInLastDays: '30', priority: '2' })
    expect(filtersOf(screen.getByRole('link', { name: '5 cases first answered, service lost, last 30 days' }))).toEqual({ respondedInLastDays: '30', priority: '2' })
    // every figure link reads back as a list state the list understands
    for (const link of screen.getAllByRole('link')) {
      const href = link.getAttribute('href')!
      if (!href.startsWith('/cases')) continue
      const state = parseListState(new URL(href, 'http://x').searchParams)
      expect(paths.cases.href(state)).toBe(href)
    }
    // the charts get the medians, 90th percentiles and (several offices) no single target
    await waitFor(() => expect(charts.some((c) => c.title === 'Time to closing, last 30 days')).toBe(true))
    const closing = charts.filter((c) => c.title === 'Time to closing, last 30 days').at(-1)!
    expect(closing.groups[1]).toEqual({ label: 'Service lost', medianHours: 7, p90Hours: 22.4, targetHours: null })
  })

  it('switches the performance window to 90 days', async () => {
    answer('get', '/api/region', regionMapResponse())
    signedInAs('supervisor')
    answer('get', '/api/dashboard', view(OFFICE))
    const { user } = renderPage({ url: paths.dashboard.href(OFFICE), routes: [{ path: paths.dashboard.path, Component: DashboardPage }] })
    await user.click(await screen.findByRole('button', { name: 'Last 90 days' }))
    expect(screen.getByRole('button', { name: 'Last 90 days' })).toHaveAttribute('aria-pressed', 'true')
    expect(filtersOf(screen.getByRole('link', { name: '5 cases closed, service lost, last 90 days' }))).toEqual({ officeId: OFFICE, closedInLastDays: '90', priority: '2' })
    // one office: its targets go on the chart
    await waitFor(() => expect(charts.some((c) => c.title === 'Time to first response, last 90 days')).toBe(true))
    expect(charts.filter((c) => c.title === 'Time to first response, last 90 days').at(-1)!.groups.map((g) => g.targetHours)).toEqual([1, 8, 24, 72])
  })

  it('lets an administrator narrow to one office, kept in the address', async () => {
    answer('get', '/api/region', regionMapResponse())
    signedInAs('admin')
    const sent = answer('get', '/api/dashboard', (req) => view(req.url.searchParams.get('officeId')))
    const page = renderPage({ url: paths.dashboard.href(), routes: [{ path: paths.dashboard.path, Component: DashboardPage }] })
    const select = await screen.findByLabelText('Office')
    await page.user.selectOptions(select, OTHER)
    await waitFor(() => expect(page.currentUrl()).toBe(paths.dashboard.href(OTHER)))
    await waitFor(() => expect(sent.at(-1)!.url.searchParams.get('officeId')).toBe(OTHER))
    expect(await screen.findByText('Kestrel Bay Field Office', { selector: 'header p' })).toBeInTheDocument()
    // the figures now carry the office
    await waitFor(() => expect(filtersOf(screen.getByRole('link', { name: /^4\s*Overdue/ }))).toEqual({ officeId: OTHER, overdue: 'true' }))
  })
})

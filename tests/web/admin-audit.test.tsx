/**
 * The audit page: the entries from the API as a table (cards on a phone), filters written to
 * the URL and sent to the API, the CSV link carrying the same filters, paging, and the
 * server's refusal of a filter shown beside it.
 */
import { screen, waitFor, within } from '@testing-library/react'
import { afterEach, describe, expect, it, vi } from 'vitest'
import { auditPageSchema, type AuditEntryView } from '../../shared/schemas/audit'
import { Component as AuditPage } from '@/app/routes/admin-audit'
import { paths } from '@/lib/paths'
import { answer, apiError } from '../support/msw-server'
import { IDS, officesResponse, staffMember } from '../support/msw-views'
import { renderPage } from '../support/web-render'

const ADMIN = '3c4d5e6f-7a8b-4c9d-8e0f-1a2b3c4d5e6f'

function entry(changes: Partial<AuditEntryView>): AuditEntryView {
  return {
    id: 1,
    at: '2026-11-30T09:12:05.000Z',
    action: 'office.time_zone_changed',
    actionLabel: 'Office time zone changed',
    actor: { id: IDS.supervisor, name: 'Sade Okafor', email: 'sade.okafor@tarnwick.example.test' },
    targetType: 'office',
    targetId: IDS.tarnwickOffice,
    officeId: IDS.tarnwickOffice,
    officeName: 'Tarnwick Field Office',
    details: { before: 'UTC', after: 'Atlantic/Azores' },
    ...changes,
  }
}

const auditPage = (entries: AuditEntryView[], total = entries.length, page = 1) => auditPageSchema.parse({ entries, total, page, pageSize: 50 })

function screenWidthPx(widthPx: number) {
  vi.stubGlobal('matchMedia', (query: string) => {
    const min = /min-width:\s*(\d+)px/.exec(query)
    return { matches: min ? widthPx >= Number(min[1]) : false, media: query, addEventListener: () => {}, removeEventListener: () => {} }
  })
}

function serve(list: () => unknown = () => auditPage([entry({}), entry({ id: 2, action: 'complainant_details.viewed', actionLabel: "Complainant's personal details opened", targetType: 'case', targetId: IDS.case, details: { reference: 'QB-26-000412', fields: ['name', 'email'] } })])) {
  answer('get', '/api/offices', officesResponse())
  answer('get', '/api/admin/users', { users: [staffMember({ id: IDS.supervisor, name: 'Sade Okafor', role: 'supervisor' }), staffMember({ id: ADMIN, name: 'Ada Quill', role: 'admin', officeId: null, officeName: null })] })
  return answer('get', '/api/admin/audit', list)
}

const open = (url: string = paths.adminAudit.href()) => renderPage({ url, routes: [{ path: paths.adminAudit.path, Component: AuditPage }] })

afterEach(() => vi.unstubAllGlobals())

describe('the audit page', () => {
  it('lists the entries in a table with who, what, target, office and details', async () => {
    screenWidthPx(1440)
    serve()
    open()
    const table = await screen.findByRole('table', { name: 'Audit entries, newest first' })
    const rows = within(table).getAllByRole('row')
    expect(rows).toHaveLength(3)
    expect(rows[1]).toHaveTextContent('Office time zone changed')
    expect(rows[1]).toHaveTextContent('Sade Okafor')
    expect(rows[1]).toHaveTextContent('Tarnwick Field Office')
    expect(rows[1]).toHaveTextContent('Atlantic/Azores')
    expect(rows[2]).toHaveTextContent("Complainant's personal details opened")
    expect(rows[2]).toHaveTextContent('QB-26-000412')
    expect(screen.getByText('2 entries')).toBeInTheDocument()
  })

  it('writes the filters to the URL, sends them to the API and puts them on the CSV link', async () => {
    screenWidthPx(1440)
    const calls = serve()
    const { user, currentUrl } = open()
    await screen.findByRole('table')
    const form = screen.getByRole('form', { name: 'Filter the audit list' })
    await user.selectOptions(within(form).getByLabelText('Action'), 'complainant_details.viewed')
    await waitFor(() => expect(within(form).getByRole('option', { name: 'Ada Quill' })).toBeInTheDocument())
    await user.selectOptions(within(form).getByLabelText('Person'), ADMIN)
    await user.type(within(form).getByLabelText('From (UTC day)'), '2026-11-01')
    await user.click(within(form).getByRole('button', { name: 'Apply filters' }))
    await waitFor(() => expect(currentUrl()).toBe('/admin/audit?action=complainant_details.viewed&actorUserId=' + ADMIN + '&from=2026-11-01'))
    await waitFor(() => expect(calls.at(-1)!.url.searchParams.get('action')).toBe('complainant_details.viewed'))
    const sent = calls.at(-1)!.url.searchParams
    expect(Object.fromEntries(sent)).toEqual({ action: 'complainant_details.viewed', actorUserId: ADMIN, from: '2026-11-01', pageSize: '50' })
    expect(screen.getByRole('link', { name: 'Download CSV' })).toHaveAttribute('href', `/api/admin/audit.csv?action=complainant_details.viewed&actorUserId=${ADMIN}&from=2026-11-01`)
    await user.click(within(form).getByRole('button', { name: 'Clear' }))
    await waitFor(() => expect(currentUrl()).toBe('/admin/audit'))
  })

  it('pages through older entries', async () => {
    screenWidthPx(1440)
    const calls = serve(() => auditPage([entry({})], 120))
    const { user, currentUrl } = open(`${paths.adminAudit.href()}?officeId=${IDS.tarnwickOffice}`)
    expect(await screen.findByText('Page 1 of 3')).toBeInTheDocument()
    expect(screen.getByRole('button', { name: 'Newer' })).toBeDisabled()
    await user.click(screen.getByRole('button', { name: 'Older' }))
    await waitFor(() => expect(currentUrl()).toBe(`/admin/audit?officeId=${IDS.tarnwickOffice}&page=2`))
    await waitFor(() => expect(calls.at(-1)!.url.searchParams.get('page')).toBe('2'))
    expect(calls.at(-1)!.url.searchParams.get('officeId')).toBe(IDS.tarnwickOffice)
  })

  it('shows the server’s refusal of a filter beside the field', async () => {
    screenWidthPx(1440)
    serve(() => apiError(400, { code: 'validation_failed', message: 'Some fields need attention.', details: [{ path: 'to', message: 'The end must come after the start.' }] }))
    open(`${paths.adminAudit.href()}?from=2026-11-02&to=2026-11-01`)
    const form = await screen.findByRole('form', { name: 'Filter the audit list' })
    expect(await within(form).findByText('The end must come after the start.')).toBeInTheDocument()
    expect(within(form).getByLabelText(/^To/)).toHaveValue('2026-11-01')
  })

  it('shows one card per entry on a phone', async () => {
    screenWidthPx(390)
    serve()
    open()
    const list = await screen.findByRole('list', { name: 'Audit entries, newest first' })
    expect(within(list).getAllByRole('listitem')).toHaveLength(2)
    expect(screen.queryByRole('table')).not.toBeInTheDocument()
  })
})

import { screen } from '@testing-library/react'
import { describe, expect, it } from 'vitest'
import { Component as AdminOfficesPage } from '@/app/routes/admin-offices'
import { paths } from '@/lib/paths'
import { answer } from '../support/msw-server'
import { IDS, office, officesResponse } from '../support/msw-views'
import { retentionSettingResponse } from '../support/msw-retention'
import { renderPage } from '../support/web-render'

describe('the administrator’s offices page', () => {
  it('lists every office, and shows one office’s settings at a time, chosen from a list', async () => {
    answer(
      'get',
      '/api/offices',
      officesResponse([office({ abilities: { setResponseTargets: true, edit: true } }), office({ id: IDS.orlessOffice, name: 'Orless Field Office', abilities: { setResponseTargets: true, edit: true } })]),
    )
    answer('get', '/api/offices/:id/retention', retentionSettingResponse({ abilities: { set: true } }))
    const { user } = renderPage({ url: paths.adminOffices.href(), routes: [{ path: paths.adminOffices.path, Component: AdminOfficesPage }] })

    expect(await screen.findByRole('heading', { name: /Targets and time zone — Tarnwick Field Office/ })).toBeInTheDocument()
    expect(screen.queryByRole('heading', { name: /Targets and time zone — Orless Field Office/ })).not.toBeInTheDocument()
    expect(screen.getAllByRole('row').map((r) => r.textContent).join(' ')).toMatch(/Orless Field Office/)
    // each row gives the address, and says when an office has no area of its own
    const tarnwick = screen.getByRole('rowheader', { name: /Tarnwick Field Office/ }).closest('tr')!
    expect(tarnwick.textContent).toContain('4 Quay Row, Tarnwick')
    expect(tarnwick.textContent).toContain('No area drawn: takes reports only as the nearest office')

    await user.selectOptions(screen.getByRole('combobox', { name: 'Settings of the office' }), 'Orless Field Office')
    expect(await screen.findByRole('heading', { name: /Targets and time zone — Orless Field Office/ })).toBeInTheDocument()
    expect(screen.queryByRole('heading', { name: /Targets and time zone — Tarnwick Field Office/ })).not.toBeInTheDocument()
  })
})

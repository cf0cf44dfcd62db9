/**
 * The office settings page: the first-response and resolution targets are two forms, each
 * sending to its own route; the time zone is chosen from the platform's zones and the server's
 * refusal shows beside the field.
 */
import { screen, waitFor, within } from '@testing-library/react'
import { describe, expect, it } from 'vitest'
import { meResponseSchema, NO_ACCOUNT_ABILITIES } from '../../shared/schemas/auth'
import { Component as OfficeSettingsPage } from '@/app/routes/office-settings'
import { paths } from '@/lib/paths'
import { answer, apiError } from '../support/msw-server'
import { IDS, office, officesResponse } from '../support/msw-views'
import { renderPage } from '../support/web-render'
import { retentionSettingResponse } from '../support/msw-retention'

function serve() {
  answer(
    'get',
    '/api/me',
    meResponseSchema.parse({
      user: { id: '00000000-0000-4000-8000-0000000000aa', email: 's@quietband.test', name: 'Sade Okafor', role: 'supervisor', officeId: IDS.tarnwickOffice, officeName: 'Tarnwick' },
      abilities: { ...NO_ACCOUNT_ABILITIES, runOfficeQueue: true, readCases: true, readDashboard: true },
    }),
  )
  answer('get', '/api/offices', officesResponse([office({ abilities: { setResponseTargets: true, edit: true } })]))
  answer('get', '/api/offices/:id/retention', retentionSettingResponse())
}

describe('the office settings page', () => {
  it('saves the first-response targets to their own route, apart from the resolution targets', async () => {
    serve()
    const first = answer('put', '/api/offices/:id/first-response-targets', (req) => ({ office: office({ firstResponseTargetsHours: req.body as never, abilities: { setResponseTargets: true, edit: true } }) }))
    const resolution = answer('put', '/api/offices/:id/response-targets', { office: office() })
    const { user } = renderPage({ url: paths.officeSettings.href(), routes: [{ path: paths.officeSettings.path, Component: OfficeSettingsPage }] })
    const form = await screen.findByRole('form', { name: 'First-response targets of Tarnwick Field Office' })
    expect(within(form).getByLabelText('Safety of life (hours)')).toHaveValue(1)
    await user.clear(within(form).getByLabelText('Safety of life (hours)'))
    await user.type(within(form).getByLabelText('Safety of life (hours)'), '2')
    await user.click(within(form).getByRole('button', { name: 'Save first-response targets' }))
    await waitFor(() => expect(first).toHaveLength(1))
    expect(first[0]!.body).toEqual({ p1: 2, p2: 8, p3: 24, p4: 72 })
    expect(resolution).toHaveLength(0)
    expect(await within(form).findByRole('status')).toHaveTextContent('Saved')
    expect(screen.getByRole('form', { name: 'Resolution targets of Tarnwick Field Office' })).toBeInTheDocument()
  })

  it('shows the server’s refusal of a time zone beside the field', async () => {
    serve()
    const sent = answer('put', '/api/offices/:id/time-zone', () =>
      apiError(400, { code: 'validation_failed', message: 'Some fields need attention.', details: [{ path: 'timeZone', message: 'Choose a time zone from the list (a name such as Atlantic/Azores).' }] }),
    )
    const { user } = renderPage({ url: paths.officeSettings.href(), routes: [{ path: paths.officeSettings.path, Component: OfficeSettingsPage }] })
    const form = await screen.findByRole('form', { name: 'Time zone of Tarnwick Field Office' })
    const select = within(form).getByLabelText(/^Time zone/)
    expect(select).toHaveValue('Atlantic/Azores')
    await user.selectOptions(select, 'UTC')
    await user.click(within(form).getByRole('button', { name: 'Save time zone' }))
    await waitFor(() => expect(sent).toHaveLength(1))
    expect(sent[0]!.body).toEqual({ timeZone: 'UTC' })
    expect(await within(form).findByText('Choose a time zone from the list (a name such as Atlantic/Azores).')).toBeInTheDocument()
  })
})

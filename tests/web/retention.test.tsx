/**
 * The legal-hold panel on the case page and the retention period on the office settings:
 * shown and offered from the server's abilities; setting and lifting send the reason (and the
 * last day) to their routes and show the hold the server answers; a period typed wrong is
 * refused beside the field before anything is sent, and the server's refusal (a closed case's
 * open follow-up needs longer) shows beside the field.
 */
import { screen, waitFor, within } from '@testing-library/react'
import { describe, expect, it } from 'vitest'
import { meResponseSchema, NO_ACCOUNT_ABILITIES } from '../../shared/schemas/auth'
import { Component as OfficeSettingsPage } from '@/app/routes/office-settings'
import { LegalHoldPanel } from '@/features/retention/components/legal-hold-panel'
import { RetentionDryRun } from '@/features/retention/components/retention-dry-run'
import { paths } from '@/lib/paths'
import { answer, apiError } from '../support/msw-server'
import { IDS, office, officesResponse } from '../support/msw-views'
import { legalHoldResponse, retentionSettingResponse } from '../support/msw-retention'
import { retentionRunResponseSchema } from '../../shared/schemas/retention'
import { renderPage } from '../support/web-render'

const openPanel = () => renderPage({ url: `/cases/${IDS.case}`, routes: [{ path: paths.case.path, Component: () => <LegalHoldPanel caseId={IDS.case} /> }] })

const HELD = { since: '2026-12-01T09:00:00.000Z', byName: 'Sade Okafor', reason: 'Court order 114', until: '2027-06-30' }

describe('the legal-hold panel', () => {
  it('shows the hold in force without controls to someone who may not change it', async () => {
    answer('get', '/api/cases/:id/legal-hold', legalHoldResponse({ active: HELD }))
    openPanel()
    expect(await screen.findByRole('status')).toHaveTextContent('On hold until 2027-06-30 (inclusive), set by Sade Okafor on 2026-12-01: Court order 114')
    expect(screen.queryByRole('button', { name: /hold/ })).not.toBeInTheDocument()
  })

  it('sets a hold with a reason and a last day, and shows what the server answers', async () => {
    answer('get', '/api/cases/:id/legal-hold', legalHoldResponse({ abilities: { set: true, lift: false } }))
    const sent = answer('post', '/api/cases/:id/legal-hold', (req) =>
      legalHoldResponse({ active: { ...HELD, reason: (req.body as { reason: string }).reason }, abilities: { set: true, lift: true } }),
    )
    const { user } = openPanel()
    await user.click(await screen.findByRole('button', { name: 'Set a legal hold…' }))
    const form = screen.getByRole('form', { name: 'Set a legal hold' })
    await user.click(within(form).getByRole('button', { name: 'Hold the case' }))
    expect(await within(form).findByText('Say why the legal hold is set.')).toBeInTheDocument()
    expect(sent).toHaveLength(0)
    await user.type(within(form).getByLabelText(/Why hold the case\?/), 'Appeal pending')
    await user.type(within(form).getByLabelText(/Last day of the hold/), '2027-06-30')
    await user.click(within(form).getByRole('button', { name: 'Hold the case' }))
    await waitFor(() => expect(sent).toHaveLength(1))
    expect(sent[0]!.url.pathname).toBe(`/api/cases/${IDS.case}/legal-hold`)
    expect(sent[0]!.body).toEqual({ reason: 'Appeal pending', until: '2027-06-30' })
    expect(await screen.findByRole('status')).toHaveTextContent('On hold until 2027-06-30 (inclusive), set by Sade Okafor on 2026-12-01: Appeal pending')
    expect(screen.getByRole('button', { name: 'Lift the hold…' })).toBeInTheDocument()
  })

  it('lifts the hold with a reason; the server’s refusal shows beside the field', async () => {
    answer('get', '/api/cases/:id/legal-hold', legalHoldResponse({ active: HELD, abilities: { set: true, lift: true } }))
    let refuse = true
    const sent = answer('post', '/api/cases/:id/legal-hold/lift', () =>
      refuse
        ? apiError(400, { code: 'validation_failed', message: 'Some fields need attention.', details: [{ path: 'reason', message: 'Keep the reason under 2000 characters.' }] })
        : legalHoldResponse({ active: null, abilities: { set: true, lift: false } }),
    )
    const { user } = openPanel()
    await user.click(await screen.findByRole('button', { name: 'Lift the hold…' }))
    const form = screen.getByRole('form', { name: 'Lift the legal hold' })
    await user.type(within(form).getByLabelText(/Why lift it\?/), 'Appeal decided')
    await user.click(within(form).getByRole('button', { name: 'Lift the hold' }))
    expect(await within(form).findByText('Keep the reason under 2000 characters.')).toBeInTheDocument()
    refuse = false
    await user.click(within(form).getByRole('button', { name: 'Lift the hold' }))
    await waitFor(() => expect(sent).toHaveLength(2))
    expect(sent[1]!.body).toEqual({ reason: 'Appeal decided' })
    expect(await screen.findByText(/No legal hold\./)).toBeInTheDocument()
    expect(screen.queryByRole('button', { name: 'Lift the hold…' })).not.toBeInTheDocument()
  })
})

function serveSettings(canSet: boolean) {
  answer(
    'get',
    '/api/me',
    meResponseSchema.parse({
      user: { id: '00000000-0000-4000-8000-0000000000ab', email: 'a@quietband.test', name: 'Ada Pell', role: 'supervisor', officeId: IDS.tarnwickOffice, officeName: 'Tarnwick' },
      abilities: { ...NO_ACCOUNT_ABILITIES, runOfficeQueue: true, readCases: true, readDashboard: true },
    }),
  )
  answer('get', '/api/offices', officesResponse([office({ abilities: { setResponseTargets: true, edit: true } })]))
  answer('get', '/api/offices/:id/retention', retentionSettingResponse({ abilities: { set: canSet } }))
}
const openSettings = () => renderPage({ url: paths.officeSettings.href(), routes: [{ path: paths.officeSettings.path, Component: OfficeSettingsPage }] })

describe('the retention period', () => {
  it('is shown, without a form, to someone who may not change it', async () => {
    serveSettings(false)
    openSettings()
    const section = await screen.findByRole('region', { name: 'Retention — Tarnwick Field Office' })
    expect(section).toHaveTextContent('24 months after a case is closed')
    expect(screen.queryByRole('form', { name: 'Retention period of Tarnwick Field Office' })).not.toBeInTheDocument()
  })

  it('refuses a period that is not whole months before sending, and shows the server’s refusal beside the field', async () => {
    serveSettings(true)
    const message = '6 months is too short: closed case QB-26-000123 has an open follow-up due 2028-01-05, so this office must keep closed cases at least 14 months.'
    const sent = answer('put', '/api/offices/:id/retention', () =>
      apiError(400, { code: 'validation_failed', message: 'Some fields need attention.', details: [{ path: 'retentionMonths', message }] }),
    )
    const { user } = openSettings()
    const form = await screen.findByRole('form', { name: 'Retention period of Tarnwick Field Office' })
    const field = within(form).getByLabelText(/Retention period \(months after closing\)/)
    expect(field).toHaveValue('24')
    await user.clear(field)
    await user.type(field, '2.5')
    await user.click(within(form).getByRole('button', { name: 'Save retention period' }))
    expect(await within(form).findByText('The retention period must be a whole number.')).toBeInTheDocument()
    expect(sent).toHaveLength(0)
    await user.clear(field)
    await user.type(field, '6')
    await user.click(within(form).getByRole('button', { name: 'Save retention period' }))
    await waitFor(() => expect(sent).toHaveLength(1))
    expect(sent[0]!.body).toEqual({ retentionMonths: '6' })
    expect(await within(form).findByText(message)).toBeInTheDocument()
  })

  it('saves a valid period', async () => {
    serveSettings(true)
    const sent = answer('put', '/api/offices/:id/retention', () => retentionSettingResponse({ retentionMonths: 36, abilities: { set: true } }))
    const { user } = openSettings()
    const form = await screen.findByRole('form', { name: 'Retention period of Tarnwick Field Office' })
    const field = within(form).getByLabelText(/Retention period \(months after closing\)/)
    await user.clear(field)
    await user.type(field, '36')
    await user.click(within(form).getByRole('button', { name: 'Save retention period' }))
    await waitFor(() => expect(sent).toHaveLength(1))
    expect(await within(form).findByRole('status')).toHaveTextContent('Saved')
    expect(screen.getByRole('region', { name: 'Retention — Tarnwick Field Office' })).toHaveTextContent('36 months after a case is closed')
  })
})

describe('the dry run for administrators', () => {
  it('asks the server only on request and lists what would go and what is kept', async () => {
    const sent = answer(
      'get',
      '/api/admin/retention/dry-run',
      retentionRunResponseSchema.parse({
        run: {
          dryRun: true,
          at: '2029-01-10T02:00:00.000Z',
          cases: [
            {
              caseId: IDS.case,
              reference: 'QB-26-000123',
              officeId: IDS.tarnwickOffice,
              closedAt: '2026-12-01T10:00:00.000Z',
              retentionEndedAt: '2028-12-01T10:00:00.000Z',
              fields: ['complainantEmail', 'complainantName', 'description'],
              redactedEventIds: [41, 42],
              evidence: [{ evidenceId: '6a1b2c3d-4e5f-4a6b-8c7d-9e0f1a2b3c4d', objectKey: 'evidence/x', sha256: 'a'.repeat(64), thumbnailKey: null }],
              mergeEventIds: [57],
              coarsePosition: { latDeg: 52.41, lonDeg: -1.52 },
              fileNames: [{ evidenceId: '6a1b2c3d-4e5f-4a6b-8c7d-9e0f1a2b3c4d', storedFileId: '8c3d4e5f-6a7b-4c8d-9e0f-1a2b3c4d5e6f', name: `erased-${'a'.repeat(12)}.csv` }],
              queuedMails: [],
              account: { outcome: 'kept', userId: '9d4e5f6a-7b8c-4d9e-8f1a-2b3c4d5e6f7a', reason: 'other_cases', otherCases: 2 },
            },
          ],
          kept: [{ caseId: '7b2c3d4e-5f6a-4b7c-8d9e-0f1a2b3c4d5e', reference: 'QB-26-000124', reason: 'legal_hold' }],
          pendingDisposals: [],
        },
      }),
    )
    const { user } = renderPage({ url: paths.adminOffices.href(), routes: [{ path: paths.adminOffices.path, Component: RetentionDryRun }] })
    const button = await screen.findByRole('button', { name: 'Show what would go' })
    expect(sent).toHaveLength(0)
    await user.click(button)
    const list = await screen.findByRole('list', { name: 'Cases the run would erase' })
    expect(list).toHaveTextContent('QB-26-000123 (period ended 2028-12-01): name, e-mail, description (redacted copy); 2 timeline entries redacted; 1 evidence file deleted; 1 file name replaced; 1 merge entry of other cases redacted; account kept: has 2 other cases')
    expect(screen.getByText(/Kept: QB-26-000124 \(legal hold\)\./)).toBeInTheDocument()
    expect(sent).toHaveLength(1)
  })
})

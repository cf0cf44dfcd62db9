/**
 * Enforcement screens against the mocked API: the case's follow-ups show where each stands on
 * the office's calendar and offer only the moves the server allows; a move or a new follow-up
 * sends what the user typed and puts the server's refusal beside the field; the responsible
 * party shows its earlier versions and a notice refused for a missing date and method says so
 * beside both fields; the work queue lists the due and overdue follow-ups; "E-mails Quietband
 * sends you" lists what the server says.
 */
import { screen, within } from '@testing-library/react'
import { describe, expect, it } from 'vitest'
import { FollowUpsSection } from '@/features/follow-ups/components/follow-ups-section'
import { ResponsiblePartySection } from '@/features/follow-ups/components/responsible-party-section'
import { DueFollowUpsSection } from '@/features/follow-ups/components/due-follow-ups-section'
import { MyEmailsPanel } from '@/features/notifications/components/my-emails-panel'
import { evidenceViewSchema } from '../../shared/schemas/evidence'
import { noticeViewSchema } from '../../shared/schemas/follow-ups'
import { answer, apiError } from '../support/msw-server'
import { renderPage } from '../support/web-render'
import { caseFollowUps, dueFollowUps, followUpView, FU_CASE_ID, myEmails, partyResponse } from '../support/msw-follow-ups'

const at = (C: () => React.ReactNode) => renderPage({ url: '/x', routes: [{ path: '/x', Component: C }] })

describe('FollowUpsSection', () => {
  it('shows an overdue follow-up with its deadline and offers confirm and escalate, not reopen', async () => {
    answer('get', `/api/cases/${FU_CASE_ID}/follow-ups`, caseFollowUps())
    at(() => <FollowUpsSection caseId={FU_CASE_ID} />)
    const list = await screen.findByRole('list', { name: 'Follow-ups, by deadline' })
    expect(within(list).getByText('Overdue')).toBeInTheDocument()
    expect(within(list).getByText('Deadline 2026-12-01')).toBeInTheDocument()
    expect(within(list).getByRole('button', { name: 'Confirm complied' })).toBeInTheDocument()
    expect(within(list).getByRole('button', { name: 'Not complied — escalate' })).toBeInTheDocument()
    expect(within(list).queryByRole('button', { name: 'Reopen' })).not.toBeInTheDocument()
    expect(screen.getByText(/Atlantic\/Azores/)).toBeInTheDocument()
  })

  it('confirms with the note typed and the version shown, and puts a refusal beside the note', async () => {
    let answered = 0
    answer('get', `/api/cases/${FU_CASE_ID}/follow-ups`, () =>
      answered === 0 ? caseFollowUps() : caseFollowUps({ followUps: [followUpView({ state: 'complied', stateLabel: 'Complied — confirmed', standing: 'closed', version: 2, abilities: { confirm: false, escalate: false, reopen: false } })] }),
    )
    const sent = answer('post', '/api/follow-ups/:id/confirm', (r) => {
      const body = r.body as { note: string }
      if (body.note.trim().length < 3) return apiError(400, { code: 'validation_failed', message: 'Some fields need attention.', details: [{ path: 'note', message: 'Write what you saw or why (at least 3 characters).' }] })
      answered += 1
      return { followUp: followUpView({ state: 'complied', standing: 'closed', version: 2 }) }
    })
    const { user } = at(() => <FollowUpsSection caseId={FU_CASE_ID} />)
    await user.click(await screen.findByRole('button', { name: 'Confirm complied' }))
    const form = screen.getByRole('form', { name: 'Confirm complied' })
    await user.type(within(form).getByLabelText('What you saw'), 'ok')
    await user.click(within(form).getByRole('button', { name: 'Confirm complied' }))
    expect(await within(form).findByText('Write what you saw or why (at least 3 characters).')).toBeInTheDocument()
    expect(within(form).getByLabelText('What you saw')).toHaveAttribute('aria-invalid', 'true')
    await user.type(within(form).getByLabelText('What you saw'), ' — new amplifier fitted')
    await user.click(within(form).getByRole('button', { name: 'Confirm complied' }))
    expect(await screen.findByText('Complied — confirmed')).toBeInTheDocument()
    expect(sent.at(-1)!.body).toEqual({ version: 1, note: 'ok — new amplifier fitted' })
    expect(sent.at(-1)!.url.pathname).toBe('/api/follow-ups/5a1b2c3d-4e5f-4a6b-8c7d-9e0f1a2b3c4d/confirm')
  })

  it('shows the server’s refusal of a deadline in the past beside the deadline field', async () => {
    answer('get', `/api/cases/${FU_CASE_ID}/follow-ups`, caseFollowUps({ followUps: [] }))
    const sent = answer('post', `/api/cases/${FU_CASE_ID}/follow-ups`, () =>
      apiError(400, { code: 'validation_failed', message: 'Some fields need attention.', details: [{ path: 'dueOn', message: 'The deadline cannot be in the past (today is 2026-12-05 at the office).' }] }),
    )
    const { user } = at(() => <FollowUpsSection caseId={FU_CASE_ID} />)
    await user.click(await screen.findByRole('button', { name: 'Add a follow-up' }))
    const form = screen.getByRole('form', { name: 'Add a follow-up' })
    await user.type(within(form).getByLabelText('Deadline'), '2026-11-01')
    await user.type(within(form).getByLabelText('What is expected'), 'Send the invoice of the new amplifier')
    await user.click(within(form).getByRole('button', { name: 'Add the follow-up' }))
    expect(await within(form).findByText(/cannot be in the past/)).toBeInTheDocument()
    expect(within(form).getByLabelText('Deadline')).toHaveAttribute('aria-invalid', 'true')
    expect(sent[0]!.body).toEqual({ dueOn: '2026-11-01', expected: 'Send the invoice of the new amplifier' })
  })
})

describe('ResponsiblePartySection', () => {
  it('shows the current party with its earlier version, and a refused notice’s problems beside the date and the method', async () => {
    answer('get', `/api/cases/${FU_CASE_ID}/responsible-party`, partyResponse())
    answer('get', `/api/cases/${FU_CASE_ID}/evidence`, { evidence: [] })
    answer('post', `/api/cases/${FU_CASE_ID}/notices`, () =>
      apiError(400, {
        code: 'validation_failed',
        message: 'Some fields need attention.',
        details: [
          { path: 'servedOn', message: 'Enter the day it was served.' },
          { path: 'method', message: 'Choose how the notice was served.' },
        ],
      }),
    )
    const { user } = at(() => <ResponsiblePartySection caseId={FU_CASE_ID} />)
    expect(await screen.findByText('Tarnwick Boat Club Ltd')).toBeInTheDocument()
    expect(screen.getByText('Earlier versions (1)')).toBeInTheDocument()
    expect(screen.getByText('No notice recorded.')).toBeInTheDocument()
    await user.click(screen.getByRole('button', { name: 'Record a notice served' }))
    expect(screen.getByRole('complementary', { name: 'Enforcement caution' })).toBeInTheDocument()
    const form = screen.getByRole('form', { name: 'Record a notice served' })
    await user.type(within(form).getByLabelText('What the notice requires'), 'Replace the amplifier within 7 days.')
    await user.click(within(form).getByRole('button', { name: 'Record the notice' }))
    expect(await within(form).findByText('Enter the day it was served.')).toBeInTheDocument()
    expect(within(form).getByText('Choose how the notice was served.')).toBeInTheDocument()
    // nothing typed is lost
    expect(within(form).getByLabelText('What the notice requires')).toHaveValue('Replace the amplifier within 7 days.')
  })

  it('records a notice with a file of the case as its copy (removed files are not offered) and shows it', async () => {
    answer('get', `/api/cases/${FU_CASE_ID}/responsible-party`, partyResponse())
    const file = (id: string, originalName: string, removed: boolean) =>
      evidenceViewSchema.parse({
        id,
        caseId: FU_CASE_ID,
        kind: 'document',
        originalName,
        sizeBytes: 2048,
        contentType: 'application/pdf',
        sha256: 'a'.repeat(64),
        uploadedBy: { id: null, name: 'Ilse Marrow', role: 'staff' },
        uploadedAt: '2026-11-26T10:00:00.000Z',
        removed: removed ? { at: '2026-11-27T10:00:00.000Z', by: 'Ilse Marrow', reason: 'Wrong file' } : null,
        verification: null,
        processing: { state: 'none', progress: 0 },
        abilities: { download: true, verify: true, remove: false },
      })
    answer('get', `/api/cases/${FU_CASE_ID}/evidence`, { evidence: [file('00000000-0000-4000-8000-0000000000e1', 'postal-receipt.pdf', false), file('00000000-0000-4000-8000-0000000000e2', 'old-scan.pdf', true)] })
    const notice = { id: '8d4e5f6a-7b8c-4d9e-8f0a-1b2c3d4e5f6a', servedOn: '2026-11-28', method: 'registered_post', methodLabel: 'Registered post', methodOther: null, servedBy: 'Ilse Marrow', reference: 'RP 4471 0093', summary: 'Replace the amplifier within 7 days.', evidenceId: '00000000-0000-4000-8000-0000000000e1', recordedAt: '2026-11-28T12:00:00.000Z', recordedBy: 'Ilse Marrow' }
    const sent = answer('post', `/api/cases/${FU_CASE_ID}/notices`, partyResponse({ notices: [noticeViewSchema.parse(notice)] }), { status: 201 })
    const { user } = at(() => <ResponsiblePartySection caseId={FU_CASE_ID} />)
    await user.click(await screen.findByRole('button', { name: 'Record a notice served' }))
    const form = screen.getByRole('form', { name: 'Record a notice served' })
    const copy = within(form).getByLabelText('Copy or receipt among the case’s evidence')
    await within(copy).findByRole('option', { name: /postal-receipt\.pdf/ })
    expect(within(copy).queryByRole('option', { name: /old-scan/ })).not.toBeInTheDocument()
    await user.type(within(form).getByLabelText('Served on'), '2026-11-28')
    await user.selectOptions(within(form).getByLabelText('How it was served'), 'registered_post')
    await user.type(within(form).getByLabelText('Reference (letter or receipt number)'), 'RP 4471 0093')
    await user.type(within(form).getByLabelText('What the notice requires'), 'Replace the amplifier within 7 days.')
    await user.selectOptions(copy, '00000000-0000-4000-8000-0000000000e1')
    await user.click(within(form).getByRole('button', { name: 'Record the notice' }))
    const list = await screen.findByRole('list', { name: 'Notices served' })
    expect(within(list).getByText(/ref\. RP 4471 0093/)).toBeInTheDocument()
    expect(sent[0]!.body).toMatchObject({ servedOn: '2026-11-28', method: 'registered_post', reference: 'RP 4471 0093', evidenceId: '00000000-0000-4000-8000-0000000000e1' })
    expect(screen.queryByRole('form', { name: 'Record a notice served' })).not.toBeInTheDocument()
  })

  it('offers no recording to a reader without the ability', async () => {
    answer('get', `/api/cases/${FU_CASE_ID}/responsible-party`, partyResponse({ abilities: { record: false } }))
    const { settled } = at(() => <ResponsiblePartySection caseId={FU_CASE_ID} />)
    await screen.findByText('Tarnwick Boat Club Ltd')
    await settled()
    expect(screen.queryByRole('button', { name: /Update the party|Record a notice/ })).not.toBeInTheDocument()
  })
})

describe('DueFollowUpsSection', () => {
  it('lists the overdue follow-up with a link to its case', async () => {
    answer('get', '/api/follow-ups/due', dueFollowUps())
    at(() => <DueFollowUpsSection showInvestigator />)
    expect(await screen.findByRole('heading', { name: 'Follow-ups due or overdue (1)' })).toBeInTheDocument()
    expect(screen.getByRole('link', { name: 'QB-2026-00412' })).toHaveAttribute('href', `/cases/${FU_CASE_ID}`)
    expect(screen.getByText('Overdue')).toBeInTheDocument()
    expect(screen.getByText('Ilse Marrow')).toBeInTheDocument()
  })

  it('says so when nothing is due', async () => {
    answer('get', '/api/follow-ups/due', dueFollowUps({ items: [] }))
    at(() => <DueFollowUpsSection />)
    expect(await screen.findByText('No follow-up is due today (2026-12-05) or overdue.')).toBeInTheDocument()
  })
})

describe('MyEmailsPanel', () => {
  it('lists what the server says this person is e-mailed', async () => {
    answer('get', '/api/me/emails', myEmails('investigator'))
    at(() => <MyEmailsPanel />)
    expect(await screen.findByText('A case is assigned to you.')).toBeInTheDocument()
    expect(screen.getByText(/A complainant adds information to a case assigned to you/)).toBeInTheDocument()
    expect(screen.queryByText(/Every morning/)).not.toBeInTheDocument()
    expect(screen.getByText('ilse.marrow@quietband.test')).toBeInTheDocument()
  })
})

/**
 * The users page: each account's last sign-in ("Never" before the first); "Change…" opens the
 * change of role or office, which sends both to the account's route and says what followed
 * (sessions ended, cases back to triage); the server's refusal of a field shows beside it, and
 * the last administrator's refusal in words; an inactive account is reactivated.
 */
import { screen, waitFor, within } from '@testing-library/react'
import { describe, expect, it } from 'vitest'
import { meResponseSchema, NO_ACCOUNT_ABILITIES } from '../../shared/schemas/auth'
import { personChangedResponseSchema } from '../../shared/schemas/people'
import { usersResponseSchema, type UserRow } from '../../shared/schemas/views'
import { Component as UsersPage } from '@/app/routes/admin-users'
import { paths } from '@/lib/paths'
import { answer, apiError } from '../support/msw-server'
import { IDS, office, officesResponse, staffMember } from '../support/msw-views'
import { renderPage } from '../support/web-render'

const ADMIN_ID = '00000000-0000-4000-8000-0000000000ad'
const ORLESS = office({ id: IDS.orlessOffice, name: 'Orless Field Office' })

const ilse = staffMember({ id: IDS.investigatorIlse, name: 'Ilse Brannock' })
const never = staffMember({ id: IDS.investigatorMorven, name: 'Morven Achterberg', lastSignedInAt: null, active: false })

function serve(users: UserRow[] = [ilse, never]) {
  answer(
    'get',
    '/api/me',
    meResponseSchema.parse({
      user: { id: ADMIN_ID, email: 'admin@quietband.test', name: 'Aino Vehkala', role: 'admin', officeId: null, officeName: null },
      abilities: { ...NO_ACCOUNT_ABILITIES, manageUsers: true, manageOffices: true, readCases: true },
    }),
  )
  answer('get', '/api/offices', officesResponse([office(), ORLESS]))
  // read at each request, so a test can change what the server holds
  return answer('get', '/api/admin/users', () => usersResponseSchema.parse({ users }))
}

const openPage = () => renderPage({ url: paths.adminUsers.href(), routes: [{ path: paths.adminUsers.path, Component: UsersPage }] })

const rowOf = async (name: string) => (await screen.findByRole('cell', { name })).closest('tr')!

describe('the users page', () => {
  it('shows each account’s last sign-in, or “Never”', async () => {
    serve()
    openPage()
    const row = await rowOf('Ilse Brannock')
    expect(within(row).getByText('29 Nov 2026', { exact: false })).toHaveAttribute('dateTime', '2026-11-29T07:40:00.000Z')
    expect(within(await rowOf('Morven Achterberg')).getByText('Never')).toBeInTheDocument()
    expect(screen.getByRole('columnheader', { name: /Last sign-in/ })).toBeInTheDocument()
  })

  it('moves a person to another office and says what followed', async () => {
    const reads = serve()
    const sent = answer('patch', '/api/admin/users/:id', () =>
      personChangedResponseSchema.parse({ user: { ...ilse, officeId: IDS.orlessOffice, officeName: 'Orless Field Office' }, sessionsEnded: 2, casesReturnedToTriage: 3 }),
    )
    const { user } = openPage()
    await user.click(within(await rowOf('Ilse Brannock')).getByRole('button', { name: /^Change…\s*role or office of Ilse Brannock$/ }))
    const form = await screen.findByRole('form', { name: 'Change role or office: Ilse Brannock' })
    expect(within(form).getByText(/open cases in the office they leave go back to that office’s triage/)).toBeInTheDocument()
    expect(within(form).getByLabelText('Role')).toHaveValue('investigator')
    await user.selectOptions(within(form).getByLabelText('Office'), IDS.orlessOffice)
    await user.click(within(form).getByRole('button', { name: 'Save change' }))
    await waitFor(() => expect(sent).toHaveLength(1))
    expect(sent[0]!.url.pathname).toBe(`/api/admin/users/${IDS.investigatorIlse}`)
    expect(sent[0]!.body).toEqual({ role: 'investigator', officeId: IDS.orlessOffice })
    expect(await within(form).findByText(/Sessions ended: 2\. Cases returned to triage: 3\./)).toBeInTheDocument()
    expect(within(form).getByText(/at Orless Field Office/)).toBeInTheDocument()
    // the list is read again
    await waitFor(() => expect(reads.length).toBeGreaterThanOrEqual(2))
  })

  it('shows the server’s refusal of a field beside it, and the last administrator’s refusal in words', async () => {
    serve()
    let reply = apiError(400, { code: 'validation_failed', message: 'Some fields need attention.', details: [{ path: 'officeId', message: 'Office supervisors belong to an office: choose one.' }] })
    const sent = answer('patch', '/api/admin/users/:id', () => reply)
    const { user } = openPage()
    await user.click(within(await rowOf('Ilse Brannock')).getByRole('button', { name: /^Change…\s*role or office of Ilse Brannock$/ }))
    const form = await screen.findByRole('form', { name: 'Change role or office: Ilse Brannock' })
    await user.selectOptions(within(form).getByLabelText('Role'), 'supervisor')
    await user.selectOptions(within(form).getByLabelText('Office'), '')
    await user.click(within(form).getByRole('button', { name: 'Save change' }))
    await waitFor(() => expect(sent).toHaveLength(1))
    expect(sent[0]!.body).toEqual({ role: 'supervisor', officeId: null })
    expect(await within(form).findByText('Office supervisors belong to an office: choose one.')).toBeInTheDocument()
    expect(within(form).getByLabelText(/^Office/)).toHaveAttribute('aria-invalid', 'true')

    reply = apiError(409, { code: 'last_admin', message: 'This is the last active administrator: make another account an administrator first, then change or deactivate this one.' })
    await user.selectOptions(within(form).getByLabelText(/^Office/), IDS.tarnwickOffice)
    await user.click(within(form).getByRole('button', { name: 'Save change' }))
    expect(await within(form).findByText(/last active administrator/)).toBeInTheDocument()
  })

  it('reactivates an inactive account', async () => {
    const held = [ilse, never]
    serve(held)
    const sent = answer('patch', '/api/admin/users/:id', () => {
      held[1] = { ...never, active: true }
      return personChangedResponseSchema.parse({ user: held[1], sessionsEnded: 0, casesReturnedToTriage: 0 })
    })
    const { user } = openPage()
    await user.click(within(await rowOf('Morven Achterberg')).getByRole('button', { name: /^Reactivate\s*Morven Achterberg$/ }))
    await waitFor(() => expect(sent).toHaveLength(1))
    expect(sent[0]!.body).toEqual({ active: true })
    expect(await within(await rowOf('Morven Achterberg')).findByText('Active')).toBeInTheDocument()
    expect(await screen.findByText('Morven Achterberg can sign in again.')).toBeInTheDocument()
  })

  it('deactivates an investigator and says their open cases went back to triage', async () => {
    const held = [ilse, never]
    serve(held)
    const sent = answer('patch', '/api/admin/users/:id', () => {
      held[0] = { ...ilse, active: false }
      return personChangedResponseSchema.parse({ user: held[0], sessionsEnded: 1, casesReturnedToTriage: 2 })
    })
    const { user } = openPage()
    await user.click(within(await rowOf('Ilse Brannock')).getByRole('button', { name: /^Deactivate\s*Ilse Brannock$/ }))
    await waitFor(() => expect(sent).toHaveLength(1))
    expect(sent[0]!.body).toEqual({ active: false })
    expect(await screen.findByText('Ilse Brannock is deactivated and signed out everywhere (1 session ended); 2 open cases went back to the office\'s triage.')).toBeInTheDocument()
  })
})

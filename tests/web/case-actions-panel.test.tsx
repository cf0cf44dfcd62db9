import { screen, waitFor, within } from '@testing-library/react'
import { describe, expect, it } from 'vitest'
import type { CaseAbilities, CaseDetail } from '../../shared/schemas/views'
import { Component as CasePage } from '@/app/routes/case'
import { paths } from '@/lib/paths'
import { answer, apiError } from '../support/msw-server'
import { measurementsResponse } from '../support/msw-measurements'
import { abilities, caseResponse, IDS, investigatorsResponse, mergeCandidatesResponse, transferOfficesResponse } from '../support/msw-views'
import { renderPage } from '../support/web-render'
import { calculationsResponse, findingsResponse } from '../support/msw-findings'
import { answerNoEnforcementRecords } from '../support/msw-follow-ups'

const CASE_URL = `/cases/${IDS.case}`

/** Serves the case with these abilities, and the lists its action forms may ask for. */
function serveTheCase(options: { abilities: CaseAbilities; changes?: Partial<CaseDetail>; otherOffices?: boolean }) {
  answer('get', '/api/cases/:id', caseResponse({ ...options.changes, abilities: options.abilities }))
  answer('get', '/api/cases/:id/investigators', investigatorsResponse())
  answer('get', '/api/cases/:id/merge-candidates', mergeCandidatesResponse())
  answer('get', '/api/cases/:id/findings', findingsResponse())
  answer('get', '/api/cases/:id/calculations', calculationsResponse([]))
  answer('get', '/api/cases/:id/measurements', measurementsResponse())
  answer('get', '/api/cases/:id/evidence', { evidence: [] })
  answerNoEnforcementRecords()
  return {
    transferOffices: answer('get', '/api/cases/:id/transfer-offices', transferOfficesResponse(options.otherOffices === false ? [] : undefined)),
  }
}

async function openTheCasePage() {
  const page = renderPage({ url: CASE_URL, routes: [{ path: paths.case.path, Component: CasePage }] })
  const panel = await screen.findByRole('region', { name: 'Actions' })
  return { ...page, panel }
}

/**
 * The actions the panel offers, by the name a person sees: the heading of each open form and
 * the summary of each folded one.
 */
function offeredActions(panel: HTMLElement): string[] {
  const headings = within(panel).queryAllByRole('heading', { level: 3 }).map((h) => h.textContent ?? '')
  const folded = Array.from(panel.querySelectorAll('summary')).map((s) => s.textContent ?? '')
  return [...headings, ...folded].map((t) => t.trim()).sort()
}

describe('the case page’s action panel', () => {
  it('offers a supervisor every triage move on a new report, and the notes', async () => {
    serveTheCase({ abilities: abilities('triage', 'assign', 'transfer', 'merge', 'dismiss', 'addInternalNote', 'messageComplainant') })
    const { panel } = await openTheCasePage()

    await waitFor(() => expect(offeredActions(panel)).toContain('Transfer to another office'))
    expect(offeredActions(panel)).toEqual(
      [
        'Set the priority',
        'Assign an investigator',
        'Merge into an open case',
        'Close at triage',
        'Transfer to another office',
        'Message the complainant',
        'Add an internal note',
      ].sort(),
    )
  })

  it('offers no transfer when there is no other office to send the report to', async () => {
    const served = serveTheCase({ abilities: abilities('triage', 'transfer', 'addInternalNote'), otherOffices: false })
    const { panel, settled } = await openTheCasePage()

    // the page asked where the report could go, and heard: nowhere
    await waitFor(() => expect(served.transferOffices).toHaveLength(1))
    await settled()
    expect(offeredActions(panel)).toEqual(['Add an internal note', 'Set the priority'])
  })

  it('offers the assigned investigator field work and a finding, and no supervisor move', async () => {
    serveTheCase({
      abilities: abilities('startFieldWork', 'proposeFinding', 'addInternalNote', 'messageComplainant'),
      changes: { status: 'assigned', investigatorId: IDS.investigatorIlse, investigatorName: 'Ilse Brannock' },
    })
    const { panel } = await openTheCasePage()

    expect(offeredActions(panel)).toEqual(['Add an internal note', 'Field work', 'Message the complainant', 'Propose a finding'])
    expect(within(panel).queryByRole('button', { name: 'Set priority' })).not.toBeInTheDocument()
  })

  it('offers a supervisor the review of a proposed finding, and reassigning rather than assigning', async () => {
    serveTheCase({
      abilities: abilities('close', 'returnFinding', 'assign', 'addInternalNote'),
      changes: { status: 'finding_proposed', investigatorId: IDS.investigatorIlse, investigatorName: 'Ilse Brannock' },
    })
    const { panel } = await openTheCasePage()

    expect(offeredActions(panel)).toEqual(['Add an internal note', 'Approve and close', 'Reassign to another investigator', 'Send back for more work'])
  })

  it('offers only reopening and the notes on a closed case', async () => {
    serveTheCase({
      abilities: abilities('reopen', 'addInternalNote', 'messageComplainant'),
      changes: { status: 'closed', resolution: 'source_corrected', resolutionLabel: 'Source corrected', closingSummary: 'The faulty amplifier was replaced.', closedAt: '2026-12-02T10:00:00.000Z' },
    })
    const { panel } = await openTheCasePage()

    expect(offeredActions(panel)).toEqual(['Add an internal note', 'Message the complainant', 'Reopen the case'])
  })

  it('offers nothing, and says so, to a viewer the abilities allow no move', async () => {
    serveTheCase({ abilities: abilities() })
    const { panel } = await openTheCasePage()

    expect(offeredActions(panel)).toEqual([])
    expect(within(panel).queryAllByRole('button')).toEqual([])
    expect(panel).toHaveTextContent('You can read this case. Changes are made by the staff of its office.')
  })

  it('sends a move with the case’s version, then offers what the answered case allows', async () => {
    const assigned = { status: 'assigned', investigatorId: IDS.investigatorIlse, investigatorName: 'Ilse Brannock' } as const
    serveTheCase({ abilities: abilities('startFieldWork', 'proposeFinding', 'addInternalNote'), changes: { ...assigned, version: 7 } })
    const moves = answer(
      'post',
      '/api/cases/:id/start-field-work',
      caseResponse({ ...assigned, version: 8, status: 'field_work', abilities: abilities('proposeFinding', 'addInternalNote') }),
    )
    const { panel, user } = await openTheCasePage()

    await user.click(within(panel).getByRole('button', { name: 'Start field work' }))

    expect(await within(panel).findByRole('status')).toHaveTextContent('Field work started.')
    expect(moves.map((m) => [m.url.pathname, m.body])).toEqual([[`/api/cases/${IDS.case}/start-field-work`, { version: 7 }]])
    expect(offeredActions(panel)).toEqual(['Add an internal note', 'Propose a finding'])
  })

  it('asks to reload when someone else moved the case first, and then offers what the fresh case allows', async () => {
    const assigned = { status: 'assigned', investigatorId: IDS.investigatorIlse, investigatorName: 'Ilse Brannock' } as const
    let current = caseResponse({ ...assigned, version: 7, abilities: abilities('startFieldWork', 'proposeFinding', 'addInternalNote') })
    const reads = answer('get', '/api/cases/:id', () => current)
    answer('get', '/api/cases/:id/findings', findingsResponse())
    answer('get', '/api/cases/:id/calculations', calculationsResponse([]))
    answer('get', '/api/cases/:id/measurements', measurementsResponse())
    answer('get', '/api/cases/:id/evidence', { evidence: [] })
    answerNoEnforcementRecords()
  answer('get', '/api/cases/:id/measurements', measurementsResponse())
  answer('get', '/api/cases/:id/evidence', { evidence: [] })
  answerNoEnforcementRecords()
    answer('post', '/api/cases/:id/start-field-work', () =>
      apiError(409, { code: 'stale_version', message: 'The case was changed by someone else. Reload it and try again.' }),
    )
    const { panel, user } = await openTheCasePage()

    // meanwhile the supervisor took the case back to triage
    current = caseResponse({ version: 8, status: 'triaged', abilities: abilities('addInternalNote') })
    await user.click(within(panel).getByRole('button', { name: 'Start field work' }))
    expect(await within(panel).findByText('Someone else changed this case a moment ago.')).toBeInTheDocument()
    await user.click(within(panel).getByRole('button', { name: 'Reload case' }))

    await waitFor(() => expect(offeredActions(panel)).toEqual(['Add an internal note']))
    expect(reads).toHaveLength(2)
  })
})

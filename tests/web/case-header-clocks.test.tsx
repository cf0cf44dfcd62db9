/**
 * The case header shows both clocks of shared/domain/case-clocks.ts side by side under
 * "Response": the first
 * response (answered after…, due in…, overdue by…, or stopped by the closing) and the
 * resolution, each with its office target, read from the case as the API answers it (mocked
 * with msw from the view schema). The words follow the one rule: overdue strictly after the
 * due time while the clock runs; the first response stops the first-response clock.
 */
import { screen, within } from '@testing-library/react'
import { describe, expect, it } from 'vitest'
import { useCase } from '@/features/case-page/api/get-case'
import { CaseHeader } from '@/features/case-page/components/case-header'
import { paths } from '@/lib/paths'
import type { CaseDetail } from '@shared/schemas/views'
import { answer } from '../support/msw-server'
import { caseResponse, IDS } from '../support/msw-views'
import { renderPage } from '../support/web-render'

const RECEIVED = '2026-11-30T08:15:00.000Z'
/** An office target of 8 h for the first response and 8 days for the resolution. */
const FIRST_DUE = '2026-11-30T16:15:00.000Z'
const RESOLUTION_DUE = '2026-12-08T08:15:00.000Z'

function openHeader(changes: Partial<CaseDetail>, now: string) {
  answer('get', '/api/cases/:id', caseResponse({ receivedAt: RECEIVED, firstResponseDueAt: FIRST_DUE, dueAt: RESOLUTION_DUE, ...changes }))
  function CaseTop() {
    const q = useCase(IDS.case)
    return q.data ? <CaseHeader detail={q.data} now={new Date(now)} /> : <p>Loading</p>
  }
  renderPage({ url: `/cases/${IDS.case}`, routes: [{ path: paths.case.path, Component: CaseTop }] })
}

/** One clock under the header's "Response" fact, found by the words it starts with ("First response: …", "Resolution: …"). */
async function fact(clock: 'First response' | 'Resolution'): Promise<HTMLElement> {
  const dd = (await screen.findByText('Response', { selector: 'dt' })).nextElementSibling as HTMLElement
  const line = within(dd).getByText((_, el) => el?.tagName === 'P' && el.textContent!.startsWith(`${clock}: `))
  return line.parentElement!
}

describe('the case header’s clocks', () => {
  it('shows a first response given within the target beside the resolution clock', async () => {
    openHeader({ status: 'assigned', firstRespondedAt: '2026-11-30T11:15:00.000Z' }, '2026-11-30T14:15:00.000Z')
    const first = await fact('First response')
    expect(first).toHaveTextContent('First response: answered after about 3 hours (target 8 h)')
    expect(first).not.toHaveTextContent(/overdue/)
    const resolution = await fact('Resolution')
    expect(resolution).toHaveTextContent(/^Resolution: about 6 hours old, against a target of 8 days/)
    expect(resolution).toHaveTextContent(/due in 8 days/)
  })

  it('counts down while no one has answered yet, with the due time', async () => {
    openHeader({ status: 'received', firstRespondedAt: null }, '2026-11-30T14:15:00.000Z')
    const first = await fact('First response')
    expect(first).toHaveTextContent('First response: due in about 2 hours (target 8 h)')
    expect(within(first).getByText(/^Due/).querySelector('time')).toHaveAttribute('dateTime', FIRST_DUE)
  })

  it('says by how much the first response is overdue, in the danger colour, once the due time has passed', async () => {
    openHeader({ status: 'received', firstRespondedAt: null, firstResponseOverdue: true }, '2026-11-30T21:15:00.000Z')
    const first = await fact('First response')
    const line = within(first).getByText(/^First response:/)
    expect(line).toHaveTextContent('First response: overdue by about 5 hours (target 8 h)')
    expect(line).toHaveClass('text-danger')
  })

  it('is not overdue at the due time itself (the shared rule: strictly after)', async () => {
    openHeader({ status: 'received', firstRespondedAt: null }, FIRST_DUE)
    const first = await fact('First response')
    expect(first).toHaveTextContent('First response: due in less than a minute (target 8 h)')
    expect(within(first).getByText(/^First response:/)).not.toHaveClass('text-danger')
  })

  it('says how late a late answer came', async () => {
    openHeader({ status: 'triaged', firstRespondedAt: '2026-11-30T18:15:00.000Z' }, '2026-12-01T09:00:00.000Z')
    expect(await fact('First response')).toHaveTextContent('First response: answered after about 10 hours, about 2 hours past the target (target 8 h)')
  })

  it('stops the first-response clock when the case closed before any answer', async () => {
    openHeader(
      { status: 'closed', firstRespondedAt: null, closedAt: '2026-11-30T12:15:00.000Z', resolution: 'withdrawn', resolutionLabel: 'Withdrawn' },
      '2026-12-02T09:00:00.000Z',
    )
    const first = await fact('First response')
    expect(first).toHaveTextContent('First response: no first response was recorded before the case closed (target 8 h)')
    expect(within(first).queryByText(/^Due/)).not.toBeInTheDocument()
  })
})

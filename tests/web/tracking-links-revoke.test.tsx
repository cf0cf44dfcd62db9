/**
 * "Close tracking links…" on the case page: shown from the case's abilities only; the first
 * click only opens the confirmation (nothing is sent), which asks why; the second sends the
 * reason, says how many links closed and reloads the case; Cancel sends nothing; a refusal of
 * the reason shows beside the field.
 */
import { screen, waitFor, within } from '@testing-library/react'
import { describe, expect, it } from 'vitest'
import { useCase } from '@/features/case-page/api/get-case'
import { TrackingLinksRevoke } from '@/features/case-page/components/tracking-links-revoke'
import { paths } from '@/lib/paths'
import { answer, apiError } from '../support/msw-server'
import { abilities, caseResponse, IDS } from '../support/msw-views'
import { renderPage } from '../support/web-render'

function serve(can: Parameters<typeof abilities>) {
  return answer('get', '/api/cases/:id', caseResponse({ status: 'assigned', abilities: abilities(...can) }))
}

/** The panel as the case page places it, with the page's own case query. */
function CaseSide() {
  const q = useCase(IDS.case)
  if (!q.data) return <p>Loading</p>
  return (
    <>
      <h1>{q.data.reference}</h1>
      <TrackingLinksRevoke detail={q.data} />
    </>
  )
}

const openCase = () => renderPage({ url: `/cases/${IDS.case}`, routes: [{ path: paths.case.path, Component: CaseSide }] })

describe('closing a case’s tracking links', () => {
  it('is not shown without the ability', async () => {
    serve(['addInternalNote'])
    openCase()
    await screen.findByRole('heading', { level: 1 })
    expect(screen.queryByRole('button', { name: 'Close tracking links…' })).not.toBeInTheDocument()
  })

  it('asks for confirmation and a reason, then closes the links and reloads the case', async () => {
    const reads = serve(['revokeTrackingLinks'])
    const sent = answer('post', '/api/cases/:id/tracking-links/revoke', { revokedCount: 3 })
    const { user } = openCase()
    await user.click(await screen.findByRole('button', { name: 'Close tracking links…' }))
    // the first click only asks
    expect(sent).toHaveLength(0)
    const form = screen.getByRole('form', { name: 'Close tracking links' })
    await user.type(within(form).getByLabelText(/Why close them\?/), 'Forwarded to a neighbour by mistake.')
    await user.click(within(form).getByRole('button', { name: 'Close all links' }))
    await waitFor(() => expect(sent).toHaveLength(1))
    expect(sent[0]!.url.pathname).toBe(`/api/cases/${IDS.case}/tracking-links/revoke`)
    expect(sent[0]!.body).toEqual({ reason: 'Forwarded to a neighbour by mistake.' })
    expect(await screen.findByRole('status')).toHaveTextContent('3 links closed.')
    expect(screen.queryByRole('form', { name: 'Close tracking links' })).not.toBeInTheDocument()
    await waitFor(() => expect(reads.length).toBeGreaterThanOrEqual(2))
  })

  it('sends nothing on Cancel or without a reason, and shows the server’s refusal beside the field', async () => {
    serve(['revokeTrackingLinks'])
    const sent = answer('post', '/api/cases/:id/tracking-links/revoke', () =>
      apiError(400, { code: 'validation_failed', message: 'Some fields need attention.', details: [{ path: 'reason', message: 'At most 2000 characters.' }] }),
    )
    const { user } = openCase()
    await user.click(await screen.findByRole('button', { name: 'Close tracking links…' }))
    await user.click(screen.getByRole('button', { name: 'Cancel' }))
    expect(screen.queryByRole('form', { name: 'Close tracking links' })).not.toBeInTheDocument()
    await user.click(screen.getByRole('button', { name: 'Close tracking links…' }))
    const form = screen.getByRole('form', { name: 'Close tracking links' })
    await user.click(within(form).getByRole('button', { name: 'Close all links' }))
    expect(await within(form).findByText('Say why the links are closed (at least 3 characters).')).toBeInTheDocument()
    expect(sent).toHaveLength(0)
    await user.type(within(form).getByLabelText(/Why close them\?/), 'A reason the server refuses')
    await user.click(within(form).getByRole('button', { name: 'Close all links' }))
    await waitFor(() => expect(sent).toHaveLength(1))
    expect(await within(form).findByText('At most 2000 characters.')).toBeInTheDocument()
  })
})

import { screen, within } from '@testing-library/react'
import { describe, expect, it } from 'vitest'
import { Component as CasePage } from '@/app/routes/case'
import { paths } from '@/lib/paths'
import { answer } from '../support/msw-server'
import { measurementsResponse } from '../support/msw-measurements'
import { abilities, caseResponse, IDS, regionMapResponse } from '../support/msw-views'
import { calculationsResponse, FINDING_IDS, findingsResponse, findingView } from '../support/msw-findings'
import { renderPage } from '../support/web-render'
import { answerNoEnforcementRecords } from '../support/msw-follow-ups'

const WARNING = 'The distance is inside the near field of a large antenna; the estimate may be high.'

function serve(status: 'finding_proposed' | 'closed', can: Parameters<typeof abilities>) {
  answer('get', '/api/cases/:id', caseResponse({ status, investigatorId: IDS.investigatorIlse, investigatorName: 'Ilse Brannock', abilities: abilities(...can) }))
  answer('get', '/api/cases/:id/calculations', calculationsResponse())
  answer('get', '/api/cases/:id/measurements', measurementsResponse())
  answer('get', '/api/cases/:id/evidence', { evidence: [] })
  answerNoEnforcementRecords()
  answer('get', '/api/region', regionMapResponse())
  answer(
    'get',
    '/api/cases/:id/findings',
    findingsResponse(findingView(), [
      findingView({
        id: FINDING_IDS.earlierFinding,
        summary: 'First look: the amplifier.',
        calculations: [],
        sourcePosition: null,
        review: { outcome: 'returned', at: '2026-12-01T15:00:00.000Z', by: 'Ansel Quarry', comments: 'Measure at the second house too.' },
      }),
    ]),
  )
}

async function openTheFinding() {
  const page = renderPage({ url: `/cases/${IDS.case}`, routes: [{ path: paths.case.path, Component: CasePage }] })
  const finding = await screen.findByRole('region', { name: 'Finding awaiting review' }).catch(() => screen.findByRole('region', { name: 'Finding' }))
  return { ...page, finding }
}

describe('the supervisor’s review of a finding', () => {
  it('shows the finding with its calculations’ numbers, interval, every warning, methods and library version, beside approve and send back', async () => {
    serve('finding_proposed', ['close', 'returnFinding', 'addInternalNote'])
    const { finding } = await openTheFinding()

    expect(finding).toHaveTextContent('A faulty masthead amplifier on the Tarnwick boat club roof')
    expect(finding).toHaveTextContent('Give the operator advice')
    expect(finding).toHaveTextContent('Tarnwick Boat Club')
    const calc = within(finding).getByRole('article', { name: 'EIRP from one measured level' })
    expect(calc).toHaveTextContent('23.41 dBm')
    expect(calc).toHaveTextContent('interval 21.9 to 24.93 dBm')
    expect(calc).toHaveTextContent('GUM U = k·u_c, k = 2 (about 95 %)')
    // the warning is on the page, not folded away
    expect(within(calc).getByText(WARNING)).toBeVisible()
    expect(calc).toHaveTextContent('itu-r-p525-free-space')
    expect(calc).toHaveTextContent('library 0.3.0')
    expect(within(finding).getByRole('complementary', { name: 'Enforcement caution' })).toHaveTextContent('local codes and licensed practice')

    const actions = screen.getByRole('region', { name: 'Actions' })
    expect(within(actions).getByRole('button', { name: 'Approve and close' })).toBeInTheDocument()
    expect(within(actions).getByRole('button', { name: 'Send back for more work' })).toBeInTheDocument()
  })

  it('keeps the earlier proposal with the supervisor’s comments when sent back', async () => {
    serve('finding_proposed', ['close', 'returnFinding'])
    const { finding } = await openTheFinding()
    expect(finding).toHaveTextContent('Earlier proposals (1)')
    expect(finding).toHaveTextContent('First look: the amplifier.')
    expect(finding).toHaveTextContent('Sent back by Ansel Quarry')
    expect(finding).toHaveTextContent('Measure at the second house too.')
  })

  it('shows the finding read-only after the case is closed, with its warnings and the caution', async () => {
    serve('closed', ['reopen'])
    const { finding } = await openTheFinding()
    expect(finding).toHaveAccessibleName('Finding')
    expect(within(finding).getByText(WARNING)).toBeVisible()
    expect(within(finding).getByRole('complementary', { name: 'Enforcement caution' })).toBeInTheDocument()
    expect(screen.queryByRole('button', { name: /Approve and close|Send back/ })).not.toBeInTheDocument()
  })
})

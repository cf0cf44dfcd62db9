import { screen, waitFor, within } from '@testing-library/react'
import { describe, expect, it } from 'vitest'
import { Component as CasePage } from '@/app/routes/case'
import { paths } from '@/lib/paths'
import { answer, apiError } from '../support/msw-server'
import { measurementsResponse } from '../support/msw-measurements'
import { abilities, caseResponse, IDS } from '../support/msw-views'
import { calculationsResponse, calculationView, FINDING_IDS, findingsResponse } from '../support/msw-findings'
import { renderPage } from '../support/web-render'
import { answerNoEnforcementRecords } from '../support/msw-follow-ups'

const assigned = { status: 'field_work', investigatorId: IDS.investigatorIlse, investigatorName: 'Ilse Brannock', version: 4 } as const

function serveTheCase() {
  answer('get', '/api/cases/:id', caseResponse({ ...assigned, abilities: abilities('proposeFinding', 'addInternalNote') }))
  answer('get', '/api/cases/:id/findings', findingsResponse())
  answer('get', '/api/cases/:id/measurements', measurementsResponse())
  answer('get', '/api/cases/:id/evidence', { evidence: [] })
  answerNoEnforcementRecords()
  answer(
    'get',
    '/api/cases/:id/calculations',
    calculationsResponse([
      calculationView(),
      calculationView({
        id: FINDING_IDS.verdictCalculation,
        kind: 'compliance_verdict',
        kindLabel: 'Compliance verdict against a limit',
        outputs: { value: { verdict: 'exceeds', marginDb: 3.2 } },
        warnings: [],
      }),
    ]),
  )
}

async function openTheForm() {
  const page = renderPage({ url: `/cases/${IDS.case}`, routes: [{ path: paths.case.path, Component: CasePage }] })
  const panel = await screen.findByRole('region', { name: 'Actions' })
  await within(panel).findByRole('group', { name: /Calculations the finding rests on/ })
  return { ...page, panel }
}

describe('the investigator’s finding form', () => {
  it('lists the case’s calculations with their main value, interval and warnings count', async () => {
    serveTheCase()
    const { panel } = await openTheForm()
    const list = within(panel).getByRole('group', { name: /Calculations the finding rests on/ })
    const eirp = within(list).getByRole('checkbox', { name: /EIRP from one measured level/ })
    expect(eirp).toHaveAccessibleName(expect.stringContaining('23.41 dBm'))
    expect(eirp).toHaveAccessibleName(expect.stringContaining('interval 21.9 to 24.93 dBm'))
    expect(eirp).toHaveAccessibleName(expect.stringContaining('1 warning'))
    const verdict = within(list).getByRole('checkbox', { name: /Compliance verdict against a limit/ })
    expect(verdict).toHaveAccessibleName(expect.stringContaining('3.2 dB'))
    expect(verdict).toHaveAccessibleName(expect.stringContaining('no warnings'))
  })

  it('puts a message beside each field that needs one, and sends nothing', async () => {
    serveTheCase()
    const sent = answer('post', '/api/cases/:id/propose-finding', caseResponse())
    const { panel, user } = await openTheForm()
    await user.type(within(panel).getByLabelText('Latitude', { exact: false }), '48.1')
    await user.type(within(panel).getByLabelText('Compliance deadline (optional)', { exact: false }), '2001-01-01')
    await user.click(within(panel).getByRole('button', { name: 'Propose finding' }))

    expect(await within(panel).findByText('Describe the source you found (at least 3 characters).')).toBeInTheDocument()
    expect(within(panel).getByLabelText('The source', { exact: false })).toHaveAccessibleDescription(expect.stringContaining('Describe the source you found'))
    expect(within(panel).getByLabelText('Longitude', { exact: false })).toHaveAccessibleDescription(expect.stringContaining('Enter the longitude too'))
    expect(within(panel).getByLabelText('Recommended action')).toHaveAccessibleDescription('Choose the recommended action.')
    expect(within(panel).getByLabelText('Compliance deadline (optional)', { exact: false })).toHaveAccessibleDescription(expect.stringContaining('cannot be in the past'))
    expect(within(panel).getByLabelText('Finding summary', { exact: false })).toHaveAccessibleDescription(expect.stringContaining('Summarise the finding'))
    expect(sent).toHaveLength(0)
  })

  it('sends the structured finding with the linked calculations, and shows the server’s refusal of a link beside the list', async () => {
    serveTheCase()
    const sent = answer('post', '/api/cases/:id/propose-finding', () =>
      apiError(400, {
        code: 'validation_failed',
        message: 'Some fields need attention.',
        details: [{ path: 'calculationIds', message: `Not calculations of this case: ${FINDING_IDS.eirpCalculation}. Link only records stored on this case.` }],
      }),
    )
    const { panel, user } = await openTheForm()
    await user.type(within(panel).getByLabelText('The source', { exact: false }), 'Masthead amplifier at the boat club')
    await user.type(within(panel).getByLabelText('Latitude', { exact: false }), '48.1021')
    await user.type(within(panel).getByLabelText('Longitude', { exact: false }), '-31.3504')
    await user.click(within(panel).getByRole('checkbox', { name: /EIRP from one measured level/ }))
    await user.selectOptions(within(panel).getByLabelText('Recommended action'), 'formal_warning')
    await user.type(within(panel).getByLabelText('Finding summary', { exact: false }), 'Oscillates when the mast heater runs.')
    await user.click(within(panel).getByRole('button', { name: 'Propose finding' }))

    await waitFor(() => expect(sent).toHaveLength(1))
    expect(sent[0]!.body).toMatchObject({
      version: 4,
      sourceDescription: 'Masthead amplifier at the boat club',
      sourceLatDeg: '48.1021',
      sourceLonDeg: '-31.3504',
      calculationIds: [FINDING_IDS.eirpCalculation],
      evidenceIds: [],
      recommendedAction: 'formal_warning',
      summary: 'Oscillates when the mast heater runs.',
    })
    const list = within(panel).getByRole('group', { name: /Calculations the finding rests on/ })
    expect(await within(list).findByText(/Not calculations of this case/)).toBeInTheDocument()
    // nothing typed is lost
    expect(within(panel).getByLabelText('The source', { exact: false })).toHaveValue('Masthead amplifier at the boat club')
  })
})

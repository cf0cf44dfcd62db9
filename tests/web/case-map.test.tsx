/**
 * The case map of the estimates workbench: folded, it asks for nothing; opened, it shows the
 * offices of the region and the office's other open cases nearby, each named with its reference
 * and distance.
 */
import { screen, within } from '@testing-library/react'
import { describe, expect, it } from 'vitest'
import { calculationsResponseSchema } from '../../shared/schemas/views'
import { equipmentListResponseSchema, measurementsResponseSchema } from '../../shared/schemas/measurements'
import { findingsResponseSchema } from '../../shared/schemas/findings'
import { nearbyCasesResponseSchema } from '../../shared/schemas/nearby-cases'
import { Component as CasePage } from '@/app/routes/case'
import { paths } from '@/lib/paths'
import { answer, apiError } from '../support/msw-server'
import { abilities, caseResponse, IDS, regionMapResponse } from '../support/msw-views'
import { renderPage } from '../support/web-render'
import { answerNoEnforcementRecords } from '../support/msw-follow-ups'

const NEARBY = nearbyCasesResponseSchema.parse({
  cases: [
    { id: '1f2e3d4c-5b6a-4978-8695-a4b3c2d1e0f9', reference: 'QB-26-000417', status: 'triaged', statusLabel: 'Triaged, awaiting investigator', latDeg: 48.111, lonDeg: -31.35, distanceM: 1001, freqLowHz: 1.71e9, freqHighHz: 1.785e9 },
    { id: '2a3b4c5d-6e7f-4a8b-9c0d-1e2f3a4b5c6d', reference: 'QB-26-000388', status: 'received', statusLabel: 'New report', latDeg: 48.12, lonDeg: -31.283, distanceM: 850, freqLowHz: 8.7e7, freqHighHz: 1.08e8 },
  ],
})

/** A case in field work with its workbench's lists, the region map and (given) the nearby cases. */
function serveCase(nearby: Parameters<typeof answer>[2]) {
  answer('get', '/api/cases/:id', caseResponse({ status: 'field_work', investigatorId: IDS.investigatorIlse, investigatorName: 'Ilse Brannock', abilities: abilities('proposeFinding', 'storeCalculation') }))
  answer('get', '/api/cases/:id/findings', findingsResponseSchema.parse({ current: null, earlier: [] }))
  answer('get', '/api/cases/:id/calculations', calculationsResponseSchema.parse({ calculations: [] }))
  answer('get', '/api/cases/:id/measurements', measurementsResponseSchema.parse({ measurements: [], abilities: { record: true } }))
  answer('get', '/api/cases/:id/evidence', { evidence: [] })
  answerNoEnforcementRecords()
  answer('get', '/api/offices/:id/equipment', equipmentListResponseSchema.parse({ items: [], abilities: { manage: false } }))
  answer('get', '/api/region', regionMapResponse())
  return answer('get', '/api/cases/:id/nearby-cases', nearby)
}

async function openWorkbench() {
  const page = renderPage({ url: paths.case.href(IDS.case), routes: [{ path: paths.case.path, Component: CasePage }] })
  const bench = await screen.findByRole('region', { name: 'Estimates workbench' })
  await page.user.click(within(bench).getByText('Estimates workbench'))
  await within(bench).findByText('Map of the case')
  return { ...page, bench }
}

describe('the case map', () => {
  it('asks for the nearby cases only once opened, then shows each with its reference and distance, and the region’s office', async () => {
    const seen = serveCase(NEARBY)
    const { user, bench, settled } = await openWorkbench()
    await settled()
    expect(seen, 'a folded map asks for nothing').toHaveLength(0)
    await user.click(within(bench).getByText('Map of the case'))
    const map = await screen.findByRole('region', { name: /^Map of case / }, { timeout: 10_000 })
    expect(seen).toHaveLength(1)
    expect(seen[0]!.url.pathname).toBe(`/api/cases/${IDS.case}/nearby-cases`)
    expect(await within(map).findByRole('img', { name: 'QB-26-000417, 1.0 km away (Triaged, awaiting investigator)' })).toBeInTheDocument()
    expect(within(map).getByRole('img', { name: 'QB-26-000388, 850 m away (New report)' })).toBeInTheDocument()
    expect(within(map).getByRole('img', { name: /Tarnwick Field Office/ })).toBeInTheDocument()
  })

  it('still shows the case when the nearby cases cannot be loaded, and says so', async () => {
    serveCase(() => apiError(403, { code: 'forbidden', message: 'Not allowed.' }))
    const { user, bench } = await openWorkbench()
    await user.click(within(bench).getByText('Map of the case'))
    const map = await screen.findByRole('region', { name: /^Map of case / }, { timeout: 10_000 })
    expect(screen.getByText(/The other open cases nearby could not be loaded just now/)).toBeInTheDocument()
    expect(within(map).getByRole('img', { name: 'Complainant’s position' })).toBeInTheDocument()
    expect(within(map).queryByRole('img', { name: /QB-26-000417/ })).not.toBeInTheDocument()
  })
})

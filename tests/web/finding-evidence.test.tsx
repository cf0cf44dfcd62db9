/**
 * Evidence files on a finding, in the browser (API mocked): the investigator's form offers the
 * case's files that were not removed, sends the ids picked and puts the server's refusal of a
 * link beside the list; the review shows each linked file by name and short hash.
 */
import { screen, waitFor, within } from '@testing-library/react'
import { describe, expect, it } from 'vitest'
import { evidenceListResponseSchema, evidenceViewSchema, type EvidenceView } from '@shared/schemas/evidence'
import { CaseActionContext } from '@/features/case-page/components/case-action-context'
import { ProposeFindingForm } from '@/features/case-page/components/finding-form'
import { FindingSummary } from '@/features/case-page/components/finding-summary'
import { answer, apiError } from '../support/msw-server'
import { abilities, caseResponse, IDS } from '../support/msw-views'
import { calculationsResponse, findingsResponse, findingView } from '../support/msw-findings'
import { renderPage } from '../support/web-render'

const TRACE_ID = '00000000-0000-4000-8000-0000000000f1'
const PHOTO_ID = '00000000-0000-4000-8000-0000000000f2'
const GONE_ID = '00000000-0000-4000-8000-0000000000f3'
const TRACE_HASH = '3fa2c9e01b7d' + 'a'.repeat(52)
const PHOTO_HASH = '0b1e77d4c2aa' + 'c'.repeat(52)

const file = (over: Partial<EvidenceView>): EvidenceView =>
  evidenceViewSchema.parse({
    id: TRACE_ID,
    caseId: IDS.case,
    kind: 'spectrum_capture',
    originalName: 'quay-trace.csv',
    sizeBytes: 9_000,
    contentType: 'text/csv',
    sha256: TRACE_HASH,
    uploadedBy: { id: IDS.investigatorIlse, name: 'Ilse Brannock', role: 'staff' },
    uploadedAt: '2026-11-20T09:15:00.000Z',
    removed: null,
    verification: null,
    processing: { state: 'done', progress: 1 },
    abilities: { download: true, verify: true, remove: false },
    ...over,
  })

const files = evidenceListResponseSchema.parse({
  evidence: [
    file({}),
    file({ id: PHOTO_ID, kind: 'photo', originalName: 'mast.jpg', contentType: 'image/jpeg', sha256: PHOTO_HASH }),
    file({ id: GONE_ID, originalName: 'wrong-site.csv', sha256: 'd'.repeat(64), removed: { at: '2026-11-21T08:00:00.000Z', by: 'Ansel Quarry', reason: 'Another site.' } }),
  ],
})

/** The form alone, inside the case page's action context (the page's other panels are not under test). */
function renderForm() {
  const detail = caseResponse({ status: 'field_work', investigatorId: IDS.investigatorIlse, investigatorName: 'Ilse Brannock', version: 4, abilities: abilities('proposeFinding') }).case
  const ctx = { detail, reload: () => {}, reloading: false, announce: () => {} }
  return renderPage({
    url: '/',
    routes: [
      {
        path: '/',
        Component: () => (
          <section aria-label="Actions">
            <CaseActionContext value={ctx}>
              <ProposeFindingForm />
            </CaseActionContext>
          </section>
        ),
      },
    ],
  })
}

function renderReview() {
  const detail = caseResponse({ status: 'finding_proposed', investigatorId: IDS.investigatorIlse, investigatorName: 'Ilse Brannock', abilities: abilities('close') }).case
  return renderPage({ url: '/', routes: [{ path: '/', Component: () => <FindingSummary detail={detail} /> }] })
}

describe('evidence files in the finding form', () => {
  it('offers the case’s files that were not removed, sends the ids picked, and shows the server’s refusal beside the list', async () => {
    answer('get', '/api/cases/:id/calculations', calculationsResponse([]))
    answer('get', '/api/cases/:id/evidence', files)
    const sent = answer('post', '/api/cases/:id/propose-finding', () =>
      apiError(400, {
        code: 'validation_failed',
        message: 'Some fields need attention.',
        details: [{ path: 'evidenceIds', message: `Removed from the case, so not linkable: ${PHOTO_ID} (mast.jpg). Link only files on this case.` }],
      }),
    )
    const { user } = renderForm()
    const panel = await screen.findByRole('region', { name: 'Actions' })
    const list = await within(panel).findByRole('group', { name: /Evidence files the finding rests on/ })
    const boxes = within(list).getAllByRole('checkbox')
    expect(boxes).toHaveLength(2)
    expect(within(list).getByRole('checkbox', { name: /quay-trace\.csv/ })).toHaveAccessibleName(expect.stringContaining('SHA-256 3fa2c9e01b7d'))
    expect(within(list).queryByRole('checkbox', { name: /wrong-site\.csv/ })).toBeNull()

    await user.type(within(panel).getByLabelText('The source', { exact: false }), 'Masthead amplifier at the boat club')
    await user.click(within(list).getByRole('checkbox', { name: /mast\.jpg/ }))
    await user.click(within(list).getByRole('checkbox', { name: /quay-trace\.csv/ }))
    await user.selectOptions(within(panel).getByLabelText('Recommended action'), 'formal_warning')
    await user.type(within(panel).getByLabelText('Finding summary', { exact: false }), 'Oscillates when the mast heater runs.')
    await user.click(within(panel).getByRole('button', { name: 'Propose finding' }))

    await waitFor(() => expect(sent).toHaveLength(1))
    expect((sent[0]!.body as { evidenceIds: string[] }).evidenceIds).toEqual([PHOTO_ID, TRACE_ID])
    expect(await within(list).findByText(/Removed from the case, so not linkable/)).toBeInTheDocument()
    expect(within(list).getByRole('checkbox', { name: /mast\.jpg/ })).toBeChecked()
  })
})

describe('evidence files in the finding review', () => {
  it('lists each linked file by name and the start of its hash, and marks one removed since', async () => {
    answer(
      'get',
      '/api/cases/:id/findings',
      findingsResponse(
        findingView({
          sourcePosition: null,
          evidenceIds: [TRACE_ID, PHOTO_ID],
          evidence: [
            { id: TRACE_ID, name: 'quay-trace.csv', sha256: TRACE_HASH, removed: false },
            { id: PHOTO_ID, name: 'mast.jpg', sha256: PHOTO_HASH, removed: true },
          ],
        }),
      ),
    )
    renderReview()
    const finding = await screen.findByRole('region', { name: 'Finding awaiting review' })
    const linked = within(finding).getByRole('list', { name: 'Linked evidence files' })
    const items = within(linked).getAllByRole('listitem')
    expect(items.map((i) => i.textContent)).toEqual(['quay-trace.csvSHA-256 3fa2c9e01b7d…', 'mast.jpgSHA-256 0b1e77d4c2aa…Removed from the case since'])
  })

  it('says so when no file is linked', async () => {
    answer('get', '/api/cases/:id/findings', findingsResponse(findingView({ sourcePosition: null })))
    renderReview()
    const finding = await screen.findByRole('region', { name: 'Finding awaiting review' })
    expect(within(finding).getByText('No evidence files linked.')).toBeInTheDocument()
  })
})

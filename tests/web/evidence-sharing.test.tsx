/**
 * Sharing an office file with the complainant: the staff card offers "Share with the
 * complainant" or "Stop sharing" only with the server's ability and sends the choice; the
 * complainant's list shows shared files apart, under "Files the office shared with you", with a
 * download link through their own report.
 */
import { screen, waitFor, within } from '@testing-library/react'
import { describe, expect, it } from 'vitest'
import { evidenceListResponseSchema, evidenceViewSchema, type EvidenceView } from '../../shared/schemas/evidence'
import { EvidenceSection } from '@/features/evidence/components/evidence-section'
import { MyEvidence } from '@/features/tracking/components/my-evidence'
import { answer, apiError } from '../support/msw-server'
import { renderPage } from '../support/web-render'

const CASE_ID = '6f1c2a34-1b2c-4d5e-8f90-123456789abc'
const LIST_PATH = `/api/cases/${CASE_ID}/evidence`
const HASH = 'b4e2d0f18c3e5f7a9b2c4d6e8f0a1b3c5d7e9f1a2b4c6d8e0f1a3b5c7d9e1f3a'
const FILE_ID = '00000000-0000-4000-8000-0000000000c1'

const evidence = (over: Partial<EvidenceView>): EvidenceView =>
  evidenceViewSchema.parse({
    id: FILE_ID,
    caseId: CASE_ID,
    kind: 'document',
    originalName: 'site-visit-letter.pdf',
    sizeBytes: 48_210,
    contentType: 'application/pdf',
    sha256: HASH,
    uploadedBy: { id: '00000000-0000-4000-8000-0000000000b1', name: 'Ilse Marrow', role: 'staff' },
    uploadedAt: '2026-11-20T09:15:00.000Z',
    removed: null,
    verification: null,
    processing: { state: 'none', progress: 0 },
    sharedWithComplainant: false,
    abilities: { download: true, verify: true, remove: false, share: true },
    ...over,
  })

describe('EvidenceCard sharing', () => {
  it('shares a file not yet shared, sending shared: true, and reads the list again', async () => {
    let reads = 0
    answer('get', LIST_PATH, () => {
      reads += 1
      return evidenceListResponseSchema.parse({ evidence: [evidence({ sharedWithComplainant: reads > 1 })] })
    })
    const shared = answer('post', '/api/evidence/:id/share', { evidence: evidence({ sharedWithComplainant: true }) })
    const { user } = renderPage({ url: '/', routes: [{ path: '/', Component: () => <EvidenceSection caseId={CASE_ID} /> }] })
    const card = await screen.findByRole('listitem', { name: 'site-visit-letter.pdf' })
    expect(card).toHaveTextContent('Not shared')
    await user.click(within(card).getByRole('button', { name: 'Share with the complainant' }))
    await waitFor(() => expect(shared).toHaveLength(1))
    expect(shared[0]!.body).toEqual({ shared: true })
    expect(shared[0]!.url.pathname).toBe(`/api/evidence/${FILE_ID}/share`)
    expect(await within(card).findByRole('button', { name: 'Stop sharing' })).toBeInTheDocument()
    expect(card).toHaveTextContent('Shared with the complainant')
  })

  it('stops sharing a shared file, sending shared: false', async () => {
    answer('get', LIST_PATH, { evidence: [evidence({ sharedWithComplainant: true })] })
    const sent = answer('post', '/api/evidence/:id/share', { evidence: evidence({ sharedWithComplainant: false }) })
    const { user } = renderPage({ url: '/', routes: [{ path: '/', Component: () => <EvidenceSection caseId={CASE_ID} /> }] })
    await user.click(await screen.findByRole('button', { name: 'Stop sharing' }))
    await waitFor(() => expect(sent).toHaveLength(1))
    expect(sent[0]!.body).toEqual({ shared: false })
  })

  it('offers no sharing control without the ability, and shows the server’s refusal', async () => {
    answer('get', LIST_PATH, {
      evidence: [
        evidence({ abilities: { download: true, verify: true, remove: false, share: false } }),
        evidence({ id: '00000000-0000-4000-8000-0000000000c2', originalName: 'removed-scan.csv' }),
      ],
    })
    answer('post', '/api/evidence/:id/share', () => apiError(409, { code: 'evidence_removed', message: 'This file was removed from the case, so it cannot be shared with the complainant.' }))
    const { user } = renderPage({ url: '/', routes: [{ path: '/', Component: () => <EvidenceSection caseId={CASE_ID} /> }] })
    const first = await screen.findByRole('listitem', { name: 'site-visit-letter.pdf' })
    expect(within(first).queryByRole('button', { name: 'Share with the complainant' })).toBeNull()
    const second = screen.getByRole('listitem', { name: 'removed-scan.csv' })
    await user.click(within(second).getByRole('button', { name: 'Share with the complainant' }))
    expect(await within(second).findByRole('alert')).toHaveTextContent('cannot be shared with the complainant')
  })
})

describe('MyEvidence shared files', () => {
  it('lists the office’s shared files apart, each with a download through their report', async () => {
    const reportId = '7a2b3c4d-5e6f-4a1b-8c2d-3e4f5a6b7c8d'
    answer('get', `/api/my/reports/${reportId}/evidence`, {
      evidence: [
        evidence({ id: '00000000-0000-4000-8000-0000000000d1', originalName: 'my-radio.jpg', kind: 'photo', uploadedBy: { id: null, name: 'Complainant', role: 'complainant' }, sharedWithComplainant: true, abilities: { download: false, verify: false, remove: false, share: false } }),
        evidence({ sharedWithComplainant: true, abilities: { download: true, verify: false, remove: false, share: false } }),
      ],
    })
    renderPage({ url: '/', routes: [{ path: '/', Component: () => <MyEvidence source={{ kind: 'account', id: reportId }} /> }] })
    const shared = await screen.findByRole('list', { name: 'Files the office shared with you' })
    expect(screen.getByRole('heading', { name: 'Files the office shared with you' })).toBeInTheDocument()
    expect(shared).toHaveTextContent('site-visit-letter.pdf')
    expect(shared).toHaveTextContent('shared by the office')
    expect(shared).not.toHaveTextContent('my-radio.jpg')
    expect(within(shared).getByRole('link', { name: 'Download site-visit-letter.pdf' })).toHaveAttribute('href', `/api/my/reports/${reportId}/evidence/${FILE_ID}/download`)
    const own = screen.getByRole('list', { name: 'Files you sent' })
    expect(own).toHaveTextContent('my-radio.jpg')
    expect(within(own).queryByRole('link')).toBeNull()
  })

  it('shows no shared section when the office shared nothing; the download link follows the tracking link', async () => {
    const token = 'trk_shared_7c1d'
    answer('get', `/api/track/${token}/evidence`, { evidence: [evidence({ sharedWithComplainant: true, abilities: { download: true, verify: false, remove: false, share: false } })] })
    renderPage({ url: '/', routes: [{ path: '/', Component: () => <MyEvidence source={{ kind: 'token', token }} /> }] })
    const link = await screen.findByRole('link', { name: 'Download site-visit-letter.pdf' })
    expect(link).toHaveAttribute('href', `/api/track/${token}/evidence/${FILE_ID}/download`)
    expect(screen.getByText('You have not sent any file yet.')).toBeInTheDocument()
  })
})

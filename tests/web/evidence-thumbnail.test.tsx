/**
 * The staff evidence list shows a photo's thumbnail (an <img> with alt text, loaded lazily, at
 * the size the server made it) only when the server says one was made, and shows on one half of
 * a two-file SigMF recording that it waits for the other; it reads the list again while a
 * thumbnail is being made. The list answer is built from the view schema and served by the
 * network mock.
 */
import { screen, within } from '@testing-library/react'
import { describe, expect, it } from 'vitest'
import { evidenceListResponseSchema, evidenceViewSchema, type EvidenceView } from '../../shared/schemas/evidence'
import { EvidenceSection } from '@/features/evidence/components/evidence-section'
import { answer } from '../support/msw-server'
import { renderPage } from '../support/web-render'

const CASE_ID = '6f1c2a34-1b2c-4d5e-8f90-123456789abd'
const HASH = 'b3f1c9e07b2d4e6f8a1b3c5d7e9f0a2b4c6d8e0f1a3b5c7d9e1f3a5b7c9d1e3f'

const evidence = (over: Partial<EvidenceView>): EvidenceView =>
  evidenceViewSchema.parse({
    id: '00000000-0000-4000-8000-0000000000c1',
    caseId: CASE_ID,
    kind: 'photo',
    originalName: 'mast.jpg',
    sizeBytes: 1_843_200,
    contentType: 'image/jpeg',
    sha256: HASH,
    uploadedBy: { id: '00000000-0000-4000-8000-0000000000b1', name: 'Ilse Marrow', role: 'staff' },
    uploadedAt: '2026-11-20T09:15:00.000Z',
    removed: null,
    verification: null,
    processing: { state: 'none', progress: 0 },
    abilities: { download: true, verify: true, remove: false },
    ...over,
  })

describe('EvidenceSection thumbnails and SigMF pairs', () => {
  it('shows the thumbnail of a photo that has one, lazily and with alt text, and none for the others', async () => {
    answer(
      'get',
      `/api/cases/${CASE_ID}/evidence`,
      evidenceListResponseSchema.parse({
        evidence: [
          evidence({ thumbnail: { state: 'done', widthPx: 320, heightPx: 240 } }),
          evidence({
            id: '00000000-0000-4000-8000-0000000000c2',
            originalName: 'cabinet.png',
            contentType: 'image/png',
            thumbnail: { state: 'failed', message: 'No thumbnail: the image declares more than 50 megapixels (a decompression bomb or an unusually large scan). The file itself is kept unchanged.' },
          }),
          evidence({
            id: '00000000-0000-4000-8000-0000000000c3',
            kind: 'iq_recording',
            originalName: 'harbour.sigmf-data',
            contentType: 'application/octet-stream',
            processing: { state: 'none', progress: 0, message: 'Waiting for its metadata "harbour.sigmf-meta": add it to this case as an I/Q recording and the two are read together.' },
          }),
        ],
      }),
    )
    const { settled } = renderPage({ url: '/', routes: [{ path: '/', Component: () => <EvidenceSection caseId={CASE_ID} /> }] })
    const list = await screen.findByRole('list', { name: 'Evidence files' })
    await settled()
    const card = (name: string) => within(list).getByRole('listitem', { name })

    const img = within(card('mast.jpg')).getByRole('img', { name: 'Thumbnail of the photo mast.jpg' })
    expect(img).toHaveAttribute('src', '/api/evidence/00000000-0000-4000-8000-0000000000c1/thumbnail')
    expect(img).toHaveAttribute('loading', 'lazy')
    expect(img).toHaveAttribute('width', '320')
    expect(img).toHaveAttribute('height', '240')

    expect(within(card('cabinet.png')).queryByRole('img')).toBeNull()
    expect(card('cabinet.png')).toHaveTextContent('No thumbnail: the image declares more than 50 megapixels')
    expect(within(card('harbour.sigmf-data')).queryByRole('img')).toBeNull()
    expect(card('harbour.sigmf-data')).toHaveTextContent('Not processed — Waiting for its metadata "harbour.sigmf-meta"')
  })

  it('reads the list again while a thumbnail is being made, and shows it once made', async () => {
    let reads = 0
    answer('get', `/api/cases/${CASE_ID}/evidence`, () => {
      reads += 1
      return { evidence: [evidence({ thumbnail: reads === 1 ? { state: 'pending' } : { state: 'done', widthPx: 240, heightPx: 320 } })] }
    })
    renderPage({ url: '/', routes: [{ path: '/', Component: () => <EvidenceSection caseId={CASE_ID} /> }] })
    const card = await screen.findByRole('listitem', { name: 'mast.jpg' })
    expect(within(card).queryByRole('img')).toBeNull()
    const img = await within(card).findByRole('img', { name: 'Thumbnail of the photo mast.jpg' }, { timeout: 5000 })
    expect(img).toHaveAttribute('width', '240')
    const readsWhenMade = reads
    await new Promise((r) => setTimeout(r, 2500))
    expect(reads).toBe(readsWhenMade)
  }, 15_000)
})

/**
 * Evidence screens: the shared uploader sends each file on its own (XMLHttpRequest, answered by
 * the network mock), shows the bytes sent against the file's size while it goes, puts the
 * server's refusal (413) beside the file it concerns and offers a retry that sends it again;
 * the staff list shows each file's integrity state and offers removal only where the server's
 * abilities allow it.
 */
import { screen, waitFor, within } from '@testing-library/react'
import { http, HttpResponse } from 'msw'
import { describe, expect, it } from 'vitest'
import { evidenceListResponseSchema, evidenceViewSchema, type EvidenceView } from '../../shared/schemas/evidence'
import { EvidenceUploader } from '@/components/uploads/evidence-uploader'
import { EvidenceSection } from '@/features/evidence/components/evidence-section'
import { MyEvidence } from '@/features/tracking/components/my-evidence'
import { answer, apiError, server } from '../support/msw-server'
import { renderPage } from '../support/web-render'

const CASE_ID = '6f1c2a34-1b2c-4d5e-8f90-123456789abc'
const UPLOAD_PATH = `/api/cases/${CASE_ID}/evidence`
const HASH = 'a3f1c9e07b2d4e6f8a1b3c5d7e9f0a2b4c6d8e0f1a3b5c7d9e1f3a5b7c9d1e3f'

const evidence = (over: Partial<EvidenceView>): EvidenceView =>
  evidenceViewSchema.parse({
    id: '00000000-0000-4000-8000-0000000000a1',
    caseId: CASE_ID,
    kind: 'spectrum_capture',
    originalName: 'harbour-trace.csv',
    sizeBytes: 18_432,
    contentType: 'text/csv',
    sha256: HASH,
    uploadedBy: { id: '00000000-0000-4000-8000-0000000000b1', name: 'Ilse Marrow', role: 'staff' },
    uploadedAt: '2026-11-20T09:15:00.000Z',
    removed: null,
    verification: null,
    processing: { state: 'done', progress: 1 },
    abilities: { download: true, verify: true, remove: false },
    ...over,
  })

/** A response whose body stays open until `release()`: the upload has left, the answer has not finished. */
function heldResponse() {
  let close: () => void = () => {}
  const body = new ReadableStream<Uint8Array>({
    start(controller) {
      close = () => {
        controller.enqueue(new TextEncoder().encode(JSON.stringify({ evidence: evidence({ originalName: 'trace.csv' }) })))
        controller.close()
      }
    },
  })
  return { response: new HttpResponse(body, { status: 201, headers: { 'Content-Type': 'application/json' } }), release: () => close() }
}

describe('EvidenceUploader', () => {
  it('shows each file’s progress, the 413 refusal beside the refused file, and sends it again on retry', async () => {
    const trace = new File(['freqHz,levelDbm\n433920000,-61.5\n'], 'trace.csv', { type: 'text/csv' })
    const big = new File([new Uint8Array(4096)], 'capture.bin', { type: 'application/octet-stream' })
    const held = heldResponse()
    const sent: { name: string; kind: string | null }[] = []
    let refuseBig = true
    server.use(
      http.post(UPLOAD_PATH, async ({ request }) => {
        const form = await request.formData()
        const file = form.get('file') as File
        // jsdom's File loses its name on the way through the XHR mock, so the files are told apart by size
        const name = file.size === big.size ? 'capture.bin' : 'trace.csv'
        sent.push({ name, kind: form.get('kind') as string | null })
        if (name === 'capture.bin' && refuseBig) return apiError(413, { code: 'file_too_large', message: 'The file is larger than the 2 kB an upload may hold.' })
        if (name === 'trace.csv') return held.response
        return HttpResponse.json({ evidence: evidence({ originalName: name }) }, { status: 201 })
      }),
    )
    const { user } = renderPage({ url: '/', routes: [{ path: '/', Component: () => <EvidenceUploader uploadPath={UPLOAD_PATH} /> }] })

    await user.selectOptions(screen.getByLabelText('Kind of file'), 'iq_recording')
    await user.upload(screen.getByLabelText('Add files'), [trace, big])

    const uploads = await screen.findByRole('list', { name: 'Uploads' })
    const row = (name: string) => within(uploads).getByText(name).closest('li')!

    // the refused file: the server's words beside it, and a retry
    await waitFor(() => expect(within(row('capture.bin')).getByRole('alert')).toHaveTextContent('The file is larger than the 2 kB an upload may hold.'))
    expect(within(row('capture.bin')).getByRole('alert')).toHaveTextContent('Make the file smaller')
    expect(within(row('trace.csv')).queryByRole('alert')).toBeNull()

    // the other file: all its bytes have left, the answer is still coming
    await waitFor(() => expect(within(row('trace.csv')).getByRole('progressbar')).toHaveAttribute('aria-valuenow', '100'))
    expect(within(row('trace.csv')).getByText(/^[\d.]+ (bytes|kB) of [\d.]+ (bytes|kB) sent/)).toBeInTheDocument()
    expect(within(row('trace.csv')).getByRole('button', { name: 'Cancel' })).toBeInTheDocument()
    held.release()
    await waitFor(() => expect(within(row('trace.csv')).getByText(/^Uploaded/)).toBeInTheDocument())

    // retry sends the refused file again, with the batch's kind
    refuseBig = false
    await user.click(within(row('capture.bin')).getByRole('button', { name: 'Retry' }))
    await waitFor(() => expect(within(row('capture.bin')).getByText('Uploaded · 4.0 kB')).toBeInTheDocument())
    expect(within(row('capture.bin')).queryByRole('alert')).toBeNull()
    expect(sent.filter((s) => s.name === 'capture.bin')).toEqual([
      { name: 'capture.bin', kind: 'iq_recording' },
      { name: 'capture.bin', kind: 'iq_recording' },
    ])
    expect(sent.filter((s) => s.name === 'trace.csv')).toEqual([{ name: 'trace.csv', kind: 'iq_recording' }])
  })

  it('says plainly when the file store is unavailable (503), beside the file', async () => {
    server.use(http.post(UPLOAD_PATH, () => apiError(503, { code: 'storage_unavailable', message: 'The file store cannot be reached, so nothing was stored. Please try again in a moment.' })))
    const { user } = renderPage({ url: '/', routes: [{ path: '/', Component: () => <EvidenceUploader uploadPath={UPLOAD_PATH} /> }] })
    await user.upload(screen.getByLabelText('Add files'), new File(['x,y\n1,2\n'], 'a.csv', { type: 'text/csv' }))
    const alert = await screen.findByRole('alert')
    expect(alert).toHaveTextContent('The file store cannot be reached')
    expect(alert.closest('li')).toHaveTextContent('a.csv')
  })
})

describe('EvidenceSection', () => {
  it('shows each file’s integrity state and offers removal only with the ability', async () => {
    answer(
      'get',
      UPLOAD_PATH,
      evidenceListResponseSchema.parse({
        evidence: [
          evidence({ verification: { at: '2026-11-21T10:00:00.000Z', by: 'Sade Okafor', outcome: 'verified' }, abilities: { download: true, verify: true, remove: true } }),
          evidence({
            id: '00000000-0000-4000-8000-0000000000a2',
            originalName: 'mast.jpg',
            kind: 'photo',
            verification: { at: '2026-11-21T10:05:00.000Z', by: 'Sade Okafor', outcome: 'failed' },
            abilities: { download: true, verify: true, remove: false },
          }),
          evidence({ id: '00000000-0000-4000-8000-0000000000a3', originalName: 'notes.pdf', kind: 'document', abilities: { download: false, verify: false, remove: false } }),
        ],
      }),
    )
    const { settled } = renderPage({ url: '/', routes: [{ path: '/', Component: () => <EvidenceSection caseId={CASE_ID} /> }] })
    const list = await screen.findByRole('list', { name: 'Evidence files' })
    await settled()
    const card = (name: string) => within(list).getByRole('listitem', { name })

    expect(card('harbour-trace.csv')).toHaveTextContent('Verified')
    expect(within(card('harbour-trace.csv')).getByRole('button', { name: 'Remove from the case' })).toBeInTheDocument()
    expect(within(card('harbour-trace.csv')).getByText(`${HASH.slice(0, 12)}…`)).toHaveAttribute('title', HASH)
    expect(within(card('harbour-trace.csv')).getByRole('link', { name: 'Download' })).toHaveAttribute('href', '/api/evidence/00000000-0000-4000-8000-0000000000a1/download')

    expect(card('mast.jpg')).toHaveTextContent('Check failed')
    expect(within(card('mast.jpg')).queryByRole('button', { name: 'Remove from the case' })).toBeNull()

    expect(card('notes.pdf')).toHaveTextContent('Not checked since intake')
    expect(within(card('notes.pdf')).queryByRole('button', { name: 'Remove from the case' })).toBeNull()
    expect(within(card('notes.pdf')).queryByRole('button', { name: 'Verify integrity' })).toBeNull()
    expect(within(card('notes.pdf')).queryByRole('link', { name: 'Download' })).toBeNull()
  })

  it('reads the list again while a file is processing, until it is done', async () => {
    let reads = 0
    answer('get', UPLOAD_PATH, () => {
      reads += 1
      return { evidence: [evidence(reads === 1 ? { processing: { state: 'running', progress: 0.4 } } : { processing: { state: 'done', progress: 1 } })] }
    })
    renderPage({ url: '/', routes: [{ path: '/', Component: () => <EvidenceSection caseId={CASE_ID} /> }] })
    const card = await screen.findByRole('listitem', { name: 'harbour-trace.csv' })
    expect(card).toHaveTextContent('Processing · 40 %')
    expect(within(card).getByRole('progressbar', { name: 'Processing of harbour-trace.csv' })).toHaveAttribute('aria-valuenow', '40')
    await waitFor(() => expect(card).toHaveTextContent('Processed'), { timeout: 5000 })
    expect(within(card).queryByRole('progressbar')).toBeNull()
    // once nothing is processing, the polling stops
    const readsWhenDone = reads
    await new Promise((r) => setTimeout(r, 2500))
    expect(reads).toBe(readsWhenDone)
  }, 15_000)

  it('sends the supervisor’s reason when a file is removed', async () => {
    answer('get', UPLOAD_PATH, { evidence: [evidence({ abilities: { download: true, verify: true, remove: true } })] })
    const removed = answer('post', '/api/evidence/:id/remove', { evidence: evidence({}) })
    const { user } = renderPage({ url: '/', routes: [{ path: '/', Component: () => <EvidenceSection caseId={CASE_ID} /> }] })
    await user.click(await screen.findByRole('button', { name: 'Remove from the case' }))
    await user.click(screen.getByRole('button', { name: 'Remove the file' }))
    expect(await screen.findByText('Say why the file is removed (at least 3 characters).')).toBeInTheDocument()
    expect(removed).toHaveLength(0)
    await user.type(screen.getByLabelText('Reason for removing it'), 'Photo of the wrong mast')
    await user.click(screen.getByRole('button', { name: 'Remove the file' }))
    await waitFor(() => expect(removed).toHaveLength(1))
    expect(removed[0]!.body).toEqual({ reason: 'Photo of the wrong mast' })
  })
})

describe('MyEvidence (the complainant’s files)', () => {
  it('lists the files they sent and sends new ones to their own report by the tracking link', async () => {
    const token = 'trk_4f9a2c7e1b'
    answer('get', `/api/track/${token}/evidence`, {
      evidence: [evidence({ originalName: 'interference-video.mp4', kind: 'audio', uploadedBy: { id: null, name: 'Complainant', role: 'complainant' }, abilities: { download: false, verify: false, remove: false } })],
    })
    const posted: string[] = []
    server.use(
      http.post(`/api/track/${token}/evidence`, async ({ request }) => {
        posted.push((await request.formData()).get('kind') as string)
        return HttpResponse.json({ evidence: evidence({}) }, { status: 201 })
      }),
    )
    const { user } = renderPage({ url: '/', routes: [{ path: '/', Component: () => <MyEvidence source={{ kind: 'token', token }} /> }] })
    const list = await screen.findByRole('list', { name: 'Files you sent' })
    expect(list).toHaveTextContent('interference-video.mp4')
    expect(list).toHaveTextContent(`SHA-256 ${HASH.slice(0, 12)}…`)
    await user.upload(screen.getByLabelText('Choose files to send'), new File([new Uint8Array(64)], 'photo.jpg', { type: 'image/jpeg' }))
    await waitFor(() => expect(posted).toEqual(['photo']))
    expect(await screen.findByText(/^Uploaded/)).toBeInTheDocument()
  })
})

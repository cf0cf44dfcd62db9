/**
 * A measurement's evidence file, in the browser (API mocked): the form offers the case's files
 * that were not removed and sends the one picked as evidenceFileId, the server's refusal of a
 * link appears beside the picker, an edit keeps the file already linked (even one removed
 * since), and the list names the linked file.
 */
import { screen, waitFor, within } from '@testing-library/react'
import { describe, expect, it } from 'vitest'
import { evidenceListResponseSchema, evidenceViewSchema, type EvidenceView } from '@shared/schemas/evidence'
import { measurementsResponseSchema } from '@shared/schemas/measurements'
import { MeasurementsSection } from '@/features/measurements/components/measurements-section'
import { answer, apiError } from '../support/msw-server'
import { renderPage } from '../support/web-render'

const CASE_ID = '6f1c2a34-1b2c-4d5e-8f90-123456789abc'
const OFFICE_ID = '00000000-0000-4000-8000-000000000001'
const TRACE_ID = '00000000-0000-4000-8000-0000000000f1'
const PHOTO_ID = '00000000-0000-4000-8000-0000000000f2'
const GONE_ID = '00000000-0000-4000-8000-0000000000f3'

const file = (over: Partial<EvidenceView>): EvidenceView =>
  evidenceViewSchema.parse({
    id: TRACE_ID,
    caseId: CASE_ID,
    kind: 'spectrum_capture',
    originalName: 'quay-trace.csv',
    sizeBytes: 9_000,
    contentType: 'text/csv',
    sha256: '3fa2c9e01b7d' + 'a'.repeat(52),
    uploadedBy: { id: '00000000-0000-4000-8000-0000000000b1', name: 'Ilse Brannock', role: 'staff' },
    uploadedAt: '2026-11-20T09:15:00.000Z',
    removed: null,
    verification: null,
    processing: { state: 'done', progress: 1 },
    abilities: { download: true, verify: true, remove: false },
    ...over,
  })

const FILES = evidenceListResponseSchema.parse({
  evidence: [
    file({}),
    file({ id: PHOTO_ID, kind: 'photo', originalName: 'mast.jpg', contentType: 'image/jpeg', sha256: 'c'.repeat(64) }),
    file({ id: GONE_ID, originalName: 'wrong-site.csv', sha256: 'd'.repeat(64), removed: { at: '2026-11-21T08:00:00.000Z', by: 'Ansel Quarry', reason: 'Another site.' } }),
  ],
})

/** A stored measurement as the server shows it. */
const stored = (over: object) =>
  measurementsResponseSchema.shape.measurements.element.parse({
    id: '00000000-0000-4000-8000-0000000000a1',
    caseId: CASE_ID,
    officeId: OFFICE_ID,
    author: 'Marta Ferreira',
    createdAt: '2026-11-20T10:20:00.000Z',
    updatedAt: '2026-11-20T10:20:00.000Z',
    takenAt: '2026-11-20T10:15:00.000Z',
    latDeg: 48.1172,
    lonDeg: -31.3921,
    heightM: null,
    freqHz: 433.92e6,
    measurementBandwidthHz: 50e3,
    rbwHz: null,
    detector: null,
    reading: { value: -40.5, unit: 'dBm' },
    antenna: { source: 'none' },
    instrumentId: null,
    cableLossDb: null,
    preampGainDb: null,
    polarisation: null,
    bearingDeg: null,
    bearingSigmaDeg: null,
    notes: null,
    evidenceFileId: TRACE_ID,
    derived: {},
    methods: { reading: { id: 'channel-power-enbw', source: 'Sum of trace powers' } },
    warnings: [],
    equipment: [],
    libraryVersion: '2.2.0',
    version: 1,
    supersedesId: null,
    supersededById: null,
    usedByCalculations: 0,
    abilities: { edit: true, correct: true },
    ...over,
  })

function serve(measurements: object[]) {
  answer('get', `/api/cases/${CASE_ID}/measurements`, measurementsResponseSchema.parse({ measurements, abilities: { record: true } }))
  answer('get', `/api/cases/${CASE_ID}/evidence`, FILES)
  answer('get', `/api/offices/${OFFICE_ID}/equipment`, { items: [], abilities: { manage: false } })
  return renderPage({ url: '/m', routes: [{ path: '/m', Component: () => <MeasurementsSection caseId={CASE_ID} officeId={OFFICE_ID} casePoint={{ latDeg: 48.1, lonDeg: -31.3 }} /> }] })
}

describe('the evidence file of a measurement', () => {
  it('offers the case’s files that were not removed, sends the one picked, and shows the server’s refusal beside the picker', async () => {
    const sent = answer('post', `/api/cases/${CASE_ID}/measurements`, () =>
      apiError(400, { code: 'validation_failed', message: 'Some fields need attention.', details: [{ path: 'measurement.evidenceFileId', message: `The evidence file mast.jpg was removed from the case and cannot be linked.` }] }),
    )
    const { user } = serve([])
    await user.click(await screen.findByRole('button', { name: 'Record a measurement' }))
    const form = await screen.findByRole('form', { name: 'Record a measurement' })
    const picker = within(form).getByLabelText('Evidence file (optional)', { exact: false }) as HTMLSelectElement
    await waitFor(() => expect(picker.options).toHaveLength(3))
    expect([...picker.options].map((o) => o.textContent)).toEqual(['None', 'quay-trace.csv (SHA-256 3fa2c9e01b7d…)', 'mast.jpg (SHA-256 cccccccccccc…)'])

    await user.type(within(form).getByLabelText('Latitude'), '48.1')
    await user.type(within(form).getByLabelText('Longitude'), '-31.35')
    await user.type(within(form).getByLabelText('Centre frequency'), '433.92')
    await user.type(within(form).getByLabelText('Reading'), '-40.5')
    await user.selectOptions(picker, PHOTO_ID)
    await user.click(within(form).getByRole('button', { name: 'Save the measurement' }))

    await waitFor(() => expect(sent).toHaveLength(1))
    expect((sent[0]!.body as { measurement: { evidenceFileId?: string } }).measurement.evidenceFileId).toBe(PHOTO_ID)
    expect(await within(form).findByText('The evidence file mast.jpg was removed from the case and cannot be linked.')).toBeTruthy()
    expect(picker).toHaveAccessibleDescription(expect.stringContaining('was removed from the case'))
  })

  it('names the linked file in the list, and keeps the link of a file removed since when the measurement is edited', async () => {
    const m = stored({ evidenceFileId: GONE_ID })
    const plain = stored({ id: '00000000-0000-4000-8000-0000000000a2', evidenceFileId: null, takenAt: '2026-11-20T11:15:00.000Z' })
    const linked = stored({ id: '00000000-0000-4000-8000-0000000000a5', takenAt: '2026-11-20T12:15:00.000Z' })
    const sent = answer('patch', `/api/measurements/${m.id}`, { measurement: m })
    const { user } = serve([m, plain, linked])

    const first = await screen.findByRole('article', { name: /^M1 ·/ })
    await waitFor(() => expect(within(first).getByText('wrong-site.csv')).toBeTruthy())
    expect(within(await screen.findByRole('article', { name: /^M3 ·/ })).getByText('quay-trace.csv')).toBeTruthy()
    expect(within(await screen.findByRole('article', { name: /^M2 ·/ })).queryByText('Evidence file')).toBeNull()

    await user.click(within(first).getByRole('button', { name: 'Edit M1' }))
    const form = await screen.findByRole('form', { name: 'Edit the measurement' })
    const picker = within(form).getByLabelText('Evidence file (optional)', { exact: false }) as HTMLSelectElement
    expect(picker.value).toBe(GONE_ID)
    expect(picker.selectedOptions[0]!.textContent).toBe('wrong-site.csv (SHA-256 dddddddddddd…) — removed from the case')
    await user.click(within(form).getByRole('button', { name: 'Save the changes' }))
    await waitFor(() => expect(sent).toHaveLength(1))
    expect((sent[0]!.body as { measurement: { evidenceFileId?: string } }).measurement.evidenceFileId).toBe(GONE_ID)
  })
})

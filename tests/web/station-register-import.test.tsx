import { screen, waitFor, within } from '@testing-library/react'
import { http, HttpResponse } from 'msw'
import { describe, expect, it } from 'vitest'
import { csvInspectionViewSchema, importReportViewSchema, registerVersionViewSchema } from '../../shared/schemas/stations'
import { ImportFlow } from '@/features/station-register/components/import-flow'
import { answer, apiError, server } from '../support/msw-server'
import { renderPage } from '../support/web-render'

const FILE_ID = '5d0c6a43-2f8e-4c1b-9a77-0e3f5b1c2d44'
const INSPECTION = csvInspectionViewSchema.parse({
  file: { id: FILE_ID, originalName: 'register.csv', sizeBytes: 321, sha256: 'a'.repeat(64), contentType: 'text/csv', contentTypeSource: 'declared', purpose: 'station_register_import', uploadedAt: '2026-12-05T09:00:00.000Z', uploadedBy: 'Test Admin' },
  delimiter: 'semicolon',
  delimiterDetected: true,
  headers: ['Code', 'Holder', 'Lat', 'Lon', 'Low (MHz)', 'High (MHz)', 'EIRP (dBW)', 'Remarks'],
  sampleRows: [{ line: 2, cells: ['A-1', 'Alder Radio Club', '47.7', '-30.6', '446.0', '446.2', '0', ''] }],
  suggestedMapping: {
    fields: {
      stationCode: { column: 'Code' },
      licensee: { column: 'Holder' },
      latitude: { column: 'Lat', unit: 'deg' },
      longitude: { column: 'Lon', unit: 'deg' },
      lowFreq: { column: 'Low (MHz)', unit: 'MHz' },
      highFreq: { column: 'High (MHz)', unit: 'MHz' },
      eirp: { column: 'EIRP (dBW)', unit: 'dBW' },
    },
  },
  notes: ['Not mapped: "Remarks".'],
})
const REPORT = importReportViewSchema.parse({
  fileId: FILE_ID,
  delimiter: 'semicolon',
  rowCount: 3,
  acceptedCount: 2,
  rejectedCount: 1,
  rejected: [{ line: 4, problems: ["text 'abc' in column EIRP (dBW) (EIRP): not a number", "unknown unit 'dBx' in column Lat"] }],
  sample: [
    {
      line: 2,
      stationCode: 'A-1',
      licensee: 'Alder Radio Club',
      service: '',
      latitudeDeg: 47.7,
      longitudeDeg: -30.6,
      antennaHeightM: null,
      lowFreqHz: 446e6,
      highFreqHz: 446.2e6,
      limit: { kind: 'eirp', eirpDbm: 30 },
      antennaGainDbi: null,
      feederLossDb: null,
      authorisedEirpDbm: 30,
      validFrom: null,
      validUntil: null,
    },
  ],
})
const VERSION = registerVersionViewSchema.parse({
  version: 2,
  importedAt: '2026-12-05T09:01:00.000Z',
  importedBy: 'Test Admin',
  fileId: FILE_ID,
  fileName: 'register.csv',
  sha256: 'a'.repeat(64),
  acceptedCount: 2,
  rejectedCount: 1,
  delimiter: 'semicolon',
  mapping: INSPECTION.suggestedMapping,
  current: true,
})

function renderFlow() {
  return renderPage({ url: '/', routes: [{ path: '/', Component: ImportFlow }] })
}

describe('importing the licence register', () => {
  it('uploads, shows the suggested column mapping with units, reports rejected rows by line, then makes the version', async () => {
    let uploads = 0
    server.use(
      http.post('/api/station-register/uploads', async ({ request }) => {
        const form = await request.formData()
        expect((form.get('file') as File).size).toBe(12)
        uploads++
        return HttpResponse.json({ inspection: INSPECTION }, { status: 201 })
      }),
    )
    const previews = answer('post', `/api/station-register/uploads/:id/preview`, { report: REPORT })
    const confirms = answer('post', `/api/station-register/uploads/:id/confirm`, { version: VERSION, report: REPORT })
    const { user } = renderFlow()

    await user.upload(screen.getByLabelText('Register file (CSV with a header row)'), new File(['Code;Holder\n'], 'register.csv', { type: 'text/csv' }))
    await user.click(screen.getByRole('button', { name: 'Upload and read the columns' }))
    expect(await screen.findByLabelText('What “EIRP (dBW)” holds')).toHaveValue('eirp')
    expect(uploads).toBe(1)
    expect(screen.getByLabelText('What “Remarks” holds')).toHaveValue('')
    const eirpRow = screen.getByLabelText('What “EIRP (dBW)” holds').closest('li')!
    expect(within(eirpRow).getByLabelText('Unit')).toHaveValue('dBW')
    expect(screen.getByText('Not mapped: "Remarks".')).toBeInTheDocument()

    // the administrator changes the power unit to dBm before checking
    await user.selectOptions(within(eirpRow).getByLabelText('Unit'), 'dBm')
    await user.click(screen.getByRole('button', { name: 'Check every row' }))
    expect(await screen.findByText(/2 can be imported/)).toBeInTheDocument()
    expect(previews[0]!.body).toMatchObject({ delimiter: 'semicolon', mapping: { fields: { eirp: { column: 'EIRP (dBW)', unit: 'dBm' }, stationCode: { column: 'Code' } } } })
    expect(screen.getByText('Line 4:').parentElement).toHaveTextContent("text 'abc' in column EIRP (dBW) (EIRP): not a number; unknown unit 'dBx' in column Lat")

    await user.click(screen.getByRole('button', { name: 'Make the new version with 2 stations' }))
    expect(await screen.findByText('Version 2 is the register in force')).toBeInTheDocument()
    expect(confirms[0]!.body).toEqual(previews[0]!.body)
  })

  it('will not check the rows while the mapping lacks a required field, and says which', async () => {
    server.use(http.post('/api/station-register/uploads', () => HttpResponse.json({ inspection: INSPECTION }, { status: 201 })))
    const { user } = renderFlow()
    await user.upload(screen.getByLabelText('Register file (CSV with a header row)'), new File(['x'], 'register.csv', { type: 'text/csv' }))
    await user.click(screen.getByRole('button', { name: 'Upload and read the columns' }))
    await user.selectOptions(await screen.findByLabelText('What “Holder” holds'), '')
    expect(screen.getByText('Choose the column that holds the licensee.')).toBeInTheDocument()
    expect(screen.getByRole('button', { name: 'Check every row' })).toBeDisabled()
  })

  it('shows the server’s words and every problem when the file is not a CSV', async () => {
    server.use(
      http.post('/api/station-register/uploads', () =>
        apiError(400, { code: 'not_csv', message: 'This file cannot be read as a CSV register: it holds binary data (a NUL byte), not text.', details: [{ path: 'file', message: 'it holds binary data (a NUL byte), not text' }] }),
      ),
    )
    const { user } = renderFlow()
    await user.upload(screen.getByLabelText('Register file (CSV with a header row)'), new File(['PK\u0003\u0004'], 'register.csv', { type: 'text/csv' }))
    await user.click(screen.getByRole('button', { name: 'Upload and read the columns' }))
    await waitFor(() => expect(screen.getByRole('alert')).toHaveTextContent('This file cannot be read as a CSV register'), { timeout: 3000 })
    expect(screen.getByText('it holds binary data (a NUL byte), not text')).toBeInTheDocument()
  })
})

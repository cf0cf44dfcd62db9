/**
 * The spectrum view of a processed evidence file: opened from the staff list, it asks for the
 * file's analysis, lists the summary's peaks, and sends the band typed in MHz / kHz to the server
 * in hertz, then shows the channel power and occupied bandwidth the server computed and says
 * they come from the display trace. The uPlot canvas is replaced (jsdom draws no canvas); its
 * props are recorded so the peaks and the band it would mark are checked.
 */
import { screen, waitFor, within } from '@testing-library/react'
import { describe, expect, it, vi } from 'vitest'
import { evidenceListResponseSchema, evidenceViewSchema, type EvidenceView } from '../../shared/schemas/evidence'
import { evidenceAnalysisResponseSchema, evidenceBandResponseSchema } from '../../shared/schemas/spectrum'
import type { SpectrumChartProps } from '@/components/charts'
import { EvidenceSection } from '@/features/evidence/components/evidence-section'
import { answer } from '../support/msw-server'
import { renderPage } from '../support/web-render'

const chartProps: SpectrumChartProps[] = []
vi.mock('@/components/charts/uplot/spectrum-chart', () => ({
  default: (props: SpectrumChartProps) => {
    chartProps.push(props)
    return <div data-testid="spectrum-chart">{props.band ? `band ${props.band.lowFreqHz}–${props.band.highFreqHz}` : 'no band'}</div>
  },
}))

const CASE_ID = '6f1c2a34-1b2c-4d5e-8f90-123456789abc'
const FILE_ID = '00000000-0000-4000-8000-0000000000a1'

const file = (over: Partial<EvidenceView> = {}): EvidenceView =>
  evidenceViewSchema.parse({
    id: FILE_ID,
    caseId: CASE_ID,
    kind: 'spectrum_capture',
    originalName: 'quay-trace.json',
    sizeBytes: 9_000,
    contentType: 'application/json',
    sha256: 'b'.repeat(64),
    uploadedBy: { id: '00000000-0000-4000-8000-0000000000b1', name: 'Ilse Marrow', role: 'staff' },
    uploadedAt: '2026-11-20T09:15:00.000Z',
    removed: null,
    verification: null,
    processing: { state: 'done', progress: 1 },
    abilities: { download: true, verify: true, remove: false },
    ...over,
  })

const freqHz = Array.from({ length: 101 }, (_, i) => 433.8e6 + i * 2.5e3)
const analysis = evidenceAnalysisResponseSchema.parse({
  analysis: {
    evidenceId: FILE_ID,
    state: 'done',
    progress: 1,
    message: null,
    libraryVersion: '2.2.0',
    summary: {
      source: 'trace_json',
      levelUnit: 'dBm',
      recording: null,
      startHz: 433.79875e6,
      stopHz: 434.05125e6,
      pointCount: 101,
      enbwHz: 3e3,
      peaks: [
        { freqHz: 433.92e6, levelDbm: -41.5, prominenceDb: 38, aboveNoiseDb: 38.5 },
        { freqHz: 433.975e6, levelDbm: -58.25, prominenceDb: 21, aboveNoiseDb: 21.75 },
      ],
      noiseFloorDbm: -80,
      noiseFloorBasis: '10th percentile of the trace levels',
      occupiedBandwidth: null,
      channelPowerDbm: -38.2,
      warnings: [],
      methods: [],
    },
    displayTrace: { freqHz, levelDbm: freqHz.map(() => -80), decimated: false, sourcePointCount: 101 },
    spectrogram: null,
    updatedAt: '2026-11-20T09:16:00.000Z',
  },
})

describe('the spectrum view', () => {
  it('asks for the analysis, shows the peaks, and sends the band in hertz', async () => {
    answer('get', `/api/cases/${CASE_ID}/evidence`, evidenceListResponseSchema.parse({ evidence: [file(), file({ id: '00000000-0000-4000-8000-0000000000a2', kind: 'photo', originalName: 'mast.jpg' })] }))
    const analysisCalls = answer('get', `/api/evidence/${FILE_ID}/analysis`, analysis)
    const bandCalls = answer('post', `/api/evidence/${FILE_ID}/band`, (req) => {
      const b = req.body as { lowFreqHz: number; highFreqHz: number }
      return evidenceBandResponseSchema.parse({
        band: {
          evidenceId: FILE_ID,
          lowFreqHz: b.lowFreqHz,
          highFreqHz: b.highFreqHz,
          levelUnit: 'dBm',
          channelPowerDbm: -40.12,
          channelPowerDbfs: null,
          channelPowerNote: null,
          occupiedBandwidthHz: 12_500,
          occupiedLowerEdgeHz: 433.914e6,
          occupiedUpperEdgeHz: 433.9265e6,
          betaPercent: 1,
          basis: { trace: 'display', pointCount: 101, pointsInBand: 20, decimated: false, sourcePointCount: 101, binSpacingHz: 2500, enbwHz: 3000 },
          warnings: ['Computed on the display trace (101 points, about 2500 Hz apart), not on the full recording.'],
          methods: [{ id: 'channel-power-enbw', source: 'x' }],
          libraryVersion: '2.2.0',
        },
      })
    })
    const { user } = renderPage({ url: '/', routes: [{ path: '/', Component: () => <EvidenceSection caseId={CASE_ID} /> }] })

    const trace = await screen.findByRole('listitem', { name: 'quay-trace.json' })
    // a photo has no spectrum to show
    expect(within(screen.getByRole('listitem', { name: 'mast.jpg' })).queryByRole('button', { name: 'Show the spectrum' })).toBeNull()
    expect(analysisCalls).toHaveLength(0)
    await user.click(within(trace).getByRole('button', { name: 'Show the spectrum' }))

    const peaks = await screen.findByRole('table', { name: 'Peaks found in the trace' })
    expect(analysisCalls).toHaveLength(1)
    const rows = within(peaks).getAllByRole('row').slice(1)
    expect(rows.map((r) => within(r).getAllByRole('cell').map((c) => c.textContent))).toEqual([
      ['1', '433.920000 MHz', '-41.5', '38.5'],
      ['2', '433.975000 MHz', '-58.3', '21.8'],
    ])
    await screen.findByTestId('spectrum-chart')
    const shown = chartProps.at(-1)!
    expect(shown.levelUnit).toBe('dBm')
    expect(shown.peaks).toEqual([
      { freqHz: 433.92e6, level: -41.5 },
      { freqHz: 433.975e6, level: -58.25 },
    ])
    expect(shown.main.freqHz).toHaveLength(101)

    // low edge in MHz, high edge in kHz: both go out in hertz
    await user.type(screen.getByLabelText('Low edge'), '433.895')
    await user.type(screen.getByLabelText('High edge'), '433945')
    await user.selectOptions(screen.getByLabelText('Unit of high edge'), 'kHz')
    await user.click(screen.getByRole('button', { name: 'Measure the band' }))

    expect(await screen.findByText('-40.12 dBm')).toBeTruthy()
    expect(bandCalls.map((c) => c.body)).toEqual([{ lowFreqHz: 433_895_000, highFreqHz: 433_945_000 }])
    expect(screen.getByText(/The display trace, not the full recording: 101 points about 2\.500 kHz apart/)).toBeTruthy()
    expect(screen.getByText(/12\.50 kHz/)).toBeTruthy()
    expect(screen.getByTestId('spectrum-chart').textContent).toBe('band 433895000–433945000')
  })

  it('saves a dBm band as a measurement of the case, with the time and place typed', async () => {
    answer('get', `/api/cases/${CASE_ID}/evidence`, evidenceListResponseSchema.parse({ evidence: [file()] }))
    answer('get', `/api/evidence/${FILE_ID}/analysis`, analysis)
    answer('post', `/api/evidence/${FILE_ID}/band`, (req) => {
      const b = req.body as { lowFreqHz: number; highFreqHz: number }
      return evidenceBandResponseSchema.parse({
        band: {
          evidenceId: FILE_ID,
          ...b,
          levelUnit: 'dBm',
          channelPowerDbm: -40.5,
          channelPowerDbfs: null,
          channelPowerNote: null,
          occupiedBandwidthHz: null,
          occupiedLowerEdgeHz: null,
          occupiedUpperEdgeHz: null,
          betaPercent: null,
          basis: { trace: 'display', pointCount: 101, pointsInBand: 20, decimated: false, sourcePointCount: 101, binSpacingHz: 2500, enbwHz: 3000 },
          warnings: [],
          methods: [],
          libraryVersion: '2.2.0',
        },
      })
    })
    const saved = answer('post', `/api/evidence/${FILE_ID}/band-measurement`, {}, { status: 201 })
    const { user } = renderPage({ url: '/', routes: [{ path: '/', Component: () => <EvidenceSection caseId={CASE_ID} /> }] })
    await user.click(await screen.findByRole('button', { name: 'Show the spectrum' }))
    await user.type(await screen.findByLabelText('Low edge'), '433.9')
    await user.type(screen.getByLabelText('High edge'), '433.95')
    await user.click(screen.getByRole('button', { name: 'Measure the band' }))
    const form = await screen.findByRole('form', { name: 'Save as a measurement' })
    // nothing typed: every missing field is named, nothing is sent
    await user.click(within(form).getByRole('button', { name: 'Save as a measurement' }))
    expect(await within(form).findByText('Enter the latitude.')).toBeTruthy()
    expect(within(form).getByText('Enter the longitude.')).toBeTruthy()
    expect(within(form).getByText('Enter the date and time the file was recorded.')).toBeTruthy()
    expect(saved).toHaveLength(0)
    await user.type(within(form).getByLabelText('Recorded at'), '2026-11-20T09:00')
    await user.type(within(form).getByLabelText('Latitude'), '48.1')
    await user.type(within(form).getByLabelText('Longitude'), '-31.35')
    await user.click(within(form).getByRole('button', { name: 'Save as a measurement' }))
    expect(await screen.findByText('Saved as a measurement of the case.')).toBeTruthy()
    // only the band's edges and when and where are sent: the server computes the level itself
    expect(saved[0]!.body).toEqual({
      lowFreqHz: 433_900_000,
      highFreqHz: 433_950_000,
      takenAt: new Date('2026-11-20T09:00').toISOString(),
      latDeg: 48.1,
      lonDeg: -31.35,
    })
  })

  it('overlays another processed file of the case when picked, and offers no measurement for a dBFS recording', async () => {
    const OTHER_ID = '00000000-0000-4000-8000-0000000000a3'
    const THIRD_ID = '00000000-0000-4000-8000-0000000000a4'
    const dbfs = (id: string) =>
      evidenceAnalysisResponseSchema.parse({
        analysis: {
          ...analysis.analysis,
          evidenceId: id,
          summary: { ...analysis.analysis.summary!, source: 'sigmf_archive', levelUnit: 'dBFS', peaks: [] },
          displayTrace: { ...analysis.analysis.displayTrace!, levelDbm: freqHz.map(() => (id === FILE_ID ? -70 : -95)) },
        },
      })
    answer(
      'get',
      `/api/cases/${CASE_ID}/evidence`,
      evidenceListResponseSchema.parse({
        evidence: [
          file({ kind: 'iq_recording', originalName: 'source-on.sigmf' }),
          file({ id: OTHER_ID, kind: 'iq_recording', originalName: 'source-off.sigmf' }),
          // still processing: not offered for comparison
          file({ id: THIRD_ID, kind: 'iq_recording', originalName: 'later.sigmf', processing: { state: 'running', progress: 0.4 } }),
        ],
      }),
    )
    answer('get', `/api/evidence/${FILE_ID}/analysis`, dbfs(FILE_ID))
    const otherCalls = answer('get', `/api/evidence/${OTHER_ID}/analysis`, dbfs(OTHER_ID))
    answer('post', `/api/evidence/${FILE_ID}/band`, (req) =>
      evidenceBandResponseSchema.parse({
        band: {
          evidenceId: FILE_ID,
          ...(req.body as object),
          levelUnit: 'dBFS',
          channelPowerDbm: null,
          channelPowerDbfs: -31.25,
          channelPowerNote: null,
          occupiedBandwidthHz: null,
          occupiedLowerEdgeHz: null,
          occupiedUpperEdgeHz: null,
          betaPercent: null,
          basis: { trace: 'display', pointCount: 101, pointsInBand: 20, decimated: true, sourcePointCount: 65536, binSpacingHz: 2500, enbwHz: 3000 },
          warnings: [],
          methods: [],
          libraryVersion: '2.2.0',
        },
      }),
    )
    const { user } = renderPage({ url: '/', routes: [{ path: '/', Component: () => <EvidenceSection caseId={CASE_ID} /> }] })
    const first = await screen.findByRole('listitem', { name: 'source-on.sigmf' })
    await user.click(within(first).getByRole('button', { name: 'Show the spectrum' }))
    const compare = await screen.findByLabelText('Compare with another file of the case')
    expect(within(compare).getAllByRole('option').map((o) => o.textContent)).toEqual(['No second trace', 'source-off.sigmf'])
    await user.selectOptions(compare, OTHER_ID)
    await waitFor(() => expect(chartProps.at(-1)!.overlay?.label).toBe('source-off.sigmf'))
    expect(otherCalls).toHaveLength(1)
    expect(chartProps.at(-1)!.overlay!.level[0]).toBe(-95)
    expect(chartProps.at(-1)!.levelUnit).toBe('dBFS')

    await user.type(screen.getByLabelText('Low edge'), '433.9')
    await user.type(screen.getByLabelText('High edge'), '433.95')
    await user.click(screen.getByRole('button', { name: 'Measure the band' }))
    expect(await screen.findByText('-31.25 dBFS')).toBeTruthy()
    expect(screen.getByText(/reduced from 65536/)).toBeTruthy()
    expect(screen.getByText(/Not offered as a measurement: a level in dBFS is relative/)).toBeTruthy()
    expect(screen.queryByRole('form', { name: 'Save as a measurement' })).toBeNull()
  })

  it('refuses a band whose high edge is not above its low edge, beside the field, without sending it', async () => {
    answer('get', `/api/cases/${CASE_ID}/evidence`, evidenceListResponseSchema.parse({ evidence: [file()] }))
    answer('get', `/api/evidence/${FILE_ID}/analysis`, analysis)
    const bandCalls = answer('post', `/api/evidence/${FILE_ID}/band`, {})
    const { user } = renderPage({ url: '/', routes: [{ path: '/', Component: () => <EvidenceSection caseId={CASE_ID} /> }] })
    await user.click(await screen.findByRole('button', { name: 'Show the spectrum' }))
    await user.type(await screen.findByLabelText('Low edge'), '433.95')
    await user.type(screen.getByLabelText('High edge'), '433.90')
    await user.click(screen.getByRole('button', { name: 'Measure the band' }))
    expect(await screen.findByText('The high edge of the band must be above its low edge.')).toBeTruthy()
    expect(bandCalls).toHaveLength(0)
  })
})

/**
 * The estimate screens: the quick calculator (its state in the URL, computed in the browser) and
 * the case's workbench (the server computes and stores; its 400s land beside the fields).
 */
import { screen, waitFor, within } from '@testing-library/react'
import { describe, expect, it } from 'vitest'
import { calculationsResponseSchema, calculationViewSchema, type CalculationView } from '../../shared/schemas/views'
import { equipmentListResponseSchema, measurementsResponseSchema } from '../../shared/schemas/measurements'
import { findingsResponseSchema } from '../../shared/schemas/findings'
import { Component as CalculatorPage } from '@/app/routes/calculator'
import { Component as CasePage } from '@/app/routes/case'
import { eirpFitInputSchema, sourceLocateInputSchema } from '../../shared/calculations'
import { eirpFitForm } from '@/features/estimates/forms/eirp-fit-form'
import { sourceLocateForm } from '@/features/estimates/forms/source-locate-form'
import { outputPathLabel } from '@/features/estimates/lib/output-path'
import { ENFORCEMENT_CAUTION } from '@/components/cautions/enforcement-caution'
import { paths } from '@/lib/paths'
import { answer, apiError } from '../support/msw-server'
import { abilities, caseResponse, IDS } from '../support/msw-views'
import { renderPage } from '../support/web-render'
import { answerNoEnforcementRecords } from '../support/msw-follow-ups'

const calculatorRoutes = [{ path: paths.calculator.path, Component: CalculatorPage }]
const STATION_ID = '5d6e7f80-91a2-4b3c-8d4e-5f6a7b8c9d0e'
const RECORD_ID = '6e7f8091-a2b3-4c4d-9e5f-6a7b8c9d0e1f'

/** A stored record as the server answers it, read through the shared view schema. */
function record(changes: Partial<CalculationView>): CalculationView {
  return calculationViewSchema.parse({
    id: RECORD_ID,
    caseId: IDS.case,
    kind: 'eirp_single_point',
    kindLabel: 'x',
    inputs: {},
    outputs: { value: {} },
    warnings: [],
    methods: [{ id: 'm', source: 's' }],
    libraryVersion: '2.0.0',
    author: { id: IDS.investigatorIlse, name: 'Ilse Brannock' },
    at: '2026-12-03T10:00:00.000Z',
    references: {},
    measurementIds: [],
    evidenceIds: [],
    ...changes,
  })
}

/** A case in field work with its workbench's lists. */
function serveWorkedCase(calculations: CalculationView[] = []) {
  answer('get', '/api/cases/:id', caseResponse({ status: 'field_work', investigatorId: IDS.investigatorIlse, investigatorName: 'Ilse Brannock', abilities: abilities('proposeFinding', 'storeCalculation') }))
  answer('get', '/api/cases/:id/findings', findingsResponseSchema.parse({ current: null, earlier: [] }))
  answer('get', '/api/cases/:id/calculations', calculationsResponseSchema.parse({ calculations }))
  answer('get', '/api/cases/:id/measurements', measurementsResponseSchema.parse({ measurements: [], abilities: { record: true } }))
  answer('get', '/api/cases/:id/evidence', { evidence: [] })
  answerNoEnforcementRecords()
  // the case page's measurement panel asks for the office's equipment
  answer('get', '/api/offices/:id/equipment', equipmentListResponseSchema.parse({ items: [], abilities: { manage: false } }))
}

async function openWorkbench() {
  const page = renderPage({ url: paths.case.href(IDS.case), routes: [{ path: paths.case.path, Component: CasePage }] })
  const bench = await screen.findByRole('region', { name: 'Estimates workbench' })
  await page.user.click(within(bench).getByText('Estimates workbench'))
  await within(bench).findByRole('list', { name: 'Stored calculations, newest first' }).catch(() => within(bench).findByText('No calculation is stored on this case yet.'))
  return { ...page, bench }
}

describe('the quick calculator', () => {
  it('keeps its inputs and result in the URL, and a link reopens both', async () => {
    const first = renderPage({ url: paths.calculator.href(), routes: calculatorRoutes })
    const { user } = first
    await user.type(await screen.findByLabelText('Field strength'), '74.77')
    await user.type(screen.getByLabelText('Measured frequency'), '433.92')
    await user.type(screen.getByLabelText('Distance from the source to the measuring point'), '1')
    await user.selectOptions(screen.getByRole('combobox', { name: 'Unit of distance from the source to the measuring point' }), 'km')
    await user.type(screen.getByLabelText('Frequency'), '433.92')
    await user.click(screen.getByRole('button', { name: 'Calculate' }))

    // E = EIRP(dBW) − 20·log10 d(km) + 74.77: 74.77 dBµV/m at 1 km is 0 dBW = 30 dBm (ITU-R P.525-4 §2.1; CHECK-VALUES 1-5)
    const result = await screen.findByRole('region', { name: 'Result' })
    expect(result).toHaveTextContent('EIRP 30.00 dBm')
    expect(result).toHaveTextContent('Nothing was stored')
    const url = new URL(first.currentUrl(), 'http://x')
    expect(Object.fromEntries(url.searchParams)).toMatchObject({
      kind: 'eirp_single_point',
      'measurement.fieldStrengthDbuvPerM': '74.77',
      distanceM: '1',
      'distanceM~unit': 'km',
      run: '1',
    })
    first.unmount()

    // the link alone: same inputs, same result, nothing typed
    renderPage({ url: first.currentUrl(), routes: calculatorRoutes })
    expect(await screen.findByLabelText('Field strength')).toHaveValue('74.77')
    expect(screen.getByRole('combobox', { name: 'Unit of distance from the source to the measuring point' })).toHaveValue('km')
    expect(await screen.findByRole('region', { name: 'Result' })).toHaveTextContent('EIRP 30.00 dBm')
  })

  it('shows the schema’s errors beside the fields it refuses, and keeps what was typed', async () => {
    const { user } = renderPage({ url: paths.calculator.href(), routes: calculatorRoutes })
    const level = await screen.findByLabelText('Field strength')
    await user.type(level, '0x10')
    await user.click(screen.getByRole('button', { name: 'Calculate' }))
    await waitFor(() => expect(level).toHaveAttribute('aria-invalid', 'true'))
    expect(level).toHaveAccessibleDescription(/decimal number/)
    expect(level).toHaveValue('0x10')
    expect(screen.queryByRole('region', { name: 'Result' })).not.toBeInTheDocument()
  })

  it('shows a verdict with its warnings and the enforcement caution', async () => {
    const { user } = renderPage({ url: paths.calculator.href(), routes: calculatorRoutes })
    await user.selectOptions(await screen.findByRole('combobox', { name: 'Estimate' }), 'compliance_verdict')
    await user.type(screen.getByLabelText('Estimated EIRP'), '45')
    // 47 CFR §15.255 average EIRP 40 dBm, an entry the library marks [M] (recalled, not verified)
    await user.selectOptions(screen.getByRole('combobox', { name: 'Band-limit entry' }), 'cfr47-15-255-average')
    await user.click(screen.getByRole('button', { name: 'Calculate' }))

    const result = await screen.findByRole('region', { name: 'Result' })
    // margin = EIRP − limit = 45 − 40 dBm (definition of the margin, common practice, no source)
    expect(result).toHaveTextContent('Exceeds the limit by 5.00 dB')
    const warnings = within(result).getByRole('list', { name: 'Warnings' })
    expect(warnings).toHaveTextContent('[M]')
    expect(warnings).toHaveTextContent('No uncertainty interval given')
    expect(result).toHaveTextContent(ENFORCEMENT_CAUTION)
  })
})

describe('the calculator’s other kinds', () => {
  it('gives the I/N of an interferer at a typed distance', async () => {
    const { user } = renderPage({ url: paths.calculator.href(), routes: calculatorRoutes })
    await user.selectOptions(await screen.findByRole('combobox', { name: 'Estimate' }), 'coexistence')
    await user.type(screen.getByLabelText("Interferer's EIRP"), '30')
    await user.type(screen.getByLabelText('Distance from the interferer to the victim'), '1000')
    await user.type(screen.getByLabelText('Frequency'), '100')
    await user.selectOptions(screen.getByRole('combobox', { name: 'Noise of the receiver' }), 'noise-power')
    await user.type(screen.getByLabelText('Noise power'), '-100')
    await user.click(screen.getByRole('button', { name: 'Calculate' }))
    // free-space loss at 100 MHz, 1 km: 72.45 dB (ITU-R P.525-4 §2.2; CHECK-VALUES 1-1), so I = 30 − 72.45 = −42.45 dBm
    // and I/N = −42.45 − (−100) = 57.55 dB (I/N in dB is the difference of the two levels: definition, common practice, no source)
    const result = await screen.findByRole('region', { name: 'Result' })
    expect(result).toHaveTextContent('I/N 57.55 dB')
    expect(result).toHaveTextContent('−42.45 dBm')
  })

  it('screens RF exposure at a typed distance and shows the caution beside it', async () => {
    const { user } = renderPage({ url: paths.calculator.href(), routes: calculatorRoutes })
    await user.selectOptions(await screen.findByRole('combobox', { name: 'Estimate' }), 'exposure_screening')
    await user.type(screen.getByLabelText('EIRP'), '60')
    await user.type(screen.getByLabelText('Frequency'), '900')
    await user.type(screen.getByLabelText('Distance from the antenna'), '1')
    await user.click(screen.getByRole('button', { name: 'Calculate' }))
    // S = 2.56·EIRP/(4πR²) with the ground-reflection factor: 1000 W at 1 m → 203.7183 W/m²
    // (far-field power density with the 2.56 reflection factor, as in FCC OET Bulletin 65 — recalled from memory)
    const result = await screen.findByRole('region', { name: 'Result' })
    const points = within(result).getByRole('list', { name: 'Points screened' })
    expect(points).toHaveTextContent('203.7183 W/m²')
    expect(result).toHaveTextContent('RF exposure: worst point above the reference level')
    expect(result).toHaveTextContent('RF exposure figures are screening values; local codes and licensed practice govern.')
  })
})

describe('the forms’ inputs', () => {
  it('sends typed fit readings and locate observations as their schemas read them, in base units', () => {
    const fit = eirpFitForm.toInputs(
      { 'exponent.kind': 'free', refDistanceM: '1', 'points#rows': '2', 'points.0.distanceM': '2', 'points.0.distanceM~unit': 'km', 'points.0.receivedPowerDbm': '-60', 'points.1.distanceM': '500', 'points.1.level': 'field', 'points.1.fieldStrengthDbuvPerM': '70', freqHz: '433.92' },
      {},
    )
    const f = eirpFitInputSchema.parse(fit)
    expect(f.readings).toEqual({ source: 'typed', points: [{ distanceM: 2000, receivedPowerDbm: -60 }, { distanceM: 500, fieldStrengthDbuvPerM: 70 }] })
    expect(f.freqHz).toBe(433_920_000)

    const locate = sourceLocateForm.toInputs(
      { 'bearings#rows': '1', 'bearings.0.latDeg': '48.1', 'bearings.0.lonDeg': '-31.4', 'bearings.0.bearingDeg': '45', bearingSigmaDeg: '5' },
      { measurements: [] },
    )
    expect(sourceLocateInputSchema.parse(locate).observations).toEqual({ source: 'typed', bearings: [{ latDeg: 48.1, lonDeg: -31.4, bearingDeg: 45 }] })

    // on a case with ticked measurements, the ids go by reference (the record keeps copies)
    const ids = [STATION_ID, RECORD_ID]
    const fromCase = sourceLocateForm.toInputs({ pointsFrom: 'measurements', use: 'bearings', bearingSigmaDeg: '5' }, { measurements: ids.map((id) => ({ id, label: id })) })
    expect(sourceLocateInputSchema.parse(fromCase).observations).toEqual({ source: 'measurements', measurementIds: ids, use: 'bearings' })
  })
})

describe('the case workbench', () => {
  it('puts the server’s field errors beside the fields and keeps the inputs', async () => {
    serveWorkedCase()
    const posted = answer('post', '/api/cases/:id/calculations', () =>
      apiError(400, {
        code: 'validation_failed',
        message: 'Some fields need attention.',
        details: [
          { path: 'inputs.distanceM', message: 'The distance must be above 0 m.' },
          { path: 'inputs.model.freqHz', message: 'Enter the model frequency.' },
        ],
      }),
    )
    const { bench, user } = await openWorkbench()
    await user.type(within(bench).getByLabelText('Field strength'), '60')
    await user.type(within(bench).getByLabelText('Measured frequency'), '100')
    await user.type(within(bench).getByLabelText('Distance from the source to the measuring point'), '0')
    await user.click(within(bench).getByRole('button', { name: 'Run and store on the case' }))

    const distance = within(bench).getByLabelText('Distance from the source to the measuring point')
    await waitFor(() => expect(distance).toHaveAccessibleDescription('The distance must be above 0 m.'))
    expect(within(bench).getByLabelText('Frequency')).toHaveAccessibleDescription('Enter the model frequency.')
    expect(distance).toHaveValue('0')
    expect(posted[0]!.body).toMatchObject({ kind: 'eirp_single_point', inputs: { measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: '60 dBµV/m', freqHz: '100 MHz' }, distanceM: '0 m' } })
  })

  it('fills the verdict form with a candidate station’s licence, and sends the station as the limit', async () => {
    const candidates = record({
      kind: 'candidate_sources',
      outputs: {
        value: {
          registerVersion: 3,
          overlappingCount: 1,
          candidates: [
            {
              rank: 1,
              stationId: STATION_ID,
              stationCode: 'TWK-0042',
              licensee: 'Tarnwick Pilots Ltd',
              service: 'maritime',
              registerVersion: 3,
              lowFreqHz: 156_700_000,
              highFreqHz: 156_900_000,
              authorisedEirpDbm: 44,
              overlapHz: 25_000,
              overlapFraction: 1,
              distanceM: 820,
              pathLossDb: 74.4,
              predictedLevelDbm: -30.4,
            },
          ],
          order: 'level',
          victimAntennaGainDbi: 0,
          modelKind: 'free-space',
        },
      },
    })
    serveWorkedCase([candidates])
    const posted = answer('post', '/api/cases/:id/calculations', () => apiError(400, { code: 'validation_failed', message: 'Some fields need attention.', details: [] }))
    const { bench, user } = await openWorkbench()
    const list = await within(bench).findByRole('list', { name: 'Stored calculations, newest first' })
    await user.click(within(list).getByText('Candidate sources from the licence register'))
    await user.click(await within(bench).findByRole('button', { name: 'Use the licence of TWK-0042 as the limit' }))

    expect(within(bench).getByRole('combobox', { name: 'Estimate' })).toHaveValue('compliance_verdict')
    const judge = within(bench).getByRole('combobox', { name: 'Judge against' })
    expect(judge).toHaveValue('station')
    expect(within(judge).getByRole('option', { selected: true })).toHaveTextContent('The licence of station TWK-0042 (Tarnwick Pilots Ltd)')

    await user.type(within(bench).getByLabelText('Estimated EIRP'), '50')
    await user.click(within(bench).getByRole('button', { name: 'Run and store on the case' }))
    await waitFor(() => expect(posted).toHaveLength(1))
    expect(posted[0]!.body).toEqual({ kind: 'compliance_verdict', inputs: { eirpDbm: '50 dBm', limit: { source: 'station', stationId: STATION_ID } } })
  })
})

describe('outputPathLabel', () => {
  it('names a stored output in words with its unit', () => {
    expect(outputPathLabel('value.erpW')).toBe('ERP [W]')
    expect(outputPathLabel('value.eirpIntervalDbm.lowDbm')).toBe('EIRP interval › low [dBm]')
    expect(outputPathLabel('value.budget.rows.0.varianceShare')).toBe('budget › rows › 1 › variance share')
    expect(outputPathLabel('value.fieldStrengthDbuvPerM')).toBe('field strength [dBµV/m]')
    expect(outputPathLabel('interval.low')).toBe('interval › low')
  })
})

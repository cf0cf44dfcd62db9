/**
 * The measurements section of a case: the levels are derived live in the browser as the
 * investigator types (with the shared derivation), the form sends figures with their units and
 * never a derived value, the server's field messages appear beside the fields they name, and a
 * refused device location says what to do instead.
 */
import { screen, waitFor, within } from '@testing-library/react'
import { afterEach, describe, expect, it } from 'vitest'
import { equipmentListResponseSchema, measurementsResponseSchema } from '../../shared/schemas/measurements'
import { MeasurementsSection } from '@/features/measurements/components/measurements-section'
import { answer, apiError } from '../support/msw-server'
import { renderPage } from '../support/web-render'

const CASE_ID = '6f1c2a34-1b2c-4d5e-8f90-123456789abc'
const OFFICE_ID = '00000000-0000-4000-8000-000000000001'
const LPDA_ID = '00000000-0000-4000-8000-0000000000e1'

const item = (over: object) => ({
  officeId: OFFICE_ID,
  manufacturer: null,
  model: null,
  serial: null,
  antennaGainDbi: null,
  antennaFactorTable: null,
  defaultCableLossDb: null,
  defaultPreampGainDb: null,
  minFreqHz: null,
  maxFreqHz: null,
  maxInputDbm: null,
  calibrationDueOn: '2030-01-31',
  calibrationState: 'ok',
  notes: null,
  version: 1,
  updatedAt: '2026-11-01T09:00:00.000Z',
  updatedBy: 'Sade Okafor',
  ...over,
})

const EQUIPMENT = equipmentListResponseSchema.parse({
  items: [
    item({
      id: LPDA_ID,
      name: 'Log-periodic LP-1',
      type: 'antenna',
      antennaFactorTable: [
        { freqHz: 200e6, antennaFactorDbPerM: 11.0 },
        { freqHz: 300e6, antennaFactorDbPerM: 13.5 },
        { freqHz: 500e6, antennaFactorDbPerM: 17.2 },
        { freqHz: 1000e6, antennaFactorDbPerM: 23.4 },
      ],
      defaultCableLossDb: 3,
    }),
    item({ id: '00000000-0000-4000-8000-0000000000e2', name: 'Handheld analyser HA-9', type: 'analyser', maxInputDbm: 20 }),
  ],
  abilities: { manage: false },
})

function Page() {
  return <MeasurementsSection caseId={CASE_ID} officeId={OFFICE_ID} casePoint={{ latDeg: 48.1, lonDeg: -31.3 }} />
}

async function openTheForm() {
  answer('get', `/api/cases/${CASE_ID}/measurements`, measurementsResponseSchema.parse({ measurements: [], abilities: { record: true } }))
  answer('get', `/api/cases/${CASE_ID}/evidence`, { evidence: [] })
  answer('get', `/api/offices/${OFFICE_ID}/equipment`, EQUIPMENT)
  const page = renderPage({ url: '/m', routes: [{ path: '/m', Component: Page }] })
  await page.user.click(await screen.findByRole('button', { name: 'Record a measurement' }))
  const form = await screen.findByRole('form', { name: 'Record a measurement' })
  return { ...page, form }
}

const realGeolocation = Object.getOwnPropertyDescriptor(navigator, 'geolocation')
afterEach(() => {
  if (realGeolocation) Object.defineProperty(navigator, 'geolocation', realGeolocation)
  else delete (navigator as { geolocation?: unknown }).geolocation
})

describe('the measurement form', () => {
  it('shows the derived levels live as the reading, frequency and antenna are typed', async () => {
    const { user, form } = await openTheForm()
    const panel = within(form).getByRole('region', { name: 'Derived levels, as you type' })
    expect(within(panel).getByText(/Waiting for the centre frequency; the reading/)).toBeTruthy()

    await user.type(within(form).getByLabelText('Centre frequency'), '433.92')
    await user.selectOptions(within(form).getByLabelText('What the instrument shows'), 'dBµV')
    await user.type(within(form).getByLabelText('Reading'), '40')
    // without an antenna a reading at the input gives no field
    expect(within(panel).getByText(/No antenna given/)).toBeTruthy()
    await user.selectOptions(within(form).getByLabelText('Antenna'), `register:${LPDA_ID}`)
    // the register's usual cable loss fills the empty field
    expect((within(form).getByLabelText('Cable loss') as HTMLInputElement).value).toBe('3')
    // E = V + AF + L_cable (register 2-5); AF at 433.92 MHz is 16.1733 dB/m by numpy.interp on log10 f: 40 + 16.17 + 3 = 59.17
    expect(panel.querySelector('[data-level="fieldStrengthDbuvPerM"]')!.textContent).toBe('59.2 dBµV/m')
    expect(within(panel).getByText('16.17 dB/m')).toBeTruthy()
    // S = E − 145.76 (register 1-8): 59.17 − 145.76 = −86.59
    expect(panel.querySelector('[data-level="pfdDbwPerM2"]')!.textContent).toBe('\u221286.6 dBW/m²')

    await user.clear(within(form).getByLabelText('Reading'))
    await user.type(within(form).getByLabelText('Reading'), '42')
    expect(panel.querySelector('[data-level="fieldStrengthDbuvPerM"]')!.textContent).toBe('61.2 dBµV/m')

    // a frequency outside the antenna's calibrated table is said at once, and gives no level
    await user.clear(within(form).getByLabelText('Centre frequency'))
    await user.type(within(form).getByLabelText('Centre frequency'), '150')
    expect(within(panel).getByText(/covers 200 MHz to 1000 MHz; 150 MHz is outside it/)).toBeTruthy()
    expect(panel.querySelector('[data-level="fieldStrengthDbuvPerM"]')!.textContent).toBe('—')
  })

  it('sends figures with their units and no derived value, and shows the server’s messages beside each field', async () => {
    const { user, form } = await openTheForm()
    const sent = answer('post', `/api/cases/${CASE_ID}/measurements`, () =>
      apiError(400, {
        code: 'validation_failed',
        message: 'Some fields need attention.',
        details: [
          { path: 'measurement.freqHz', message: 'Enter the centre frequency above 0 Hz.' },
          { path: 'measurement.reading.value', message: 'The reading (25.0 dBm) is above what Handheld analyser HA-9 can take (20 dBm at its input).' },
          { path: 'measurement.latDeg', message: 'Enter the latitude.' },
        ],
      }),
    )
    await user.type(within(form).getByLabelText('Centre frequency'), '0')
    await user.type(within(form).getByLabelText('Reading'), '25')
    await user.click(within(form).getByRole('button', { name: 'Save the measurement' }))

    await waitFor(() => expect(sent).toHaveLength(1))
    const body = sent[0]!.body as { measurement: Record<string, unknown> }
    expect(Object.keys(body)).toEqual(['measurement'])
    expect(body.measurement).not.toHaveProperty('derived')
    expect(body.measurement).toMatchObject({ freqHz: '0 MHz', reading: { unit: 'dBm', value: '25 dBm' }, antenna: { source: 'none' } })

    const frequency = within(form).getByLabelText('Centre frequency')
    await waitFor(() => expect(frequency.getAttribute('aria-invalid')).toBe('true'))
    expect(document.getElementById(frequency.getAttribute('aria-describedby')!.split(' ').find((x) => x.endsWith('-error'))!)!.textContent).toBe('Enter the centre frequency above 0 Hz.')
    expect(within(form).getByText(/above what Handheld analyser HA-9 can take/)).toBeTruthy()
    expect(within(form).getByLabelText('Latitude').getAttribute('aria-invalid')).toBe('true')
    expect(within(form).getByText('Some fields need attention: see the messages beside them.')).toBeTruthy()
  })

  it('says what to do when the device’s location is refused', async () => {
    Object.defineProperty(navigator, 'geolocation', {
      configurable: true,
      value: { getCurrentPosition: (_ok: unknown, fail: (e: { code: number }) => void) => fail({ code: 1 }) },
    })
    const { user, form } = await openTheForm()
    await user.click(within(form).getByRole('button', { name: 'Use this device’s position' }))
    expect(await within(form).findByText(/Location access was refused on this device\. Type the position, or pick it on the map/)).toBeTruthy()
  })

  it('fills the position from the device when allowed', async () => {
    Object.defineProperty(navigator, 'geolocation', {
      configurable: true,
      value: { getCurrentPosition: (ok: (p: { coords: { latitude: number; longitude: number; accuracy: number } }) => void) => ok({ coords: { latitude: 48.123456, longitude: -31.4, accuracy: 8 } }) },
    })
    const { user, form } = await openTheForm()
    await user.click(within(form).getByRole('button', { name: 'Use this device’s position' }))
    await waitFor(() => expect((within(form).getByLabelText('Latitude') as HTMLInputElement).value).toBe('48.123456'))
    expect((within(form).getByLabelText('Longitude') as HTMLInputElement).value).toBe('-31.400000')
    expect(within(form).getByText(/to within about 8 m/)).toBeTruthy()
  })
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
    heightM: 1.5,
    freqHz: 433.92e6,
    measurementBandwidthHz: null,
    rbwHz: 120e3,
    detector: 'rms',
    reading: { value: 40, unit: 'dBµV' },
    antenna: { source: 'register', equipmentId: LPDA_ID },
    instrumentId: null,
    cableLossDb: 3,
    preampGainDb: null,
    polarisation: 'vertical',
    bearingDeg: null,
    bearingSigmaDeg: null,
    notes: null,
    evidenceFileId: null,
    derived: { fieldStrengthDbuvPerM: 59.17329488947475, pfdDbwPerM2: -86.58, isotropicReceivedPowerDbm: -70.5, antennaFactorDbPerM: 16.17329488947475 },
    methods: {},
    warnings: ['Log-periodic LP-1: calibration ran out on 2026-06-30, before this measurement (2026-11-20).'],
    equipment: [{ equipmentId: LPDA_ID, name: 'Log-periodic LP-1', type: 'antenna', calibrationDueOn: '2026-06-30', version: 1 }],
    libraryVersion: '2.0.0',
    version: 1,
    supersedesId: null,
    supersededById: null,
    usedByCalculations: 0,
    abilities: { edit: true, correct: true },
    ...over,
  })

describe('the measurement list', () => {
  it('offers Correct (not Edit) once a calculation uses a measurement, sends the correction, and marks a superseded one', async () => {
    const used = stored({ id: '00000000-0000-4000-8000-0000000000a1', usedByCalculations: 1, abilities: { edit: false, correct: true } })
    const old = stored({ id: '00000000-0000-4000-8000-0000000000a2', supersededById: '00000000-0000-4000-8000-0000000000a3', abilities: { edit: false, correct: false } })
    answer('get', `/api/cases/${CASE_ID}/measurements`, measurementsResponseSchema.parse({ measurements: [old, used], abilities: { record: true } }))
    answer('get', `/api/cases/${CASE_ID}/evidence`, { evidence: [] })
    answer('get', `/api/offices/${OFFICE_ID}/equipment`, EQUIPMENT)
    const sent = answer('post', `/api/measurements/${used.id}/corrections`, { measurement: { ...used, id: '00000000-0000-4000-8000-0000000000a4', supersedesId: used.id } }, { status: 201 })
    const { user } = renderPage({ url: '/m', routes: [{ path: '/m', Component: Page }] })

    const first = await screen.findByRole('article', { name: /^M1 ·/ })
    expect(within(first).getByText('Superseded by a correction — kept as recorded')).toBeTruthy()
    expect(within(first).queryByRole('button')).toBeNull()
    const second = screen.getByRole('article', { name: /^M2 ·/ })
    expect(within(second).getByText(/calibration ran out on 2026-06-30/)).toBeTruthy()
    expect(within(second).getByText('59.2 dBµV/m')).toBeTruthy()
    expect(within(second).queryByRole('button', { name: 'Edit M2' })).toBeNull()
    await user.click(within(second).getByRole('button', { name: 'Correct M2' }))

    const form = await screen.findByRole('form', { name: 'Correct the measurement' })
    expect((within(form).getByLabelText('Centre frequency') as HTMLInputElement).value).toBe('433.92')
    await user.clear(within(form).getByLabelText('Reading'))
    await user.type(within(form).getByLabelText('Reading'), '41')
    await user.click(within(form).getByRole('button', { name: 'Save the correction' }))
    await waitFor(() => expect(sent).toHaveLength(1))
    expect(sent[0]!.body).toMatchObject({ measurement: { reading: { unit: 'dBµV', value: '41 dBµV' }, antenna: { source: 'register', equipmentId: LPDA_ID }, freqHz: '433.92 MHz' } })
  })
})

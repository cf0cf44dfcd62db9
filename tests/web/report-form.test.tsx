import { screen, waitFor, within } from '@testing-library/react'
import { describe, expect, it } from 'vitest'
import { latestSinceDate, reportSchema } from '../../shared/schemas/cases'
import { Component as ReportPage } from '@/app/routes/report'
import { paths } from '@/lib/paths'
import { http, HttpResponse } from 'msw'
import { answer, apiError, server } from '../support/msw-server'
import { anonymousMe, regionMapResponse, submittedReport } from '../support/msw-views'
import { renderPage } from '../support/web-render'

/** A report that passes every rule, as a person would type it. */
const GOOD = {
  name: 'Edda Marlow',
  email: 'edda.marlow@example.test',
  service: 'broadcasting',
  frequency: '98.4',
  address: '12 Gull Lane, Tarnwick',
  latDeg: '48.1',
  lonDeg: '−31.35',
  since: '2026-11-20',
  pattern: 'All the time',
  experience: 'The service works badly (degradation)',
  description: 'Crackling over the morning programme since the new mast went up.',
}

/** The message the shared report schema gives for one field, when the rest of the report is good. */
function sharedMessage(field: string, value: string): string {
  const input: Record<string, unknown> = {
    name: GOOD.name,
    email: GOOD.email,
    service: 'broadcasting',
    frequencyFrom: GOOD.frequency,
    frequencyUnit: 'MHz',
    address: GOOD.address,
    latDeg: GOOD.latDeg,
    lonDeg: GOOD.lonDeg,
    since: GOOD.since,
    pattern: 'continuous',
    experience: 'degradation',
    description: GOOD.description,
    website: '',
    [field]: value,
  }
  const result = reportSchema.safeParse(input)
  const issue = result.error?.issues.find((i) => i.path[0] === field)
  if (!issue) throw new Error(`the shared schema accepts ${field} = ${value}`)
  return issue.message
}

async function openTheReportPage() {
  answer('get', '/api/me', anonymousMe())
  answer('get', '/api/region', regionMapResponse())
  const page = renderPage({ url: paths.report.href(), routes: [{ path: paths.report.path, Component: ReportPage }] })
  await screen.findByRole('form', { name: 'Interference report' })
  return page
}

async function fillInAGoodReport(user: ReturnType<typeof renderPage>['user'], changes: Partial<typeof GOOD> = {}) {
  const r = { ...GOOD, ...changes }
  await user.type(screen.getByLabelText('Your name'), r.name)
  await user.type(screen.getByLabelText('E-mail'), r.email)
  await user.selectOptions(screen.getByLabelText('Affected service'), r.service)
  await user.type(screen.getByLabelText('Frequency'), r.frequency)
  await user.type(screen.getByLabelText('Address or place'), r.address)
  await user.type(screen.getByLabelText('Latitude'), r.latDeg)
  await user.type(screen.getByLabelText('Longitude'), r.lonDeg)
  await user.type(screen.getByLabelText('Date it started'), r.since)
  await user.click(screen.getByRole('radio', { name: r.pattern }))
  await user.click(screen.getByRole('radio', { name: r.experience }))
  await user.type(screen.getByLabelText('Describe what you notice'), r.description)
}

describe('the public report form', () => {
  it('shows the map with the region’s offices, and the typed position on it (the typed figures lead)', async () => {
    const { user } = await openTheReportPage()
    const map = await screen.findByRole('region', { name: 'Map: pick where it happens' }, { timeout: 10_000 })
    expect(map).toHaveClass('leaflet-container')
    expect(within(screen.getByRole('list', { name: 'Key to the map' })).getAllByRole('listitem').map((li) => li.textContent)).toEqual([
      'Region boundary and land',
      '1 field office',
    ])
    expect(screen.getByText('No place picked on the map yet.')).toBeInTheDocument()
    await user.type(screen.getByLabelText('Latitude'), GOOD.latDeg)
    await user.type(screen.getByLabelText('Longitude'), '-31.35')
    expect(await screen.findByText('Marker at 48.1000° N, 31.3500° W')).toBeInTheDocument()
    expect(within(map).getByRole('img', { name: 'The place you gave' })).toBeInTheDocument()
    await user.clear(screen.getByLabelText('Latitude'))
    await user.type(screen.getByLabelText('Latitude'), '51.5')
    expect(await screen.findByText('51.5000° N, 31.3500° W is outside Vellmark Coast. It is still accepted.')).toBeInTheDocument()
  })

  it('refuses a hexadecimal frequency in the browser with the shared parser’s message, and sends nothing', async () => {
    const sent = answer('post', '/api/reports', submittedReport(), { status: 201 })
    const { user } = await openTheReportPage()
    await fillInAGoodReport(user, { frequency: '0x10' })
    await user.click(screen.getByRole('button', { name: 'Submit report' }))

    const frequency = screen.getByLabelText('Frequency')
    const expected = sharedMessage('frequencyFrom', '0x10')
    expect(expected).toBe('Enter the frequency as a decimal number, like 433.92.')
    await untilInvalid(frequency)
    expect(frequency).toHaveAccessibleDescription(expected)
    expect(sent).toHaveLength(0)
  })

  it('refuses a start date in the future with the shared schema’s message', async () => {
    const sent = answer('post', '/api/reports', submittedReport(), { status: 201 })
    const { user } = await openTheReportPage()
    const nextWeek = new Date(Date.parse(`${latestSinceDate()}T00:00:00Z`) + 7 * 86_400_000).toISOString().slice(0, 10)
    await fillInAGoodReport(user, { since: nextWeek })
    await user.click(screen.getByRole('button', { name: 'Submit report' }))

    const since = screen.getByLabelText('Date it started')
    await untilInvalid(since)
    expect(since).toHaveAccessibleDescription(sharedMessage('since', nextWeek))
    expect(sharedMessage('since', nextWeek)).toBe('The date it started cannot be in the future.')
    expect(sent).toHaveLength(0)
  })

  it('names every missing field at once when the form is sent empty', async () => {
    const sent = answer('post', '/api/reports', submittedReport(), { status: 201 })
    const { user } = await openTheReportPage()
    await user.click(screen.getByRole('button', { name: 'Submit report' }))

    await untilInvalid(screen.getByLabelText('Your name'))
    expect(screen.getByLabelText('Your name')).toHaveAccessibleDescription(sharedMessage('name', ''))
    expect(screen.getByLabelText('Frequency')).toHaveAccessibleDescription(sharedMessage('frequencyFrom', ''))
    expect(screen.getByLabelText('Latitude')).toHaveAccessibleDescription(expect.stringContaining(sharedMessage('latDeg', '')))
    expect(screen.getByRole('group', { name: 'When does it happen?' })).toHaveTextContent('Choose when it happens.')
    expect(sent).toHaveLength(0)
  })

  it('shows the server’s 400 field errors beside their fields and keeps what was typed', async () => {
    const sent = answer('post', '/api/reports', () =>
      apiError(400, {
        code: 'validation_failed',
        message: 'Some fields need attention.',
        details: [{ path: 'since', message: 'The date it started cannot be in the future.' }],
      }),
    )
    const { user } = await openTheReportPage()
    await fillInAGoodReport(user)
    await user.click(screen.getByRole('button', { name: 'Submit report' }))

    const since = screen.getByLabelText('Date it started')
    await untilInvalid(since)
    expect(sent).toHaveLength(1)
    expect(since).toHaveAccessibleDescription('The date it started cannot be in the future.')
    expect(since).toHaveFocus()
    expect(screen.getByLabelText('Describe what you notice')).toHaveValue(GOOD.description)
    expect(screen.queryByRole('heading', { name: 'Report received' })).not.toBeInTheDocument()
  })

  it('shows a form-level message when too many reports came from the same address', async () => {
    answer('post', '/api/reports', () => apiError(429, { code: 'too_many_reports', message: 'Too many reports.' }))
    const { user } = await openTheReportPage()
    await fillInAGoodReport(user)
    await user.click(screen.getByRole('button', { name: 'Submit report' }))

    expect(await screen.findByText(/Too many reports have come from this address in the last hour/)).toBeInTheDocument()
    expect(screen.getByLabelText('Your name')).toHaveValue(GOOD.name)
  })

  it('submits a good report as the shared schema reads it, and shows its reference', async () => {
    const sent = answer('post', '/api/reports', submittedReport({ reference: 'QB-26-000413' }), { status: 201 })
    const { user } = await openTheReportPage()
    await fillInAGoodReport(user)
    await user.click(screen.getByRole('button', { name: 'Submit report' }))

    const confirmation = await screen.findByRole('region', { name: 'Report received' })
    expect(within(confirmation).getByText('QB-26-000413')).toBeInTheDocument()
    expect(sent).toHaveLength(1)
    expect(sent[0]!.body).toEqual({
      name: 'Edda Marlow',
      email: 'edda.marlow@example.test',
      service: 'broadcasting',
      frequencyFrom: 98.4,
      frequencyUnit: 'MHz',
      address: '12 Gull Lane, Tarnwick',
      latDeg: 48.1,
      lonDeg: -31.35,
      since: '2026-11-20',
      pattern: 'continuous',
      experience: 'degradation',
      description: 'Crackling over the morning programme since the new mast went up.',
      website: '',
    })
    // what the browser sends is itself a valid report for the server
    expect(reportSchema.safeParse(sent[0]!.body).success).toBe(true)
  })

  it('reads a frequency written with its own unit and sends it in the unit chosen beside it', async () => {
    const sent = answer('post', '/api/reports', submittedReport(), { status: 201 })
    const { user } = await openTheReportPage()
    await fillInAGoodReport(user, { frequency: '433.92 MHz' })
    await user.selectOptions(screen.getByLabelText('Unit'), 'GHz')
    await user.click(screen.getByRole('button', { name: 'Submit report' }))

    await screen.findByRole('region', { name: 'Report received' })
    expect(sent[0]!.body).toMatchObject({ frequencyFrom: 0.43392, frequencyUnit: 'GHz' })
  })

  it('offers to attach files as soon as the report is received, sent through its own tracking link', async () => {
    answer('post', '/api/reports', submittedReport({ reference: 'QB-26-000414' }), { status: 201 })
    const uploads: { kind: string | null; size: number }[] = []
    const token = new URL(submittedReport().trackingUrl).pathname.split('/').pop()!
    server.use(
      http.post(`/api/track/${token}/evidence`, async ({ request }) => {
        const form = await request.formData()
        uploads.push({ kind: form.get('kind') as string | null, size: (form.get('file') as File).size })
        return HttpResponse.json({ error: { code: 'case_closed', message: 'This report is closed, so no more files can be added to it.', requestId: 'r1' } }, { status: 409 })
      }),
    )
    const { user } = await openTheReportPage()
    await fillInAGoodReport(user)
    await user.click(screen.getByRole('button', { name: 'Submit report' }))

    const files = await screen.findByRole('region', { name: 'Add photos, recordings or screenshots' })
    await user.upload(within(files).getByLabelText('Choose files to send'), new File([new Uint8Array(321)], 'noise.jpg', { type: 'image/jpeg' }))

    // the file went to this report's tracking link, as a photo; the server's answer is shown beside it
    await waitFor(() => expect(uploads).toEqual([{ kind: 'photo', size: 321 }]))
    expect(await within(files).findByText(/no more files can be added/)).toBeInTheDocument()
  })
})

/** Waits until the control is marked invalid (validation runs asynchronously). */
async function untilInvalid(control: HTMLElement) {
  await waitFor(() => expect(control).toBeInvalid())
}

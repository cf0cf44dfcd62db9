import { screen, waitFor } from '@testing-library/react'
import { describe, expect, it } from 'vitest'
import { bandLimitViewSchema, type BandLimitView } from '../../shared/schemas/views'
import { BandLimitForm } from '@/features/band-limits/components/band-limit-form'
import { answer } from '../support/msw-server'
import { renderPage } from '../support/web-render'

/** An invented entry: conducted 30 dBm, reduced 1 dB per dB of gain above 6 dBi, one range. */
const ENTRY: BandLimitView = bandLimitViewSchema.parse({
  id: '0b4e2a9c-57d8-4a3e-9a51-2f1f6b8f3c11',
  key: 'test-conducted-gain-rule',
  title: 'Test band with a gain rule',
  bandsHz: [{ lowHz: 2_400_000_000, highHz: 2_483_500_000 }],
  spec: { kind: 'conducted', conductedPowerDbm: 30, gainRule: { kind: 'reduce-conducted-above', thresholdGainDbi: 6, reductionDbPerDb: 1 } },
  citation: 'Invented for this test',
  verified: true,
  statusNote: 'Invented',
  conditions: null,
  version: 3,
  updatedAt: '2026-12-01T10:00:00.000Z',
  updatedBy: null,
})

function renderForm() {
  return renderPage({ url: '/', routes: [{ path: '/', Component: () => <BandLimitForm bandLimit={ENTRY} onDone={() => {}} /> }] })
}

describe('the band-limit form', () => {
  it('edits the antenna-gain rule’s figures with their units', async () => {
    const sent = answer('patch', '/api/band-limits/:id', { bandLimit: ENTRY })
    const { user } = renderForm()
    const threshold = screen.getByLabelText('Antenna gain above which the limit is reduced (dBi)')
    expect(threshold).toHaveValue('6 dBi')
    await user.clear(threshold)
    await user.type(threshold, '9 dBi')
    await user.clear(screen.getByLabelText('Reduction per dB of gain (dB/dB)'))
    await user.type(screen.getByLabelText('Reduction per dB of gain (dB/dB)'), '0.5')
    await user.type(screen.getByLabelText('Reason for the change'), 'Corrected to the regulation as amended')
    await user.click(screen.getByRole('button', { name: 'Save change' }))
    await waitFor(() => expect(sent).toHaveLength(1))
    const body = sent[0]!.body as { changes: { spec: { gainRule: unknown } }; version: number }
    expect(body.version).toBe(3)
    expect(body.changes.spec.gainRule).toEqual({ kind: 'reduce-conducted-above', thresholdGainDbi: 9, reductionDbPerDb: 0.5 })
  })

  it('adds a second frequency range and removes it again', async () => {
    const sent = answer('patch', '/api/band-limits/:id', { bandLimit: ENTRY })
    const { user } = renderForm()
    await user.click(screen.getByRole('button', { name: 'Add a frequency range' }))
    await user.type(screen.getByLabelText('Range 2: lower edge'), '5725 MHz')
    await user.type(screen.getByLabelText('Range 2: upper edge'), '5875 MHz')
    await user.type(screen.getByLabelText('Reason for the change'), 'Second band added')
    await user.click(screen.getByRole('button', { name: 'Save change' }))
    await waitFor(() => expect(sent).toHaveLength(1))
    expect((sent[0]!.body as { changes: { bandsHz: unknown } }).changes.bandsHz).toEqual([
      { lowHz: 2_400_000_000, highHz: 2_483_500_000 },
      { lowHz: 5_725_000_000, highHz: 5_875_000_000 },
    ])
    await user.click(screen.getByRole('button', { name: 'Remove range 2' }))
    expect(screen.queryByLabelText('Range 2: lower edge')).toBeNull()
  })

  it('puts a range’s error beside that range after another was removed', async () => {
    const { user } = renderForm()
    await user.click(screen.getByRole('button', { name: 'Add a frequency range' }))
    await user.click(screen.getByRole('button', { name: 'Add a frequency range' }))
    await user.click(screen.getByRole('button', { name: 'Remove range 2' }))
    // the range now shown second is the third one added: its edges are reversed
    await user.type(screen.getByLabelText('Range 2: lower edge'), '900 MHz')
    await user.type(screen.getByLabelText('Range 2: upper edge'), '800 MHz')
    await user.type(screen.getByLabelText('Reason for the change'), 'Typo check')
    await user.click(screen.getByRole('button', { name: 'Save change' }))
    expect(await screen.findByText('The upper edge must be above the lower edge.')).toBeInTheDocument()
    expect(screen.getByLabelText('Range 2: upper edge')).toHaveAttribute('aria-invalid', 'true')
  })
})

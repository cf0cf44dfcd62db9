/**
 * The equipment register page: a supervisor sees the office's items with an expired calibration
 * said in words, edits an item with every number as a quantity with its unit, and finds the
 * server's messages beside the fields they name (table rows included).
 */
import { screen, waitFor, within } from '@testing-library/react'
import { describe, expect, it } from 'vitest'
import { meResponseSchema, NO_ACCOUNT_ABILITIES } from '../../shared/schemas/auth'
import { equipmentListResponseSchema } from '../../shared/schemas/measurements'
import { Component as EquipmentPage } from '@/app/routes/equipment'
import { paths } from '@/lib/paths'
import { answer, apiError } from '../support/msw-server'
import { renderPage } from '../support/web-render'

const OFFICE_ID = '00000000-0000-4000-8000-000000000001'
const ITEM = {
  id: '00000000-0000-4000-8000-0000000000e1',
  officeId: OFFICE_ID,
  name: 'Biconical antenna BC-1',
  type: 'antenna',
  manufacturer: null,
  model: null,
  serial: 'HM-BC-01',
  antennaGainDbi: null,
  antennaFactorTable: [
    { freqHz: 30e6, antennaFactorDbPerM: 13.4 },
    { freqHz: 300e6, antennaFactorDbPerM: 18.1 },
  ],
  defaultCableLossDb: 1.2,
  defaultPreampGainDb: null,
  minFreqHz: 30e6,
  maxFreqHz: 300e6,
  maxInputDbm: null,
  calibrationDueOn: '2026-09-30',
  calibrationState: 'expired',
  notes: null,
  version: 3,
  updatedAt: '2026-11-01T09:00:00.000Z',
  updatedBy: 'Sade Okafor',
}

describe('the equipment register page', () => {
  it('shows an expired calibration in words, and puts the server’s messages beside the fields of an edit', async () => {
    answer(
      'get',
      '/api/me',
      meResponseSchema.parse({
        user: { id: '00000000-0000-4000-8000-0000000000aa', email: 's@quietband.test', name: 'Sade Okafor', role: 'supervisor', officeId: OFFICE_ID, officeName: 'Harrowmere' },
        abilities: { ...NO_ACCOUNT_ABILITIES, readEquipment: true, manageEquipment: true },
      }),
    )
    answer('get', `/api/offices/${OFFICE_ID}/equipment`, equipmentListResponseSchema.parse({ items: [ITEM], abilities: { manage: true } }))
    const sent = answer('patch', `/api/equipment/${ITEM.id}`, () =>
      apiError(400, {
        code: 'validation_failed',
        message: 'Some fields need attention.',
        details: [{ path: 'item.antennaFactorTable.1.freqHz', message: 'List the frequencies from lowest to highest, each once.' }],
      }),
    )
    const { user } = renderPage({ url: paths.equipment.href(), routes: [{ path: paths.equipment.path, Component: EquipmentPage }] })
    const card = await screen.findByRole('article', { name: 'Biconical antenna BC-1' })
    expect(within(card).getByText('⚠ Calibration ran out on 2026-09-30')).toBeTruthy()
    expect(within(card).getByText('Antenna-factor table: 2 points, 30–300 MHz (13.4–18.1 dB/m)')).toBeTruthy()

    await user.click(within(card).getByRole('button', { name: 'Edit' }))
    const form = within(card).getByRole('form', { name: 'Edit Biconical antenna BC-1' })
    const row2 = within(form).getByLabelText('Row 2: frequency')
    expect((row2 as HTMLInputElement).value).toBe('300')
    await user.clear(row2)
    await user.type(row2, '20')
    await user.click(within(form).getByRole('button', { name: 'Save the changes' }))
    await waitFor(() => expect(sent).toHaveLength(1))
    expect(sent[0]!.body).toMatchObject({
      version: 3,
      item: { name: 'Biconical antenna BC-1', type: 'antenna', antennaFactorTable: [{ freqHz: '30 MHz', antennaFactorDbPerM: '13.4 dB/m' }, { freqHz: '20 MHz', antennaFactorDbPerM: '18.1 dB/m' }], defaultCableLossDb: '1.2 dB' },
    })
    await waitFor(() => expect(row2.getAttribute('aria-invalid')).toBe('true'))
    expect(within(form).getByText('List the frequencies from lowest to highest, each once.')).toBeTruthy()
  })
})

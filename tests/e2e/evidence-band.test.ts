/**
 * In Chromium: the demo investigator puts an analyser trace in dBm that states the noise
 * bandwidth its points were read in on a case being worked, sees the upload's progress bar,
 * waits for the processing job, opens the spectrum, types a band's edges, reads the channel
 * power the server computed, saves it as a measurement with the time and place, and finds it
 * in the case's measurements naming the evidence file. The level shown and the level stored are
 * checked against the in-band points summed by hand here. Screenshots at 1440 and 390 px go to
 * test-results/screenshots.
 *
 * The trace is JSON ({ freqHz, levelDbm, enbwHz }): the CSV trace format has no field for the
 * resolution bandwidth, so a CSV trace's channel power is not computed (see evidence-band.test.ts).
 */
import path from 'node:path'
import { afterAll, describe, expect, inject, it } from 'vitest'
import { createPool } from '../../server/db/client'
import { DEMO } from '../support/harness'
import { newPage, SCREENSHOTS } from '../support/browser'
import { landedOnWork, runningApp, submitSignIn, workedCaseOfDemoInvestigator } from '../support/e2e'

const app = runningApp()
const pool = createPool(inject('databaseUrl'), 1)
afterAll(async () => {
  await pool.end()
})

/**
 * 160 points from 156.700 MHz, 1.25 kHz apart, each read in a 1.25 kHz noise bandwidth (each
 * cell exactly one noise bandwidth wide): a carrier around 156.8 MHz over a −97 dBm floor.
 */
const FREQ_HZ = Array.from({ length: 160 }, (_, i) => 156_700_000 + i * 1250)
const LEVEL_DBM = FREQ_HZ.map((_, i) => Math.round((-97 + 40 * Math.exp(-(((i - 80) / 4) ** 2)) + 2 * Math.cos(i)) * 100) / 100)
const TRACE = Buffer.from(JSON.stringify({ freqHz: FREQ_HZ, levelDbm: LEVEL_DBM, enbwHz: 1250 }))
const NAME = 'channel-16-carrier.json'
/** Edges on cell boundaries (midpoints): points 73 to 88 (156.79125 … 156.81000 MHz) lie wholly inside. */
const LOW_MHZ = '156.790625'
const HIGH_MHZ = '156.810625'

/** The channel power by hand: the in-band points' powers summed in mW (summing powers of noise-like cells: common practice, no source). */
function channelPowerByHandDbm(): number {
  let mw = 0
  for (let i = 73; i <= 88; i++) mw += Math.pow(10, LEVEL_DBM[i]! / 10)
  return 10 * Math.log10(mw)
}

describe('a band of a spectrum trace saved as a measurement', () => {
  it('the investigator uploads a trace, measures a band on its spectrum and keeps it as a measurement naming the file, at 1440 and 390 px', async () => {
    const expected = channelPowerByHandDbm()
    // the sum covers 16 whole cells of the band and none outside it
    expect(FREQ_HZ[73]! - 625).toBeCloseTo(Number(LOW_MHZ) * 1e6, 3)
    expect(FREQ_HZ[88]! + 625).toBeCloseTo(Number(HIGH_MHZ) * 1e6, 3)

    const caseId = await workedCaseOfDemoInvestigator(pool)
    const { page, errors } = await newPage(app.browser)
    await page.setViewportSize({ width: 1440, height: 900 })
    await submitSignIn(page, app.web.baseUrl, DEMO.investigator)
    await landedOnWork(page)
    await page.goto(`${app.web.baseUrl}/cases/${caseId}`)
    const section = page.getByRole('region', { name: 'Evidence files' })
    await section.waitFor({ timeout: 20_000 })

    // upload, with its progress bar
    await section.getByLabel('Kind of file').selectOption('spectrum_capture')
    await section.getByLabel('Add files').setInputFiles({ name: NAME, mimeType: 'application/json', buffer: TRACE })
    const upload = section.getByRole('list', { name: 'Uploads' }).getByRole('listitem').first()
    await expect.poll(() => upload.getByRole('progressbar', { name: `Upload of ${NAME}` }).count(), { timeout: 10_000 }).toBe(1)
    await expect.poll(() => upload.textContent(), { timeout: 15_000 }).toMatch(/Uploaded/)

    // the processing job runs; then the spectrum opens
    const card = section.getByRole('list', { name: 'Evidence files' }).getByRole('listitem', { name: NAME }).first()
    await card.waitFor({ timeout: 15_000 })
    const show = card.getByRole('button', { name: 'Show the spectrum' })
    await show.waitFor({ timeout: 30_000 })
    await show.click()
    const spectrum = card.getByRole('region', { name: `Spectrum of ${NAME}` })
    await spectrum.waitFor({ timeout: 15_000 })

    // the band, typed in MHz
    const bandForm = spectrum.getByRole('form', { name: 'Measure a band' })
    await bandForm.getByLabel('Unit of low edge').selectOption('MHz')
    await bandForm.getByLabel('Unit of high edge').selectOption('MHz')
    await bandForm.getByLabel('Low edge', { exact: true }).fill(LOW_MHZ)
    await bandForm.getByLabel('High edge', { exact: true }).fill(HIGH_MHZ)
    await bandForm.getByRole('button', { name: 'Measure the band' }).click()
    const shownPower = spectrum.getByText(`${expected.toFixed(2)} dBm`, { exact: true })
    await shownPower.waitFor({ timeout: 15_000 })

    // saved with when and where; the page sends no level, the server computes it again
    const save = spectrum.getByRole('form', { name: 'Save as a measurement' })
    await save.getByLabel('Recorded at').fill('2026-11-20T09:30')
    await save.getByLabel('Latitude', { exact: true }).fill('48.1021')
    await save.getByLabel('Longitude', { exact: true }).fill('-31.3504')
    const posted = page.waitForRequest((r) => r.method() === 'POST' && r.url().endsWith('/band-measurement'))
    await save.getByRole('button', { name: 'Save as a measurement' }).click()
    const body = (await posted).postDataJSON() as Record<string, unknown>
    expect(Object.keys(body).sort()).toEqual(['highFreqHz', 'latDeg', 'lonDeg', 'lowFreqHz', 'takenAt'])
    await spectrum.getByText('Saved as a measurement of the case.').waitFor({ timeout: 15_000 })
    await spectrum.screenshot({ path: path.join(SCREENSHOTS, 'evidence-band-spectrum-1440.png') })

    // the case's measurements list it, naming the file; the stored level is the hand sum
    const measurements = page.getByRole('region', { name: 'Measurements' })
    const article = measurements.getByRole('article').filter({ hasText: NAME }).last()
    await article.waitFor({ timeout: 15_000 })
    expect(await article.textContent()).toContain(`${expected.toFixed(1).replace('-', '\u2212')} dBm`)
    const { rows } = await pool.query<{ reading_value: number; reading_unit: string; evidence_file_id: string; library_version: string; methods: { reading?: { id: string } } }>(
      `SELECT m.reading_value, m.reading_unit, m.evidence_file_id, m.library_version, m.methods FROM measurements m JOIN evidence_files e ON e.id = m.evidence_file_id
        WHERE m.case_id = $1 AND e.display_name = $2 ORDER BY m.created_at DESC LIMIT 1`,
      [caseId, NAME],
    )
    expect(rows[0]?.reading_unit).toBe('dBm')
    expect(rows[0]!.reading_value).toBeCloseTo(expected, 6)
    expect(rows[0]!.methods.reading?.id).toBe('channel-power-enbw')
    await article.scrollIntoViewIfNeeded()
    await article.screenshot({ path: path.join(SCREENSHOTS, 'evidence-band-measurement-1440.png') })

    // the same at a phone's width: nothing wider than the screen
    await page.setViewportSize({ width: 390, height: 844 })
    await spectrum.scrollIntoViewIfNeeded()
    const widths = await page.evaluate(() => ({ doc: document.documentElement.scrollWidth, view: window.innerWidth }))
    expect(widths.doc).toBeLessThanOrEqual(widths.view)
    await spectrum.screenshot({ path: path.join(SCREENSHOTS, 'evidence-band-spectrum-390.png') })
    await article.scrollIntoViewIfNeeded()
    await article.screenshot({ path: path.join(SCREENSHOTS, 'evidence-band-measurement-390.png') })
    expect(errors).toEqual([])
    await page.close()
  })
})

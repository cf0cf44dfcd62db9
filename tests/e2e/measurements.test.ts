/**
 * In Chromium: the assigned investigator records a measurement on a case being worked, with the
 * levels shown live as they type, a reading the analyser cannot take refused beside its field,
 * and the stored measurement listed with its derived levels; the section reads at desktop and at
 * phone width (nothing wider than the screen). Screenshots go to test-results/screenshots.
 */
import path from 'node:path'
import { afterAll, describe, expect, inject, it } from 'vitest'
import { createPool } from '../../server/db/client'
import { DEMO } from '../support/harness'
import { newPage, screenshot, SCREENSHOTS } from '../support/browser'
import { landedOnWork, runningApp, submitSignIn, workedCaseOfDemoInvestigator } from '../support/e2e'

const app = runningApp()
const pool = createPool(inject('databaseUrl'), 1)
afterAll(async () => {
  await pool.end()
})


describe('measurements on a case', () => {
  it('the investigator records one with the levels shown live, and it reads at 1440 and 390 px', async () => {
    const caseId = await workedCaseOfDemoInvestigator(pool)
    const { page, errors } = await newPage(app.browser)
    await page.setViewportSize({ width: 1440, height: 900 })
    await submitSignIn(page, app.web.baseUrl, DEMO.investigator)
    await landedOnWork(page)
    await page.goto(`${app.web.baseUrl}/cases/${caseId}`)
    const section = page.getByRole('region', { name: 'Measurements' })
    await section.waitFor({ timeout: 20_000 })
    await section.getByRole('button', { name: 'Record a measurement' }).click()
    const form = section.getByRole('form', { name: 'Record a measurement' })
    await form.waitFor()

    // the map opens for picking the position (or says why it cannot), beside the typed fields
    await form.getByRole('button', { name: 'Pick on the map' }).click()
    await expect.poll(async () => (await form.getByLabel('Map to pick the measurement position').count()) + (await form.getByText(/Type the latitude and longitude instead/).count()), { timeout: 15_000 }).toBeGreaterThan(0)
    await form.screenshot({ path: path.join(SCREENSHOTS, 'measurements-map-1440.png') })
    await form.getByRole('button', { name: 'Close the map' }).click()
    await form.getByRole('textbox', { name: 'Latitude' }).fill('48.1172')
    await form.getByRole('textbox', { name: 'Longitude' }).fill('-31.3921')
    await form.getByRole('textbox', { name: 'Antenna height above ground' }).fill('1.5')
    await form.getByRole('textbox', { name: 'Centre frequency' }).fill('433.92')
    await form.getByLabel('What the instrument shows').selectOption('dBm')
    await form.getByRole('textbox', { name: 'Reading', exact: true }).fill('25')
    await form.getByLabel('Antenna', { exact: true }).selectOption({ label: 'Log-periodic antenna LP-1 (HM-LP-01)' })
    await form.getByLabel('Instrument', { exact: true }).selectOption({ label: 'Handheld analyser HA-1 (HM-HA-01)' })
    await form.getByRole('textbox', { name: 'Resolution bandwidth (RBW)' }).fill('120')
    await form.getByLabel('Detector', { exact: true }).selectOption('rms')
    await form.getByLabel('Polarisation', { exact: true }).selectOption('vertical')
    const live = form.getByRole('region', { name: 'Derived as you type' }).or(form.getByRole('region', { name: 'Derived levels, as you type' }))
    // the analyser takes at most 20 dBm: said live, and refused by the server beside the field
    await expect.poll(() => live.getByText(/above what Handheld analyser HA-1 can take/).count()).toBe(1)
    await form.getByRole('button', { name: 'Save the measurement' }).click()
    await expect.poll(() => form.getByText(/above what Handheld analyser HA-1 can take/).count(), { timeout: 10_000 }).toBeGreaterThan(1)
    await screenshot(page, 'measurements-form-error-1440')

    await form.getByRole('textbox', { name: 'Reading', exact: true }).fill('-58.4')
    await expect.poll(() => live.locator('[data-level="fieldStrengthDbuvPerM"]').textContent()).toMatch(/dBµV\/m$/)
    const liveField = await live.locator('[data-level="fieldStrengthDbuvPerM"]').textContent()
    expect(liveField).not.toBe('—')
    await form.screenshot({ path: path.join(SCREENSHOTS, 'measurements-form-1440.png') })
    await form.getByRole('button', { name: 'Save the measurement' }).click()
    // this file's measurement (other browser tests may have recorded some on the same demo case)
    const card = section.getByRole('article').filter({ hasText: /433\.92/ }).first()
    await card.waitFor({ timeout: 10_000 })
    // the server's stored value is the one shown live (both derive with the same code)
    expect(await card.textContent()).toContain(liveField!)
    await section.screenshot({ path: path.join(SCREENSHOTS, 'measurements-section-1440.png') })

    await page.setViewportSize({ width: 390, height: 844 })
    await section.scrollIntoViewIfNeeded()
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390)
    await section.screenshot({ path: path.join(SCREENSHOTS, 'measurements-section-390.png') })
    await section.getByRole('button', { name: /^(Edit|Correct) M/ }).first().click()
    const edit = section.getByRole('form').first()
    await edit.waitFor()
    const wide = await page.evaluate(() =>
      [...document.querySelectorAll('form *')].filter((e) => e.getBoundingClientRect().right > 392).slice(0, 5).map((e) => `${e.tagName}.${e.getAttribute('name') ?? ''} ${Math.round(e.getBoundingClientRect().right)}`),
    )
    expect(wide).toEqual([])
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390)
    await page.screenshot({ path: path.join(SCREENSHOTS, 'measurements-form-390.png') })
    await edit.screenshot({ path: path.join(SCREENSHOTS, 'measurements-form-390-full.png') })
    expect(errors).toEqual([])
  }, 120_000)

  it('the equipment register reads at 1440 and 390 px, with the expired calibration said in words', async () => {
    const { page, errors } = await newPage(app.browser)
    await page.setViewportSize({ width: 1440, height: 900 })
    await submitSignIn(page, app.web.baseUrl, DEMO.supervisor)
    await page.getByRole('link', { name: 'Equipment' }).click()
    await page.getByRole('heading', { name: 'Antennas and instruments', level: 1 }).waitFor({ timeout: 20_000 })
    const biconical = page.getByRole('article', { name: 'Biconical antenna BC-1' })
    await biconical.waitFor({ timeout: 20_000 })
    expect(await biconical.getByText(/Calibration ran out on 2026-09-30/).count()).toBe(1)
    await screenshot(page, 'equipment-1440')
    await page.getByRole('article', { name: 'Log-periodic antenna LP-1' }).getByRole('button', { name: 'Edit' }).click()
    await page.setViewportSize({ width: 390, height: 844 })
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390)
    await page.getByRole('form', { name: 'Edit Log-periodic antenna LP-1' }).screenshot({ path: path.join(SCREENSHOTS, 'equipment-form-390.png') })
    await page.getByRole('article', { name: 'Biconical antenna BC-1' }).screenshot({ path: path.join(SCREENSHOTS, 'equipment-item-390.png') })
    expect(errors).toEqual([])
  }, 90_000)
})

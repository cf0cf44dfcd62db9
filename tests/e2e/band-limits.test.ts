/**
 * In Chromium: the band-limit list shows unverified values as such; a supervisor edits a limit
 * with a reason (a bad number is refused beside its field) and finds the change in its history;
 * the page reads at desktop and at phone width.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { inject } from 'vitest'
import { createDb, createPool } from '../../server/db/client'
import { seedBandLimits } from '../../server/modules/band-limits/band-limits.seed'
import { DEMO } from '../support/harness'
import path from 'node:path'
import { newPage, screenshot, SCREENSHOTS } from '../support/browser'
import { runningApp, submitSignIn } from '../support/e2e'

const app = runningApp()
const title = `Browser test limit ${process.pid}-${Date.now()}`
const pool = createPool(inject('databaseUrl'), 1)

beforeAll(async () => {
  // an entry of this file's own, so no other test's entry changes
  await seedBandLimits(createDb(pool), [
    { id: `browser-test-${process.pid}-${Date.now()}`, title, bandsHz: [{ lowHz: 433.05e6, highHz: 434.79e6 }], spec: { kind: 'erp', erpDbm: 10 }, citation: 'Test table, row 1', status: '[M]', statusNote: 'Made by a browser test.' },
  ])
})
afterAll(async () => {
  await pool.end()
})

describe('band limits', () => {
  it('a supervisor edits a limit with a reason and finds the change in its history', async () => {
    const { page, errors } = await newPage(app.browser)
    await page.setViewportSize({ width: 1440, height: 900 })
    await submitSignIn(page, app.web.baseUrl, DEMO.otherSupervisor)
    await page.getByRole('link', { name: 'Band limits' }).click()
    await page.getByRole('heading', { name: 'Band limits', level: 1 }).waitFor({ timeout: 20_000 })
    const card = page.getByRole('article', { name: title })
    await card.waitFor({ timeout: 20_000 })
    expect(await card.getByText(/Unverified/).count()).toBe(1)
    expect(await page.getByText(/Unverified/).count()).toBeGreaterThan(5)
    await screenshot(page, 'band-limits-1440')
    await page.screenshot({ path: path.join(SCREENSHOTS, 'band-limits-1440-top.png') })

    await card.getByRole('button', { name: 'Edit' }).click()
    const form = card.getByRole('form')
    await form.getByLabel('ERP (dBm)').fill('14 W')
    await form.getByRole('button', { name: 'Save change' }).click()
    await expect.poll(() => form.getByText(/Use one of these units/).count()).toBe(1)
    await expect.poll(() => form.getByText('Enter why the limit changes.').count()).toBe(1)

    await form.getByLabel('ERP (dBm)').fill('14 dBm')
    await form.getByLabel('Verified against the regulation’s text').check()
    await form.getByLabel(/^Reason for the change/).fill('Checked against the published table')
    await form.getByRole('button', { name: 'Save change' }).click()
    await expect.poll(() => card.getByText(/^ERP 14 dBm/).count(), { timeout: 10_000 }).toBe(1)
    expect(await card.getByText('Verified', { exact: true }).count()).toBe(1)

    await card.getByRole('button', { name: 'History' }).click()
    const history = card.getByRole('list', { name: 'Changes, newest first' })
    await history.waitFor({ timeout: 10_000 })
    expect(await history.textContent()).toContain('Checked against the published table')
    expect(await history.textContent()).toMatch(/ERP 10 dBm.*→.*ERP 14 dBm/)

    await page.setViewportSize({ width: 390, height: 844 })
    await card.scrollIntoViewIfNeeded()
    // nothing wider than the phone's screen
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390)
    await screenshot(page, 'band-limits-390')
    await card.screenshot({ path: path.join(SCREENSHOTS, 'band-limits-390-entry.png') })
    expect(errors).toEqual([])
  }, 90_000)
})

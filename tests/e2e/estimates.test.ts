/**
 * In Chromium: the quick calculator (a result computed in the browser, its inputs in the
 * address) and a case's estimates workbench (a run stored on the case, listed with its
 * summary), each at desktop (1440 px) and phone (390 px) width, with screenshots to read.
 */
import { afterAll, describe, expect, inject, it } from 'vitest'
import type { Page } from 'playwright-core'
import { createPool } from '../../server/db/client'
import { DEMO } from '../support/harness'
import path from 'node:path'
import { newPage, screenshot, SCREENSHOTS } from '../support/browser'
import { runningApp, submitSignIn } from '../support/e2e'

const app = runningApp()
const T = { timeout: 20_000 }
const pool = createPool(inject('databaseUrl'), 1)
afterAll(async () => {
  await pool.end()
})

async function signIn(page: Page, email: string) {
  await submitSignIn(page, app.web.baseUrl, email)
  await page.getByRole('region', { name: 'Account' }).waitFor(T)
}

/** Nothing on the page is wider than the window (no sideways scroll). */
async function noSidewaysScroll(page: Page) {
  const wide = await page.evaluate(() => {
    const limit = document.documentElement.clientWidth
    // the widest elements that stick out, named so a failure says where to look
    return [...document.querySelectorAll('body *')]
      .filter((el) => el.getBoundingClientRect().right > limit + 1 && !el.closest('[class*="overflow-x-auto"]'))
      .slice(0, 5)
      .map((el) => `${el.tagName.toLowerCase()}.${String(el.className).slice(0, 60)} "${(el.textContent ?? '').slice(0, 40)}" right=${Math.round(el.getBoundingClientRect().right)}`)
  })
  expect(wide).toEqual([])
}

describe('estimates', () => {
  it('the quick calculator computes in the browser and a link reopens the result', async () => {
    const { page, errors } = await newPage(app.browser)
    await page.setViewportSize({ width: 1440, height: 900 })
    await signIn(page, DEMO.investigator)
    await page.getByRole('link', { name: 'Calculator' }).first().click()
    await page.getByRole('heading', { level: 1, name: 'Quick calculator' }).waitFor(T)
    await page.getByLabel('Field strength', { exact: true }).fill('74.77')
    await page.getByLabel('Measured frequency', { exact: true }).fill('433.92')
    await page.getByLabel('Distance from the source to the measuring point', { exact: true }).fill('1')
    await page.getByLabel('Unit of distance from the source to the measuring point').selectOption('km')
    await page.getByLabel('Frequency', { exact: true }).fill('433.92')
    await page.getByRole('button', { name: 'Add an uncertainty contribution' }).click()
    await page.getByLabel('Contribution 1: name').fill('Receiver and antenna calibration')
    await page.getByLabel('Expanded uncertainty U', { exact: true }).fill('2')
    await page.getByLabel('Coverage factor k', { exact: true }).fill('2')
    await page.getByRole('button', { name: 'Calculate' }).click()
    const result = page.getByRole('region', { name: 'Result' })
    await result.waitFor(T)
    // 74.77 dBµV/m at 1 km is 0 dBW = 30 dBm EIRP in free space (ITU-R P.525-4 §2.1; CHECK-VALUES 1-5)
    expect(await result.innerText()).toContain('EIRP 30.00 dBm')
    await screenshot(page, 'estimates-calculator-1440')

    const link = page.url()
    expect(new URL(link).searchParams.get('run')).toBe('1')
    await page.setViewportSize({ width: 390, height: 844 })
    await page.goto(link)
    await page.getByRole('region', { name: 'Result' }).waitFor(T)
    expect(await page.getByLabel('Field strength', { exact: true }).inputValue()).toBe('74.77')
    await noSidewaysScroll(page)
    await screenshot(page, 'estimates-calculator-390')

    // a verdict with an unverified limit shows its warnings and cautions
    await page.getByLabel('Estimate', { exact: true }).selectOption('compliance_verdict')
    await page.getByLabel('Estimated EIRP', { exact: true }).fill('45')
    await page.getByLabel('Band-limit entry').selectOption('cfr47-15-255-average')
    await page.getByRole('button', { name: 'Calculate' }).click()
    await page.getByRole('list', { name: 'Warnings' }).waitFor(T)
    await noSidewaysScroll(page)
    await screenshot(page, 'estimates-verdict-390')

    // a fit of three readings draws its curve and residuals
    await page.setViewportSize({ width: 1440, height: 900 })
    await page.getByLabel('Estimate', { exact: true }).selectOption('eirp_fit')
    for (const [i, [d, p]] of [['50', '-40.1'], ['120', '-49.0'], ['400', '-57.9']].entries()) {
      await page.getByRole('button', { name: 'Add a reading' }).click()
      await page.getByLabel('Distance from the source', { exact: true }).nth(i).fill(d!)
      await page.getByLabel('Isotropic received power', { exact: true }).nth(i).fill(p!)
    }
    await page.getByLabel('Frequency (optional)', { exact: true }).fill('433.92')
    await page.getByRole('button', { name: 'Calculate' }).click()
    await page.getByRole('region', { name: 'Result' }).getByText('R² of the fit').waitFor(T)
    await page.waitForTimeout(500)
    await screenshot(page, 'estimates-fit-1440')
    expect(errors).toEqual([])
  })

  it('the workbench stores a run on the case and lists it', async () => {
    const { rows } = await pool.query<{ id: string; reference: string }>(
      `SELECT c.id, c.reference FROM cases c JOIN users u ON u.id = c.investigator_id
        WHERE u.email = $1 AND c.status IN ('assigned', 'field_work', 'returned') ORDER BY c.received_at LIMIT 1`,
      [DEMO.investigator],
    )
    expect(rows.length).toBe(1)
    const { page, errors } = await newPage(app.browser)
    await page.setViewportSize({ width: 1440, height: 900 })
    await signIn(page, DEMO.investigator)
    await page.goto(`${app.web.baseUrl}/cases/${rows[0]!.id}`)
    const bench = page.getByRole('region', { name: 'Estimates workbench' })
    await bench.waitFor(T)
    await bench.getByText('Estimates workbench', { exact: true }).click()
    await bench.getByLabel('Field strength', { exact: true }).fill('68.2')
    await bench.getByLabel('Measured frequency', { exact: true }).fill('156.8')
    await bench.getByLabel('Distance from the source to the measuring point', { exact: true }).fill('240')
    await bench.getByLabel('Frequency', { exact: true }).fill('156.8')
    await bench.getByRole('button', { name: 'Run and store on the case' }).click()
    const stored = bench.getByRole('list', { name: 'Stored calculations, newest first' })
    await stored.waitFor(T)
    expect(await stored.innerText()).toMatch(/EIRP .* dBm/)
    await bench.getByRole('region', { name: /Result/ }).first().waitFor(T)
    await screenshot(page, 'estimates-workbench-1440')

    await page.setViewportSize({ width: 390, height: 844 })
    await noSidewaysScroll(page)
    await stored.locator('summary').first().click()
    await bench.getByRole('button', { name: 'Recompute with the current library' }).first().click()
    await bench.getByText('The current library gives the same result').waitFor(T)
    await noSidewaysScroll(page)
    await screenshot(page, 'estimates-workbench-390')
    // the recompute at phone width, as seen on the screen (the full page is very long)
    await bench.getByText('The current library gives the same result').scrollIntoViewIfNeeded()
    await page.screenshot({ path: path.join(SCREENSHOTS, 'estimates-workbench-390-recompute.png') })
    expect(errors).toEqual([])
  })
})

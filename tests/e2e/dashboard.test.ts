/**
 * In Chromium: a supervisor opens the dashboard from the main navigation, follows a figure to
 * the filtered case list (which shows the same count), opens a case and downloads its case file
 * from the case page (the PDF's text, read with pdf-parse, holds the case's reference); the
 * page fits 1440 px and 390 px; an administrator narrows the dashboard to one office.
 */
import fs from 'node:fs'
import { PDFParse } from 'pdf-parse'
import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { DEMO } from '../support/harness'
import { newPage, screenshot } from '../support/browser'
import { landedOnWork, runningApp, submitSignIn } from '../support/e2e'

const app = runningApp()

/** How far the page is wider than its viewport (0: no horizontal scroll). */
const overflowPx = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)

describe('the dashboard', () => {
  it('a supervisor follows a figure to the filtered list and opens a case; the page fits 1440 px and 390 px', async () => {
    const { page, errors } = await newPage(app.browser)
    await page.setViewportSize({ width: 1440, height: 900 })
    await submitSignIn(page, app.web.baseUrl, DEMO.supervisor)
    await landedOnWork(page)
    const nav = page.getByRole('navigation', { name: /main/i })
    await nav.getByRole('link', { name: 'Dashboard' }).click()
    await page.getByRole('heading', { level: 1, name: 'Dashboard' }).waitFor({ timeout: 20_000 })
    const openTable = page.getByRole('table', { name: 'Open cases by state and harm class' })
    await openTable.waitFor({ timeout: 20_000 })
    await page.getByRole('figure', { name: /Time to first response, last 30 days/ }).locator('canvas').first().waitFor({ timeout: 20_000 })
    await page.locator('.leaflet-container').first().waitFor({ timeout: 20_000 })
    expect(await overflowPx(page)).toBeLessThanOrEqual(0)
    await screenshot(page, 'dashboard-1440')

    // the "All open" figure, followed to the list: the list counts the same cases
    const allOpen = openTable.getByRole('link', { name: /^\d+ open cases$/ })
    const figure = Number((await allOpen.textContent())!.replace(/\D/g, ''))
    expect(figure).toBeGreaterThan(0)
    await allOpen.click()
    await page.waitForURL((url) => url.pathname === '/cases' && url.searchParams.get('open') === 'true', { timeout: 20_000 })
    await expect.poll(() => page.getByText(/cases? match(es)? these filters/).textContent(), { timeout: 20_000 }).toMatch(new RegExp(`^${figure} (case matches|cases match) these filters`))

    // and a case of it opens
    const firstCase = page.getByRole('table', { name: 'Cases' }).getByRole('link').first()
    const reference = (await firstCase.textContent())!.trim()
    await firstCase.click()
    await page.waitForURL(/\/cases\/[0-9a-f-]{36}$/, { timeout: 20_000 })
    await page.getByRole('heading', { level: 1, name: new RegExp(reference) }).waitFor({ timeout: 20_000 })

    // its case file, downloaded from the case page: the PDF's text (pdf-parse) holds the case's reference
    const [download] = await Promise.all([page.waitForEvent('download', { timeout: 30_000 }), page.getByRole('button', { name: 'Case file (PDF)' }).click()])
    expect(download.suggestedFilename()).toMatch(new RegExp(`^${reference}-CF\\d+\\.pdf$`))
    const parser = new PDFParse({ data: new Uint8Array(fs.readFileSync(await download.path())) })
    try {
      const text = (await parser.getText()).text.replace(/\s+/g, ' ')
      expect(text).toContain(`Case file — ${reference}`)
    } finally {
      await parser.destroy()
    }
    await expect.poll(() => page.getByText(/Saved .*\.pdf · SHA-256/).count(), { timeout: 10_000 }).toBe(1)

    // a dashboard-only filter shows on the list, and can be removed there
    await page.goBack()
    await page.goBack()
    await page.getByRole('link', { name: /Due in the next 24 hours/ }).click()
    await page.waitForURL((url) => url.searchParams.get('dueSoon') === 'true', { timeout: 20_000 })
    await page.getByRole('button', { name: 'Remove filter: Due within 24 hours' }).click()
    await page.waitForURL((url) => url.pathname === '/cases' && !url.searchParams.has('dueSoon'), { timeout: 20_000 })

    // on a phone: no sideways scroll
    await page.setViewportSize({ width: 390, height: 844 })
    await page.goto(`${app.web.baseUrl}/dashboard`)
    // a phone gets the open work as a list, one line per state
    await page.getByRole('list', { name: 'Open cases by state' }).waitFor({ timeout: 20_000 })
    expect(await page.getByRole('table', { name: 'Open cases by state and harm class' }).isVisible()).toBe(false)
    await page.locator('.leaflet-container').first().waitFor({ timeout: 20_000 })
    await page.waitForTimeout(300)
    expect(await overflowPx(page)).toBeLessThanOrEqual(0)
    await screenshot(page, 'dashboard-390')
    expect(errors).toEqual([])
  }, 120_000)

  it('an administrator sees every office and narrows to one', async () => {
    const { page, errors } = await newPage(app.browser)
    await submitSignIn(page, app.web.baseUrl, DEMO.admin)
    await page.waitForURL((url) => url.pathname !== '/sign-in', { timeout: 20_000 })
    await page.goto(`${app.web.baseUrl}/dashboard`)
    await page.getByText('All offices', { exact: true }).first().waitFor({ timeout: 20_000 })
    const select = page.getByLabel('Office')
    const options = await select.locator('option').allTextContents()
    expect(options.length).toBeGreaterThan(2)
    await select.selectOption({ label: options[1]! })
    await page.waitForURL((url) => url.searchParams.has('officeId'), { timeout: 20_000 })
    await expect.poll(() => page.locator('main header p').first().textContent(), { timeout: 20_000 }).toBe(options[1])
    expect(errors).toEqual([])
  }, 90_000)
})

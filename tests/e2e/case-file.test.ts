/**
 * In Chromium: the demo supervisor opens a case of the office and presses "Case file (PDF)";
 * the browser saves a PDF whose SHA-256 (node:crypto over the saved bytes) is the one the page
 * shows and the one on the case's timeline, which now lists the issued file. Printed (print
 * media), the case page leaves off the site's header, navigation, forms and buttons and keeps the
 * case. The button fits at 390 px with nothing wider than the screen. Screenshots go to
 * test-results/screenshots.
 */
import crypto from 'node:crypto'
import fs from 'node:fs'
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

describe('the case file from the case page', () => {
  it('the supervisor downloads the signed PDF, whose SHA-256 is on the timeline; the page prints without its controls', async () => {
    const caseId = await workedCaseOfDemoInvestigator(pool)
    const { page, errors } = await newPage(app.browser)
    await page.setViewportSize({ width: 1440, height: 900 })
    await submitSignIn(page, app.web.baseUrl, DEMO.supervisor)
    await landedOnWork(page)
    await page.goto(`${app.web.baseUrl}/cases/${caseId}`)
    const button = page.getByRole('button', { name: 'Case file (PDF)' })
    await button.waitFor({ timeout: 20_000 })

    const [download] = await Promise.all([page.waitForEvent('download', { timeout: 20_000 }), button.click()])
    const saved = await download.path()
    const bytes = fs.readFileSync(saved)
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-')
    expect(download.suggestedFilename()).toMatch(/^QB-.*-CF\d+\.pdf$/)
    const hash = crypto.createHash('sha256').update(bytes).digest('hex')

    // the page shows the hash, and the timeline's newest entry records it
    await expect.poll(() => page.getByText(/Saved .*\.pdf · SHA-256/).textContent(), { timeout: 10_000 }).toContain(hash)
    const { rows } = await pool.query<{ sha256: string; file: string }>(
      "SELECT data->>'sha256' AS sha256, data->>'fileReference' AS file FROM case_events WHERE case_id = $1 AND kind = 'case_file_issued' ORDER BY id DESC LIMIT 1",
      [caseId],
    )
    expect(rows[0]!.sha256).toBe(hash)
    expect(download.suggestedFilename()).toBe(`${rows[0]!.file}.pdf`)
    const timeline = page.getByRole('region', { name: /Timeline/ }).first()
    await expect.poll(() => timeline.textContent(), { timeout: 10_000 }).toContain(`Case file ${rows[0]!.file} issued`)
    await page.screenshot({ path: path.join(SCREENSHOTS, 'case-file-button-1440.png') })

    // printed: no site header, navigation, forms or buttons; the case's reference and timeline stay
    await page.emulateMedia({ media: 'print' })
    expect(await page.getByRole('navigation', { name: 'Main' }).isVisible()).toBe(false)
    expect(await button.isVisible()).toBe(false)
    expect(await page.locator('main form').evaluateAll((forms) => forms.filter((f) => (f as HTMLElement).offsetParent !== null).length)).toBe(0)
    expect(await page.locator('main h1').first().isVisible()).toBe(true)
    expect(await timeline.isVisible()).toBe(true)
    await page.screenshot({ path: path.join(SCREENSHOTS, 'case-print.png'), fullPage: true })
    await page.emulateMedia({ media: 'screen' })

    await page.setViewportSize({ width: 390, height: 844 })
    await button.scrollIntoViewIfNeeded()
    const widths = await page.evaluate(() => ({
      doc: document.documentElement.scrollWidth,
      view: window.innerWidth,
      // the widest elements, named, when the page is too wide
      wide: [...document.querySelectorAll('main *')]
        .filter((e) => e.getBoundingClientRect().right > window.innerWidth + 1)
        .slice(-3)
        .map((e) => `${e.tagName.toLowerCase()}: ${(e.textContent ?? '').slice(0, 80)}`),
    }))
    expect(widths.doc, widths.wide.join('\n')).toBeLessThanOrEqual(widths.view)
    await page.screenshot({ path: path.join(SCREENSHOTS, 'case-file-button-390.png') })
    expect(errors).toEqual([])
    await page.close()
  })
})

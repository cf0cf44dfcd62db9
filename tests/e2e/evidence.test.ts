/**
 * In Chromium: the demo investigator puts a small spectrum trace (CSV) on a case being worked,
 * sees the file's progress bar, then the file listed with the first 12 hex digits of its
 * SHA-256 (the hash of the bytes sent, computed here with node:crypto), verifies it, reads its
 * custody log and downloads the case's bundle (the manifest names the same hash); the section reads at
 * 1440 and 390 px with nothing wider than the screen. Screenshots go to test-results/screenshots.
 */
import crypto from 'node:crypto'
import path from 'node:path'
import { afterAll, describe, expect, inject, it } from 'vitest'
import { createPool } from '../../server/db/client'
import { DEMO } from '../support/harness'
import { newPage, SCREENSHOTS } from '../support/browser'
import { landedOnWork, runningApp, submitSignIn, workedCaseOfDemoInvestigator } from '../support/e2e'
import { readZip } from '../support/zip-reader'
import { bundleManifestSchema } from '../../shared/schemas/evidence-bundle'

const app = runningApp()
const pool = createPool(inject('databaseUrl'), 1)
afterAll(async () => {
  await pool.end()
})


// a short trace with a unique line, so its hash is this run's own
const TRACE = Buffer.from(['freqHz,levelDbm', ...Array.from({ length: 200 }, (_, i) => `${156_800_000 + i * 1250},${(-98 + (i % 9)).toFixed(1)}`), `# run ${crypto.randomUUID()}`].join('\n') + '\n')

describe('evidence on a case', () => {
  it('the investigator uploads a CSV trace with its progress shown, and sees it listed with its hash, at 1440 and 390 px', async () => {
    const caseId = await workedCaseOfDemoInvestigator(pool)
    const { page, errors } = await newPage(app.browser)
    await page.setViewportSize({ width: 1440, height: 900 })
    await submitSignIn(page, app.web.baseUrl, DEMO.investigator)
    await landedOnWork(page)
    await page.goto(`${app.web.baseUrl}/cases/${caseId}`)
    const section = page.getByRole('region', { name: 'Evidence files' })
    await section.waitFor({ timeout: 20_000 })

    await section.getByLabel('Kind of file').selectOption('spectrum_capture')
    await section.getByLabel('Add files').setInputFiles({ name: 'channel-16-trace.csv', mimeType: 'text/csv', buffer: TRACE })
    const upload = section.getByRole('list', { name: 'Uploads' }).getByRole('listitem').first()
    await expect.poll(() => upload.getByRole('progressbar', { name: 'Upload of channel-16-trace.csv' }).count(), { timeout: 10_000 }).toBe(1)
    await expect.poll(() => upload.textContent(), { timeout: 15_000 }).toMatch(/Uploaded/)
    expect(await upload.getByRole('progressbar').getAttribute('aria-valuenow')).toBe('100')

    const hash = crypto.createHash('sha256').update(TRACE).digest('hex')
    const card = section.getByRole('list', { name: 'Evidence files' }).getByRole('listitem', { name: 'channel-16-trace.csv' }).first()
    await card.waitFor({ timeout: 15_000 })
    const shown = card.getByText(`${hash.slice(0, 12)}…`)
    expect(await shown.count()).toBe(1)
    expect(await shown.getAttribute('title')).toBe(hash)
    expect(await card.textContent()).toContain('Spectrum capture')

    // the server reads the stored file again: verified, and the custody log tells the story so far
    await card.getByRole('button', { name: 'Verify integrity' }).click()
    await expect.poll(() => card.textContent(), { timeout: 10_000 }).toMatch(/Verified \d/)
    await card.getByRole('button', { name: 'Custody log' }).click()
    const log = card.getByRole('list', { name: 'Custody log' })
    await log.waitFor({ timeout: 10_000 })
    await expect.poll(() => log.textContent(), { timeout: 10_000 }).toMatch(/Uploaded.*Integrity verified/s)
    await section.screenshot({ path: path.join(SCREENSHOTS, 'evidence-section-1440.png') })

    // the bundle link gives a ZIP whose manifest names the file with the same hash, checked again while bundling
    const href = await section.getByRole('link', { name: /Download the bundle/ }).getAttribute('href')
    const zip = await page.request.get(`${app.web.baseUrl}${href}`)
    expect(zip.status()).toBe(200)
    const entries = readZip(await zip.body())
    const manifest = bundleManifestSchema.parse(JSON.parse(entries.find((e) => e.name === 'manifest.json')!.data.toString('utf8')))
    const listed = manifest.files.find((f) => f.name === 'channel-16-trace.csv' && f.sha256 === hash)
    expect(listed?.check.outcome).toBe('match')
    expect(crypto.createHash('sha256').update(entries.find((e) => e.name === listed!.path)!.data).digest('hex')).toBe(hash)

    await page.setViewportSize({ width: 390, height: 844 })
    await section.scrollIntoViewIfNeeded()
    const widths = await page.evaluate(() => ({ doc: document.documentElement.scrollWidth, view: window.innerWidth }))
    expect(widths.doc).toBeLessThanOrEqual(widths.view)
    await section.screenshot({ path: path.join(SCREENSHOTS, 'evidence-section-390.png') })
    expect(errors).toEqual([])
    await page.close()
  })
})

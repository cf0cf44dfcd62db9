/** In Chromium: a supervisor changes the office's targets on the office's settings page, reached from the office queue. */
import { describe, expect, it } from 'vitest'
import { DEMO } from '../support/harness'
import { newPage, screenshot } from '../support/browser'
import { landedOnWork, runningApp, submitSignIn } from '../support/e2e'

const app = runningApp()

describe('response targets', () => {
  it('a supervisor changes them, and the office keeps the new figures', async () => {
    const { page, errors } = await newPage(app.browser)
    await submitSignIn(page, app.web.baseUrl, DEMO.otherSupervisor) // Kestrel Bay, so no other test's figures move
    await landedOnWork(page)
    await page.getByRole('link', { name: 'Office settings' }).click()
    const form = page.getByRole('form', { name: 'Resolution targets of Kestrel Bay' })
    await form.waitFor({ timeout: 20_000 })
    const p4 = form.getByLabel(/^Nuisance \(hours\)$/)
    const before = await p4.inputValue()
    await p4.fill('300')
    await form.getByRole('button', { name: 'Save resolution targets' }).click()
    await expect.poll(() => form.getByRole('status').textContent(), { timeout: 10_000 }).toContain('Saved')
    await screenshot(page, 'office-response-targets')
    await page.reload()
    await expect.poll(() => page.getByRole('form', { name: 'Resolution targets of Kestrel Bay' }).getByLabel(/^Nuisance \(hours\)$/).inputValue(), { timeout: 20_000 }).toBe('300')
    // a bad figure is refused beside its field
    await p4.fill('0')
    await form.getByRole('button', { name: 'Save resolution targets' }).click()
    await expect.poll(() => form.getByRole('alert').allTextContents()).toContainEqual(expect.stringContaining('At least 1 hour'))
    await p4.fill(before)
    await form.getByRole('button', { name: 'Save resolution targets' }).click()
    await expect.poll(() => form.getByRole('status').textContent()).toContain('Saved')
    // the first-response targets are a form of their own beside it
    const first = page.getByRole('form', { name: 'First-response targets of Kestrel Bay' })
    const firstP1 = first.getByLabel(/^Safety of life \(hours\)$/)
    const firstBefore = await firstP1.inputValue()
    await firstP1.fill('2')
    await first.getByRole('button', { name: 'Save first-response targets' }).click()
    await expect.poll(() => first.getByRole('status').textContent(), { timeout: 10_000 }).toContain('Saved')
    await firstP1.fill(firstBefore)
    await first.getByRole('button', { name: 'Save first-response targets' }).click()
    await expect.poll(() => first.getByRole('status').textContent(), { timeout: 10_000 }).toContain('Saved')
    expect(errors).toEqual([])
  }, 90_000)
})

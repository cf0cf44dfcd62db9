/**
 * In Debian's Chromium: each demo role signs in and sees its own navigation; a wrong
 * password shows a clear error; unknown paths show the app's 404 page.
 */
import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { DEMO } from '../support/harness'
import { newPage, screenshot } from '../support/browser'
import { runningApp, submitSignIn } from '../support/e2e'

const app = runningApp()

const signIn = (page: Page, email: string, password?: string) => submitSignIn(page, app.web.baseUrl, email, password)

const mainNavLinks = async (page: Page) => (await page.getByRole('navigation', { name: 'Main' }).getByRole('link').allTextContents()).map((s) => s.trim())

describe('signing in as each demo role', () => {
  it.each([
    ['complainant', DEMO.complainant, ['My reports', 'Report interference'], 'Rosa Lindqvist'],
    ['investigator', DEMO.investigator, ['My cases'], 'Marta Ferreira'],
    ['supervisor', DEMO.supervisor, ['Office queue', 'Cases'], 'Sade Okafor'],
    ['admin', DEMO.admin, ['Users', 'Offices'], 'Idris Vaughan-Ole'],
  ])('the %s sees their own navigation and name', async (role, email, links, name) => {
    const { page, errors } = await newPage(app.browser)
    await signIn(page, email)
    await expect.poll(() => mainNavLinks(page), { timeout: 15_000 }).toEqual(expect.arrayContaining(links))
    expect(await mainNavLinks(page)).not.toContain('Sign in')
    await expect.poll(() => page.getByRole('region', { name: 'Account' }).textContent()).toContain(name)
    await screenshot(page, `first-screen-${role}`)
    expect(errors).toEqual([])
    await page.context().close()
  })

  it('shows the generic error for a wrong password, and stays on the sign-in page', async () => {
    const { page, errors } = await newPage(app.browser)
    await signIn(page, DEMO.supervisor, 'not-the-right-password')
    await expect.poll(() => page.getByRole('alert').allTextContents(), { timeout: 15_000 }).toContainEqual(expect.stringContaining('E-mail or password is not correct.'))
    expect(new URL(page.url()).pathname).toBe('/sign-in')
    await screenshot(page, 'sign-in-wrong-password')
    expect(errors).toEqual([])
    await page.context().close()
  })

  it('shows the public navigation to a visitor, and the app’s 404 page for an unknown path', async () => {
    const { page, errors } = await newPage(app.browser)
    await page.goto(`${app.web.baseUrl}/`)
    await expect.poll(() => mainNavLinks(page), { timeout: 15_000 }).toEqual(['Report interference', 'Follow a report', 'Sign in'])
    await screenshot(page, 'home-public')
    const res = await page.goto(`${app.web.baseUrl}/no/such/page`)
    expect(res?.status()).toBe(200) // the web app answers, then shows its own page
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toMatch(/not|find/i)
    expect(errors).toEqual([])
    await page.context().close()
  })

  it('uses the self-hosted typeface', async () => {
    const { page } = await newPage(app.browser)
    await page.goto(`${app.web.baseUrl}/`)
    await page.evaluate(() => document.fonts.ready)
    const family = await page.evaluate(() => getComputedStyle(document.body).fontFamily)
    expect(family).toContain('Public Sans')
    await page.context().close()
  })
})

/**
 * In Debian's Chromium: a visitor's pages log no errors; creating an account ends with "check
 * your e-mail", the e-mailed link's page confirms the address and signs the person in, and a
 * wrong password says so in plain words with the way out.
 */
import { describe, expect, it } from 'vitest'
import { newPage, screenshot } from '../support/browser'
import { runningApp, submitSignIn } from '../support/e2e'
import { readMailbox } from '../../server/mail/dev-mailbox'

const app = runningApp()
const T = { timeout: 20_000 }

describe('an anonymous visitor', () => {
  it('gets pages whose console shows no error (nobody signed in is not an error)', async () => {
    const { page, errors } = await newPage(app.browser)
    const consoleErrors: string[] = []
    page.on('console', (m) => {
      if (m.type() === 'error') consoleErrors.push(m.text())
    })
    for (const path of ['/', '/report', '/sign-in']) {
      await page.goto(`${app.web.baseUrl}${path}`)
      await page.waitForLoadState('networkidle')
    }
    expect(consoleErrors).toEqual([])
    expect(errors).toEqual([])
    await page.context().close()
  })
})

describe('creating an account', () => {
  it('asks to check the e-mail, and the link’s page confirms the address and signs in', async () => {
    const email = `new-account-${process.pid}-${Date.now()}@example.test`
    const { page, errors } = await newPage(app.browser)
    await page.goto(`${app.web.baseUrl}/register`)
    await page.getByLabel('Your name').fill('Juno Ashby')
    await page.getByLabel('E-mail').fill(email)
    await page.getByLabel('Password').fill('a sentence to remember')
    await page.getByRole('button', { name: 'Create account' }).click()
    await page.getByText('Check your e-mail.').waitFor(T)
    expect(await page.locator('main').innerText()).toContain(email)
    await screenshot(page, 'register-check-email')

    let link: string | undefined
    await expect
      .poll(async () => {
        const mail = (await readMailbox(app.web.mailboxDir)).find((m) => m.to.includes(email))
        link = mail && /https?:\/\/\S+\/confirm-email\?token=[A-Za-z0-9_-]+/.exec(mail.text)?.[0]
        return link
      }, { timeout: 30_000, interval: 500 })
      .toBeDefined()
    await page.goto(link!)
    await page.getByRole('heading', { level: 1, name: 'Confirm your e-mail address' }).waitFor(T)
    await screenshot(page, 'confirm-email')
    await page.getByRole('button', { name: 'Confirm my address and sign in' }).click()
    await page.getByRole('heading', { level: 1, name: 'My reports' }).waitFor(T)
    await expect.poll(() => page.getByRole('region', { name: 'Account' }).textContent()).toContain('Juno Ashby')
    expect(errors).toEqual([])
    await page.context().close()
  })

  it('shows a plain notice for a link that cannot be used', async () => {
    const { page } = await newPage(app.browser)
    await page.goto(`${app.web.baseUrl}/confirm-email?token=${'x'.repeat(43)}`)
    await page.getByRole('button', { name: 'Confirm my address and sign in' }).click()
    await page.getByText('This link cannot be used.').waitFor(T)
    await page.context().close()
  })
})

describe('a wrong password', () => {
  it('offers a link by e-mail as the way out', async () => {
    const { page } = await newPage(app.browser)
    await submitSignIn(page, app.web.baseUrl, `nobody-${process.pid}@example.test`, 'not-the-right-password')
    await expect.poll(() => page.getByRole('alert').allTextContents(), T).toContainEqual(expect.stringContaining('E-mail or password is not correct.'))
    await page.getByRole('link', { name: 'Get a link by e-mail to choose a new password' }).waitFor(T)
    await page.context().close()
  })
})

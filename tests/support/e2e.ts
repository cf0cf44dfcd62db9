/** What every browser test file needs: the running app, a browser, and signing in through the form. */
import { afterAll, beforeAll } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { DEMO_PASSWORD } from '../../ops/seed-demo'
import { launchBrowser } from './browser'
import { startWebServer, type RunningWeb } from './web-server'

/** Starts the app and Chromium before this file's tests and stops both after them. */
export function runningApp(): { web: RunningWeb; browser: Browser } {
  const app = {} as { web: RunningWeb; browser: Browser }
  beforeAll(async () => {
    app.web = await startWebServer()
    app.browser = await launchBrowser()
  })
  afterAll(async () => {
    await app.browser?.close()
    await app.web?.close()
  })
  return app
}

/** Fills and sends the sign-in form (demo password by default). */
export async function submitSignIn(page: Page, baseUrl: string, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`)
  await page.getByLabel('E-mail').fill(email)
  await page.getByLabel('Password').fill(password)
  await page.getByRole('button', { name: 'Sign in' }).click()
}

/** What every browser test file needs: the running app, a browser, and signing in through the form. */
import { afterAll, beforeAll } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import type pg from 'pg'
import { DEMO_PASSWORD } from '../../ops/seed-demo'
import { paths } from '../../web/src/lib/paths'
import { DEMO } from './harness'
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

/** A Harrowmere case the demo investigator is working (the demo seed assigns several), the first by reference. */
export async function workedCaseOfDemoInvestigator(pool: Pick<pg.Pool, 'query'>): Promise<string> {
  const { rows } = await pool.query<{ id: string }>(
    `SELECT c.id FROM cases c JOIN users u ON u.id = c.investigator_id
      WHERE u.email = $1 AND c.status IN ('assigned', 'field_work', 'returned') ORDER BY c.reference LIMIT 1`,
    [DEMO.investigator],
  )
  if (!rows[0]) throw new Error('the demo seed has no case being worked by the demo investigator')
  return rows[0].id
}

/** Waits until a signed-in member of staff has landed on their start page (work). */
export async function landedOnWork(page: Page): Promise<void> {
  await page.waitForURL((url) => url.pathname === paths.work.path, { timeout: 20_000 })
}

/** Debian's Chromium driven by playwright-core (never a downloaded browser). */
import fs from 'node:fs'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import { chromium, type Browser, type Page } from 'playwright-core'

export const SCREENSHOTS = fileURLToPath(new URL('../../test-results/screenshots', import.meta.url))
const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium'
// Playwright adds --headless and --no-sandbox (as root); these keep Chromium off the network.
const ARGS = ['--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--disable-dev-shm-usage']

export async function launchBrowser(): Promise<Browser> {
  if (!fs.existsSync(CHROMIUM)) throw new Error(`Chromium not found at ${CHROMIUM} (apt-get install chromium)`)
  return chromium.launch({ executablePath: CHROMIUM, headless: true, args: ARGS })
}

/** A fresh page (its own cookies) that records page errors. */
export async function newPage(browser: Browser): Promise<{ page: Page; errors: string[] }> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 860 } })
  const page = await context.newPage()
  const errors: string[] = []
  page.on('pageerror', (e) => errors.push(e.message))
  return { page, errors }
}

export async function screenshot(page: Page, name: string): Promise<void> {
  fs.mkdirSync(SCREENSHOTS, { recursive: true })
  await page.screenshot({ path: path.join(SCREENSHOTS, `${name}.png`), fullPage: true })
}


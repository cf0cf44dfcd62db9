/**
 * In Debian's Chromium: every page of the app, for the role that sees it, is checked by axe-core
 * against WCAG 2.1 A and AA (zero serious or critical violations) at desktop width, and is never
 * wider than the screen at 390 px (the page scrolls down, never sideways).
 *
 * axe-core is the automated part of a WCAG check only (it finds about a third of the success
 * criteria's failures, by the axe-core project's own account): keyboard walks and labels are
 * tested beside each feature.
 */
import { describe, expect, it } from 'vitest'
import { inject } from 'vitest'
import AxeBuilder from '@axe-core/playwright'
import type { Browser, Page } from 'playwright-core'
import { createDb, createPool } from '../../server/db/client'
import { issueTrackingLink } from '../../server/modules/cases/tracking-tokens'
import { paths } from '../../web/src/lib/paths'
import { DEMO } from '../support/harness'
import { screenshot } from '../support/browser'
import { runningApp, submitSignIn, workedCaseOfDemoInvestigator } from '../support/e2e'

const app = runningApp()

type Who = 'visitor' | keyof typeof DEMO

interface PageCheck {
  name: string
  who: Who
  /** The path to open, worked out once the app runs (ids and tokens come from the database). */
  path: (ids: Ids) => string
  /** Something on the page that says it has rendered. */
  ready: (page: Page) => Promise<unknown>
}

interface Ids {
  caseId: string
  myReportId: string
  trackingPath: string
  /** An office of the demo, for its edit page. */
  officeId: string
}

const heading = (page: Page) => page.getByRole('heading', { level: 1 }).first().waitFor({ timeout: 20_000 })

const PAGES: PageCheck[] = [
  { name: 'home', who: 'visitor', path: () => paths.home.href(), ready: heading },
  { name: 'sign-in', who: 'visitor', path: () => paths.signIn.href(), ready: heading },
  { name: 'register', who: 'visitor', path: () => paths.register.href(), ready: heading },
  { name: 'forgot-password', who: 'visitor', path: () => paths.forgotPassword.href(), ready: heading },
  { name: 'report', who: 'visitor', path: () => paths.report.href(), ready: heading },
  { name: 'track', who: 'visitor', path: () => paths.track.href(), ready: heading },
  { name: 'track-report', who: 'visitor', path: (ids) => ids.trackingPath, ready: heading },
  { name: 'not-found', who: 'visitor', path: () => '/no/such/page', ready: heading },
  // ready once the document is read: the contents of its groups are listed
  { name: 'api-reference', who: 'visitor', path: () => paths.apiReference.href(), ready: (page) => page.getByRole('navigation', { name: 'Groups of operations' }).waitFor({ timeout: 20_000 }) },
  { name: 'my-reports', who: 'complainant', path: () => paths.myReports.href(), ready: heading },
  { name: 'my-report', who: 'complainant', path: (ids) => paths.myReport.href(ids.myReportId), ready: heading },
  { name: 'work-investigator', who: 'investigator', path: () => paths.work.href(), ready: heading },
  { name: 'case-investigator', who: 'investigator', path: (ids) => paths.case.href(ids.caseId), ready: heading },
  { name: 'calculator', who: 'investigator', path: () => paths.calculator.href(), ready: heading },
  { name: 'band-limits', who: 'investigator', path: () => paths.bandLimits.href(), ready: heading },
  { name: 'station-register', who: 'investigator', path: () => paths.stationRegister.href(), ready: heading },
  { name: 'equipment', who: 'supervisor', path: () => paths.equipment.href(), ready: heading },
  { name: 'work-supervisor', who: 'supervisor', path: () => paths.work.href(), ready: heading },
  { name: 'cases', who: 'supervisor', path: () => paths.cases.href(), ready: heading },
  { name: 'case-supervisor', who: 'supervisor', path: (ids) => paths.case.href(ids.caseId), ready: heading },
  { name: 'dashboard-supervisor', who: 'supervisor', path: () => paths.dashboard.href(), ready: heading },
  { name: 'office-settings', who: 'supervisor', path: () => paths.officeSettings.href(), ready: heading },
  { name: 'my-emails', who: 'investigator', path: () => paths.myEmails.href(), ready: heading },
  { name: 'dashboard-admin', who: 'admin', path: () => paths.dashboard.href(), ready: heading },
  { name: 'admin-users', who: 'admin', path: () => paths.adminUsers.href(), ready: heading },
  { name: 'admin-offices', who: 'admin', path: () => paths.adminOffices.href(), ready: heading },
  { name: 'admin-office-new', who: 'admin', path: () => paths.adminOfficeNew.href(), ready: heading },
  { name: 'admin-office-edit', who: 'admin', path: (ids) => paths.adminOfficeEdit.href(ids.officeId), ready: heading },
  { name: 'admin-audit', who: 'admin', path: () => paths.adminAudit.href(), ready: heading },
]

async function idsFromDatabase(): Promise<Ids> {
  const pool = createPool(inject('databaseUrl'), 2)
  try {
    const caseId = await workedCaseOfDemoInvestigator(pool)
    const { rows } = await pool.query<{ id: string }>(
      `SELECT c.id FROM cases c JOIN users u ON u.id = c.complainant_user_id WHERE u.email = $1 ORDER BY c.reference LIMIT 1`,
      [DEMO.complainant],
    )
    if (!rows[0]) throw new Error('the demo seed has no report of the demo complainant')
    const link = await issueTrackingLink(createDb(pool), 'http://quietband.test', caseId)
    const office = await pool.query<{ id: string }>(`SELECT id FROM offices ORDER BY name LIMIT 1`)
    if (!office.rows[0]) throw new Error('the demo seed has no office')
    return { caseId, myReportId: rows[0].id, trackingPath: new URL(link).pathname, officeId: office.rows[0].id }
  } finally {
    await pool.end()
  }
}

/** A context signed in as `who` (or a visitor's), at the given width. */
async function pageFor(browser: Browser, who: Who, width: number): Promise<Page> {
  const context = await browser.newContext({ viewport: { width, height: 900 } })
  const page = await context.newPage()
  if (who !== 'visitor') {
    await submitSignIn(page, app.web.baseUrl, DEMO[who])
    await page.waitForURL((url) => url.pathname !== paths.signIn.path, { timeout: 20_000 })
  }
  return page
}

const describeViolation = (v: { id: string; impact?: string | null; help: string; nodes: { target: unknown[] }[] }) =>
  `${v.impact} ${v.id}: ${v.help} — ${v.nodes
    .slice(0, 4)
    .map((n) => JSON.stringify(n.target))
    .join(', ')}`

describe('every page meets WCAG 2.1 AA as far as axe-core can tell, and fits a phone', () => {
  let ids: Ids
  const pages = new Map<string, Page>()
  const page = async (who: Who, width: number) => {
    const key = `${who}@${width}`
    if (!pages.has(key)) pages.set(key, await pageFor(app.browser, who, width))
    return pages.get(key)!
  }

  it.each(PAGES.map((p) => [p.name, p] as const))('%s: no serious or critical axe violation at 1440 px', { timeout: 120_000 }, async (_name, check) => {
    ids ??= await idsFromDatabase()
    const p = await page(check.who, 1440)
    await p.goto(`${app.web.baseUrl}${check.path(ids)}`)
    await check.ready(p)
    await p.waitForLoadState('networkidle')
    const result = await new AxeBuilder({ page: p }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa']).analyze()
    const bad = result.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical')
    expect(bad.map(describeViolation)).toEqual([])
  })

  it.each(PAGES.map((p) => [p.name, p] as const))('%s: no sideways scroll at 390 px', async (name, check) => {
    ids ??= await idsFromDatabase()
    const p = await page(check.who, 390)
    await p.goto(`${app.web.baseUrl}${check.path(ids)}`)
    await check.ready(p)
    await p.waitForLoadState('networkidle')
    const widthPx = await p.evaluate(() => document.documentElement.scrollWidth)
    if (widthPx > 390) await screenshot(p, `too-wide-${name}-390`)
    expect(widthPx, `${name} is ${widthPx} px wide on a 390 px screen`).toBeLessThanOrEqual(390)
  })
})

describe('the keyboard reaches everything', () => {
  it('the first Tab shows the skip link, and Enter on it moves focus to the page’s content', async () => {
    const p = await pageFor(app.browser, 'investigator', 1440)
    await p.goto(`${app.web.baseUrl}${paths.calculator.href()}`)
    await heading(p)
    await p.keyboard.press('Tab')
    const skip = p.getByRole('link', { name: 'Skip to content' })
    await expect.poll(() => skip.evaluate((el) => el === document.activeElement)).toBe(true)
    // the link is on screen (not clipped to 1 px) while it has focus
    const box = await skip.boundingBox()
    expect(box!.width).toBeGreaterThan(20)
    await p.keyboard.press('Enter')
    await expect.poll(() => p.evaluate(() => document.activeElement?.id)).toBe('main')
    await p.context().close()
  })

  it('every focusable control on the case page shows a visible focus ring', async () => {
    const ids = await idsFromDatabase()
    const p = await pageFor(app.browser, 'investigator', 1440)
    await p.goto(`${app.web.baseUrl}${paths.case.href(ids.caseId)}`)
    await heading(p)
    await p.waitForLoadState('networkidle')
    // Tab through the first 40 stops; each must have an outline or a box shadow while focused
    const unringed: string[] = []
    for (let i = 0; i < 40; i++) {
      await p.keyboard.press('Tab')
      const seen = await p.evaluate(() => {
        const el = document.activeElement as HTMLElement | null
        if (!el || el === document.body) return null
        const ring = (e: Element) => {
          const s = getComputedStyle(e)
          return (s.outlineStyle !== 'none' && parseFloat(s.outlineWidth) >= 2) || s.boxShadow !== 'none'
        }
        // a visually hidden input is drawn by its label: the label must show the ring
        const hidden = el.getBoundingClientRect().width <= 1
        const label = el.id ? document.querySelector(`label[for="${CSS.escape(el.id)}"]`) : null
        const ringed = hidden && label ? ring(label) : ring(el)
        return ringed ? '' : el.outerHTML.slice(0, 160)
      })
      if (seen) unringed.push(seen)
    }
    expect(unringed).toEqual([])
    await p.context().close()
  })
})

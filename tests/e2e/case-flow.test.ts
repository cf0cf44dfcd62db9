/**
 * The whole flow in Debian's Chromium: a member of the public files a report → the
 * confirmation e-mail arrives in the development mailbox → the supervisor triages and
 * assigns → the investigator finds it in "My cases", works it and proposes a finding → the
 * supervisor approves and closes → the complainant's tracking page shows the closure and the
 * closing e-mail arrives.
 */
import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { DEMO } from '../support/harness'
import { newPage, screenshot } from '../support/browser'
import { runningApp, submitSignIn } from '../support/e2e'
import { readMailbox } from '../../server/mail/dev-mailbox'

const app = runningApp()

const T = { timeout: 20_000 }

async function signIn(page: Page, email: string) {
  await submitSignIn(page, app.web.baseUrl, email)
  await page.getByRole('region', { name: 'Account' }).waitFor(T)
}

async function openCase(page: Page, reference: string) {
  await page.goto(`${app.web.baseUrl}/cases?q=${reference}`)
  await page.getByRole('link', { name: reference }).first().click()
  await page.getByRole('heading', { level: 1, name: reference }).waitFor(T)
}

/** Waits for the development mailbox page to list a message whose subject matches. */
async function mailboxShows(page: Page, subject: RegExp) {
  await expect
    .poll(async () => {
      await page.goto(`${app.web.baseUrl}/dev/mailbox`)
      await page.waitForLoadState('networkidle')
      return subject.test(await page.locator('main').innerText())
    }, { timeout: 30_000, interval: 1000 })
    .toBe(true)
}

describe('a report from the public to its closing', () => {
  it('goes through every hand and ends with the complainant told', async () => {
    const stamp = Date.now()
    const email = `flow-${stamp}@example.test`

    // 1. the public files a report
    const { page: pub, errors } = await newPage(app.browser)
    await pub.goto(`${app.web.baseUrl}/report`)
    await pub.getByLabel('Your name').fill('Wren Calloway')
    await pub.getByLabel('E-mail').fill(email)
    await pub.getByLabel('Affected service').selectOption('mobile_network')
    await pub.getByLabel('Frequency', { exact: true }).fill('1747')
    await pub.getByLabel('Unit', { exact: true }).selectOption('MHz')
    await pub.getByLabel('Address or place').fill('Lantern Row 9, Harrowmere')
    await pub.getByLabel('Latitude').fill('48.105')
    await pub.getByLabel('Longitude').fill('-31.38')
    await pub.getByLabel('Date it started').fill('2026-11-25')
    await pub.getByRole('radio', { name: 'All the time' }).check()
    await pub.getByRole('radio', { name: 'The service is lost (outage)' }).check()
    await pub.getByLabel('Describe what you notice').fill(`No phone signal indoors since a new box appeared on the roof opposite (${stamp}).`)
    await pub.getByRole('button', { name: 'Submit report' }).click()
    await pub.getByRole('heading', { name: 'Report received' }).waitFor(T)
    const reference = /QB-\d{2}-\d{6}/.exec(await pub.locator('main').innerText())![0]
    await screenshot(pub, 'flow-1-report-received')

    // 2. the confirmation e-mail arrives in the development mailbox, with the tracking link
    await mailboxShows(pub, new RegExp(`\\[${reference}\\] We have received your interference report`))
    await screenshot(pub, 'flow-2-mailbox')
    const received = (await readMailbox(app.web.mailboxDir)).find((m) => m.to.includes(email) && m.subject.includes('received'))!
    const trackingUrl = /https?:\/\/\S+\/track\/[A-Za-z0-9_-]+/.exec(received.text)![0]

    // 3. the supervisor triages and assigns
    const { page: sup } = await newPage(app.browser)
    await signIn(sup, DEMO.supervisor)
    await sup.getByRole('link', { name: 'Office queue' }).click()
    await sup.getByRole('heading', { level: 1, name: 'Office queue' }).waitFor(T)
    // other test files file reports into the same office at the same time, so the report is
    // looked up among the office's new reports rather than on the queue's first screen
    await sup.goto(`${app.web.baseUrl}/cases?status=received&q=${reference}`)
    await sup.getByRole('link', { name: reference }).first().waitFor(T)
    await screenshot(sup, 'flow-3-new-reports')
    await openCase(sup, reference)
    await sup.getByLabel('Harm class', { exact: true }).selectOption('2')
    await sup.getByRole('button', { name: 'Set priority' }).click()
    await sup.getByRole('radio', { name: /Marta Ferreira/ }).waitFor(T)
    await sup.getByRole('radio', { name: /Marta Ferreira/ }).check()
    await sup.getByRole('button', { name: 'Assign', exact: true }).click()
    await expect.poll(() => sup.locator('main').innerText(), T).toContain('With investigator')
    await screenshot(sup, 'flow-4-assigned')

    // 4. the investigator sees it in "My cases", starts field work and proposes a finding
    const { page: inv } = await newPage(app.browser)
    await signIn(inv, DEMO.investigator)
    await inv.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'My cases' }).click()
    await inv.getByRole('heading', { level: 1, name: 'My cases' }).waitFor(T)
    // "My cases" as a full list (the investigator's open cases), narrowed to this report
    await inv.goto(`${app.web.baseUrl}/cases?investigatorId=me&open=true&q=${reference}`)
    await inv.getByRole('link', { name: reference }).first().waitFor(T)
    await screenshot(inv, 'flow-5-my-cases')
    await inv.getByRole('link', { name: reference }).first().click()
    await inv.getByRole('button', { name: 'Start field work' }).click()
    await inv.getByLabel('Finding summary').waitFor(T)
    // a calculation stored on the case through the API (as the workbench stores them), to link to the finding
    const caseId = new URL(inv.url()).pathname.split('/').pop()!
    const storedStatus = await inv.evaluate(async (id) => {
      const inputs = { measurement: { kind: 'field-strength', fieldStrengthDbuvPerM: '74.77 dBµV/m', freqHz: '100 MHz' }, distanceM: '1 km', model: { kind: 'free-space', freqHz: '100 MHz' }, measurementContributions: [{ name: 'antenna calibration', distribution: { kind: 'normal', expandedUncertainty: '1.5 dB', coverageFactor: 2 } }] }
      const res = await fetch(`/api/cases/${id}/calculations`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ kind: 'eirp_single_point', inputs }) })
      return res.status
    }, caseId)
    expect(storedStatus).toBe(201)
    await inv.reload()
    const calculationList = inv.getByRole('group', { name: /Calculations the finding rests on/ })
    await calculationList.getByRole('checkbox').first().waitFor(T)
    await calculationList.getByRole('checkbox').first().check()
    await inv.getByLabel('The source', { exact: true }).fill('Unlicensed mobile repeater on the roof opposite')
    await inv.locator('#finding-lat').fill('48.1062')
    await inv.locator('#finding-lon').fill('-31.3786')
    await inv.getByLabel('Recommended action').selectOption('advise_operator')
    // the form fits a phone's width
    await inv.setViewportSize({ width: 390, height: 844 })
    expect(await inv.evaluate(() => document.documentElement.scrollWidth), 'no sideways scrolling at 390 px').toBeLessThanOrEqual(390)
    await screenshot(inv, 'flow-5b-finding-form-390')
    await inv.setViewportSize({ width: 1280, height: 860 })
    await inv.getByLabel('Finding summary').fill('An unlicensed mobile repeater on the roof opposite raised the uplink noise; the owner switched it off on request.')
    await inv.getByRole('button', { name: 'Propose finding' }).click()
    await expect.poll(() => inv.locator('main').innerText(), T).toContain('Finding awaiting review')

    // 5. the supervisor reviews the structured finding, approves and closes
    await openCase(sup, reference)
    await expect.poll(() => sup.locator('main').innerText(), T).toContain('Unlicensed mobile repeater on the roof opposite')
    expect(await sup.locator('main').innerText()).toContain('Before acting on this finding')
    expect(await sup.locator('main').innerText()).toMatch(/Calculations it rests on[\s\S]*dBm[\s\S]*library \d+\.\d+\.\d+/)
    await sup.setViewportSize({ width: 390, height: 844 })
    expect(await sup.evaluate(() => document.documentElement.scrollWidth), 'no sideways scrolling at 390 px').toBeLessThanOrEqual(390)
    await screenshot(sup, 'flow-5c-finding-review-390')
    await sup.setViewportSize({ width: 1280, height: 860 })
    await screenshot(sup, 'flow-5d-finding-review')
    await sup.getByLabel('Resolution').selectOption('source_corrected')
    await sup.getByLabel('Summary for the complainant').fill('We found an unlicensed repeater near you. Its owner has switched it off, and your service should be back.')
    await sup.getByRole('button', { name: 'Approve and close' }).click()
    await expect.poll(() => sup.locator('main').innerText(), T).toContain('Closed')
    await screenshot(sup, 'flow-6-closed')

    // 6. the complainant's tracking page shows the closure, and the closing e-mail arrives
    const { page: comp } = await newPage(app.browser)
    await comp.goto(trackingUrl)
    await comp.getByRole('heading', { name: 'Closed: Source found and corrected' }).waitFor(T)
    expect(await comp.locator('main').innerText()).toContain('Its owner has switched it off')
    await expect(comp.getByRole('button', { name: 'Withdraw report' }).count()).resolves.toBe(0)
    await screenshot(comp, 'flow-7-tracking-closed')
    await mailboxShows(comp, new RegExp(`\\[${reference}\\] Your report is closed`))
    expect(errors).toEqual([])
  }, 180_000)
})

/**
 * In Debian's Chromium: a supervisor opens a case closed with a compliance deadline, records
 * the responsible party and a notice served, sees the follow-up made from the finding and
 * confirms it; the investigator's queue lists follow-ups; "E-mails Quietband sends you" lists
 * the supervisor's e-mails. Each screen fits 1440 and 390 px without sideways scrolling.
 */
import path from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { newPage, SCREENSHOTS } from '../support/browser'
import { runningApp, submitSignIn } from '../support/e2e'
import { createTestContext, type TestContext } from '../support/harness'
import { makeOffice } from '../support/factories'
import { closedWithDeadline, dayFromToday } from '../support/factories'

const app = runningApp()
const T = { timeout: 20_000 }
let t: TestContext
beforeAll(async () => {
  t = await createTestContext()
})
afterAll(() => t?.close())

const noSideScroll = (page: import('playwright-core').Page) => page.evaluate(() => document.documentElement.scrollWidth)

describe('enforcement records on the case page', () => {
  it('records the party and a notice, confirms the follow-up, and fits 1440 and 390 px', async () => {
    const office = await makeOffice(t, { timeZone: 'Atlantic/Azores' })
    const c = await closedWithDeadline(t, office, dayFromToday(7))
    const { page, errors } = await newPage(app.browser)
    await page.setViewportSize({ width: 1440, height: 900 })
    await submitSignIn(page, app.web.baseUrl, c.supervisor!.email, c.supervisor!.password)
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'), T)
    await page.goto(`${app.web.baseUrl}/cases/${c.id}`)
    const party = page.getByRole('region', { name: 'Responsible party and notices' })
    await party.getByText('No responsible party recorded yet.').waitFor(T)
    await party.getByRole('button', { name: 'Record the party' }).click()
    await party.getByLabel('Name (person or organisation)').fill('Harbour Boat Club Ltd')
    await party.getByLabel('E-mail').fill('secretary@boatclub.example')
    await party.getByRole('button', { name: 'Record the party' }).click()
    await party.getByText('Version 1, recorded by', { exact: false }).waitFor(T)
    await party.getByRole('button', { name: 'Record a notice served' }).click()
    const notice = party.getByRole('form', { name: 'Record a notice served' })
    await notice.getByRole('button', { name: 'Record the notice' }).click()
    await notice.getByText('Enter the day it was served.').waitFor(T)
    await notice.getByLabel('Served on').fill(dayFromToday(0))
    await notice.getByLabel('How it was served').selectOption('registered_post')
    await notice.getByLabel('Reference (letter or receipt number)').fill('RP 4471 0093')
    await notice.getByLabel('What the notice requires').fill('Replace the masthead amplifier within 7 days.')
    await notice.getByRole('button', { name: 'Record the notice' }).click()
    await party.getByRole('list', { name: 'Notices served' }).getByText(/RP 4471 0093/).waitFor(T)

    const followUps = page.getByRole('region', { name: 'Follow-ups' })
    await followUps.getByText(`Deadline ${dayFromToday(7)}`).waitFor(T)
    await followUps.getByText('Upcoming').waitFor(T)
    await party.screenshot({ path: path.join(SCREENSHOTS, 'responsible-party-1440.png') })
    await followUps.screenshot({ path: path.join(SCREENSHOTS, 'follow-ups-1440.png') })
    expect(await noSideScroll(page)).toBeLessThanOrEqual(1440)

    await page.setViewportSize({ width: 390, height: 844 })
    await followUps.getByRole('button', { name: 'Confirm complied' }).click()
    await followUps.getByLabel('What you saw').fill('Visited on site: new amplifier fitted, no emission.')
    expect(await noSideScroll(page)).toBeLessThanOrEqual(390)
    await followUps.screenshot({ path: path.join(SCREENSHOTS, 'follow-ups-move-390.png') })
    await followUps.getByRole('form', { name: 'Confirm complied' }).getByRole('button', { name: 'Confirm complied' }).click()
    await followUps.getByText('Complied — confirmed').waitFor(T)
    await party.scrollIntoViewIfNeeded()
    expect(await noSideScroll(page)).toBeLessThanOrEqual(390)
    await party.screenshot({ path: path.join(SCREENSHOTS, 'responsible-party-390.png') })

    await page.goto(`${app.web.baseUrl}/work`)
    await page.getByRole('heading', { name: /Follow-ups due or overdue/ }).waitFor(T)
    await page.getByText(/No follow-up is due today/).waitFor(T)
    expect(await noSideScroll(page)).toBeLessThanOrEqual(390)
    await page.screenshot({ path: path.join(SCREENSHOTS, 'work-follow-ups-390.png') })

    await page.getByRole('link', { name: 'E-mails you get' }).click()
    await page.getByRole('heading', { level: 1, name: 'E-mails Quietband sends you' }).waitFor(T)
    await page.getByText(/Every morning \(07:00 office time\)/).waitFor(T)
    expect(await noSideScroll(page)).toBeLessThanOrEqual(390)
    await page.screenshot({ path: path.join(SCREENSHOTS, 'my-emails-390.png'), fullPage: true })
    expect(errors).toEqual([])
    await page.context().close()
  }, 120_000)
})

/**
 * In Debian's Chromium: the report form's map is drawn from the region's data (GET
 * /api/region); a click on it fills in latitude and longitude. With no region set up the form
 * says so plainly, and a report with typed figures still goes in.
 */
import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { newPage, screenshot } from '../support/browser'
import { runningApp } from '../support/e2e'

const app = runningApp()
const T = { timeout: 20_000 }
const MAP = 'Map of Vellmark Coast: pick where it happens'

/** Clicks the map at a position: the map is equirectangular over the region's outline box. */
async function clickMapAt(page: Page, p: { latDeg: number; lonDeg: number }) {
  const box = { southDeg: 47.2, northDeg: 48.6, westDeg: -32.2, eastDeg: -29.8 }
  const svg = page.getByRole('application', { name: MAP }).locator('svg')
  await svg.scrollIntoViewIfNeeded()
  const frame = (await svg.boundingBox())!
  await page.mouse.click(
    frame.x + ((p.lonDeg - box.westDeg) / (box.eastDeg - box.westDeg)) * frame.width,
    frame.y + ((box.northDeg - p.latDeg) / (box.northDeg - box.southDeg)) * frame.height,
  )
}

describe('the report form’s map', () => {
  it('shows the region from its data, and a click fills in latitude and longitude', async () => {
    const { page, errors } = await newPage(app.browser)
    await page.goto(`${app.web.baseUrl}/report`)
    const map = page.getByRole('application', { name: MAP })
    await map.waitFor(T)
    // the demo data's office marks and place names are drawn
    await expect.poll(() => map.locator('text').allTextContents()).toEqual(expect.arrayContaining(['Harrowmere office', 'Kestrel Bay office', 'Marrow Sound']))

    await clickMapAt(page, { latDeg: 48.105, lonDeg: -31.38 })
    const lat = Number(await page.getByLabel('Latitude').inputValue())
    const lon = Number(await page.getByLabel('Longitude').inputValue())
    expect(Math.abs(lat - 48.105)).toBeLessThan(0.01)
    expect(Math.abs(lon - -31.38)).toBeLessThan(0.01)
    await page.getByText(/^Marker at 48\.1\d{3}° N, 31\.3\d{3}° W$/).waitFor(T)

    // the arrow keys move the marker from there
    await map.focus()
    await page.keyboard.press('ArrowUp')
    expect(Number(await page.getByLabel('Latitude').inputValue())).toBeCloseTo(lat + 0.01, 6)

    for (const width of [1440, 390]) {
      await page.setViewportSize({ width, height: 900 })
      await map.scrollIntoViewIfNeeded()
      await screenshot(page, `report-map-${width}`)
    }
    expect(errors).toEqual([])
    await page.context().close()
  })

  it('says plainly that no map is set up, and takes a report with typed figures', async () => {
    const { page, errors } = await newPage(app.browser)
    await page.route('**/api/region', (route) => route.fulfill({ status: 200, contentType: 'application/geo+json', body: JSON.stringify({ type: 'FeatureCollection', features: [] }) }))
    await page.goto(`${app.web.baseUrl}/report`)
    await page.getByText('No map is set up for this service yet.', { exact: false }).waitFor(T)
    expect(await page.getByRole('application').count()).toBe(0)

    await page.getByLabel('Your name').fill('Ines Harlow')
    await page.getByLabel('E-mail').fill(`no-map-${Date.now()}@example.test`)
    await page.getByLabel('Affected service').selectOption('broadcasting')
    await page.getByLabel('Frequency', { exact: true }).fill('98.4')
    await page.getByLabel('Unit', { exact: true }).selectOption('MHz')
    await page.getByLabel('Address or place').fill('Quay Steps 3, Harrowmere')
    await page.getByLabel('Latitude').fill('48.11')
    await page.getByLabel('Longitude').fill('-31.37')
    await page.getByLabel('Date it started').fill('2026-11-25')
    await page.getByRole('radio', { name: 'All the time' }).check()
    await page.getByRole('radio', { name: 'The service works badly (degradation)' }).check()
    await page.getByLabel('Describe what you notice').fill('Hiss over the evening programme on the kitchen radio.')
    await screenshot(page, 'report-no-map')
    await page.getByRole('button', { name: 'Submit report' }).click()
    await page.getByRole('heading', { name: 'Report received' }).waitFor(T)
    expect(errors).toEqual([])
    await page.context().close()
  })
})

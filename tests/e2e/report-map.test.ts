/**
 * In Debian's Chromium: the report form's map is Leaflet over the offline basemap drawn from
 * the region's data (GET /api/region; no tile server is configured, so no request leaves the
 * service); a click on it fills in latitude and longitude. With no region set up the form says
 * so plainly, and a report with typed figures still goes in.
 */
import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import path from 'node:path'
import { SCREENSHOTS, newPage, screenshot } from '../support/browser'
import { runningApp } from '../support/e2e'

const app = runningApp()
const T = { timeout: 20_000 }
const MAP = 'Map: pick where it happens'
/** A 1 × 1 transparent PNG, the smallest tile. */
const ONE_PIXEL_PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==', 'base64')

/** Web Mercator's northing for a latitude (the map's projection), up to a constant factor. */
const mercatorY = (latDeg: number) => Math.log(Math.tan(Math.PI / 4 + (latDeg * Math.PI) / 360))

/**
 * Clicks the map at a position, framed by the drawn region boundary: the demo outline's box is
 * 47.2–48.6° N, 32.2–29.8° W; on Leaflet's Web Mercator x is linear in longitude, y in mercatorY.
 */
async function clickMapAt(page: Page, p: { latDeg: number; lonDeg: number }): Promise<{ x: number; y: number }> {
  const box = { southDeg: 47.2, northDeg: 48.6, westDeg: -32.2, eastDeg: -29.8 }
  const outline = page.getByRole('img', { name: 'Boundary of Vellmark Coast' })
  await page.getByRole('region', { name: MAP }).scrollIntoViewIfNeeded()
  // the map fits itself to the region (offices other test files add far off are drawn, not
  // framed): wait until the outline stops moving before reading where it is
  let frame = (await outline.boundingBox())!
  for (let i = 0; i < 20; i++) {
    await page.waitForTimeout(150)
    const next = (await outline.boundingBox())!
    const still = Math.abs(next.x - frame.x) < 0.5 && Math.abs(next.y - frame.y) < 0.5 && Math.abs(next.width - frame.width) < 0.5
    frame = next
    if (still) break
  }
  const at = {
    x: frame.x + ((p.lonDeg - box.westDeg) / (box.eastDeg - box.westDeg)) * frame.width,
    y: frame.y + ((mercatorY(box.northDeg) - mercatorY(p.latDeg)) / (mercatorY(box.northDeg) - mercatorY(box.southDeg))) * frame.height,
  }
  await page.mouse.click(at.x, at.y)
  return at
}

describe('the report form’s map', () => {
  it('draws the region with Leaflet and no tiles, and a click fills in latitude and longitude', async () => {
    const { page, errors } = await newPage(app.browser)
    const foreign: string[] = []
    page.on('request', (r) => {
      if (!r.url().startsWith(app.web.baseUrl) && !r.url().startsWith('data:')) foreign.push(r.url())
    })
    await page.goto(`${app.web.baseUrl}/report`)
    const map = page.getByRole('region', { name: MAP })
    await map.waitFor(T)
    expect(await map.getAttribute('class')).toContain('leaflet-container')
    expect(await page.locator('img.leaflet-tile').count()).toBe(0)
    // the demo data's offices and place names are drawn, and the key names the layers
    await expect.poll(() => map.locator('.leaflet-tooltip').allTextContents()).toEqual(expect.arrayContaining(['Harrowmere office', 'Kestrel Bay office']))
    expect(await map.locator('.qb-map-place').allTextContents()).toContain('Marrow Sound')
    const key = page.getByRole('list', { name: 'Key to the map' })
    // API tests add offices of their own to the same database, so the count is the demo's two or more
    expect(await key.locator('li').allTextContents()).toEqual(['Region boundary and land', expect.stringMatching(/^\d+ field offices$/), 'Office area'])
    // a scale bar in metres or kilometres, and a north arrow
    expect(await map.locator('.leaflet-control-scale-line').textContent()).toMatch(/^\d+ k?m$/)
    await page.getByRole('img', { name: 'North arrow: north is up' }).waitFor(T)

    const clicked = await clickMapAt(page, { latDeg: 48.105, lonDeg: -31.38 })
    await expect.poll(() => page.getByLabel('Latitude').inputValue()).not.toBe('')
    const lat = Number(await page.getByLabel('Latitude').inputValue())
    const lon = Number(await page.getByLabel('Longitude').inputValue())
    // inside the region, and the marker drawn from the typed figures sits where the click was
    // (the view depends on the offices other test files add, so the figures are not compared
    // with a position worked out from the outline alone)
    expect(lat).toBeGreaterThan(47.2)
    expect(lat).toBeLessThan(48.6)
    expect(lon).toBeGreaterThan(-32.2)
    expect(lon).toBeLessThan(-29.8)
    await page.getByText(/^Marker at 4\d\.\d{4}° N, 3\d\.\d{4}° W$/).waitFor(T)
    const marker = (await map.getByRole('img', { name: 'The place you gave' }).boundingBox())!
    expect(Math.abs(marker.x + marker.width / 2 - clicked.x)).toBeLessThan(4)
    expect(Math.abs(marker.y + marker.height / 2 - clicked.y)).toBeLessThan(4)
    expect(await key.locator('li').allTextContents()).toContain('The place you gave')

    // the typed figures stay the source of truth: typing moves the marker
    await page.getByLabel('Latitude').fill('47.95')
    await page.getByText(/^Marker at 47\.9500° N, /).waitFor(T)

    for (const width of [1440, 390]) {
      await page.setViewportSize({ width, height: 900 })
      await map.scrollIntoViewIfNeeded()
      await screenshot(page, `report-map-${width}`)
      await page.getByRole('region', { name: MAP }).locator('..').locator('..').screenshot({ path: path.join(SCREENSHOTS, `report-map-${width}-map.png`) })
    }
    expect(foreign, 'no request left the service').toEqual([])
    expect(errors).toEqual([])
    await page.context().close()
  })

  it('draws the tiles of a configured tile server under the layers, with its credit as plain text', async () => {
    const { page, errors } = await newPage(app.browser)
    const tiles: string[] = []
    // the region answer as a server with MAP_TILE_URL would give it; tiles from this origin (CSP img-src 'self')
    await page.route('**/api/region', async (route) => {
      const body = await (await route.fetch()).json()
      const basemap = { kind: 'tiles', urlTemplate: `${app.web.baseUrl}/test-tiles/{z}/{x}/{y}.png`, attribution: 'Test tiles © <Example>' }
      await route.fulfill({ status: 200, contentType: 'application/geo+json', body: JSON.stringify({ ...body, basemap }) })
    })
    await page.route('**/test-tiles/**', (route) => {
      tiles.push(route.request().url())
      return route.fulfill({ status: 200, contentType: 'image/png', body: ONE_PIXEL_PNG })
    })
    await page.goto(`${app.web.baseUrl}/report`)
    const map = page.getByRole('region', { name: MAP })
    await map.waitFor(T)
    await expect.poll(() => map.locator('img.leaflet-tile-loaded').count()).toBeGreaterThan(0)
    expect(tiles[0]).toMatch(/\/test-tiles\/\d+\/\d+\/\d+\.png$/)
    expect(await map.locator('.leaflet-control-attribution').textContent()).toBe('Leaflet | Test tiles © <Example>')
    // the land is the tiles' now: no offline land, but the region's boundary and offices stay
    expect(await page.getByRole('list', { name: 'Key to the map' }).locator('li').allTextContents()).toEqual([expect.stringMatching(/^\d+ field offices$/), 'Office area'])
    await page.getByRole('img', { name: 'Boundary of Vellmark Coast' }).waitFor(T)
    expect(errors).toEqual([])
    await page.context().close()
  })

  it('says plainly that no map is set up, and takes a report with typed figures', async () => {
    const { page, errors } = await newPage(app.browser)
    await page.route('**/api/region', (route) => route.fulfill({ status: 200, contentType: 'application/geo+json', body: JSON.stringify({ type: 'FeatureCollection', features: [], basemap: { kind: 'offline' } }) }))
    await page.goto(`${app.web.baseUrl}/report`)
    await page.getByText('No map is set up for this service yet.', { exact: false }).waitFor(T)
    expect(await page.locator('.leaflet-container').count()).toBe(0)

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

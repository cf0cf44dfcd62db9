/**
 * The office editor (/admin/offices/new and /admin/offices/:id/edit): what it sends, what it
 * refuses before sending, and how it shows the server's answers. The API is mocked (msw); the
 * Leaflet map renders in jsdom but is not clicked here: the corner steps the map calls are pure
 * functions, tested below on their own, and the area comes in as an uploaded or pasted GeoJSON.
 */
import { screen, waitFor, within } from '@testing-library/react'
import { describe, expect, it } from 'vitest'
import { areaSchema, type AreaGeometry } from '../../shared/schemas/region'
import { areaCheckResponseSchema, officeSavedResponseSchema, type AreaWarning } from '../../shared/schemas/offices'
import { Component as AdminOfficesPage } from '@/app/routes/admin-offices'
import { Component as NewOfficePage } from '@/app/routes/admin-office-new'
import { Component as EditOfficePage } from '@/app/routes/admin-office-edit'
import { addVertex, moveVertex, removeVertex, verticesAfterKey, withoutLastVertex } from '@/components/map/lib/area-vertices'
import { draftOfArea, draftState, TOO_FEW_CORNERS } from '@/features/offices/lib/area-draft'
import { fieldOfPath, officeInputOf, formValuesOf } from '@/features/offices/lib/office-form'
import { STALE_MESSAGE } from '@/features/offices/components/office-editor'
import { paths } from '@/lib/paths'
import { answer, apiError } from '../support/msw-server'
import { IDS, office, officesResponse, regionMapResponse } from '../support/msw-views'
import { retentionSettingResponse } from '../support/msw-retention'
import { renderPage } from '../support/web-render'

/** A 0.1° × 0.1° box north-east of Tarnwick, as GeoJSON positions [lon, lat]. */
const BOX: [number, number][] = [
  [-31.3, 48.2],
  [-31.2, 48.2],
  [-31.2, 48.3],
  [-31.3, 48.3],
]
const boxArea = (): AreaGeometry => areaSchema.parse({ type: 'Polygon', coordinates: [[...BOX, BOX[0]]] })

const ROUTES = [
  { path: paths.adminOffices.path, Component: AdminOfficesPage },
  { path: paths.adminOfficeNew.path, Component: NewOfficePage },
  { path: paths.adminOfficeEdit.path, Component: EditOfficePage },
]

const editable = (changes: Parameters<typeof office>[0] = {}) => office({ abilities: { setResponseTargets: true, edit: true }, ...changes })

/** The offices page the editor returns to after a save. */
function answerOfficesPage(list = [editable()]) {
  answer('get', '/api/offices', officesResponse(list))
  answer('get', '/api/offices/:id/retention', retentionSettingResponse({ abilities: { set: true } }))
}

function overlap(message: string): AreaWarning {
  return { code: 'area_overlaps', message, otherOfficeId: IDS.orlessOffice, otherOfficeName: 'Orless Field Office', overlapKm2: 12.4 }
}

const geoJsonFile = (name: string, value: unknown) => new File([JSON.stringify(value)], name, { type: 'application/json' })

async function fillNewOffice(user: ReturnType<typeof renderPage>['user']) {
  await user.type(await screen.findByRole('textbox', { name: 'Name' }), 'Brackwater Field Office')
  await user.type(screen.getByRole('textbox', { name: /^Area name/ }), 'Vellmark Coast — north')
  await user.type(screen.getByRole('textbox', { name: /^Postal address/ }), '2 Ferry Lane, Brackwater')
  await user.type(screen.getByRole('textbox', { name: 'Latitude (°)' }), '48.25')
  await user.type(screen.getByRole('textbox', { name: 'Longitude (°)' }), '-31.25')
  await user.selectOptions(screen.getByRole('combobox', { name: 'Time zone' }), 'Atlantic/Azores')
}

describe('a new office', () => {
  it('sends the typed details and the uploaded file’s polygon, then shows the office’s page with the saved notice', async () => {
    answer('get', '/api/region', regionMapResponse())
    const checks = answer('post', '/api/admin/offices/check-area', areaCheckResponseSchema.parse({ areaKm2: 82.7, warnings: [] }))
    const created = editable({ id: IDS.orlessOffice, name: 'Brackwater Field Office', area: boxArea() })
    const posts = answer('post', '/api/admin/offices', officeSavedResponseSchema.parse({ office: created, warnings: [] }), { status: 201 })
    answerOfficesPage([editable(), created])
    const { user, currentUrl } = renderPage({ url: paths.adminOfficeNew.href(), routes: ROUTES })

    await fillNewOffice(user)
    const file = geoJsonFile('brackwater.geojson', { type: 'Feature', properties: { name: 'north' }, geometry: { type: 'Polygon', coordinates: [[...BOX, BOX[0]]] } })
    await user.upload(screen.getByLabelText('Or upload a GeoJSON file'), file)
    expect(await screen.findByText('4 corners, from brackwater.geojson.')).toBeInTheDocument()

    // the size shown against a sphere's latitude–longitude rectangle, A = R²·Δλ·(sin φ₂ − sin φ₁)
    // (spherical geometry, recalled from memory; R = 6371 km, the mean radius): within 0.5 %,
    // the gap between the mean and the equatorial radius turf uses
    const km2 = Number(/Size: ([\d.,]+) km²/.exec(screen.getByText(/^Size:/).textContent ?? '')?.[1]?.replace(',', ''))
    const rad = Math.PI / 180
    const expectedKm2 = 6371 ** 2 * (0.1 * rad) * (Math.sin(48.3 * rad) - Math.sin(48.2 * rad))
    expect(Math.abs(km2 - expectedKm2) / expectedKm2).toBeLessThan(0.005)

    expect(await screen.findByText('No overlap with other offices’ areas.', {}, { timeout: 3000 })).toBeInTheDocument()
    expect(checks.at(-1)?.body).toEqual({ area: boxArea(), latDeg: 48.25, lonDeg: -31.25 })

    await user.click(screen.getByRole('button', { name: 'Create the office' }))
    await screen.findByText('Created: Brackwater Field Office.')
    expect(posts).toHaveLength(1)
    expect(posts[0]!.body).toEqual({
      name: 'Brackwater Field Office',
      regionName: 'Vellmark Coast — north',
      address: '2 Ferry Lane, Brackwater',
      latDeg: 48.25,
      lonDeg: -31.25,
      timeZone: 'Atlantic/Azores',
      area: boxArea(),
    })
    expect(currentUrl()).toBe(paths.adminOffices.href(IDS.orlessOffice))
  })

  it('refuses a file holding a line, beside the file field, and sends nothing', async () => {
    answer('get', '/api/region', regionMapResponse())
    const { user } = renderPage({ url: paths.adminOfficeNew.href(), routes: ROUTES })
    const input = await screen.findByLabelText('Or upload a GeoJSON file')
    await user.upload(input, geoJsonFile('coast-road.json', { type: 'LineString', coordinates: BOX }))
    const message = 'The file holds a LineString; an office area must be a Polygon or MultiPolygon.'
    expect(await screen.findByText(message)).toBeInTheDocument()
    expect(input).toHaveAccessibleDescription(expect.stringContaining(message))
    expect(input).toHaveAttribute('aria-invalid', 'true')
    expect(screen.getByText('No corners yet.')).toBeInTheDocument()
    expect(screen.queryByText(/^Size:/)).not.toBeInTheDocument()
    // no handler answers check-area or a save: any request would fail the test (web-setup)
    await new Promise((r) => setTimeout(r, 800))
  })

  it('marks an outline that crosses itself and does not save it', async () => {
    answer('get', '/api/region', regionMapResponse())
    const { user } = renderPage({ url: paths.adminOfficeNew.href(), routes: ROUTES })
    await fillNewOffice(user)
    await user.click(screen.getByText('Or paste GeoJSON'))
    // a bow tie: its two long edges cross at the middle, 48.25° N, 31.25° W
    const bowTie = { type: 'Polygon', coordinates: [[[-31.3, 48.2], [-31.2, 48.3], [-31.2, 48.2], [-31.3, 48.3], [-31.3, 48.2]]] }
    await user.click(screen.getByRole('textbox', { name: 'GeoJSON text' }))
    await user.paste(JSON.stringify(bowTie))
    await user.click(screen.getByRole('button', { name: 'Use this GeoJSON' }))
    const message = 'The outline crosses itself near 48.25° N, 31.25° W; move the corners so no two edges cross.'
    expect(await screen.findByText(message)).toBeInTheDocument()
    expect(screen.queryByText(/^Size:/)).not.toBeInTheDocument()
    const map = await screen.findByRole('region', { name: 'Map: the area and position of the new office' }, { timeout: 10_000 })
    expect(await within(map).findByRole('img', { name: 'The outline crosses itself near 48.25° N, 31.25° W' })).toBeInTheDocument()

    await user.click(screen.getByRole('button', { name: 'Create the office' }))
    expect(screen.getByText(message)).toBeInTheDocument()
    expect(screen.getByRole('button', { name: 'Create the office' })).toBeInTheDocument()
    // nothing answers a save or a check: a request would fail the test (web-setup)
    await new Promise((r) => setTimeout(r, 800))
  })
})

describe('editing an office', () => {
  function renderEdit(changes: Parameters<typeof office>[0] = {}) {
    answer('get', '/api/region', regionMapResponse())
    answer('get', '/api/offices/:id', { office: editable({ area: boxArea(), version: 3, ...changes }) })
    return renderPage({ url: paths.adminOfficeEdit.href(IDS.tarnwickOffice), routes: ROUTES })
  }

  it('shows the overlaps the server finds in the area, in its words', async () => {
    const said = 'Overlaps Orless Field Office’s area by 12.4 km². A report filed in the overlap goes to whichever office is nearer to the place.'
    const checks = answer('post', '/api/admin/offices/check-area', areaCheckResponseSchema.parse({ areaKm2: 82.7, warnings: [overlap(said)] }))
    renderEdit()
    expect(await screen.findByText(said, {}, { timeout: 3000 })).toBeInTheDocument()
    expect(checks[0]!.body).toEqual({ area: boxArea(), latDeg: 48.1, lonDeg: -31.4, officeId: IDS.tarnwickOffice })
  })

  it('draws the saved area’s corners on the map as buttons, and the office once (the region map’s copy left out)', async () => {
    answer('post', '/api/admin/offices/check-area', areaCheckResponseSchema.parse({ areaKm2: 82.7, warnings: [] }))
    const { user } = renderEdit()
    const map = await screen.findByRole('region', { name: 'Map: the area and position of Tarnwick Field Office' }, { timeout: 10_000 })
    const corners = await within(map).findAllByRole('button', { name: /^Corner \d of 4, / })
    expect(corners).toHaveLength(4)
    expect(corners[0]).toHaveAccessibleName('Corner 1 of 4, 48.2000° N, 31.3000° W. Arrow keys move it; Delete removes it.')
    expect(within(map).getAllByRole('img', { name: 'Tarnwick Field Office office' })).toHaveLength(1)
    // Delete on a focused corner removes it: the form counts three
    corners[3]!.focus()
    await user.keyboard('{Delete}')
    expect(await screen.findByText('3 corners.')).toBeInTheDocument()
    expect(await within(map).findAllByRole('button', { name: /^Corner \d of 3, / })).toHaveLength(3)
  })

  it('puts a 400’s field message beside its field, and sends the version it read', async () => {
    answer('post', '/api/admin/offices/check-area', areaCheckResponseSchema.parse({ areaKm2: 82.7, warnings: [] }))
    const puts = answer('put', '/api/admin/offices/:id', () =>
      apiError(400, { code: 'validation_failed', message: 'Some fields need attention.', details: [{ path: 'timeZone', message: 'Choose a time zone from the list (a name such as Atlantic/Azores).' }] }),
    )
    const { user } = renderEdit()
    await user.click(await screen.findByRole('button', { name: 'Save the office' }))
    const select = screen.getByRole('combobox', { name: 'Time zone' })
    await waitFor(() => expect(select).toHaveAccessibleDescription(expect.stringContaining('Choose a time zone from the list (a name such as Atlantic/Azores).')))
    expect(puts[0]!.url.pathname).toBe(`/api/admin/offices/${IDS.tarnwickOffice}`)
    expect(puts[0]!.body).toMatchObject({ name: 'Tarnwick Field Office', version: 3, area: boxArea(), latDeg: 48.1, lonDeg: -31.4 })
  })

  it('says someone else saved first on a 409 stale_version', async () => {
    answer('post', '/api/admin/offices/check-area', areaCheckResponseSchema.parse({ areaKm2: 82.7, warnings: [] }))
    answer('put', '/api/admin/offices/:id', () => apiError(409, { code: 'stale_version', message: 'Someone else saved this office a moment ago.' }))
    const { user } = renderEdit()
    await user.click(await screen.findByRole('button', { name: 'Save the office' }))
    expect(await screen.findByText(STALE_MESSAGE)).toBeInTheDocument()
    expect(STALE_MESSAGE).toBe('Someone saved this office while you were editing; reload to see their change.')
  })

  it('returns to the office with the saved area’s warnings', async () => {
    const said = 'Overlaps Orless Field Office’s area by 12.4 km².'
    answer('post', '/api/admin/offices/check-area', areaCheckResponseSchema.parse({ areaKm2: 82.7, warnings: [] }))
    answer('put', '/api/admin/offices/:id', officeSavedResponseSchema.parse({ office: editable({ area: boxArea(), version: 4 }), warnings: [overlap(said)] }))
    answerOfficesPage()
    const { user, currentUrl } = renderEdit()
    await user.click(await screen.findByRole('button', { name: 'Save the office' }))
    expect(await screen.findByText('Saved: Tarnwick Field Office.')).toBeInTheDocument()
    expect(screen.getByText(said)).toBeInTheDocument()
    expect(currentUrl()).toBe(paths.adminOffices.href(IDS.tarnwickOffice))
  })
})

describe('the offices page’s actions', () => {
  it('offers a new office, and the chosen office’s editor only where the server allows it', async () => {
    answerOfficesPage([editable(), office({ id: IDS.orlessOffice, name: 'Orless Field Office', abilities: { setResponseTargets: true, edit: false } })])
    const { user } = renderPage({ url: paths.adminOffices.href(), routes: ROUTES })
    expect(await screen.findByRole('link', { name: 'New office' })).toHaveAttribute('href', paths.adminOfficeNew.href())
    expect(screen.getByRole('link', { name: 'Edit details and area of Tarnwick Field Office' })).toHaveAttribute('href', paths.adminOfficeEdit.href(IDS.tarnwickOffice))
    await user.selectOptions(screen.getByRole('combobox', { name: 'Settings of the office' }), 'Orless Field Office')
    await screen.findByRole('heading', { name: /Targets and time zone — Orless Field Office/ })
    expect(screen.queryByRole('link', { name: /^Edit details and area/ })).not.toBeInTheDocument()
  })
})

describe('the area editor’s corner steps', () => {
  const a = { latDeg: 48.2, lonDeg: -31.3 }
  const b = { latDeg: 48.2, lonDeg: -31.2 }
  const c = { latDeg: 48.3, lonDeg: -31.2 }

  it('add a corner at the end, rounded to 4 decimals, and leave the given list as it was', () => {
    const before = [a, b]
    expect(addVertex(before, { latDeg: 48.300004, lonDeg: -31.199996 })).toEqual([a, b, c])
    expect(before).toEqual([a, b])
  })

  it('move, remove and undo corners', () => {
    expect(moveVertex([a, b, c], 1, { latDeg: 48.25, lonDeg: -31.15 })).toEqual([a, { latDeg: 48.25, lonDeg: -31.15 }, c])
    expect(removeVertex([a, b, c], 0)).toEqual([b, c])
    expect(withoutLastVertex([a, b, c])).toEqual([a, b])
    expect(withoutLastVertex([])).toEqual([])
  })

  it('move a focused corner by one step per arrow key, remove it with Delete, and ignore other keys', () => {
    const step = { latDeg: 0.01, lonDeg: 0.02 }
    expect(verticesAfterKey([a, b], 0, 'ArrowUp', step)).toEqual([{ latDeg: 48.21, lonDeg: -31.3 }, b])
    expect(verticesAfterKey([a, b], 0, 'ArrowLeft', step)).toEqual([{ latDeg: 48.2, lonDeg: -31.32 }, b])
    expect(verticesAfterKey([a, b], 1, 'Delete', step)).toEqual([a])
    expect(verticesAfterKey([a, b], 1, 'Enter', step)).toBeNull()
    expect(verticesAfterKey([{ latDeg: 89.995, lonDeg: 179.99 }], 0, 'ArrowUp', step)).toEqual([{ latDeg: 90, lonDeg: 179.99 }])
    expect(verticesAfterKey([{ latDeg: 0, lonDeg: 179.99 }], 0, 'ArrowRight', step)).toEqual([{ latDeg: 0, lonDeg: -179.99 }])
  })
})

describe('the area draft', () => {
  it('asks for a third corner, finds where a bow tie crosses, and measures a good outline', () => {
    expect(draftState({ kind: 'corners', vertices: [] })).toMatchObject({ area: null, problem: null })
    expect(draftState({ kind: 'corners', vertices: [{ latDeg: 48.2, lonDeg: -31.3 }, { latDeg: 48.2, lonDeg: -31.2 }] })).toMatchObject({ area: undefined, problem: TOO_FEW_CORNERS })
    // the diagonals of the square cross at its centre (by symmetry)
    const bowTie = draftState({ kind: 'corners', vertices: [{ latDeg: 48.2, lonDeg: -31.3 }, { latDeg: 48.3, lonDeg: -31.2 }, { latDeg: 48.2, lonDeg: -31.2 }, { latDeg: 48.3, lonDeg: -31.3 }] })
    expect(bowTie.area).toBeUndefined()
    expect(bowTie.crossings).toHaveLength(1)
    expect(bowTie.crossings[0]!.latDeg).toBeCloseTo(48.25, 9)
    expect(bowTie.crossings[0]!.lonDeg).toBeCloseTo(-31.25, 9)
    expect(bowTie.km2).toBeNull()
    const box = draftState(draftOfArea(boxArea()))
    expect(box.area).toEqual(boxArea())
    expect(box.problem).toBeNull()
    expect(box.km2).toBeGreaterThan(0)
  })

  it('keeps an area of several parts as it is, to be shown and replaced only by upload', () => {
    const multi = areaSchema.parse({ type: 'MultiPolygon', coordinates: [[[...BOX, BOX[0]]], [[[-31.0, 48.0], [-30.9, 48.0], [-30.9, 48.1], [-31.0, 48.0]]]] })
    expect(draftOfArea(multi)).toEqual({ kind: 'fixed', area: multi })
    expect(draftState(draftOfArea(multi)).area).toEqual(multi)
  })
})

describe('the office form’s request', () => {
  it('reads typed degrees strictly and names every field in trouble', () => {
    const values = { ...formValuesOf(null, 'Atlantic/Azores'), latDeg: '0x30', lonDeg: '' }
    const built = officeInputOf(values, { area: undefined, problem: TOO_FEW_CORNERS })
    expect('errors' in built && Object.keys(built.errors).sort()).toEqual(['area', 'latDeg', 'lonDeg', 'name'])
  })

  it('builds the body from good values, the position as numbers', () => {
    const values = { name: ' Brackwater ', regionName: '', address: '', latDeg: '48.25°', lonDeg: '−31.25', timeZone: 'Atlantic/Azores' }
    expect(officeInputOf(values, { area: null, problem: null })).toEqual({ input: { name: 'Brackwater', regionName: '', address: '', latDeg: 48.25, lonDeg: -31.25, timeZone: 'Atlantic/Azores', area: null } })
  })

  it('places a server issue’s path on its field', () => {
    expect(fieldOfPath('area.coordinates.0')).toBe('area')
    expect(fieldOfPath('timeZone')).toBe('timeZone')
    expect(fieldOfPath('version')).toBeNull()
  })
})

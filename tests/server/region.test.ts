/**
 * The public region map (GET /api/region): the demo region's outline, coast and place names,
 * and each office's point and area, as GeoJSON; nothing private about offices.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { regionMapSchema, regionSchema, type RegionMap } from '../../shared/schemas/region'
import { createDb } from '../../server/db/client'
import { createApp } from '../../server/app'
import { ConfigError, loadEnv, tileOrigin } from '../../server/config/env'
import { presentRegionMap, saveRegion } from '../../server/modules/regions/regions.service'
import { DEMO_OFFICES } from '../../ops/seed-demo'
import { DEMO_OFFICE_AREAS, DEMO_REGION_MAP, seedDemoRegion } from '../../ops/seed-demo-region'
import { boxOfGeometries, positionsOf } from '../../web/src/components/map/lib/map-box'
import { createTestContext, uniqueAddress, type TestContext } from '../support/harness'
import { makeOffice, makeUser, signIn } from '../support/factories'

let t: TestContext
beforeAll(async () => {
  t = await createTestContext()
})
afterAll(() => t.close())

const anonymous = () => request.agent(t.app).set('X-Forwarded-For', uniqueAddress())
const kinds = (map: RegionMap) => map.features.map((f) => f.properties.kind)

/**
 * Runs `look` until the map did not change while it ran (other test files add offices, and
 * each office is on the public map), at most five times; returns the last run's result.
 */
async function whileMapHoldsStill<T>(look: () => Promise<T>): Promise<{ result: T; stable: boolean }> {
  let result: T | undefined
  for (let attempt = 0; attempt < 5; attempt++) {
    const before = (await anonymous().get('/api/region')).headers.etag
    result = await look()
    if ((await anonymous().get('/api/region')).headers.etag === before) return { result, stable: true }
  }
  return { result: result!, stable: false }
}

describe('GET /api/region', () => {
  it('answers anyone, signed in or not, with a FeatureCollection the shared schema accepts', async () => {
    const res = await anonymous().get('/api/region')
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toMatch(/^application\/geo\+json/)
    const map = regionMapSchema.parse(res.body)
    const region = map.features.find((f) => f.properties.kind === 'region')
    expect(region?.properties).toEqual({ kind: 'region', name: 'Vellmark Coast' })
    expect(region?.geometry).toEqual(DEMO_REGION_MAP.outline)
    expect(kinds(map).filter((k) => k === 'coast')).toHaveLength(1)
    expect(kinds(map).filter((k) => k === 'place')).toHaveLength(DEMO_REGION_MAP.places.length)

    const staff = await signIn(t, await makeUser(t, { role: 'supervisor', office: await makeOffice(t) }))
    const { result, stable } = await whileMapHoldsStill(async () => [(await anonymous().get('/api/region')).body, (await staff.get('/api/region')).body])
    expect(stable, 'the map held still for one look').toBe(true)
    expect(result[1]).toEqual(result[0])
  })

  it('gives each office its point and its area', async () => {
    const map = regionMapSchema.parse((await anonymous().get('/api/region')).body)
    for (const office of DEMO_OFFICES) {
      const point = map.features.find((f) => f.properties.kind === 'office' && f.properties.name === office.name)
      expect(point?.geometry).toEqual({ type: 'Point', coordinates: [office.centreLonDeg, office.centreLatDeg] })
      const area = map.features.find((f) => f.properties.kind === 'office_area' && f.properties.name === office.name)
      expect(area?.geometry).toEqual(DEMO_OFFICE_AREAS[office.name])
    }
  })

  it('tells nothing private about offices: no ids, response targets, region labels or staff', async () => {
    const res = await anonymous().get('/api/region')
    const { rows } = await t.pool.query<{ id: string }>('SELECT id FROM offices')
    // a person who shares an office's name (other test files make both from the same odd strings) is not a leak
    const { rows: staff } = await t.pool.query<{ email: string; name: string }>(`SELECT email, name FROM users WHERE role <> 'complainant' AND name NOT IN (SELECT name FROM offices)`)
    for (const f of (res.body as RegionMap).features.filter((x) => x.properties.kind.startsWith('office'))) {
      expect(Object.keys(f.properties).sort()).toEqual(['kind', 'name'])
    }
    for (const secret of [...rows.map((r) => r.id), ...staff.flatMap((s) => [s.email, s.name]), 'target', 'Hours', 'regionName', 'Vellmark Coast — north']) {
      expect(res.text).not.toContain(secret)
    }
  })

  it('may be kept for five minutes by browsers and proxies, sets no cookie, and answers 304 to a matching ETag', async () => {
    const res = await anonymous().get('/api/region')
    expect(res.headers['cache-control']).toBe('public, max-age=300')
    expect(res.headers['set-cookie']).toBeUndefined()
    expect(res.headers.etag).toBeTruthy()
    const { result: again, stable } = await whileMapHoldsStill(async () => {
      const first = await anonymous().get('/api/region')
      return anonymous().get('/api/region').set('If-None-Match', first.headers.etag!)
    })
    expect(stable, 'the map held still for one look').toBe(true)
    expect(again.status).toBe(304)
  })

  it('holds only the offices while no region is set up (the web then shows no map)', () => {
    const map = presentRegionMap(null, [{ name: 'Upland', centreLatDeg: 10, centreLonDeg: 20, area: null }])
    expect(regionMapSchema.parse(map)).toEqual({
      type: 'FeatureCollection',
      features: [{ type: 'Feature', geometry: { type: 'Point', coordinates: [20, 10] }, properties: { kind: 'office', name: 'Upland' } }],
      basemap: { kind: 'offline' },
    })
  })

  it('names the offline basemap while no tile server is configured', async () => {
    const res = await anonymous().get('/api/region')
    expect(res.body.basemap).toEqual({ kind: 'offline' })
    expect(res.headers['content-security-policy']).toMatch(/img-src 'self' data: blob:;/)
  })

  it('names the configured tile server and its credit, and lets the browser load its tiles (CSP img-src)', async () => {
    const mapTiles = { urlTemplate: 'https://{s}.tiles.example.org/base/{z}/{x}/{y}.png', attribution: 'Map data © Example <contributors>' }
    const handle = createApp({ pool: t.pool, boss: t.boss, sessionSecret: 'test-session-secret-that-is-long-enough-0123', publicUrl: 'http://127.0.0.1:3999', trustProxy: 1, mapTiles })
    try {
      const res = await request(handle.app).get('/api/region').set('X-Forwarded-For', uniqueAddress())
      expect(res.status).toBe(200)
      expect(regionMapSchema.parse(res.body).basemap).toEqual({ kind: 'tiles', ...mapTiles })
      expect(res.headers['content-security-policy']).toContain("img-src 'self' data: blob: https://*.tiles.example.org;")
    } finally {
      handle.close()
    }
  })
})

describe('region data on write', () => {
  it('refuses a region whose outline is not an area, and writes nothing', async () => {
    const before = await t.pool.query('SELECT name, outline, updated_at FROM region')
    const bad = { ...DEMO_REGION_MAP, outline: { type: 'Point', coordinates: [-31, 48] } } as unknown as typeof DEMO_REGION_MAP
    await expect(saveRegion(createDb(t.pool), bad)).rejects.toThrow(/Polygon or MultiPolygon/)
    expect((await t.pool.query('SELECT name, outline, updated_at FROM region')).rows).toEqual(before.rows)
  })

  it('refuses an open ring and a position off the globe', () => {
    const open = { type: 'Polygon', coordinates: [[[-31, 47], [-30, 47], [-30, 48], [-31, 48]]] }
    expect(regionSchema.safeParse({ ...DEMO_REGION_MAP, coast: open }).success).toBe(false)
    const offGlobe = { type: 'Polygon', coordinates: [[[-31, 47], [-30, 97], [-30, 48], [-31, 47]]] }
    expect(regionSchema.safeParse({ ...DEMO_REGION_MAP, outline: offGlobe }).error?.issues[0]?.message).toMatch(/latitude −90 to 90/)
  })

  it('keeps an office’s area a Polygon or MultiPolygon in the database too (the application role is refused a Point)', async () => {
    const client = await t.pool.connect()
    try {
      await client.query('BEGIN')
      await expect(client.query(`UPDATE offices SET area = '{"type":"Point","coordinates":[-31,48]}'::jsonb`)).rejects.toMatchObject({ code: '23514' })
    } finally {
      await client.query('ROLLBACK')
      client.release()
    }
  })
})

describe('the demo region', () => {
  const box = boxOfGeometries([DEMO_REGION_MAP.outline])!
  const inside = ([lon, lat]: [number, number]) => lat >= box.southDeg && lat <= box.northDeg && lon >= box.westDeg && lon <= box.eastDeg
  // The areas were split on an equirectangular drawing of the box (standard parallel at its
  // middle): x = (λ − λ0)·cos φ1, y = φ, in degrees.
  const cosPhi1 = Math.cos((((box.southDeg + box.northDeg) / 2) * Math.PI) / 180)
  const project = (p: { latDeg: number; lonDeg: number }) => ({ x: (p.lonDeg - box.westDeg) * cosPhi1, y: p.latDeg })

  it('passes the shared schema, and its coast, places and office areas lie inside its outline’s box', () => {
    expect(regionSchema.parse(DEMO_REGION_MAP)).toEqual(DEMO_REGION_MAP)
    expect(box).toEqual({ southDeg: 47.2, northDeg: 48.6, westDeg: -32.2, eastDeg: -29.8 })
    const positions = [DEMO_REGION_MAP.coast, ...DEMO_REGION_MAP.places.map((p) => p.point), ...Object.values(DEMO_OFFICE_AREAS)].flatMap((g) => positionsOf(g.coordinates))
    expect(positions.length).toBeGreaterThan(40)
    for (const p of positions) expect(inside(p), String(p)).toBe(true)
  })

  it('is added to a demo database seeded before the region map, and never written twice', async () => {
    const client = await t.pool.connect()
    try {
      await client.query('BEGIN')
      const db = createDb(client)
      expect(await seedDemoRegion(db)).toBe(false)
      await client.query('DELETE FROM region')
      await client.query('UPDATE offices SET area = NULL')
      expect(await seedDemoRegion(db)).toBe(true)
      const { rows } = await client.query<{ name: string; area: unknown }>('SELECT name, area FROM offices ORDER BY name')
      expect(rows.filter((r) => r.name in DEMO_OFFICE_AREAS)).toEqual(Object.entries(DEMO_OFFICE_AREAS).map(([name, area]) => ({ name, area })))
      expect((await client.query('SELECT name FROM region')).rows).toEqual([{ name: 'Vellmark Coast' }])
    } finally {
      await client.query('ROLLBACK')
      client.release()
    }
  })

  it('splits the offices’ areas where both offices are equally far on the map (the nearest-office rule)', () => {
    const [harrowmere, kestrel] = DEMO_OFFICES.map((o) => project({ latDeg: o.centreLatDeg, lonDeg: o.centreLonDeg }))
    const shared = positionsOf(DEMO_OFFICE_AREAS.Harrowmere!.coordinates).filter(([lon, lat]) =>
      positionsOf(DEMO_OFFICE_AREAS['Kestrel Bay']!.coordinates).some(([lon2, lat2]) => lon === lon2 && lat === lat2),
    )
    expect(new Set(shared.map(String)).size).toBe(2)
    for (const [lon, lat] of shared) {
      const p = project({ latDeg: lat, lonDeg: lon })
      const toH = Math.hypot(p.x - harrowmere!.x, p.y - harrowmere!.y)
      const toK = Math.hypot(p.x - kestrel!.x, p.y - kestrel!.y)
      // the split's positions are written to 0.001°
      expect(Math.abs(toH - toK)).toBeLessThan(0.003)
    }
  })
})

describe('map tile configuration (MAP_TILE_URL, MAP_TILE_ATTRIBUTION)', () => {
  const complete = {
    PUBLIC_URL: 'http://127.0.0.1:3000',
    DATABASE_URL: 'postgres://u:p@127.0.0.1:5432/db',
    SESSION_SECRET: 'x'.repeat(40),
    S3_BUCKET: 'evidence',
    S3_ACCESS_KEY_ID: 'key',
    S3_SECRET_ACCESS_KEY: 'secret',
    SMTP_URL: 'smtp://127.0.0.1:2525',
  }

  it('is optional: unset, the offline basemap is used', () => {
    expect(loadEnv(complete).MAP_TILE_URL).toBeUndefined()
  })

  it('takes an http(s) template with {z}, {x} and {y} and a credit', () => {
    const env = loadEnv({ ...complete, MAP_TILE_URL: 'https://tiles.example.org/{z}/{x}/{y}.png', MAP_TILE_ATTRIBUTION: 'Map data © Example' })
    expect(env.MAP_TILE_URL).toBe('https://tiles.example.org/{z}/{x}/{y}.png')
    expect(tileOrigin(env.MAP_TILE_URL!)).toBe('https://tiles.example.org')
    expect(tileOrigin('http://{s}.tiles.example.org:8080/{z}/{x}/{y}.png')).toBe('http://*.tiles.example.org:8080')
  })

  it.each([
    ['a template without {y}', { MAP_TILE_URL: 'https://tiles.example.org/{z}/{x}.png', MAP_TILE_ATTRIBUTION: 'Credit' }, /MAP_TILE_URL:/],
    ['a non-http template', { MAP_TILE_URL: 'ftp://tiles.example.org/{z}/{x}/{y}.png', MAP_TILE_ATTRIBUTION: 'Credit' }, /MAP_TILE_URL:/],
    ['a template without its credit', { MAP_TILE_URL: 'https://tiles.example.org/{z}/{x}/{y}.png' }, /MAP_TILE_ATTRIBUTION:/],
  ])('refuses %s, naming the variable', (_what, change, name) => {
    expect(() => loadEnv({ ...complete, ...change })).toThrow(ConfigError)
    expect(() => loadEnv({ ...complete, ...change })).toThrow(name)
  })
})

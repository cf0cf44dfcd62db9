/**
 * The API document served at GET /api/openapi.json: a valid OpenAPI 3.1 document that lists
 * exactly the app's routes, and whose answer check (expectAnswerMatchesDocument, which the
 * route × role matrix runs on every call) refuses a body that does not fit.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import fs from 'node:fs'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import request from 'supertest'
import { z } from 'zod'
import { Validator } from '@seriousme/openapi-schema-validator'
import { createTestContext, type TestContext } from '../support/harness'
import { listRoutes } from '../support/routes'
import { makeCase, makeOffice, makeUser, signIn } from '../support/factories'
import { compileDocumentAnswers, documentedRouteOf, expectAnswerFitsItsRoute, expectAnswerMatchesDocument } from '../support/api-document'
import { buildApiDocument, type ApiDocument } from '../../server/openapi/document'
import type { ApiOperation } from '../../server/openapi/operation'
import { caseResponseSchema } from '../../shared/schemas/views'

const METHODS = ['get', 'put', 'post', 'patch', 'delete'] as const

/** 'GET /api/cases/:id' for every operation of the document. */
function documentedRoutes(document: ApiDocument): string[] {
  const out: string[] = []
  for (const [p, item] of Object.entries(document.paths ?? {})) {
    for (const m of METHODS) if (item[m]) out.push(`${m.toUpperCase()} ${p.replace(/\{(\w+)\}/g, ':$1')}`)
  }
  return out.sort()
}

/** Answer fields the document leaves blank (`{}`: any value), e.g. a `z.unknown()` in a view schema. */
function blankAnswerFields(doc: ApiDocument): string[] {
  const blank: string[] = []
  const walk = (schema: unknown, where: string): void => {
    if (!schema || typeof schema !== 'object') return
    if (Array.isArray(schema)) return schema.forEach((s, i) => walk(s, `${where}/${i}`))
    const o = schema as Record<string, unknown>
    for (const [name, field] of Object.entries((o.properties ?? {}) as Record<string, object>)) {
      if (Object.keys(field).length === 0) blank.push(`${where}.${name}`)
      walk(field, `${where}.${name}`)
    }
    for (const key of ['items', 'prefixItems', 'anyOf', 'oneOf', 'allOf', 'additionalProperties']) walk(o[key], `${where}/${key}`)
  }
  for (const [p, item] of Object.entries(doc.paths ?? {})) {
    for (const m of METHODS) {
      for (const [status, answer] of Object.entries(item[m]?.responses ?? {})) {
        for (const media of Object.values((answer as { content?: Record<string, { schema?: unknown }> }).content ?? {})) walk(media.schema, `${m} ${p} ${status}`)
      }
    }
  }
  walk(Object.values(doc.components?.schemas ?? {}), 'components')
  return blank
}

let t: TestContext
let document: ApiDocument

beforeAll(async () => {
  t = await createTestContext()
  const res = await request(t.app).get('/api/openapi.json')
  expect(res.status).toBe(200)
  document = res.body as ApiDocument
})
afterAll(() => t.close())

describe('GET /api/openapi.json', () => {
  it('is a valid OpenAPI 3.1 document', async () => {
    const result = await new Validator().validate(structuredClone(document) as unknown as Record<string, unknown>)
    expect(result.errors ?? [], JSON.stringify(result.errors, null, 1)?.slice(0, 4000)).toEqual([])
    expect(result.valid).toBe(true)
    expect(document.openapi).toMatch(/^3\.1\./)
  })

  it('lists every route of the app', () => {
    const documented = new Set(documentedRoutes(document))
    expect(listRoutes(t.handle.api).filter((r) => !documented.has(r))).toEqual([])
  })

  it('lists only routes the app has', () => {
    const routes = new Set(listRoutes(t.handle.api))
    expect(documentedRoutes(document).filter((r) => !routes.has(r))).toEqual([])
  })

  it('lists every route of the route × role matrix', () => {
    // the matrix's rows, read from its source: a route it calls must be documented
    const matrixFile = path.join(path.dirname(fileURLToPath(import.meta.url)), 'route-role-matrix.test.ts')
    const matrixRoutes = [...fs.readFileSync(matrixFile, 'utf8').matchAll(/route: '((?:GET|POST|PUT|PATCH|DELETE) \/api\/[^']*)'/g)].map((m) => m[1])
    expect(matrixRoutes.length).toBeGreaterThan(50)
    const documented = new Set(documentedRoutes(document))
    expect(matrixRoutes.filter((r) => !documented.has(r))).toEqual([])
  })

  it('is the same document the server builds, and public to cache', async () => {
    expect(document).toEqual(JSON.parse(JSON.stringify(buildApiDocument())))
    const res = await request(t.app).get('/api/openapi.json')
    expect(res.headers['cache-control']).toMatch(/^public, max-age=\d+$/)
    expectAnswerMatchesDocument('GET', '/api/openapi.json', res)
  })

  it('describes the session cookie, who may call, and the one error body', () => {
    expect(document.components?.securitySchemes?.session).toEqual(expect.objectContaining({ type: 'apiKey', in: 'cookie', name: 'qb.sid' }))
    const triage = document.paths?.['/api/cases/{id}/triage']?.post
    expect(triage?.security).toEqual([{ session: [] }])
    expect((triage as Record<string, unknown>)['x-callers']).toEqual(['investigator', 'supervisor', 'admin'])
    expect(Object.keys(triage?.responses ?? {})).toEqual(expect.arrayContaining(['200', '400', '401', '403', '404', '409', 'default']))
    expect(document.paths?.['/api/reports']?.post?.security).toBeUndefined()
    const errorRef = { $ref: '#/components/schemas/ApiError' }
    expect(triage?.responses?.default).toEqual(expect.objectContaining({ content: { 'application/json': { schema: errorRef } } }))
    expect(document.components?.schemas?.ApiError).toBeDefined()
  })

  it('writes requests as their input side and answers as their output side', () => {
    const query = document.paths?.['/api/admin/audit']?.get?.parameters ?? []
    // `from` is a string in the URL (the schema turns it into a Date after parsing)
    expect(query).toContainEqual(expect.objectContaining({ in: 'query', name: 'from', schema: expect.objectContaining({ type: 'string' }) }))
    // the case is a named component of the document; its instants are date-time strings
    const caseAnswer = JSON.stringify(document.paths?.['/api/cases/{id}']?.get?.responses?.['200'])
    expect(caseAnswer).toContain('"$ref":"#/components/schemas/CaseDetail"')
    expect(JSON.stringify(document.components?.schemas?.CaseDetail)).toContain('"format":"date-time"')
    expect(document.paths?.['/api/cases/export.csv']?.get?.responses?.['200']).toEqual(
      expect.objectContaining({ content: { 'text/csv': { schema: expect.objectContaining({ type: 'string', format: 'binary' }) } } }),
    )
    expect(document.paths?.['/api/me/saved-views/{id}']?.delete?.responses?.['204']).not.toHaveProperty('content')
  })

  it('gives every answer field a type, and refuses a transform in an answer', () => {
    expect(blankAnswerFields(document)).toEqual([])
    // the check sees a blank field when there is one
    const things = (answer: z.ZodType): ApiOperation => ({ method: 'get', path: '/api/things', summary: 'Things', tag: 'Test', callers: ['admin'], responses: { 200: answer } })
    expect(blankAnswerFields(buildApiDocument([things(z.object({ data: z.unknown() }))]))).toEqual(['get /api/things 200.data'])
    // an answer is its schema's output side: a transform there has no shape to show
    expect(() => buildApiDocument([things(z.object({ count: z.string().transform((v) => v.length) }))])).toThrow(/transform/i)
  })

  it('writes a multipart upload as multipart/form-data with binary file fields', () => {
    const upload: ApiOperation = {
      method: 'post',
      path: '/api/things/:id/files',
      summary: 'Upload',
      tag: 'Test',
      callers: ['admin'],
      params: z.object({ id: z.uuid() }),
      body: { multipart: z.object({ kind: z.enum(['photo', 'trace']) }), files: ['file'] },
      responses: { 201: caseResponseSchema },
    }
    const doc = buildApiDocument([upload])
    const schema = doc.paths?.['/api/things/{id}/files']?.post?.requestBody
    expect(JSON.stringify(schema)).toContain('"multipart/form-data"')
    expect(JSON.stringify(schema)).toContain('"file":{"type":"string","format":"binary"')
    expect(() => buildApiDocument([{ ...upload, params: undefined }])).toThrow(/path's parameters/)
  })
})

describe('expectAnswerMatchesDocument', () => {
  it('compiles every JSON answer schema of the document strictly (unknown keywords and formats fail)', () => {
    expect(compileDocumentAnswers(document)).toBeGreaterThan(200)
  })

  it('passes a real case answer and fails the same answer with a field of the wrong type, or a field too many', async () => {
    const office = await makeOffice(t)
    const supervisor = await signIn(t, await makeUser(t, { role: 'supervisor', office }))
    const { id } = await makeCase(t, { office })
    const res = await supervisor.get(`/api/cases/${id}`)
    expect(res.status).toBe(200)
    expectAnswerMatchesDocument('GET', '/api/cases/:id', res)
    const wrongType = { ...res, body: { case: { ...res.body.case, version: 'one' } } }
    expect(() => expectAnswerMatchesDocument('GET', '/api/cases/:id', wrongType)).toThrow(/\/case\/version must be integer/)
    // the same, finding the route from the request (as view-contracts.test.ts uses it)
    expectAnswerFitsItsRoute(res)
    expect(() => expectAnswerFitsItsRoute(wrongType)).toThrow(/\/case\/version must be integer/)
    const extra = { ...res, body: { case: { ...res.body.case, complainantPassword: 'x' } } }
    expect(() => expectAnswerMatchesDocument('GET', '/api/cases/:id', extra)).toThrow(/additional properties/)
    const notJson = { ...res, headers: { ...res.headers, 'content-type': 'text/html' } }
    expect(() => expectAnswerMatchesDocument('GET', '/api/cases/:id', notJson)).toThrow(/content type/)
    expect(() => expectAnswerMatchesDocument('GET', '/api/cases/:id/nowhere', res)).toThrow(/not in the API document/)
  })

  it('finds the route a concrete path takes, a literal segment before a parameter', () => {
    expect(documentedRouteOf('GET', '/api/cases/export.csv')).toBe('/api/cases/export.csv')
    expect(documentedRouteOf('GET', '/api/cases/00000000-0000-4000-8000-000000000000')).toBe('/api/cases/:id')
    expect(documentedRouteOf('DELETE', '/api/cases/00000000-0000-4000-8000-000000000000')).toBeUndefined()
    expect(documentedRouteOf('GET', '/api/nowhere')).toBeUndefined()
  })

  it('checks an error against the one error body', async () => {
    const res = await request(t.app).get('/api/cases/00000000-0000-4000-8000-000000000000')
    expect(res.status).toBe(401)
    expectAnswerMatchesDocument('GET', '/api/cases/:id', res)
    expect(() => expectAnswerMatchesDocument('GET', '/api/cases/:id', { ...res, body: { error: { code: 'x' } } })).toThrow(/must have required property/)
  })
})

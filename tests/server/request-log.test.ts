import { PassThrough } from 'node:stream'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { createTestContext, uniqueAddress, type TestContext } from '../support/harness'
import { makeCase, makeOffice, makeUser, signIn } from '../support/factories'
import { createLogger } from '../../server/log/logger'
import { loggablePath, REDACTED, requestLog } from '../../server/http/request-log'
import express from 'express'
import { requestId } from '../../server/http/request-id'
import { errorHandler } from '../../server/http/error-handler'

/** Every line the app logs, as parsed JSON objects, plus the raw text. */
const sink = new PassThrough()
let raw = ''
sink.on('data', (chunk: Buffer) => (raw += chunk.toString('utf8')))
const lines = () => raw.split('\n').filter(Boolean).map((l) => JSON.parse(l) as Record<string, unknown>)
const lineFor = (requestId: string) => lines().find((l) => l.requestId === requestId)

let t: TestContext
beforeAll(async () => {
  t = await createTestContext({ logger: createLogger({ level: 'info', format: 'json', destination: sink }) })
})
afterAll(() => t.close())

describe('the request log', () => {
  it('writes one JSON line per request with method, path, status, duration and request id', async () => {
    const res = await request(t.app).get('/api/health').set('X-Forwarded-For', uniqueAddress())
    const line = lineFor(res.headers['x-request-id'] as string)
    expect(line).toMatchObject({ req: { method: 'GET', path: '/api/health' }, res: { status: 200 }, level: 30 })
    expect(typeof line!.durationMs).toBe('number')
  })

  it('names the signed-in user by id, never by e-mail', async () => {
    const supervisor = await makeUser(t, { role: 'supervisor', office: await makeOffice(t) })
    const agent = await signIn(t, supervisor)
    const res = await agent.get('/api/cases?pageSize=1').expect(200)
    const line = lineFor(res.headers['x-request-id'] as string)!
    expect(line.userId).toBe(supervisor.id)
    expect(JSON.stringify(line)).not.toContain(supervisor.email)
  })

  it('logs client errors as warnings', async () => {
    const res = await request(t.app).get('/api/no-such-route').set('X-Forwarded-For', uniqueAddress()).expect(404)
    expect(lineFor(res.headers['x-request-id'] as string)).toMatchObject({ level: 40, res: { status: 404 } })
  })

  it('never writes a password, a session cookie or a tracking link', async () => {
    const agent = request.agent(t.app).set('X-Forwarded-For', uniqueAddress())
    const office = await makeOffice(t)
    const investigator = await makeUser(t, { role: 'investigator', office })
    const signedIn = await agent.post('/api/auth/sign-in').send({ email: investigator.email, password: investigator.password }).expect(200)
    const cookie = String(signedIn.headers['set-cookie']).split(';')[0]!.split('=')[1]!
    const report = await makeCase(t, { office })
    const tracked = await request(t.app).get(`/api/track/${report.trackingToken}?token=${report.trackingToken}`).set('X-Forwarded-For', uniqueAddress())
    expect(tracked.status).toBe(200)
    const line = lineFor(tracked.headers['x-request-id'] as string)!
    expect((line.req as { path: string }).path).toBe(`/api/track/${REDACTED}?token=${REDACTED}`)
    expect(raw).not.toContain(investigator.password)
    expect(raw).not.toContain(decodeURIComponent(cookie))
    expect(raw).not.toContain(report.trackingToken)
  })
})

describe('a loggable path', () => {
  it.each([
    ['/api/cases/0b6f1d9e-8a8e-4d7e-9a51-1d2c3b4a5f60', '/api/cases/0b6f1d9e-8a8e-4d7e-9a51-1d2c3b4a5f60'],
    ['/track/abcDEF0123456789abcdefXYZ', `/track/${REDACTED}`],
    ['/api/track/short/information', `/api/track/${REDACTED}/information`],
    ['/api/auth/confirm/xyz', `/api/auth/confirm/${REDACTED}`],
    ['/anything/Zm9vYmFyYmF6cXV4cXV1eGNvcmdl', `/anything/${REDACTED}`],
    ['/api/cases?status=open&q=Lindqvist&page=2', `/api/cases?status=open&q=${REDACTED}&page=2`],
    ['/api/x?resetToken=abc&email=a%40b.test', `/api/x?resetToken=${REDACTED}&email=${REDACTED}`],
  ])('keeps record ids and hides secrets: %s', (url, expected) => {
    expect(loggablePath(url)).toBe(expected)
  })
})

describe('the request log, when a request fails on our side', () => {
  const out = new PassThrough()
  let text = ''
  out.on('data', (c: Buffer) => (text += c.toString('utf8')))
  const app = express()
  app.use(requestId)
  app.use(requestLog(createLogger({ format: 'json', destination: out })))
  app.get('/bug', () => {
    throw new Error('an unexpected bug')
  })
  app.get('/outage', () => {
    throw Object.assign(new Error('terminating connection due to administrator command'), { code: '57P01' })
  })
  app.use(errorHandler)
  const lineOf = (id: string) => text.split('\n').filter(Boolean).map((l) => JSON.parse(l)).find((l) => l.requestId === id)

  it('writes the error with its stack on the request’s own line', async () => {
    const res = await request(app).get('/bug').expect(500)
    const line = lineOf(res.headers['x-request-id'] as string)
    expect(line).toMatchObject({ level: 50, res: { status: 500 }, err: { message: 'an unexpected bug' } })
    expect(line.err.stack).toContain('request-log.test.ts')
  })

  it('writes a database outage as one short line, without a stack', async () => {
    const res = await request(app).get('/outage').expect(503)
    const line = lineOf(res.headers['x-request-id'] as string)
    expect(line).toMatchObject({ level: 50, res: { status: 503 }, err: { type: 'DatabaseUnavailable', message: '57P01 terminating connection due to administrator command' } })
    expect(line.err.stack ?? '').toBe('')
  })
})

describe('the readable log of development', () => {
  it('writes one line per request that says method, path, status and duration', async () => {
    const out = new PassThrough()
    let text = ''
    out.on('data', (c: Buffer) => (text += c.toString('utf8')))
    const app = express()
    app.use(requestId)
    app.use(requestLog(createLogger({ format: 'pretty', destination: out })))
    app.get('/api/track/:token', (_req, res) => res.json({ ok: true }))
    await request(app).get('/api/track/Zm9vYmFyYmF6cXV4cXV1eGNvcmdl').expect(200)
    const lines = text.split('\n').filter(Boolean)
    expect(lines).toHaveLength(1)
    expect(lines[0]).toMatch(new RegExp(`GET /api/track/\\[redacted\\] 200 \\d+ ms`))
    expect(text).not.toContain('Zm9vYmFyYmF6cXV4cXV1eGNvcmdl')
  })
})

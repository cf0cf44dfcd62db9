import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { createTestContext, type TestContext } from '../support/harness'
import { makeUser, signIn } from '../support/factories'

let t: TestContext
beforeAll(async () => {
  t = await createTestContext()
})
afterAll(() => t.close())

describe('the development mailbox', () => {
  it('is off (404 mailbox_disabled) when a real mail server is configured', async () => {
    const res = await request(t.app).get('/api/dev/mailbox').expect(404)
    expect(res.body.error.code).toBe('mailbox_disabled')
  })
})

describe('the one error shape', () => {
  it('answers malformed JSON with 400 malformed_json and a request id', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').set('Content-Type', 'application/json').send('{"email": ').expect(400)
    expect(res.body).toEqual({ error: { code: 'malformed_json', message: expect.any(String), requestId: expect.any(String) } })
    expect(res.headers['x-request-id']).toBe(res.body.error.requestId)
  })

  it('answers an unknown /api route with 404 JSON', async () => {
    const res = await request(t.app).get('/api/no-such-thing').expect(404)
    expect(res.body.error.code).toBe('route_not_found')
  })

  it('answers an oversize body with 413', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').send({ email: 'a@b.test', password: 'x'.repeat(300_000) }).expect(413)
    expect(res.body.error.code).toBe('payload_too_large')
  })

  it('answers a malformed id with 400 and the field named', async () => {
    const admin = await signIn(t, await makeUser(t, { role: 'admin' }))
    const res = await admin.get('/api/offices/not-a-uuid').expect(400)
    expect(res.body.error.details[0].path).toBe('id')
  })
})

import { afterEach, describe, expect, it, vi } from 'vitest'
import { meResponseSchema } from '../../shared/schemas/auth'
import { ApiError, api, toApiError } from '@/lib/api-client'
import { shouldRetry } from '@/lib/query-client'

describe('toApiError', () => {
  it('keeps the code, message, field details and request id of the one error body', () => {
    const error = toApiError({
      status: 400,
      body: { error: { code: 'validation_failed', message: 'Some fields need attention.', details: [{ path: 'email', message: 'Enter a valid e-mail address.' }], requestId: 'req-7' } },
    })
    expect(error).toBeInstanceOf(ApiError)
    expect(error).toMatchObject({ status: 400, code: 'validation_failed', message: 'Some fields need attention.', requestId: 'req-7' })
    expect(error.details).toEqual([{ path: 'email', message: 'Enter a valid e-mail address.' }])
  })

  it('turns a non-JSON gateway answer into server_unavailable with a plain message', () => {
    const error = toApiError({ status: 502, body: '<html>Bad gateway</html>' })
    expect(error.code).toBe('server_unavailable')
    expect(error.message).toMatch(/did not answer/)
    expect(error.requestId).toBeNull()
  })

  it('names an unexplained 4xx by its status', () => {
    expect(toApiError({ status: 418, body: undefined }).code).toBe('http_418')
  })
})

describe('shouldRetry', () => {
  it('does not retry client errors, which would fail the same way again', () => {
    expect(shouldRetry(0, new ApiError({ status: 401, code: 'unauthenticated', message: 'x' }))).toBe(false)
    expect(shouldRetry(0, new ApiError({ status: 404, code: 'case_not_found', message: 'x' }))).toBe(false)
  })

  it('retries server and network errors twice, then stops', () => {
    const down = new ApiError({ status: 0, code: 'network_error', message: 'x' })
    expect(shouldRetry(0, down)).toBe(true)
    expect(shouldRetry(1, down)).toBe(true)
    expect(shouldRetry(2, down)).toBe(false)
  })
})

describe('api.read', () => {
  afterEach(() => vi.unstubAllGlobals())
  const answering = (body: unknown) => vi.stubGlobal('fetch', vi.fn(async () => new Response(JSON.stringify(body), { status: 200, headers: { 'Content-Type': 'application/json' } })))

  it('gives the answer as its schema reads it', async () => {
    answering({ user: null })
    await expect(api.read(meResponseSchema, '/api/me')).resolves.toEqual({ user: null })
  })

  it('refuses an answer of another shape with unexpected_answer', async () => {
    answering({ user: { id: 'not-an-id' } })
    await expect(api.read(meResponseSchema, '/api/me')).rejects.toMatchObject({ code: 'unexpected_answer' })
  })
})

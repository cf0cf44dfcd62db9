/**
 * The one way the web app talks to the API: JSON in and out, same-origin cookies, and every
 * failure turned into an ApiError carrying the server's stable code and request id.
 */
import type { z } from 'zod'
import type { ApiErrorBody } from '@shared/schemas/errors'

export interface FieldIssue {
  path: string
  message: string
}

/** A failed API call. `status` is 0 when the server could not be reached at all. */
export class ApiError extends Error {
  readonly status: number
  readonly code: string
  readonly details: FieldIssue[]
  readonly requestId: string | null

  constructor(options: { status: number; code: string; message: string; details?: FieldIssue[]; requestId?: string | null }) {
    super(options.message)
    this.name = 'ApiError'
    this.status = options.status
    this.code = options.code
    this.details = options.details ?? []
    this.requestId = options.requestId ?? null
  }
}

export const isApiError = (value: unknown): value is ApiError => value instanceof ApiError

const UNREACHABLE_MESSAGE = 'The Quietband server did not answer. Check your connection and try again.'

/**
 * Builds an ApiError from a response status and its (possibly non-JSON) body. A proxy or
 * gateway that answers with HTML still yields a usable error with a plain message.
 */
export function toApiError(options: { status: number; body: unknown }): ApiError {
  const { status, body } = options
  const error = (body as Partial<ApiErrorBody> | null)?.error
  if (error && typeof error.code === 'string') {
    return new ApiError({
      status,
      code: error.code,
      message: typeof error.message === 'string' && error.message ? error.message : `Request failed (${status}).`,
      details: Array.isArray(error.details) ? error.details : [],
      requestId: typeof error.requestId === 'string' ? error.requestId : null,
    })
  }
  if (status >= 500 || status === 0) {
    return new ApiError({ status, code: status === 0 ? 'network_error' : 'server_unavailable', message: UNREACHABLE_MESSAGE })
  }
  return new ApiError({ status, code: `http_${status}`, message: `Request failed (${status}).` })
}

type Method = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE'

async function readBody(response: Response): Promise<unknown> {
  if (response.status === 204) return undefined
  const text = await response.text()
  if (!text) return undefined
  try {
    return JSON.parse(text)
  } catch {
    return text
  }
}

/** Sends one request; resolves with the parsed JSON body (undefined for 204) or throws ApiError. */
export async function apiRequest<T>(options: { method?: Method; path: string; body?: unknown; signal?: AbortSignal; cache?: RequestCache }): Promise<T> {
  const { method = 'GET', path, body, signal, cache } = options
  let response: Response
  try {
    response = await fetch(path, {
      method,
      credentials: 'same-origin',
      headers: { Accept: 'application/json', ...(body !== undefined ? { 'Content-Type': 'application/json' } : {}) },
      body: body !== undefined ? JSON.stringify(body) : undefined,
      signal,
      ...(cache ? { cache } : {}),
    })
  } catch (cause) {
    if (signal?.aborted) throw cause
    throw new ApiError({ status: 0, code: 'network_error', message: UNREACHABLE_MESSAGE })
  }
  const parsed = await readBody(response)
  if (!response.ok) throw toApiError({ status: response.status, body: parsed })
  return parsed as T
}

const UNEXPECTED_ANSWER_MESSAGE = 'The Quietband server answered in a form this page does not know. Reload the page; if this stays, tell the office the time it happened.'

/**
 * GET, checked against the answer's schema (shared/schemas): an answer of another shape is an
 * ApiError ('unexpected_answer') instead of a page reading fields that are not there.
 */
async function readChecked<S extends z.ZodType>(schema: S, path: string, signal?: AbortSignal): Promise<z.output<S>> {
  const body = await apiRequest<unknown>({ path, signal })
  const parsed = schema.safeParse(body)
  if (!parsed.success) throw new ApiError({ status: 200, code: 'unexpected_answer', message: UNEXPECTED_ANSWER_MESSAGE })
  return parsed.data
}

/** POST of a multipart form (a file upload); the browser writes the form's boundary itself. */
async function upload<T>(path: string, form: FormData): Promise<T> {
  let response: Response
  try {
    response = await fetch(path, { method: 'POST', credentials: 'same-origin', headers: { Accept: 'application/json' }, body: form })
  } catch {
    throw new ApiError({ status: 0, code: 'network_error', message: UNREACHABLE_MESSAGE })
  }
  const parsed = await readBody(response)
  if (!response.ok) throw toApiError({ status: response.status, body: parsed })
  return parsed as T
}

export const api = {
  /** POST of a multipart form with a file. */
  upload,
  get: <T>(path: string, signal?: AbortSignal) => apiRequest<T>({ path, signal }),
  /** GET whose answer is parsed with its schema from shared/schemas. */
  read: readChecked,
  post: <T>(path: string, body?: unknown) => apiRequest<T>({ method: 'POST', path, body }),
  patch: <T>(path: string, body?: unknown) => apiRequest<T>({ method: 'PATCH', path, body }),
  put: <T>(path: string, body?: unknown) => apiRequest<T>({ method: 'PUT', path, body }),
}

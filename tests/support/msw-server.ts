/**
 * The API as component tests see it: Mock Service Worker intercepts the page's fetch calls at
 * the network layer, so the components, their hooks and the real API client run unchanged.
 * No handler is installed by default: each test says what the server answers. Any other
 * request gets a network error and is kept in `unansweredRequests`, which the setup file
 * checks after every test, so a page cannot quietly call an endpoint no test expected.
 */
import { http, HttpResponse, type JsonBodyType } from 'msw'
import { setupServer } from 'msw/node'
import type { ApiErrorBody } from '../../shared/schemas/errors'

export const server = setupServer()

/** `METHOD /path` of each request no handler answered since the last check. */
export const unansweredRequests: string[] = []

/** Starts intercepting; a request without a handler fails (a network error) and is recorded. */
export function listen(): void {
  server.listen({
    onUnhandledRequest: (request, print) => {
      unansweredRequests.push(`${request.method} ${new URL(request.url).pathname}`)
      print.error()
    },
  })
}

/** One request the page sent, as the server would read it. */
export interface SeenRequest {
  method: string
  url: URL
  /** The parsed JSON body, or undefined when there was none. */
  body: unknown
}

type Method = 'get' | 'post' | 'patch' | 'put' | 'delete'

/**
 * Answers `method path` with the JSON `answer` (a value, or a function of the request) and
 * keeps every request it answered, so a test can check what the page sent.
 */
export function answer(
  method: Method,
  path: string,
  reply: JsonBodyType | ((request: SeenRequest) => JsonBodyType | Response),
  init: { status?: number } = {},
): SeenRequest[] {
  const seen: SeenRequest[] = []
  server.use(
    http[method](path, async ({ request }) => {
      const text = request.method === 'GET' || request.method === 'HEAD' ? '' : await request.text()
      const seenRequest: SeenRequest = { method: request.method, url: new URL(request.url), body: text ? JSON.parse(text) : undefined }
      seen.push(seenRequest)
      const body = typeof reply === 'function' ? reply(seenRequest) : reply
      return body instanceof Response ? body : HttpResponse.json(body, { status: init.status ?? 200 })
    }),
  )
  return seen
}

/** The one error body of the API (`{ error: { code, message, details?, requestId } }`) as a response. */
export function apiError(status: number, error: Omit<ApiErrorBody['error'], 'requestId'> & { requestId?: string }): Response {
  const body: ApiErrorBody = { error: { requestId: 'req-test-1', ...error } }
  return HttpResponse.json(body, { status })
}

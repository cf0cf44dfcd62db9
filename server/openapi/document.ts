/**
 * The API document (OpenAPI 3.1), built by zod-openapi from the modules' operation lists: every
 * shape in it is one of the zod schemas the routes parse requests with and the presenters answer
 * with (requests as their input side, answers as their output side). Nothing in it is written
 * by hand, so it cannot drift from the code; tests/server/openapi.test.ts checks it against the
 * app's routes and its answers.
 */
import { z } from 'zod'
import { createDocument, type ZodOpenApiContentObject, type ZodOpenApiOperationObject, type ZodOpenApiResponsesObject } from 'zod-openapi'
import type { oas31 } from 'zod-openapi'
import packageJson from '../../package.json' with { type: 'json' }
import { apiErrorSchema } from '../../shared/schemas/errors'
import { ALL_OPERATIONS } from './all-operations'
import type { ApiOperation, Caller, ErrorStatus, RawAnswer, TypedJsonAnswer } from './operation'

export type ApiDocument = oas31.OpenAPIObject

/** The session cookie's security scheme (express-session's cookie, set by sign-in). */
export const SESSION_SCHEME = 'session'

const SUCCESS_WORDS: Record<string, string> = { 200: 'OK', 201: 'Created', 202: 'Accepted', 204: 'No content', 302: 'Found (a redirect)', 303: 'See other (a redirect)' }

const ERROR_WORDS: Record<ErrorStatus, string> = {
  400: 'The request does not fit its schema (validation_failed lists every problem in details), or a rule refuses it',
  401: 'Not signed in',
  403: 'Signed in, but this role may not do it here',
  404: 'Not found, or not the caller’s to see (another office’s record is 404)',
  409: 'The record’s state or version refuses it (invalid_transition, stale_version, …)',
  410: 'Gone: the file was deleted when its retention period ended (its record is kept)',
  413: 'The request or file is too large',
  415: 'The file’s type is not accepted',
  422: 'The file cannot be read',
  429: 'Too many requests from this address or account for now',
  503: 'A service it needs (database, file store, signer) is unavailable; try again',
}

const SIGNED_IN: readonly Caller[] = ['complainant', 'investigator', 'supervisor', 'admin']

/** Express's `/cases/:id` as OpenAPI's `/cases/{id}`. */
export const openApiPath = (expressPath: string) => expressPath.replace(/:(\w+)/g, '{$1}')

const pathParamNames = (expressPath: string) => [...expressPath.matchAll(/:(\w+)/g)].map((m) => m[1])

const isZod = (v: unknown): v is z.ZodType => typeof v === 'object' && v !== null && '_zod' in v

/** `getCasesIdTriage` for GET /api/cases/:id/triage: unique, as method and path are. */
function operationId(op: ApiOperation): string {
  const words = op.path.replace(/^\/api\//, '').split(/[^A-Za-z0-9]+/).filter(Boolean)
  return op.method + words.map((w) => w[0].toUpperCase() + w.slice(1)).join('')
}

/** The error statuses an operation can answer, derived from what it takes and who may call it, plus its own. */
export function errorStatusesOf(op: ApiOperation): ErrorStatus[] {
  const out = new Set<ErrorStatus>(op.errors ?? [])
  if (op.query || op.body) out.add(400)
  if (!op.callers.includes('anonymous')) out.add(401)
  if (SIGNED_IN.some((c) => !op.callers.includes(c))) out.add(403)
  if (pathParamNames(op.path).length > 0) out.add(404)
  return [...out].sort()
}

function successContent(answer: z.ZodType | RawAnswer | TypedJsonAnswer): ZodOpenApiContentObject | undefined {
  if (isZod(answer)) return { 'application/json': { schema: answer } }
  if ('schema' in answer) return { [answer.contentType]: { schema: answer.schema } }
  // a file or text sent as it is: binary to the document
  return answer.contentType ? { [answer.contentType]: { schema: z.file() } } : undefined
}

function requestBody(body: NonNullable<ApiOperation['body']>): ZodOpenApiOperationObject['requestBody'] {
  if (isZod(body)) return { required: true, content: { 'application/json': { schema: body } } }
  const files = Object.fromEntries(body.files.map((f) => [f, z.file()]))
  return { required: true, content: { 'multipart/form-data': { schema: body.multipart.extend(files) } } }
}

function operationObject(op: ApiOperation): ZodOpenApiOperationObject {
  const named = pathParamNames(op.path)
  const declared = op.params ? Object.keys(op.params.shape) : []
  if ([...named].sort().join() !== [...declared].sort().join()) {
    throw new Error(`${op.method.toUpperCase()} ${op.path}: its params schema must declare exactly the path's parameters (${named.join(', ') || 'none'})`)
  }
  const responses: ZodOpenApiResponsesObject = {}
  for (const [status, answer] of Object.entries(op.responses)) {
    if (!answer) continue
    const content = successContent(answer)
    const words = !isZod(answer) && 'description' in answer ? answer.description : SUCCESS_WORDS[status]
    responses[status as '200'] = content ? { description: words, content } : { description: words }
  }
  const errorBody = { 'application/json': { schema: apiErrorSchema } }
  for (const status of errorStatusesOf(op)) responses[String(status) as '400'] = { description: ERROR_WORDS[status], content: errorBody }
  responses.default = { description: 'Any other error (500 internal_error, 503 database_unavailable, …): the one error body', content: errorBody }
  return {
    operationId: operationId(op),
    summary: op.summary,
    ...(op.description ? { description: op.description } : {}),
    tags: [op.tag],
    ...(op.callers.includes('anonymous') ? {} : { security: [{ [SESSION_SCHEME]: [] }] }),
    ...(op.params || op.query ? { requestParams: { ...(op.params ? { path: op.params } : {}), ...(op.query ? { query: op.query } : {}) } } : {}),
    ...(op.body ? { requestBody: requestBody(op.body) } : {}),
    responses,
    'x-callers': [...op.callers],
  }
}

const built = new WeakMap<readonly ApiOperation[], ApiDocument>()

/** The OpenAPI 3.1 document of `ops` (every operation of the app by default); built once per list and process. */
export function buildApiDocument(ops: readonly ApiOperation[] = ALL_OPERATIONS): ApiDocument {
  const cached = built.get(ops)
  if (cached) return cached
  const seen = new Set<string>()
  const paths: Record<string, Record<string, ZodOpenApiOperationObject>> = {}
  for (const op of [...ops].sort((a, b) => a.path.localeCompare(b.path) || a.method.localeCompare(b.method))) {
    const key = `${op.method.toUpperCase()} ${op.path}`
    if (seen.has(key)) throw new Error(`${key} is listed twice`)
    seen.add(key)
    ;(paths[openApiPath(op.path)] ??= {})[op.method] = operationObject(op)
  }
  const document = createDocument({
    openapi: '3.1.0',
    info: {
      title: 'Quietband API',
      version: packageJson.version,
      description: 'The HTTP API of Quietband. Every error answers the one body `ApiError`; `x-callers` names who may call an operation (policy may still refuse a given record).',
    },
    tags: [...new Set(ops.map((o) => o.tag))].sort().map((name) => ({ name })),
    components: {
      securitySchemes: { [SESSION_SCHEME]: { type: 'apiKey', in: 'cookie', name: 'qb.sid', description: 'The session cookie that sign-in sets.' } },
    },
    paths,
  })
  built.set(ops, document)
  return document
}

/**
 * Reading an OpenAPI 3.1 document for the reference page: `$ref` resolution, the operations in
 * the document's order with their parameters, body and answers, grouped by tag, and the text
 * filter. Pure (no React, no fetch) so it is tested on its own; the schemas themselves are
 * turned into trees by schema-tree.ts.
 */
import { ROLE_LABELS, ROLES, type Role } from '@shared/domain/roles'

/** A JSON object of the document, before we know more of its shape. */
export type JsonObject = Record<string, unknown>

export const isObject = (value: unknown): value is JsonObject => typeof value === 'object' && value !== null && !Array.isArray(value)

const text = (value: unknown): string | undefined => (typeof value === 'string' && value.trim() ? value : undefined)

/** The last segment of a `$ref` (`#/components/schemas/CaseView` → `CaseView`), as the component's name. */
export function refName(ref: string): string {
  const last = ref.split('/').pop() ?? ref
  return decodePointerSegment(last) || ref
}

const decodePointerSegment = (segment: string) => {
  let decoded = segment
  try {
    decoded = decodeURIComponent(segment)
  } catch {
    // a lone % is taken as written
  }
  return decoded.replace(/~1/g, '/').replace(/~0/g, '~')
}

/** What a local `$ref` (`#/…`, a JSON Pointer into the document) points at; undefined when it points nowhere. */
export function resolvePointer(document: unknown, ref: string): unknown {
  if (ref === '#') return document
  if (!ref.startsWith('#/')) return undefined
  let at: unknown = document
  for (const segment of ref.slice(2).split('/').map(decodePointerSegment)) {
    if (Array.isArray(at)) at = at[Number(segment)]
    else if (isObject(at)) at = Object.hasOwn(at, segment) ? at[segment] : undefined
    else return undefined
    if (at === undefined) return undefined
  }
  return at
}

/**
 * A parameter, request body or response that may be a `$ref` to `components`: the object it
 * stands for (following a chain of references, never round a loop), or undefined.
 */
export function derefObject(document: unknown, value: unknown): JsonObject | undefined {
  const seen = new Set<string>()
  let at = value
  while (isObject(at) && typeof at.$ref === 'string') {
    if (seen.has(at.$ref)) return undefined
    seen.add(at.$ref)
    at = resolvePointer(document, at.$ref)
  }
  return isObject(at) ? at : undefined
}

/** Who may call an operation, in the product's words ('anonymous' is anyone, signed in or not). */
export function callerLabel(caller: string): string {
  if (caller === 'anonymous') return 'Anyone'
  return (ROLES as readonly string[]).includes(caller) ? ROLE_LABELS[caller as Role] : caller
}

/** The callers of `x-callers` in words, "Anyone" first; null when the document does not say. */
export function callersInWords(callers: readonly string[] | null): string[] | null {
  if (!callers) return null
  const ordered = [...new Set(callers)].sort((a, b) => Number(b === 'anonymous') - Number(a === 'anonymous'))
  return ordered.map(callerLabel)
}

export interface ApiParameter {
  name: string
  /** 'path', 'query', 'header' or 'cookie'. */
  in: string
  required: boolean
  description?: string
  schema: unknown
  deprecated: boolean
}

export interface ApiMedia {
  contentType: string
  /** The JSON Schema of the body; undefined when the document gives none. */
  schema: unknown
}

export interface ApiRequestBody {
  required: boolean
  description?: string
  media: ApiMedia[]
}

export interface ApiResponse {
  /** '200', '404', '4XX' or 'default'. */
  status: string
  description?: string
  media: ApiMedia[]
}

export interface ApiOperationEntry {
  /** The anchor of the operation on the page (unique within the document). */
  id: string
  /** GET, POST, … */
  method: string
  /** The address as a caller writes it, the server's base path included. */
  path: string
  summary: string
  description?: string
  tag: string
  /** `x-callers`, as written; null when the document does not say. */
  callers: string[] | null
  /** Whether the operation asks for a security scheme (the session cookie). */
  signIn: boolean
  deprecated: boolean
  parameters: ApiParameter[]
  requestBody: ApiRequestBody | null
  responses: ApiResponse[]
}

const METHODS = ['get', 'put', 'post', 'delete', 'options', 'head', 'patch', 'trace']

/** The tag an operation without one is filed under. */
export const UNTAGGED = 'Other'

/** An id usable as an HTML anchor: lower case, letters and digits, single dashes. */
export const slug = (value: string) =>
  value
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '') || 'x'

/** The base path of the first server (`/api`), when it is a path the document's paths do not already carry. */
function basePath(document: JsonObject): string {
  const servers = Array.isArray(document.servers) ? document.servers : []
  const url = isObject(servers[0]) ? text(servers[0].url) : undefined
  if (!url) return ''
  try {
    return new URL(url, 'http://base.invalid').pathname.replace(/\/+$/, '')
  } catch {
    return ''
  }
}

function readMedia(content: unknown): ApiMedia[] {
  if (!isObject(content)) return []
  return Object.entries(content).map(([contentType, media]) => ({ contentType, schema: isObject(media) ? media.schema : undefined }))
}

/** A requirement list that is there and not `[]` nor `[{}]` (the "no sign-in needed" entry). */
function asksForSecurity(security: unknown): boolean | undefined {
  if (!Array.isArray(security)) return undefined
  if (security.length === 0) return false
  // `{}` among the alternatives means the operation may also be called without any
  return !security.some((requirement) => isObject(requirement) && Object.keys(requirement).length === 0)
}

function readParameters(document: unknown, pathItem: JsonObject, operation: JsonObject): ApiParameter[] {
  const byKey = new Map<string, ApiParameter>()
  // operation-level parameters override the path item's of the same name and place
  for (const list of [pathItem.parameters, operation.parameters]) {
    if (!Array.isArray(list)) continue
    for (const raw of list) {
      const p = derefObject(document, raw)
      const name = p && text(p.name)
      if (!p || !name) continue
      const place = text(p.in) ?? 'query'
      const schema = p.schema ?? (isObject(p.content) ? Object.values(p.content).map((m) => (isObject(m) ? m.schema : undefined))[0] : undefined)
      byKey.set(`${place}:${name}`, {
        name,
        in: place,
        required: place === 'path' || p.required === true,
        description: text(p.description) ?? text(derefObject(document, schema)?.description),
        schema,
        deprecated: p.deprecated === true,
      })
    }
  }
  return [...byKey.values()]
}

function readRequestBody(document: unknown, raw: unknown): ApiRequestBody | null {
  const body = derefObject(document, raw)
  if (!body) return null
  return { required: body.required === true, description: text(body.description), media: readMedia(body.content) }
}

function readResponses(document: unknown, raw: unknown): ApiResponse[] {
  if (!isObject(raw)) return []
  const entries = Object.entries(raw).map(([status, value]) => {
    const response = derefObject(document, value)
    return { status, description: response && text(response.description), media: response ? readMedia(response.content) : [] }
  })
  // numbered statuses in order, 'default' (the error shape) last
  const rank = (status: string) => (status === 'default' ? 1000 : Number.parseInt(status, 10) || 999)
  return entries.sort((a, b) => rank(a.status) - rank(b.status))
}

/** Every operation of the document, in the document's order. */
export function listOperations(document: unknown): ApiOperationEntry[] {
  if (!isObject(document) || !isObject(document.paths)) return []
  const base = basePath(document)
  const documentSignIn = asksForSecurity(document.security) ?? false
  const usedIds = new Map<string, number>()
  const operations: ApiOperationEntry[] = []
  for (const [rawPath, rawItem] of Object.entries(document.paths)) {
    const pathItem = derefObject(document, rawItem)
    if (!pathItem) continue
    const path = base && !rawPath.startsWith(`${base}/`) && rawPath !== base ? `${base}${rawPath}` : rawPath
    for (const method of Object.keys(pathItem).filter((key) => METHODS.includes(key))) {
      const operation = pathItem[method]
      if (!isObject(operation)) continue
      const tags = Array.isArray(operation.tags) ? operation.tags.filter((t): t is string => typeof t === 'string' && t.trim() !== '') : []
      const callers = Array.isArray(operation['x-callers']) ? operation['x-callers'].filter((c): c is string => typeof c === 'string') : null
      const baseId = `op-${slug(`${method} ${path}`)}`
      const n = (usedIds.get(baseId) ?? 0) + 1
      usedIds.set(baseId, n)
      operations.push({
        id: n === 1 ? baseId : `${baseId}-${n}`,
        method: method.toUpperCase(),
        path,
        summary: text(operation.summary) ?? text(operation.operationId) ?? '(no summary)',
        description: text(operation.description),
        tag: tags[0] ?? UNTAGGED,
        callers,
        signIn: asksForSecurity(operation.security) ?? documentSignIn,
        deprecated: operation.deprecated === true,
        parameters: readParameters(document, pathItem, operation),
        requestBody: readRequestBody(document, operation.requestBody),
        responses: readResponses(document, operation.responses),
      })
    }
  }
  return operations
}

export interface TagGroup {
  name: string
  /** The anchor of the tag's section. */
  id: string
  description?: string
  operations: ApiOperationEntry[]
}

/**
 * The operations by tag: the tags the document lists first, in its order, then any other tag
 * in the order it first appears. Tags without operations are left out.
 */
export function groupByTag(document: unknown, operations: readonly ApiOperationEntry[]): TagGroup[] {
  const declared = isObject(document) && Array.isArray(document.tags) ? document.tags.filter(isObject) : []
  const descriptions = new Map<string, string | undefined>()
  for (const tag of declared) {
    const name = text(tag.name)
    if (name && !descriptions.has(name)) descriptions.set(name, text(tag.description))
  }
  const order = [...descriptions.keys()]
  for (const op of operations) if (!order.includes(op.tag)) order.push(op.tag)
  return order
    .map((name) => ({ name, id: `tag-${slug(name)}`, description: descriptions.get(name), operations: operations.filter((op) => op.tag === name) }))
    .filter((group) => group.operations.length > 0)
}

/**
 * The operations whose method, path, summary or tag hold every word of `query` (any case, any
 * order); all of them for an empty query. `{id}` and `:id` spell a path parameter alike.
 */
export function filterOperations<T extends Pick<ApiOperationEntry, 'method' | 'path' | 'summary' | 'tag'>>(operations: readonly T[], query: string): T[] {
  const words = query
    .toLowerCase()
    .replace(/:([a-z0-9_]+)/gi, '{$1}')
    .split(/\s+/)
    .filter(Boolean)
  if (words.length === 0) return [...operations]
  return operations.filter((op) => {
    const haystack = `${op.method} ${op.path} ${op.summary} ${op.tag}`.toLowerCase()
    return words.every((word) => haystack.includes(word))
  })
}

/** The name of the session cookie, from the document's cookie security scheme, when it has one. */
export function sessionCookieName(document: unknown): string | undefined {
  const schemes = isObject(document) && isObject(document.components) && isObject(document.components.securitySchemes) ? document.components.securitySchemes : {}
  for (const raw of Object.values(schemes)) {
    const scheme = derefObject(document, raw)
    if (scheme && scheme.type === 'apiKey' && scheme.in === 'cookie' && text(scheme.name)) return text(scheme.name)
  }
  return undefined
}

const STATUS_WORDS: Record<string, string> = {
  '200': 'OK',
  '201': 'Created',
  '202': 'Accepted',
  '204': 'No content',
  '302': 'Found (redirect)',
  '303': 'See other (redirect)',
  '304': 'Not modified',
  '400': 'Bad request',
  '401': 'Not signed in',
  '403': 'Not allowed',
  '404': 'Not found',
  '409': 'Conflict',
  '413': 'Too large',
  '415': 'Unsupported media type',
  '422': 'Unprocessable',
  '429': 'Too many requests',
  '500': 'Server error',
  '503': 'Unavailable',
}

/** A status code's usual words (`404` → `Not found`); undefined for a code without; `default` is any other status, an error. */
export function statusWords(status: string): string | undefined {
  if (status === 'default') return 'Any other status (an error)'
  return STATUS_WORDS[status]
}

/**
 * The component the operation's `default` answer (the error shape) refers to, e.g.
 * `#/components/schemas/ApiError`: answers with that body are told apart by code only.
 */
export function errorBodyRef(operation: Pick<ApiOperationEntry, 'responses'>): string | undefined {
  const fallback = operation.responses.find((r) => r.status === 'default')
  const schema = fallback?.media[0]?.schema
  return isObject(schema) && typeof schema.$ref === 'string' ? schema.$ref : undefined
}

/**
 * Checks a real answer against the API document: the operation must be in it, its status
 * documented (exactly, or as `default`), its content type one the document names, and a JSON
 * body must validate against the document's schema for that status (JSON Schema 2020-12, as
 * OpenAPI 3.1 writes it). The route × role matrix calls it for every call it makes.
 */
import { expect } from 'vitest'
import Ajv2020, { type ValidateFunction } from 'ajv/dist/2020'
import addFormats from 'ajv-formats'
import { buildApiDocument, openApiPath, type ApiDocument } from '../../server/openapi/document'

/** The document's component schemas, for Ajv, as the `$defs` of one schema of this id; `#/components/schemas/…` references are rewritten to it. */
const COMPONENTS_ID = 'https://quietband.invalid/openapi-components.json'

interface AnswerLike {
  status: number
  headers: Record<string, string | string[] | undefined>
  body?: unknown
  text?: string
}

/** One Ajv per document (its components added once), and each operation's schema compiled once. */
const validators = new WeakMap<ApiDocument, { ajv: Ajv2020; compiled: Map<string, ValidateFunction> }>()

function validatorFor(document: ApiDocument, key: string, schema: unknown): ValidateFunction {
  let v = validators.get(document)
  if (!v) {
    // strict about schemas (an unknown keyword or format fails rather than passing unchecked), not about zod's style of types
    const ajv = new Ajv2020({ allErrors: true, strictSchema: true, strictTypes: false, strictTuples: false, strictRequired: false })
    addFormats(ajv)
    ajv.addFormat('binary', true) // OpenAPI's name for a file's bytes; never a JSON body
    ajv.addSchema(withComponentsId({ $defs: document.components?.schemas ?? {} }), COMPONENTS_ID)
    v = { ajv, compiled: new Map() }
    validators.set(document, v)
  }
  let validate = v.compiled.get(key)
  if (!validate) {
    validate = v.ajv.compile(withComponentsId(schema))
    v.compiled.set(key, validate)
  }
  return validate
}

function withComponentsId(schema: unknown): object {
  return JSON.parse(JSON.stringify(schema).replaceAll('"#/components/schemas/', `"${COMPONENTS_ID}#/$defs/`))
}

const isJsonType = (type: string) => type === 'application/json' || /\+json$/.test(type)

/**
 * Asserts that `res` (a supertest answer) fits the document's operation `method expressPath`
 * (e.g. 'GET', '/api/cases/:id'). `document` defaults to the app's own.
 */
export function expectAnswerMatchesDocument(method: string, expressPath: string, res: AnswerLike, document: ApiDocument = buildApiDocument()): void {
  const where = `${method.toUpperCase()} ${expressPath} → ${res.status}`
  const operation = document.paths?.[openApiPath(expressPath)]?.[method.toLowerCase() as 'get']
  expect(operation, `${method.toUpperCase()} ${expressPath} is not in the API document`).toBeDefined()
  const responses = operation!.responses as Record<string, { content?: Record<string, { schema?: unknown }> } | undefined>
  const status = responses[String(res.status)] ? String(res.status) : 'default'
  const answer = responses[status]
  expect(answer, `${where}: status not in the API document`).toBeDefined()
  const contentType = String(res.headers['content-type'] ?? '').split(';')[0].trim()
  if (!answer!.content) {
    expect(res.text ?? '', `${where}: the document says no body`).toBe('')
    return
  }
  expect(Object.keys(answer!.content), `${where}: content type`).toContain(contentType)
  if (!isJsonType(contentType)) return
  const validate = validatorFor(document, `${method.toUpperCase()} ${openApiPath(expressPath)} ${status} ${contentType}`, answer!.content[contentType].schema)
  if (!validate(res.body)) {
    const problems = validate.errors!.map((e) => `${e.instancePath || '(body)'} ${e.message} ${JSON.stringify(e.params)}`)
    expect.fail(`${where}: body does not fit the document: ${problems.join('; ')}`)
  }
}

/** Compiles every JSON answer schema of the document (so one no call reaches still has to compile strictly); returns how many. */
export function compileDocumentAnswers(document: ApiDocument = buildApiDocument()): number {
  let count = 0
  for (const [p, item] of Object.entries(document.paths ?? {})) {
    for (const [method, operation] of Object.entries(item as Record<string, { responses?: Record<string, { content?: Record<string, { schema?: unknown }> }> }>)) {
      for (const [status, answer] of Object.entries(operation.responses ?? {})) {
        for (const [type, media] of Object.entries(answer.content ?? {})) {
          if (!isJsonType(type)) continue
          expect(() => validatorFor(document, `${method.toUpperCase()} ${p} ${status} ${type}`, media.schema), `${method} ${p} ${status}`).not.toThrow()
          count += 1
        }
      }
    }
  }
  return count
}

/** The document's route (Express form) that a concrete path takes: literal segments before parameters, as Express's order mostly gives. */
export function documentedRouteOf(method: string, concretePath: string, document: ApiDocument = buildApiDocument()): string | undefined {
  const segments = concretePath.split('/')
  const candidates = Object.keys(document.paths ?? {}).filter((p) => {
    const parts = p.split('/')
    return parts.length === segments.length && parts.every((part, i) => /^\{\w+\}$/.test(part) || part === segments[i]) && document.paths?.[p]?.[method.toLowerCase() as 'get']
  })
  const params = (p: string) => (p.match(/\{/g) ?? []).length
  const best = candidates.sort((a, b) => params(a) - params(b))[0]
  return best?.replace(/\{(\w+)\}/g, ':$1')
}

/** expectAnswerMatchesDocument for a supertest answer, finding its route from the request it answers. */
export function expectAnswerFitsItsRoute(res: AnswerLike & { request: { method: string; url: string } }): void {
  const { method } = res.request
  const concrete = new URL(res.request.url, 'http://localhost').pathname
  const route = documentedRouteOf(method, concrete)
  expect(route, `${method} ${concrete} matches no operation of the API document`).toBeDefined()
  expectAnswerMatchesDocument(method, route!, res)
}

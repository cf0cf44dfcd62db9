/**
 * The API reference page and the pure reading of an OpenAPI 3.1 document behind it: tags and
 * operations in the document's order, callers in the product's words, `$ref`s resolved to their
 * component (and a reference to itself stopped), required, nullable, enum and format marks,
 * unions as choices, the text filter, and a plain message when the document cannot be loaded.
 * The document below is a small hand-written one (test data), not the server's.
 */
import { screen, waitFor, within } from '@testing-library/react'
import { afterEach, describe, expect, it, vi } from 'vitest'
import type { RouteObject } from 'react-router-dom'
import { Component as ApiReferencePage } from '@/app/routes/api-reference'
import { routes } from '@/app/router'
import { callersInWords, errorBodyRef, filterOperations, groupByTag, listOperations, resolvePointer, statusWords } from '@/features/api-reference/lib/openapi'
import { schemaTree, treeRows, typeInWords, type SchemaNode } from '@/features/api-reference/lib/schema-tree'
import { paths } from '@/lib/paths'
import { answer, apiError } from '../support/msw-server'
import { renderPage } from '../support/web-render'

const errorBody = { 'application/json': { schema: { $ref: '#/components/schemas/ApiError' } } }
const caseId = { name: 'id', in: 'path', required: true, schema: { type: 'string', format: 'uuid' } }

/** A small OpenAPI 3.1 document in the shape the server writes (test data). */
const DOCUMENT = {
  openapi: '3.1.0',
  info: { title: 'Quietband API', version: '9.9.9', description: 'Every error answers the one body `ApiError`.' },
  tags: [{ name: 'Reports', description: 'What anyone may send.' }, { name: 'Cases' }, { name: 'Unused' }],
  components: {
    securitySchemes: { session: { type: 'apiKey', in: 'cookie', name: 'qb.sid' } },
    schemas: {
      ApiError: {
        type: 'object',
        properties: {
          error: {
            type: 'object',
            properties: {
              code: { type: 'string' },
              message: { type: 'string' },
              details: { type: 'array', items: { type: 'object', properties: { path: { type: 'string' }, message: { type: 'string' } }, required: ['path', 'message'] } },
              requestId: { type: 'string' },
            },
            required: ['code', 'message', 'requestId'],
          },
        },
        required: ['error'],
      },
      CaseState: { type: 'string', enum: ['received', 'triaged', 'closed'], description: 'Where the case stands.' },
      Person: { type: 'object', properties: { name: { type: 'string' }, email: { type: ['string', 'null'], format: 'email' } }, required: ['name', 'email'] },
      CaseView: {
        type: 'object',
        properties: {
          id: { type: 'string', format: 'uuid' },
          reference: { type: 'string', description: 'The case’s reference, e.g. QB-26-000412.' },
          state: { $ref: '#/components/schemas/CaseState' },
          closedAt: { anyOf: [{ type: 'string', format: 'date-time' }, { type: 'null' }] },
          assignee: { anyOf: [{ $ref: '#/components/schemas/Person' }, { type: 'null' }] },
          mergedInto: { $ref: '#/components/schemas/CaseView' },
          notes: { type: 'array', items: { type: 'string' }, maxItems: 20 },
        },
        required: ['id', 'reference', 'state', 'closedAt'],
      },
      Evidence: {
        oneOf: [
          { type: 'object', properties: { kind: { type: 'string', const: 'photo' }, widthPx: { type: 'integer' } }, required: ['kind'] },
          { type: 'object', properties: { kind: { type: 'string', const: 'spectrum' }, rbwHz: { type: 'number', exclusiveMinimum: 0 } }, required: ['kind', 'rbwHz'] },
        ],
      },
    },
  },
  paths: {
    '/api/cases': {
      get: {
        summary: 'List the office’s cases',
        tags: ['Cases'],
        security: [{ session: [] }],
        'x-callers': ['investigator', 'supervisor', 'admin'],
        parameters: [
          { name: 'state', in: 'query', schema: { $ref: '#/components/schemas/CaseState' } },
          { name: 'page', in: 'query', description: 'Which page, from 1.', schema: { type: 'integer', minimum: 1, default: 1 } },
        ],
        responses: {
          '200': { description: 'OK', content: { 'application/json': { schema: { type: 'object', properties: { items: { type: 'array', items: { $ref: '#/components/schemas/CaseView' } } }, required: ['items'] } } } },
          '401': { description: 'Not signed in', content: errorBody },
        },
      },
    },
    '/api/cases/{id}': {
      get: {
        summary: 'One case',
        tags: ['Cases'],
        security: [{ session: [] }],
        'x-callers': ['supervisor', 'admin'],
        parameters: [caseId],
        responses: {
          '200': { description: 'OK', content: { 'application/json': { schema: { $ref: '#/components/schemas/CaseView' } } } },
          default: { description: 'Any other error', content: errorBody },
          '404': { description: 'Not found', content: errorBody },
        },
      },
    },
    '/api/cases/{id}/file.pdf': {
      get: {
        summary: 'The signed case file',
        tags: ['Cases'],
        security: [{ session: [] }],
        'x-callers': ['supervisor', 'admin'],
        parameters: [caseId],
        responses: { '200': { description: 'The signed PDF', content: { 'application/pdf': { schema: { type: 'string', format: 'binary' } } } } },
      },
    },
    '/api/cases/{id}/evidence': {
      post: {
        summary: 'Add a file to a case',
        tags: ['Cases'],
        security: [{ session: [] }],
        'x-callers': ['investigator'],
        parameters: [caseId],
        requestBody: {
          required: true,
          content: { 'multipart/form-data': { schema: { type: 'object', properties: { note: { type: 'string', maxLength: 500 }, file: { type: 'string', format: 'binary' } }, required: ['file'] } } },
        },
        responses: { '201': { description: 'Created', content: { 'application/json': { schema: { $ref: '#/components/schemas/Evidence' } } } } },
      },
    },
    '/api/reports': {
      post: {
        summary: 'File a report',
        tags: ['Reports'],
        'x-callers': ['complainant', 'anonymous'],
        requestBody: {
          required: true,
          content: {
            'application/json': {
              schema: { type: 'object', properties: { description: { type: 'string', minLength: 10, maxLength: 4000 }, freqHz: { type: 'number', minimum: 0 } }, required: ['description'] },
            },
          },
        },
        responses: {
          '201': { description: 'Created', content: { 'application/json': { schema: { type: 'object', properties: { reference: { type: 'string' } }, required: ['reference'] } } } },
          default: { description: 'Any other error', content: errorBody },
        },
      },
    },
  },
}

const open = () => renderPage({ url: paths.apiReference.href(), routes: [{ path: paths.apiReference.path, Component: ApiReferencePage }] })

const serveDocument = (document: unknown = DOCUMENT) => answer('get', '/api/openapi.json', document as Record<string, unknown>)

/** The operation's card, by its method and address. */
const card = (name: string) => screen.getByRole('article', { name })

/** Opens an operation's parameters, body and answers. */
async function openOperation(user: ReturnType<typeof open>['user'], name: string) {
  await user.click(within(card(name)).getByText(`of ${name}`, { exact: false }))
  await waitFor(() => expect(within(card(name)).getByRole('heading', { name: 'Answers' })).toBeInTheDocument())
  return card(name)
}

/** The row of a property in a schema tree (its list item), found by the property's name. */
function propertyRow(container: HTMLElement, name: string): HTMLElement {
  const names = within(container).getAllByText(name, { selector: 'code' })
  const row = names.map((n) => n.closest('li')).find((li): li is HTMLLIElement => li !== null)
  if (!row) throw new Error(`no property row named ${name}`)
  return row
}

/** The first line of a property row: its name, type and marks (not its nested fields). */
const rowHead = (row: HTMLElement) => row.querySelector('p') as HTMLElement

/** The node of a property by name among a node's children. */
const child = (node: SchemaNode, name: string) => {
  const found = node.children.find((c) => c.name === name)
  if (!found) throw new Error(`no property ${name}`)
  return found
}

afterEach(() => vi.unstubAllGlobals())

describe('the API reference page', () => {
  it('lists the document’s tags in its order, each with its operations, and links to the document', async () => {
    serveDocument()
    open()
    const contents = await screen.findByRole('navigation', { name: 'Groups of operations' })
    expect(within(contents).getAllByRole('link').map((a) => a.getAttribute('aria-label'))).toEqual(['Reports, 1 operation', 'Cases, 4 operations'])
    expect(within(contents).getByRole('link', { name: 'Cases, 4 operations' })).toHaveAttribute('href', '#tag-cases')
    expect(screen.getAllByRole('heading', { level: 2 }).map((h) => h.textContent)).toEqual(['Before you start', 'Operations by group', 'Reports', 'Cases'])
    const cases = screen.getByRole('region', { name: 'Cases' })
    expect(within(cases).getAllByRole('article').map((a) => a.getAttribute('aria-labelledby') && within(a).getByRole('heading', { level: 3 }).textContent)).toEqual([
      'GET /api/cases',
      'GET /api/cases/{id}',
      'GET /api/cases/{id}/file.pdf',
      'POST /api/cases/{id}/evidence',
    ])
    expect(within(card('POST /api/reports')).getByText('File a report')).toBeInTheDocument()
    expect(screen.getByText('What anyone may send.')).toBeInTheDocument()
    expect(screen.getByText('Quietband API', { exact: false })).toHaveTextContent('Quietband API, version 9.9.9.')
    expect(screen.getByText('ApiError', { selector: 'code' })).toBeInTheDocument()
    expect(screen.getByText('qb.sid', { selector: 'code' })).toBeInTheDocument()
    expect(screen.getByRole('link', { name: 'Download the OpenAPI document (JSON)' })).toHaveAttribute('href', '/api/openapi.json')
    expect(screen.getByRole('status')).toHaveTextContent('5 operations in 2 groups.')
  })

  it('says who may call each operation in the product’s words, and whether it needs the session', async () => {
    serveDocument()
    open()
    await screen.findByRole('navigation', { name: 'Groups of operations' })
    const report = card('POST /api/reports')
    expect(within(report).getByText('Who may call it').nextElementSibling).toHaveTextContent(/^Anyone, Complainant$/)
    expect(within(report).getByText('Sign-in').nextElementSibling).toHaveTextContent('Not needed')
    const list = card('GET /api/cases')
    expect(within(list).getByText('Who may call it').nextElementSibling).toHaveTextContent(/^Field investigator, Office supervisor, System administrator$/)
    expect(within(list).getByText('Sign-in').nextElementSibling).toHaveTextContent('Needs the session cookie')
  })

  it('shows a $ref resolved to its component, with required, nullable, format and enum marks', async () => {
    serveDocument()
    const { user } = open()
    await screen.findByRole('navigation', { name: 'Groups of operations' })
    const one = await openOperation(user, 'GET /api/cases/{id}')
    expect(within(one).getByText('CaseView (object)')).toBeInTheDocument()
    const state = propertyRow(one, 'state')
    expect(state).toHaveTextContent('CaseState (string)')
    expect(state).toHaveTextContent('required')
    expect(state).toHaveTextContent('One of: "received", "triaged", "closed"')
    expect(state).toHaveTextContent('Where the case stands.')
    const closedAt = propertyRow(one, 'closedAt')
    expect(closedAt).toHaveTextContent('required')
    expect(closedAt).toHaveTextContent('can be null')
    expect(closedAt).toHaveTextContent('format date-time')
    expect(propertyRow(one, 'id')).toHaveTextContent('format uuid')
    const assignee = propertyRow(one, 'assignee')
    expect(rowHead(assignee)).toHaveTextContent('Person (object)')
    expect(rowHead(assignee)).toHaveTextContent('optional')
    expect(rowHead(assignee)).toHaveTextContent('can be null')
    expect(rowHead(assignee)).not.toHaveTextContent('required')
    // the nested object folds away; its fields are inside the fold
    const fold = within(assignee).getByText('Fields of Person (2)').closest('details')
    expect(fold).not.toHaveAttribute('open')
    expect(propertyRow(fold as HTMLElement, 'email')).toHaveTextContent('can be null')
    expect(propertyRow(one, 'notes')).toHaveTextContent('array of string')
    expect(propertyRow(one, 'notes')).toHaveTextContent('at most 20 items')
    // parameters and answers
    expect(within(one).getByRole('table', { name: 'Parameters of GET /api/cases/{id}' })).toHaveTextContent('idpathstring (uuid)Yes')
    const answers = within(one).getByRole('heading', { name: 'Answers' }).nextElementSibling as HTMLElement
    const statuses = [...answers.children].map((li) => li.querySelector('p')?.textContent?.trim())
    expect(statuses).toEqual([
      '200 OK',
      '404 Not found',
      'Any other status (an error) — Any other error',
    ])
    // the error answers name the one error body and point to its fields, instead of repeating them
    expect(within(answers).getAllByText('ApiError', { selector: 'code' })).toHaveLength(2)
    expect(within(answers).getAllByRole('link', { name: 'its fields' })[0]).toHaveAttribute('href', '#api-errors')
    expect(document.getElementById('api-errors')).toHaveTextContent('Errors')
  })

  it('stops at a $ref that refers back to a component already open above', async () => {
    serveDocument()
    const { user } = open()
    await screen.findByRole('navigation', { name: 'Groups of operations' })
    const one = await openOperation(user, 'GET /api/cases/{id}')
    const mergedInto = propertyRow(one, 'mergedInto')
    expect(mergedInto).toHaveTextContent('CaseView (as above)')
    expect(mergedInto).toHaveTextContent('Refers back to CaseView, shown above; not repeated here.')
    expect(within(mergedInto).queryByRole('group')).not.toBeInTheDocument()
  })

  it('shows a list’s items, a file answer, a multipart body and a union as choices', async () => {
    serveDocument()
    const { user } = open()
    await screen.findByRole('navigation', { name: 'Groups of operations' })
    const list = await openOperation(user, 'GET /api/cases')
    expect(propertyRow(list, 'items')).toHaveTextContent('array of CaseView')
    expect(within(list).getByText('Fields of each item of items (7)')).toBeInTheDocument()
    expect(within(list).getByRole('table', { name: 'Parameters of GET /api/cases' })).toHaveTextContent('at least 1 · default 1')
    const pdf = await openOperation(user, 'GET /api/cases/{id}/file.pdf')
    expect(within(pdf).getByText('application/pdf')).toBeInTheDocument()
    expect(within(pdf).getByText('file')).toBeInTheDocument()
    const upload = await openOperation(user, 'POST /api/cases/{id}/evidence')
    expect(within(upload).getByRole('heading', { name: 'Request body (required)' })).toBeInTheDocument()
    expect(within(upload).getByText('multipart/form-data')).toBeInTheDocument()
    expect(propertyRow(upload, 'file')).toHaveTextContent('filerequired')
    expect(within(upload).getByText('Evidence (one of)')).toBeInTheDocument()
    expect(within(upload).getByText('told apart by', { exact: false })).toHaveTextContent('told apart by kind')
    expect(within(upload).getByText('Choice 1: kind = "photo"')).toBeInTheDocument()
    expect(within(upload).getByText('Choice 2: kind = "spectrum"')).toBeInTheDocument()
    // a choice's fields show as soon as the choices are open
    expect(rowHead(propertyRow(upload, 'rbwHz'))).toHaveTextContent('rbwHznumberrequired')
    expect(propertyRow(upload, 'rbwHz')).toHaveTextContent('more than 0')
  })

  it('narrows the operations to those whose address or summary hold the typed words', async () => {
    serveDocument()
    const { user } = open()
    await screen.findByRole('navigation', { name: 'Groups of operations' })
    const filter = screen.getByRole('searchbox', { name: 'Filter operations' })
    await user.type(filter, 'PDF')
    await waitFor(() => expect(screen.getByRole('status')).toHaveTextContent('1 of 5 operations match.'))
    expect(screen.getAllByRole('article').map((a) => within(a).getByRole('heading', { level: 3 }).textContent)).toEqual(['GET /api/cases/{id}/file.pdf'])
    expect(screen.queryByRole('region', { name: 'Reports' })).not.toBeInTheDocument()
    await user.clear(filter)
    await user.type(filter, 'report file')
    await waitFor(() => expect(screen.getAllByRole('article')).toHaveLength(1))
    expect(card('POST /api/reports')).toBeInTheDocument()
    await user.clear(filter)
    await user.type(filter, 'spectrum mask')
    await waitFor(() => expect(screen.getByRole('status')).toHaveTextContent('No operation matches “spectrum mask”.'))
    expect(screen.queryByRole('article')).not.toBeInTheDocument()
    expect(screen.queryByRole('navigation', { name: 'Groups of operations' })).not.toBeInTheDocument()
  })

  it('opens the operation a link names by its anchor', async () => {
    serveDocument()
    renderPage({ url: `${paths.apiReference.href()}#op-get-api-cases-id`, routes: [{ path: paths.apiReference.path, Component: ApiReferencePage }] })
    await screen.findByRole('navigation', { name: 'Groups of operations' })
    expect(card('GET /api/cases/{id}')).toHaveAttribute('id', 'op-get-api-cases-id')
    expect(within(card('GET /api/cases/{id}')).getByRole('heading', { name: 'Answers' })).toBeInTheDocument()
    expect(within(card('GET /api/cases')).queryByRole('heading', { name: 'Answers' })).not.toBeInTheDocument()
  })

  it('lists parameters as cards on a narrow screen', async () => {
    vi.stubGlobal('matchMedia', (query: string) => ({ matches: false, media: query, addEventListener: () => {}, removeEventListener: () => {} }))
    serveDocument()
    const { user } = open()
    await screen.findByRole('navigation', { name: 'Groups of operations' })
    const list = await openOperation(user, 'GET /api/cases')
    expect(within(list).queryByRole('table')).not.toBeInTheDocument()
    const params = within(list).getByRole('list', { name: 'Parameters of GET /api/cases' })
    expect(within(params).getAllByRole('listitem').map((li) => li.textContent)).toEqual([
      'statein query, optionalCaseState (string) · one of "received", "triaged", "closed"Where the case stands.',
      'pagein query, optionalinteger · at least 1 · default 1Which page, from 1.',
    ])
  })

  it('says plainly when the document cannot be loaded, with the server’s words and a way to retry', async () => {
    answer('get', '/api/openapi.json', () => apiError(404, { code: 'not_found', message: 'There is no such address.' }))
    open()
    const alert = await screen.findByRole('alert')
    expect(alert).toHaveTextContent('Could not load the API description.')
    expect(alert).toHaveTextContent('There is no such address.')
    expect(within(alert).getByRole('button', { name: 'Try again' })).toBeInTheDocument()
    expect(screen.getByRole('link', { name: '/api/openapi.json' })).toHaveAttribute('href', '/api/openapi.json')
    expect(screen.queryByRole('article')).not.toBeInTheDocument()
  })

  it('says so when the answer is not an OpenAPI document, without asking again', async () => {
    const seen = serveDocument({ hello: 'world' })
    open()
    const alert = await screen.findByRole('alert')
    expect(alert).toHaveTextContent('Could not load the API description.')
    expect(alert).toHaveTextContent('answered in a form this page does not know')
    expect(seen).toHaveLength(1)
  })
})

describe('the page’s address', () => {
  it('is a route of the router outside every ability guard (anyone may read it)', () => {
    /** The chain of route objects from the root down to the one with `path`. */
    const chain = (list: RouteObject[], path: string): RouteObject[] | null => {
      for (const route of list) {
        if (route.path === path) return [route]
        const below = chain(route.children ?? [], path)
        if (below) return [route, ...below]
      }
      return null
    }
    const found = chain(routes, paths.apiReference.path)
    expect(found).not.toBeNull()
    expect(found!.filter((r) => r.element !== undefined && r.path === undefined)).toEqual([])
    expect(paths.apiReference.href()).toBe('/api-reference')
  })
})

describe('reading an OpenAPI document', () => {
  it('lists operations in the document’s order, with the path item’s and the operation’s parameters', () => {
    const ops = listOperations(DOCUMENT)
    expect(ops.map((o) => `${o.method} ${o.path}`)).toEqual([
      'GET /api/cases',
      'GET /api/cases/{id}',
      'GET /api/cases/{id}/file.pdf',
      'POST /api/cases/{id}/evidence',
      'POST /api/reports',
    ])
    expect(new Set(ops.map((o) => o.id)).size).toBe(ops.length)
    expect(ops[1]!.responses.map((r) => r.status)).toEqual(['200', '404', 'default'])
    const merged = listOperations({
      openapi: '3.1.0',
      paths: { '/x/{id}': { parameters: [{ name: 'id', in: 'path', schema: { type: 'string' } }, { name: 'q', in: 'query', schema: { type: 'string' } }], get: { parameters: [{ name: 'q', in: 'query', required: true, schema: { type: 'integer' } }] } } },
    })
    expect(merged[0]!.parameters.map((p) => `${p.name} ${p.in} ${p.required}`)).toEqual(['id path true', 'q query true'])
  })

  it('puts the server’s base path before addresses that do not carry it', () => {
    const ops = listOperations({ openapi: '3.1.0', servers: [{ url: 'https://quietband.example.test/api/' }], paths: { '/cases': { get: {} }, '/api/me': { get: {} } } })
    expect(ops.map((o) => o.path)).toEqual(['/api/cases', '/api/me'])
    expect(ops[0]!.tag).toBe('Other')
    expect(ops[0]!.summary).toBe('(no summary)')
  })

  it('groups by tag in the document’s tag order, leaving out tags without operations', () => {
    const groups = groupByTag(DOCUMENT, listOperations(DOCUMENT))
    expect(groups.map((g) => [g.name, g.operations.length])).toEqual([
      ['Reports', 1],
      ['Cases', 4],
    ])
    expect(groups[0]!.description).toBe('What anyone may send.')
  })

  it('filters by every typed word, in any case and order, reading :id as {id}', () => {
    const ops = listOperations(DOCUMENT)
    const names = (q: string) => filterOperations(ops, q).map((o) => `${o.method} ${o.path}`)
    expect(names('')).toHaveLength(5)
    expect(names('  ')).toHaveLength(5)
    expect(names('EVIDENCE post')).toEqual(['POST /api/cases/{id}/evidence'])
    expect(names('/cases/:id/file')).toEqual(['GET /api/cases/{id}/file.pdf'])
    expect(names('office’s')).toEqual(['GET /api/cases'])
    expect(names('reports cases')).toEqual([])
  })

  it('names callers as the product does, anyone first, and admits when the document does not say', () => {
    expect(callersInWords(['admin', 'anonymous', 'complainant'])).toEqual(['Anyone', 'System administrator', 'Complainant'])
    expect(callersInWords(['investigator', 'robot'])).toEqual(['Field investigator', 'robot'])
    expect(callersInWords(null)).toBeNull()
    expect(listOperations({ openapi: '3.1.0', paths: { '/a': { get: {} } } })[0]!.callers).toBeNull()
  })

  it('resolves JSON Pointers with escaped segments and nothing else', () => {
    const doc = { components: { schemas: { 'a/b': { type: 'string' }, 'm~n': { type: 'integer' } } } }
    expect(resolvePointer(doc, '#/components/schemas/a~1b')).toEqual({ type: 'string' })
    expect(resolvePointer(doc, '#/components/schemas/m~0n')).toEqual({ type: 'integer' })
    expect(resolvePointer(doc, '#/components/schemas/missing')).toBeUndefined()
    expect(resolvePointer(doc, 'https://elsewhere.example.test/schema.json')).toBeUndefined()
  })

  it('words statuses, and finds the error body the default answer refers to', () => {
    expect(statusWords('204')).toBe('No content')
    expect(statusWords('418')).toBeUndefined()
    expect(statusWords('default')).toBe('Any other status (an error)')
    const [list, one] = listOperations(DOCUMENT)
    expect(errorBodyRef(one!)).toBe('#/components/schemas/ApiError')
    expect(errorBodyRef(list!)).toBeUndefined()
  })
})

describe('a schema as a tree', () => {
  const caseView = schemaTree({ $ref: '#/components/schemas/CaseView' }, DOCUMENT)

  it('keeps the component’s name and its properties with required and nullable marks', () => {
    expect(caseView.refName).toBe('CaseView')
    expect(caseView.children.map((c) => [c.name, c.required, c.nullable])).toEqual([
      ['id', true, false],
      ['reference', true, false],
      ['state', true, false],
      ['closedAt', true, true],
      ['assignee', false, true],
      ['mergedInto', false, false],
      ['notes', false, false],
    ])
    expect(child(caseView, 'closedAt')).toMatchObject({ kind: 'string', format: 'date-time' })
    expect(child(caseView, 'state')).toMatchObject({ refName: 'CaseState', enumValues: ['"received"', '"triaged"', '"closed"'], description: 'Where the case stands.' })
    expect(typeInWords(child(caseView, 'notes'))).toBe('array of string')
  })

  it('stops a reference to itself and ends', () => {
    const mergedInto = child(caseView, 'mergedInto')
    expect(mergedInto).toMatchObject({ cycle: true, refName: 'CaseView', children: [] })
    // two components referring to each other end as well
    const doc = { components: { schemas: { A: { type: 'object', properties: { b: { $ref: '#/components/schemas/B' } } }, B: { type: 'array', items: { $ref: '#/components/schemas/A' } } } } }
    const a = schemaTree({ $ref: '#/components/schemas/A' }, doc)
    const b = child(a, 'b')
    expect(typeInWords(b)).toBe('B (array of A)')
    expect(b.items).toMatchObject({ cycle: true, refName: 'A' })
    expect(treeRows(a)).toHaveLength(2)
  })

  it('reads nullability written as a type list, as anyOf with null, as an enum with null, and the OpenAPI 3.0 flag', () => {
    expect(schemaTree({ type: ['integer', 'null'] }, {})).toMatchObject({ kind: 'integer', nullable: true })
    expect(schemaTree({ anyOf: [{ $ref: '#/components/schemas/Person' }, { type: 'null' }], description: 'Who has it' }, DOCUMENT)).toMatchObject({
      refName: 'Person',
      nullable: true,
      description: 'Who has it',
    })
    expect(schemaTree({ enum: ['a', null] }, {})).toMatchObject({ kind: 'string', nullable: true, enumValues: ['"a"'] })
    expect(schemaTree({ type: 'string', nullable: true }, {})).toMatchObject({ nullable: true })
    expect(schemaTree({ type: 'string' }, {})).toMatchObject({ nullable: false })
  })

  it('shows unions as choices, named by the property that tells them apart', () => {
    const evidence = schemaTree({ $ref: '#/components/schemas/Evidence' }, DOCUMENT)
    expect(evidence).toMatchObject({ kind: 'one of', discriminator: 'kind' })
    expect(evidence.variants.map((v) => v.label)).toEqual(['Choice 1: kind = "photo"', 'Choice 2: kind = "spectrum"'])
    expect(child(evidence.variants[1]!, 'rbwHz').constraints).toEqual(['more than 0'])
    const loose = schemaTree({ anyOf: [{ type: 'string' }, { type: 'integer' }] }, {})
    expect(loose.variants.map((v) => v.label)).toEqual(['Choice 1: string', 'Choice 2: integer'])
  })

  it('merges allOf objects into one, and reads records, tuples, files, constants and limits', () => {
    const merged = schemaTree({ allOf: [{ $ref: '#/components/schemas/Person' }, { type: 'object', properties: { office: { type: 'string' } }, required: ['office'] }] }, DOCUMENT)
    expect(merged.children.map((c) => [c.name, c.required])).toEqual([
      ['name', true],
      ['email', true],
      ['office', true],
    ])
    const record = schemaTree({ type: 'object', additionalProperties: { type: 'number' } }, {})
    expect(record.children).toMatchObject([{ label: 'Each key’s value', kind: 'number' }])
    const point = schemaTree({ type: 'array', prefixItems: [{ type: 'number' }, { type: 'number' }] }, {})
    expect(point.kind).toBe('tuple')
    expect(point.children.map((c) => c.label)).toEqual(['Place 1', 'Place 2'])
    expect(schemaTree({ type: 'string', format: 'binary' }, {})).toMatchObject({ kind: 'file', format: 'binary' })
    expect(schemaTree({ const: 3 }, {})).toMatchObject({ kind: 'integer', constValue: '3' })
    expect(schemaTree({ type: 'string', minLength: 1, maxLength: 200, pattern: '^[A-Z]+$', default: 'A' }, {}).constraints).toEqual([
      '1–200 characters',
      'matches ^[A-Z]+$',
      'default "A"',
    ])
    expect(schemaTree({}, {}).kind).toBe('any value')
    expect(schemaTree({ $ref: '#/components/schemas/Gone' }, DOCUMENT)).toMatchObject({ missingRef: true, refName: 'Gone' })
  })
})

/**
 * A person's saved views of the case list: saved, listed by name, removed; names unique per
 * person; another person neither sees nor removes them; bad names and queries are refused with
 * the field named; every answer fits its schema exactly.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { savedViewResponseSchema, savedViewsResponseSchema, SAVED_VIEWS_PER_PERSON_MAX } from '../../shared/schemas/saved-views'
import { createTestContext, type TestContext } from '../support/harness'
import { makeOffice, makeUser, signIn, type Agent } from '../support/factories'

let t: TestContext
let marta: Agent
let sade: Agent

beforeAll(async () => {
  t = await createTestContext()
  const office = await makeOffice(t)
  marta = await signIn(t, await makeUser(t, { role: 'investigator', office }))
  sade = await signIn(t, await makeUser(t, { role: 'supervisor', office }))
})
afterAll(() => t.close())

const views = async (agent: Agent) => {
  const res = await agent.get('/api/me/saved-views')
  expect(res.status).toBe(200)
  expect(savedViewsResponseSchema.parse(res.body)).toEqual(res.body)
  return res.body.views as { id: string; name: string; listQuery: string }[]
}

describe('saved views of the case list', () => {
  it('keeps a named view with its query, lists a person’s views by name, and removes one', async () => {
    const late = await marta.post('/api/me/saved-views').send({ name: '  Late and mine ', listQuery: 'investigatorId=me&overdue=true' })
    expect(late.status).toBe(201)
    expect(savedViewResponseSchema.parse(late.body)).toEqual(late.body)
    expect(late.body.view).toMatchObject({ name: 'Late and mine', listQuery: 'investigatorId=me&overdue=true' })
    await marta.post('/api/me/saved-views').send({ name: 'All safety of life', listQuery: 'priority=1' }).expect(201)

    expect((await views(marta)).map((v) => v.name)).toEqual(['All safety of life', 'Late and mine'])

    await marta.delete(`/api/me/saved-views/${late.body.view.id}`).expect(204)
    expect((await views(marta)).map((v) => v.name)).toEqual(['All safety of life'])
  })

  it('keeps each person’s views to themselves: another person neither sees nor removes them', async () => {
    const mine = (await views(marta))[0]!
    expect(await views(sade)).toEqual([])
    const res = await sade.delete(`/api/me/saved-views/${mine.id}`)
    expect(res.status).toBe(404)
    expect((await views(marta)).map((v) => v.id)).toContain(mine.id)
  })

  it('refuses a name the person already uses, and says so', async () => {
    const res = await marta.post('/api/me/saved-views').send({ name: 'All safety of life', listQuery: 'priority=1,2' })
    expect(res.status).toBe(409)
    expect(res.body.error.message).toContain('already have a view called “All safety of life”')
    // the same name is free for someone else
    await sade.post('/api/me/saved-views').send({ name: 'All safety of life', listQuery: 'priority=1' }).expect(201)
  })

  it.each([
    ['an empty name', { name: '   ', listQuery: '' }, 'name'],
    ['a name of 81 characters', { name: 'x'.repeat(81), listQuery: '' }, 'name'],
    ['a name with a control character', { name: 'Late\u0007', listQuery: '' }, 'name'],
    ['a query that is not name=value pairs', { name: 'Odd', listQuery: '<script>' }, 'listQuery'],
    ['a query of 2,001 characters', { name: 'Long', listQuery: `q=${'x'.repeat(1999)}` }, 'listQuery'],
  ])('refuses %s with the field named', async (_what, body, field) => {
    const before = (await views(marta)).length
    const res = await marta.post('/api/me/saved-views').send(body)
    expect(res.status).toBe(400)
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toContain(field)
    expect((await views(marta)).length).toBe(before)
  })

  it(`stops at ${SAVED_VIEWS_PER_PERSON_MAX} views per person with a clear message`, async () => {
    const have = (await views(sade)).length
    for (let i = have; i < SAVED_VIEWS_PER_PERSON_MAX; i++) await sade.post('/api/me/saved-views').send({ name: `View ${i}`, listQuery: `page=${i + 1}` }).expect(201)
    const res = await sade.post('/api/me/saved-views').send({ name: 'One too many', listQuery: '' })
    expect(res.status).toBe(409)
    expect(res.body.error.message).toContain(`${SAVED_VIEWS_PER_PERSON_MAX} saved views`)
  })
})

/**
 * A complainant's added information closes the loop: the assigned investigator is e-mailed
 * (through the outbox, in the same transaction), or the office's supervisors when nobody is
 * assigned; and everyone can read which e-mails Quietband sends them.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { MAIL_KINDS } from '../../shared/domain/mail-kinds'
import { myEmailsResponseSchema } from '../../shared/schemas/follow-ups'
import { createTestContext, uniqueAddress, type TestContext } from '../support/harness'
import { makeCase, makeOffice, makeUser, signIn } from '../support/factories'
import { queuedMails } from '../support/cases'

let t: TestContext
beforeAll(async () => {
  t = await createTestContext()
})
afterAll(() => t?.close())

const addedInfo = async (email: string) => (await queuedMails(t.pool, email)).filter((m) => m.subject.includes('The complainant added information'))
const addThroughLink = (token: string, body: string) => request(t.app).post(`/api/track/${token}/information`).set('X-Forwarded-For', uniqueAddress()).send({ body })

describe('a complainant adds information', () => {
  it('e-mails the assigned investigator, not the supervisors', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'field_work' })
    const res = await addThroughLink(c.trackingToken, 'The noise is worse after 22:00, mostly on channel 9.')
    expect(res.status, JSON.stringify(res.body)).toBeLessThan(300)
    const [mail, ...more] = await addedInfo(c.investigator!.email)
    expect(more).toEqual([])
    expect(mail!.subject).toBe(`[${c.reference}] The complainant added information`)
    expect(mail!.text).toContain('assigned to you')
    expect(mail!.text).toContain(`/cases/${c.id}`)
    expect(await addedInfo(c.supervisor!.email)).toEqual([])
  })

  it('e-mails every active supervisor of the office when no investigator is assigned', async () => {
    const office = await makeOffice(t)
    const [s1, s2] = [await makeUser(t, { role: 'supervisor', office }), await makeUser(t, { role: 'supervisor', office })]
    const elsewhere = await makeUser(t, { role: 'supervisor', office: await makeOffice(t) })
    const c = await makeCase(t, { office, state: 'triaged', supervisor: s1 })
    expect((await addThroughLink(c.trackingToken, 'I have found the licence number on the mast.')).status).toBeLessThan(300)
    expect(await addedInfo(s1.email)).toHaveLength(1)
    expect(await addedInfo(s2.email)).toHaveLength(1)
    expect((await addedInfo(s1.email))[0]!.text).toContain('No investigator is working on it')
    expect(await addedInfo(elsewhere.email)).toEqual([])
  })

  it('queues nothing when the addition is refused', async () => {
    const office = await makeOffice(t)
    const c = await makeCase(t, { office, state: 'assigned' })
    expect((await addThroughLink(c.trackingToken, '')).status).toBe(400)
    expect(await addedInfo(c.investigator!.email)).toEqual([])
  })
})

describe('E-mails Quietband sends you', () => {
  it('lists, per role, the kinds of the mail table that reach that role', async () => {
    const office = await makeOffice(t)
    for (const role of ['investigator', 'supervisor', 'complainant', 'admin'] as const) {
      const user = await makeUser(t, { role, office: role === 'investigator' || role === 'supervisor' ? office : null })
      const res = await (await signIn(t, user)).get('/api/me/emails')
      expect(res.status).toBe(200)
      const body = myEmailsResponseSchema.parse(res.body)
      expect(body).toMatchObject({ role, address: user.email })
      const expected = Object.entries(MAIL_KINDS).filter(([, k]) => (k.to as readonly string[]).includes(role)).map(([name]) => name)
      expect(body.kinds.map((k) => k.kind)).toEqual(expected)
    }
    expect((await request(t.app).get('/api/me/emails')).status).toBe(401)
  })

  it('tells an investigator about additions and a supervisor about the digest', async () => {
    const office = await makeOffice(t)
    const inv = myEmailsResponseSchema.parse((await (await signIn(t, await makeUser(t, { role: 'investigator', office }))).get('/api/me/emails')).body)
    expect(inv.kinds.map((k) => k.kind)).toContain('complainantAddedInformationMail')
    expect(inv.kinds.map((k) => k.kind)).not.toContain('officeDigestMail')
    const sup = myEmailsResponseSchema.parse((await (await signIn(t, await makeUser(t, { role: 'supervisor', office }))).get('/api/me/emails')).body)
    expect(sup.kinds.map((k) => k.kind)).toContain('officeDigestMail')
  })
})

/**
 * The office's morning digest: once a follow-up's deadline has passed it is overdue, and the
 * digest e-mailed to each supervisor of the office lists it with the office's overdue cases,
 * their due times in the office's zone; it goes out at 07:00 office time (its IANA zone, not
 * UTC) or the first check after, once per local day, whatever restarts or second checks
 * follow, and only on a day with something late or due (that day is recorded with no
 * recipients and settled); the pg-boss job runs the check.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createTestContext, type TestContext } from '../support/harness'
import { makeCase, makeOffice, makeUser } from '../support/factories'
import { atLocal, closedWithDeadline, dayFromToday } from '../support/factories'
import { queuedMails } from '../support/cases'
import { runOfficeDigests } from '../../server/modules/follow-ups/digest.service'
import { startDigestWorker } from '../../server/modules/follow-ups/digest-job'

let t: TestContext
beforeAll(async () => {
  t = await createTestContext()
})
afterAll(() => t?.close())

const digestsTo = async (email: string) => (await queuedMails(t.pool, email)).filter((m) => m.subject.includes('overdue cases and follow-ups'))
const daysRecorded = async (officeId: string) =>
  (await t.pool.query(`SELECT to_char(local_day, 'YYYY-MM-DD') AS day, recipients FROM digest_sends WHERE office_id = $1 ORDER BY local_day`, [officeId])).rows

describe('the office digest', () => {
  it('lists a follow-up whose deadline has passed and the overdue cases, once per local day at 07:00 office time', async () => {
    const timeZone = 'America/Los_Angeles'
    const office = await makeOffice(t, { timeZone })
    const deadline = dayFromToday(3)
    const c = await closedWithDeadline(t, office, deadline)
    const second = await makeUser(t, { role: 'supervisor', office })
    // a case triaged now at priority 2 (24 h target here): overdue well before the check below
    const late = await makeCase(t, { office, state: 'triaged', priority: 2, supervisor: c.supervisor })
    const day = dayFromToday(2, new Date(`${deadline}T12:00:00Z`))
    const only = { officeIds: [office.id] }

    // 06:59 office time: not yet (in UTC it is already 14:59)
    const early = atLocal(day, 6, 45, timeZone)
    expect((await runOfficeDigests(t.services, early, only)).sent).toEqual([])
    expect(await digestsTo(c.supervisor!.email)).toEqual([])

    const seven = atLocal(day, 7, 0, timeZone)
    const run = await runOfficeDigests(t.services, seven, only)
    expect(run.sent).toEqual([{ officeId: office.id, localDay: day, recipients: 2 }])
    for (const s of [c.supervisor!, second]) {
      const [mail, ...more] = await digestsTo(s.email)
      expect(more).toEqual([])
      expect(mail!.subject).toBe(`${office.name}: overdue cases and follow-ups on ${day}`)
      expect(mail!.text).toMatch(/Follow-ups overdue \(1\):/)
      expect(mail!.text).toContain(`${c.reference} — deadline ${deadline}: Send a formal warning`)
      expect(mail!.text).toMatch(/Overdue cases \(1\):/)
      expect(mail!.text).toContain(late.reference)
      expect(mail!.text).toContain(`/cases/${c.id}`)
      // an empty section of a digest that is sent still says so
      expect(mail!.text).toContain('Follow-ups due today: none.')
    }
    // the investigator gets no digest
    expect(await digestsTo(c.investigator!.email)).toEqual([])

    // a later check the same local day, as after a restart: nothing more
    expect((await runOfficeDigests(t.services, atLocal(day, 8, 0, timeZone), only)).sent).toEqual([])
    expect((await runOfficeDigests(t.services, atLocal(day, 23, 45, timeZone), only)).sent).toEqual([])
    expect(await digestsTo(second.email)).toHaveLength(1)

    // the next local day: a new digest
    const next = dayFromToday(1, new Date(`${day}T12:00:00Z`))
    expect((await runOfficeDigests(t.services, atLocal(next, 9, 30, timeZone), only)).sent).toEqual([{ officeId: office.id, localDay: next, recipients: 2 }])
    expect(await digestsTo(second.email)).toHaveLength(2)
  })

  it('sends nothing on a day with nothing late or due, records the day as settled, and skips an office without an active supervisor', async () => {
    const timeZone = 'Asia/Tokyo'
    const quiet = await makeOffice(t, { timeZone })
    const sup = await makeUser(t, { role: 'supervisor', office: quiet })
    const empty = await makeOffice(t)
    const day = dayFromToday(2)
    // a case due at 09:00 office time that day: not yet late at the 07:30 check
    const c = await makeCase(t, { office: quiet, state: 'triaged', priority: 2, supervisor: sup })
    await t.pool.query(`UPDATE cases SET due_at = $2 WHERE id = $1`, [c.id, atLocal(day, 9, 0, timeZone)])

    const run = await runOfficeDigests(t.services, atLocal(day, 7, 30, timeZone), { officeIds: [quiet.id, empty.id] })
    expect(run.sent).toEqual([])
    expect(run.nothingToReport).toEqual([{ officeId: quiet.id, localDay: day }])
    expect(await digestsTo(sup.email)).toEqual([])
    expect(await daysRecorded(quiet.id)).toEqual([{ day, recipients: 0 }])
    // the office without a supervisor: nothing sent and nothing recorded, so it is checked again later
    expect(await daysRecorded(empty.id)).toEqual([])

    // the case falls late at 09:00; the noon check leaves the settled day alone (the next morning reports it)
    const noon = await runOfficeDigests(t.services, atLocal(day, 12, 0, timeZone), { officeIds: [quiet.id] })
    expect(noon).toEqual({ sent: [], nothingToReport: [] })
    expect(await digestsTo(sup.email)).toEqual([])

    // the next morning: the late case, in one digest
    const next = dayFromToday(1, new Date(`${day}T12:00:00Z`))
    const morning = await runOfficeDigests(t.services, atLocal(next, 7, 5, timeZone), { officeIds: [quiet.id] })
    expect(morning.sent).toEqual([{ officeId: quiet.id, localDay: next, recipients: 1 }])
    const [mail, ...more] = await digestsTo(sup.email)
    expect(more).toEqual([])
    expect(mail!.text).toMatch(/Overdue cases \(1\):/)
    expect(mail!.text).toContain(c.reference)
    expect(await daysRecorded(quiet.id)).toEqual([
      { day, recipients: 0 },
      { day: next, recipients: 1 },
    ])
  })

  it("writes a case's due time in the office's zone, naming the zone", async () => {
    const timeZone = 'Atlantic/Azores'
    const office = await makeOffice(t, { timeZone })
    const sup = await makeUser(t, { role: 'supervisor', office })
    const c = await makeCase(t, { office, state: 'triaged', priority: 2, supervisor: sup })
    // 10:30 UTC on 1 Dec 2026; the Azores keep UTC−1 in winter (standard time, no summer time
    // in December), so the office reads 09:30 (worked by hand from the zone's offset)
    await t.pool.query(`UPDATE cases SET due_at = '2026-12-01T10:30:00Z' WHERE id = $1`, [c.id])
    const day = dayFromToday(1)
    const run = await runOfficeDigests(t.services, atLocal(day, 7, 15, timeZone), { officeIds: [office.id] })
    expect(run.sent).toEqual([{ officeId: office.id, localDay: day, recipients: 1 }])
    const [mail] = await digestsTo(sup.email)
    // triaged, not yet assigned
    expect(mail!.text).toContain(`${c.reference} — due 1 Dec 2026, 09:30 (Atlantic/Azores), no investigator`)
    expect(mail!.text).not.toContain('UTC')
  })

  it('is run by the pg-boss job, whose clock the test sets', async () => {
    const office = await makeOffice(t, { timeZone: 'Europe/Lisbon' })
    const sup = await makeUser(t, { role: 'supervisor', office })
    // something late, or the day would send nothing: a case due long before the job's clock
    const late = await makeCase(t, { office, state: 'triaged', priority: 2, supervisor: sup })
    await t.pool.query(`UPDATE cases SET due_at = now() - interval '2 hours' WHERE id = $1`, [late.id])
    const day = dayFromToday(5)
    const queueName = `office-digest-test-${process.pid}-${Math.random().toString(36).slice(2, 8)}`
    // the job's clock: 07:10 in Lisbon on that day (only this office, so other files' offices are left alone)
    const worker = await startDigestWorker(t.services, { queueName, pollingIntervalSeconds: 0.5, now: () => atLocal(day, 7, 10, 'Europe/Lisbon'), officeIds: [office.id] })
    try {
      await expect.poll(async () => (await digestsTo(sup.email)).length, { timeout: 15_000, interval: 250 }).toBe(1)
      const { rows } = await t.pool.query(`SELECT state, start_after > now() + interval '50 minutes' AS later FROM pgboss.job WHERE name = $1 AND state = 'created'`, [queueName])
      expect(rows, 'the next check waits about an hour').toEqual([{ state: 'created', later: true }])
    } finally {
      await worker.stop()
    }
  })
})

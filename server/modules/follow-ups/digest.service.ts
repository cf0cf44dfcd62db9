/**
 * The office's morning digest: at DIGEST_LOCAL_HOUR office time (or the first check after it),
 * each active supervisor of the office is e-mailed the office's overdue cases (the one rule of
 * shared/domain/case-clocks.ts) and its open follow-ups overdue or due that day, with times in
 * the office's own zone. A day with nothing late or due sends nothing: an empty summary only
 * teaches people to ignore it.
 *
 * The day's record (`digest_sends`) is written in the transaction that queues the e-mails, so
 * another process or a restart finds it and sends nothing twice. A day with nothing to report
 * is recorded too (no recipients): the morning's check settles the day either way, and what
 * falls late later that day is in the next morning's digest, as it is after a day with one.
 * An office without an active supervisor is skipped (nothing recorded) until one exists.
 */
import { DIGEST_LOCAL_HOUR, localDay, localHour } from '../../../shared/domain/follow-ups'
import type { ServiceContext } from '../../context'
import { withTransaction } from '../../db/client'
import { queueMail } from '../../jobs/boss'
import { officeDigestMail, type DigestLine } from '../../mail/notification-templates'
import { activeStaffOf } from '../users/users.repo'
import { claimDigest, digestRecorded, dueFollowUps, officesForDigest, overdueCasesOf } from './follow-ups.repo'

export type DigestDeps = Pick<ServiceContext, 'pool' | 'db' | 'boss' | 'publicUrl' | 'mailQueue'>

export interface DigestRun {
  /** Offices whose digest was queued by this run, with the local day and the number of supervisors e-mailed. */
  sent: { officeId: string; localDay: string; recipients: number }[]
  /** Offices whose day this run settled with nothing late or due: recorded, nothing sent. */
  nothingToReport: { officeId: string; localDay: string }[]
}

/** A moment as the office reads it, its zone named: "5 Dec 2026, 14:00 (Atlantic/Azores)". */
export function officeTime(at: Date, timeZone: string): string {
  const local = new Intl.DateTimeFormat('en-GB', { timeZone, dateStyle: 'medium', timeStyle: 'short', hourCycle: 'h23' }).format(at)
  return `${local} (${timeZone})`
}

/** Checks every office (or only the given ones) at `now` and sends the digests that are due and not yet sent. */
export async function runOfficeDigests(deps: DigestDeps, now: Date, opts: { officeIds?: readonly string[] } = {}): Promise<DigestRun> {
  const sent: DigestRun['sent'] = []
  const nothingToReport: DigestRun['nothingToReport'] = []
  const offices = (await officesForDigest(deps.db)).filter((o) => !opts.officeIds || opts.officeIds.includes(o.id))
  for (const office of offices) {
    if (localHour(now, office.timeZone) < DIGEST_LOCAL_HOUR) continue
    const day = localDay(now, office.timeZone)
    const result = await withTransaction(deps.pool, async ({ db, client }) => {
      const supervisors = await activeStaffOf(db, office.id, 'supervisor')
      if (supervisors.length === 0) return undefined
      // the usual later check of a recorded day stops here; the claim below is the guarantee
      if (await digestRecorded(db, office.id, day)) return undefined
      const link = (id: string) => `${deps.publicUrl}/cases/${id}`
      const [cases, followUps] = await Promise.all([overdueCasesOf(db, office.id, now), dueFollowUps(db, { officeIds: [office.id] }, now)])
      const empty = cases.length === 0 && followUps.length === 0
      if (!(await claimDigest(db, office.id, day, empty ? 0 : supervisors.length))) return undefined
      if (empty) return { officeId: office.id, localDay: day, recipients: 0 }
      const overdueCases: DigestLine[] = cases.map((c) => ({
        reference: c.reference,
        link: link(c.id),
        detail: `due ${officeTime(c.dueAt, office.timeZone)}${c.investigatorName ? `, ${c.investigatorName}` : ', no investigator'}`,
      }))
      const line = (f: (typeof followUps)[number]): DigestLine => ({
        reference: f.caseReference,
        link: link(f.caseId),
        detail: `deadline ${f.dueOn}: ${f.expected}${f.investigatorName ? ` (${f.investigatorName})` : ''}`,
      })
      for (const s of supervisors) {
        await queueMail(
          deps.boss,
          client,
          officeDigestMail(s, {
            officeName: office.name,
            localDay: day,
            overdueCases,
            overdueFollowUps: followUps.filter((f) => f.overdue).map(line),
            dueFollowUps: followUps.filter((f) => !f.overdue).map(line),
          }),
          deps.mailQueue,
        )
      }
      return { officeId: office.id, localDay: day, recipients: supervisors.length }
    })
    if (result?.recipients === 0) nothingToReport.push({ officeId: result.officeId, localDay: result.localDay })
    else if (result) sent.push(result)
  }
  return { sent, nothingToReport }
}

/**
 * The office's morning digest: at DIGEST_LOCAL_HOUR office time (or the first check after it),
 * each active supervisor of the office is e-mailed the office's overdue cases (the one rule of
 * shared/domain/case-clocks.ts) and its open follow-ups overdue or due that day. The day's
 * record (`digest_sends`) is written in the transaction that queues the e-mails, so another
 * process or a restart finds it and sends nothing twice; an office without an active
 * supervisor is skipped until one exists.
 */
import { DIGEST_LOCAL_HOUR, localDay, localHour } from '../../../shared/domain/follow-ups'
import type { ServiceContext } from '../../context'
import { withTransaction } from '../../db/client'
import { queueMail } from '../../jobs/boss'
import { officeDigestMail, type DigestLine } from '../../mail/notification-templates'
import { activeStaffOf } from '../users/users.repo'
import { claimDigest, dueFollowUps, officesForDigest, overdueCasesOf } from './follow-ups.repo'

export type DigestDeps = Pick<ServiceContext, 'pool' | 'db' | 'boss' | 'publicUrl' | 'mailQueue'>

export interface DigestRun {
  /** Offices whose digest was queued by this run, with the local day and the number of supervisors e-mailed. */
  sent: { officeId: string; localDay: string; recipients: number }[]
}

/** Checks every office (or only the given ones) at `now` and sends the digests that are due and not yet sent. */
export async function runOfficeDigests(deps: DigestDeps, now: Date, opts: { officeIds?: readonly string[] } = {}): Promise<DigestRun> {
  const sent: DigestRun['sent'] = []
  const offices = (await officesForDigest(deps.db)).filter((o) => !opts.officeIds || opts.officeIds.includes(o.id))
  for (const office of offices) {
    if (localHour(now, office.timeZone) < DIGEST_LOCAL_HOUR) continue
    const day = localDay(now, office.timeZone)
    const result = await withTransaction(deps.pool, async ({ db, client }) => {
      const supervisors = await activeStaffOf(db, office.id, 'supervisor')
      if (supervisors.length === 0) return undefined
      if (!(await claimDigest(db, office.id, day, supervisors.length))) return undefined
      const link = (id: string) => `${deps.publicUrl}/cases/${id}`
      const [cases, followUps] = await Promise.all([overdueCasesOf(db, office.id, now), dueFollowUps(db, { officeIds: [office.id] }, now)])
      const overdueCases: DigestLine[] = cases.map((c) => ({
        reference: c.reference,
        link: link(c.id),
        detail: `due ${c.dueAt.toISOString().slice(0, 16).replace('T', ' ')} UTC${c.investigatorName ? `, ${c.investigatorName}` : ', no investigator'}`,
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
    if (result) sent.push(result)
  }
  return { sent }
}

/** E-mails that keep staff in the loop: a complainant's addition, and the office's morning digest. */
import { composeMail } from './templates'
import type { OutgoingMail } from './mailer'

export function complainantAddedInformationMail(to: { name: string; email: string }, c: { reference: string }, caseLink: string, opts: { unassigned: boolean }): OutgoingMail {
  return composeMail(to.email, `[${c.reference}] The complainant added information`, [
    `Hello ${to.name},`,
    opts.unassigned
      ? `The complainant of ${c.reference} has added information. No investigator is working on it, so this comes to the office's supervisors.`
      : `The complainant of ${c.reference}, assigned to you, has added information.`,
    'Read it on the case page:',
    caseLink,
  ])
}

export interface DigestLine {
  reference: string
  link: string
  /** What is late or due, in words (due time, deadline, what is expected). */
  detail: string
}

export function officeDigestMail(
  to: { name: string; email: string },
  d: { officeName: string; localDay: string; overdueCases: DigestLine[]; overdueFollowUps: DigestLine[]; dueFollowUps: DigestLine[] },
): OutgoingMail {
  const section = (title: string, lines: DigestLine[]) =>
    lines.length === 0 ? [`${title}: none.`] : [`${title} (${lines.length}):`, ...lines.flatMap((l) => [`${l.reference} — ${l.detail}`, l.link])]
  return composeMail(to.email, `${d.officeName}: overdue cases and follow-ups on ${d.localDay}`, [
    `Hello ${to.name},`,
    `The morning summary for ${d.officeName} on ${d.localDay} (office time).`,
    ...section('Overdue cases', d.overdueCases),
    ...section('Follow-ups overdue', d.overdueFollowUps),
    ...section('Follow-ups due today', d.dueFollowUps),
  ])
}

/**
 * Every kind of e-mail Quietband sends, as data: which event sends it and to whom. The key is
 * the name of the template function that writes it (server/mail/*-templates.ts, templates.ts),
 * and a test holds the two together: a template without an entry here, or an entry without a
 * template, fails. The "E-mails Quietband sends you" panel is built from this table, so it
 * cannot drift from what the code sends.
 */
import type { Role } from './roles'

export interface MailKind {
  /** Who receives it, by role (a complainant is also whoever filed a report without an account). */
  to: readonly Role[]
  /** The event that sends it, in the reader's words. */
  when: string
  /** The same for a role that receives it for another reason. */
  whenFor?: Partial<Record<Role, string>>
  /** Sent to everyone who asks for it (account e-mails), not tied to a case. */
  account?: boolean
}

export const MAIL_KINDS = {
  // account e-mails
  staffInvitationMail: { to: ['investigator', 'supervisor', 'admin'], when: 'An administrator creates your staff account (a link to choose your password).', account: true },
  passwordResetMail: { to: ['complainant', 'investigator', 'supervisor', 'admin'], when: 'You ask to reset your password.', account: true },
  confirmAddressMail: { to: ['complainant'], when: 'You create an account (a link to confirm your address).', account: true },
  alreadyRegisteredMail: { to: ['complainant', 'investigator', 'supervisor', 'admin'], when: 'Someone tries to create an account with your address.', account: true },
  noAccountResetMail: { to: ['complainant'], when: 'Someone asks for a password reset for an address without an account.', account: true },
  // the complainant's case e-mails
  reportReceivedMail: { to: ['complainant'], when: 'Your report is received (with its private tracking link).' },
  caseAssignedComplainantMail: { to: ['complainant'], when: 'An engineer is first assigned to your report.' },
  informationRequestedMail: { to: ['complainant'], when: 'The engineers ask you for more information.' },
  messageToComplainantMail: { to: ['complainant'], when: 'The office writes to you about your report.' },
  caseClosedMail: { to: ['complainant'], when: 'Your report is closed, merged or withdrawn (with the outcome).' },
  caseReopenedMail: { to: ['complainant'], when: 'Your report is reopened.' },
  // staff case e-mails
  investigatorAssignedMail: { to: ['investigator'], when: 'A case is assigned to you.' },
  safetyReportMail: { to: ['supervisor'], when: 'A report suggested priority 1 (safety of life) reaches your office.' },
  findingProposedMail: { to: ['supervisor'], when: 'An investigator of your office proposes a finding for review.' },
  findingReturnedMail: { to: ['investigator'], when: 'Your proposed finding is sent back for more work.' },
  complainantAddedInformationMail: {
    to: ['investigator', 'supervisor'],
    when: 'A complainant adds information to a case assigned to you.',
    whenFor: { supervisor: 'A complainant adds information to a case of your office that no investigator is working on.' },
  },
  officeDigestMail: { to: ['supervisor'], when: 'Every morning (07:00 office time), sent only on days with something late or due: overdue cases and follow-ups due or overdue in your office.' },
} as const satisfies Record<string, MailKind>

export type MailKindName = keyof typeof MAIL_KINDS
export const MAIL_KIND_NAMES = Object.keys(MAIL_KINDS) as MailKindName[]

/** What sends the kind, as a person of this role reads it. */
export function mailKindWhen(kind: MailKindName, role: Role): string {
  const k: MailKind = MAIL_KINDS[kind]
  return k.whenFor?.[role] ?? k.when
}

/** The kinds of e-mail a person of this role can receive, in the table's order. */
export function mailKindsFor(role: Role): MailKindName[] {
  return MAIL_KIND_NAMES.filter((k) => (MAIL_KINDS[k].to as readonly Role[]).includes(role))
}

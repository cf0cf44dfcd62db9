/**
 * Enforcement after a finding: the party responsible for the source, the notices served on it
 * and its replies (proof of notice), and the follow-ups that keep a compliance deadline in
 * view. The lists are data, so the forms, the database CHECKs and the API read the same values.
 *
 * A follow-up is due on a calendar day of its office (its IANA time zone): it is "due" on that
 * day and "overdue" from the next day while it is still open. This is the one definition; the
 * server's SQL (server/modules/follow-ups/follow-ups.repo.ts) states the same comparison.
 */

/** How a notice reached the responsible party. */
export const NOTICE_METHODS = ['in_person', 'registered_post', 'email', 'other'] as const
export type NoticeMethod = (typeof NOTICE_METHODS)[number]

export const NOTICE_METHOD_LABELS: Record<NoticeMethod, string> = {
  in_person: 'Handed over in person',
  registered_post: 'Registered post',
  email: 'E-mail',
  other: 'Other (describe)',
}

/** Where a follow-up came from. */
export const FOLLOW_UP_SOURCES = ['finding', 'staff'] as const
export type FollowUpSource = (typeof FOLLOW_UP_SOURCES)[number]

export const FOLLOW_UP_STATES = ['open', 'complied', 'escalated'] as const
export type FollowUpState = (typeof FOLLOW_UP_STATES)[number]

export const FOLLOW_UP_STATE_LABELS: Record<FollowUpState, string> = {
  open: 'Open',
  complied: 'Complied — confirmed',
  escalated: 'Not complied — escalated',
}

/** Who may make a follow-up move, relative to the case. */
export type FollowUpMover = 'office_supervisor' | 'assigned_investigator'

/** The moves of a follow-up: each one change of state and one timeline entry. */
export const FOLLOW_UP_MOVES = {
  confirm: { from: ['open'], to: 'complied', by: ['office_supervisor', 'assigned_investigator'] },
  escalate: { from: ['open'], to: 'escalated', by: ['office_supervisor', 'assigned_investigator'] },
  reopen: { from: ['complied', 'escalated'], to: 'open', by: ['office_supervisor'] },
} as const satisfies Record<string, { from: readonly FollowUpState[]; to: FollowUpState; by: readonly FollowUpMover[] }>
export type FollowUpMoveName = keyof typeof FOLLOW_UP_MOVES
export const FOLLOW_UP_MOVE_NAMES = Object.keys(FOLLOW_UP_MOVES) as FollowUpMoveName[]

export const FOLLOW_UP_MOVE_LABELS: Record<FollowUpMoveName, string> = {
  confirm: 'Confirm complied',
  escalate: 'Not complied — escalate',
  reopen: 'Reopen',
}

export function followUpMoveAllowedFrom(move: FollowUpMoveName, state: FollowUpState): boolean {
  return (FOLLOW_UP_MOVES[move].from as readonly FollowUpState[]).includes(state)
}

/** Where a follow-up stands on a given office-local day. */
export type FollowUpStanding = 'overdue' | 'due' | 'upcoming' | 'closed'

/**
 * The one rule: an open follow-up is due on its day and overdue on every later day (ISO dates
 * compare as strings). A confirmed or escalated one is closed.
 */
export function followUpStanding(f: { state: FollowUpState; dueOn: string }, today: string): FollowUpStanding {
  if (f.state !== 'open') return 'closed'
  if (f.dueOn < today) return 'overdue'
  return f.dueOn === today ? 'due' : 'upcoming'
}

/**
 * The calendar day (YYYY-MM-DD) at `now` in an IANA time zone: an office's "today". Uses the
 * platform's time-zone data (Intl), in the browser and on the server alike.
 */
export function localDay(now: Date, timeZone: string): string {
  const parts = new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).formatToParts(now)
  const get = (t: string) => parts.find((p) => p.type === t)!.value
  return `${get('year')}-${get('month')}-${get('day')}`
}

/** The hour of the day (0–23) at `now` in an IANA time zone. */
export function localHour(now: Date, timeZone: string): number {
  const h = new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', hourCycle: 'h23' }).format(now)
  return Number(h)
}

/** The office-local hour from which the day's digest goes out (or the first check after it). */
export const DIGEST_LOCAL_HOUR = 7

/** The timeline entries these records write (kinds of case_events), with their titles. */
export const ENFORCEMENT_EVENT_TITLES: Record<string, string> = {
  party_recorded: 'Responsible party recorded',
  notice_served: 'Notice served on the responsible party',
  party_reply: 'Reply from the responsible party',
  follow_up_added: 'Follow-up added',
  follow_up_confirm: 'Follow-up confirmed: complied',
  follow_up_escalate: 'Follow-up not complied: escalated',
  follow_up_reopen: 'Follow-up reopened',
}

/** The timeline kind of a follow-up move. */
export const followUpEventKind = (move: FollowUpMoveName) => `follow_up_${move}`

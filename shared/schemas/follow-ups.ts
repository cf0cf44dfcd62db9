/**
 * Enforcement records of a case as the API takes and answers them: the responsible party
 * (versioned), the notices served on it and its replies, the follow-ups and their moves, the
 * investigator's follow-up queue and "E-mails Quietband sends you".
 */
import { z } from 'zod'
import { FOLLOW_UP_MOVE_NAMES, FOLLOW_UP_SOURCES, FOLLOW_UP_STATES, NOTICE_METHODS } from '../domain/follow-ups'
import { ROLES } from '../domain/roles'
import { storableString } from './text'

const text = (max: number, what: string) => storableString().trim().max(max, { message: `${what}: at most ${max} characters.` })
/** An empty text field (as a form sends it) is the same as a missing one. */
const blankIsMissing = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v)
const optionalText = (max: number, what: string) => z.preprocess(blankIsMissing, text(max, what).optional())
/** Years a record's day may carry (a guard against typing errors; the database's dates need a year after 0). */
// (only a well-formed date is compared, so a malformed one gets one message)
const plausibleYear = (d: string) => !/^\d{4}-\d{2}-\d{2}$/.test(d) || (d >= '1970-01-01' && d <= '2199-12-31')
const YEAR_MESSAGE = 'Check the year: the date must lie between 1970 and 2199.'

/** A required calendar day: missing and malformed each get their own message. */
const day = (what: string) =>
  z.preprocess(
    blankIsMissing,
    z.iso
      .date({ error: (iss) => (iss.input === undefined ? `Enter ${what}.` : `Enter ${what} as a date (YYYY-MM-DD).`) })
      .refine(plausibleYear, { message: YEAR_MESSAGE }),
  )
const optionalId = (what: string) => z.preprocess(blankIsMissing, z.uuid({ message: `Not a valid ${what} id.` }).optional())

/** POST /api/cases/:id/responsible-party — a new version of the party's record. */
export const responsiblePartyInputSchema = z
  .object({
    name: text(200, 'Name').min(2, { message: 'Enter the name of the person or organisation (at least 2 characters).' }),
    address: optionalText(500, 'Address'),
    email: z.preprocess(blankIsMissing, z.email({ message: 'Enter a valid e-mail address, or leave it empty.' }).max(254).optional()),
    phone: optionalText(40, 'Phone'),
  })
  .refine((v) => v.address || v.email || v.phone, { path: ['address'], message: 'Give at least one way to reach them: an address, an e-mail or a phone number.' })
export type ResponsiblePartyInput = z.input<typeof responsiblePartyInputSchema>
export type ResponsibleParty = z.output<typeof responsiblePartyInputSchema>

/** POST /api/cases/:id/notices — a notice served on the responsible party. */
export const noticeInputSchema = z
  .object({
    servedOn: day('the day it was served'),
    method: z.enum(NOTICE_METHODS, { message: 'Choose how the notice was served.' }),
    methodOther: optionalText(200, 'How it was served'),
    servedBy: optionalText(200, 'Served by'),
    reference: optionalText(100, 'Reference'),
    summary: text(2000, 'What the notice says').min(3, { message: 'Say what the notice requires (at least 3 characters).' }),
    evidenceId: optionalId('evidence file'),
  })
  .superRefine((v, ctx) => {
    if (v.method === 'other' && !v.methodOther) ctx.addIssue({ code: 'custom', path: ['methodOther'], message: 'Describe how the notice was served.' })
    if (v.method !== 'other' && v.methodOther) ctx.addIssue({ code: 'custom', path: ['methodOther'], message: 'Describe the method only when you choose “Other”.' })
  })
export type NoticeInput = z.input<typeof noticeInputSchema>
export type Notice = z.output<typeof noticeInputSchema>

/** POST /api/cases/:id/party-replies — a reply from the responsible party. */
export const replyInputSchema = z.object({
  receivedOn: day('the day the reply arrived'),
  noticeId: optionalId('notice'),
  summary: text(4000, 'Reply').min(3, { message: 'Summarise the reply (at least 3 characters).' }),
  evidenceId: optionalId('evidence file'),
})
export type ReplyInput = z.input<typeof replyInputSchema>
export type Reply = z.output<typeof replyInputSchema>

/** POST /api/cases/:id/follow-ups — a follow-up added by staff (not in the past of the office's calendar: checked by the server). */
export const followUpInputSchema = z.object({
  dueOn: day('the deadline'),
  expected: text(1000, 'What is expected').min(3, { message: 'Say what the party must do (at least 3 characters).' }),
})
export type FollowUpInput = z.input<typeof followUpInputSchema>
export type FollowUp = z.output<typeof followUpInputSchema>

/** POST /api/follow-ups/:id/{confirm,escalate,reopen} — one move; reopening may set a new deadline. */
export const followUpMoveInputSchema = z.object({
  version: z.number({ message: 'The follow-up version is required.' }).int().min(1),
  note: text(2000, 'Note').min(3, { message: 'Write what you saw or why (at least 3 characters).' }),
  dueOn: z.preprocess(blankIsMissing, z.iso.date({ message: 'Enter the new deadline as a date (YYYY-MM-DD).' }).refine(plausibleYear, { message: YEAR_MESSAGE }).optional()),
})
export type FollowUpMoveInput = z.input<typeof followUpMoveInputSchema>
export type FollowUpMove = z.output<typeof followUpMoveInputSchema>

const id = z.uuid()
const instant = z.iso.datetime()
const isoDay = z.iso.date()

export const responsiblePartyViewSchema = z.object({
  id,
  version: z.number().int(),
  name: z.string(),
  address: z.string().nullable(),
  email: z.string().nullable(),
  phone: z.string().nullable(),
  recordedAt: instant,
  recordedBy: z.string(),
})
export type ResponsiblePartyView = z.infer<typeof responsiblePartyViewSchema>

export const noticeViewSchema = z.object({
  id,
  servedOn: isoDay,
  method: z.enum(NOTICE_METHODS),
  methodLabel: z.string(),
  methodOther: z.string().nullable(),
  servedBy: z.string(),
  reference: z.string().nullable(),
  summary: z.string(),
  evidenceId: id.nullable(),
  recordedAt: instant,
  recordedBy: z.string(),
})
export type NoticeView = z.infer<typeof noticeViewSchema>

export const replyViewSchema = z.object({
  id,
  receivedOn: isoDay,
  noticeId: id.nullable(),
  summary: z.string(),
  evidenceId: id.nullable(),
  recordedAt: instant,
  recordedBy: z.string(),
})
export type ReplyView = z.infer<typeof replyViewSchema>

/** GET /api/cases/:id/responsible-party — the current record, earlier versions (newest first), notices and replies. */
export const responsiblePartyResponseSchema = z.object({
  current: responsiblePartyViewSchema.nullable(),
  earlier: z.array(responsiblePartyViewSchema),
  notices: z.array(noticeViewSchema),
  replies: z.array(replyViewSchema),
  abilities: z.object({ record: z.boolean() }),
})
export type ResponsiblePartyResponse = z.infer<typeof responsiblePartyResponseSchema>

export const followUpStandingSchema = z.enum(['overdue', 'due', 'upcoming', 'closed'])

export const followUpViewSchema = z.object({
  id,
  caseId: id,
  dueOn: isoDay,
  expected: z.string(),
  source: z.enum(FOLLOW_UP_SOURCES),
  state: z.enum(FOLLOW_UP_STATES),
  stateLabel: z.string(),
  /** Where it stands on the office's today. */
  standing: followUpStandingSchema,
  version: z.number().int(),
  lastNote: z.string().nullable(),
  changedAt: instant.nullable(),
  createdAt: instant,
  abilities: z.object(Object.fromEntries(FOLLOW_UP_MOVE_NAMES.map((m) => [m, z.boolean()])) as Record<(typeof FOLLOW_UP_MOVE_NAMES)[number], z.ZodBoolean>),
})
export type FollowUpView = z.infer<typeof followUpViewSchema>

/** POST /api/cases/:id/follow-ups (201) and each move, POST /api/follow-ups/:id/<move>: the follow-up as it now stands. */
export const followUpResponseSchema = z.object({ followUp: followUpViewSchema })
export type FollowUpResponse = z.infer<typeof followUpResponseSchema>

/** GET /api/cases/:id/follow-ups */
export const caseFollowUpsResponseSchema = z.object({
  /** The office's today (YYYY-MM-DD, its time zone). */
  today: isoDay,
  timeZone: z.string(),
  followUps: z.array(followUpViewSchema),
  abilities: z.object({ add: z.boolean() }),
})
export type CaseFollowUpsResponse = z.infer<typeof caseFollowUpsResponseSchema>

/** One open follow-up due or overdue, as a queue lists it. */
export const followUpQueueItemSchema = z.object({
  id,
  caseId: id,
  caseReference: z.string(),
  dueOn: isoDay,
  expected: z.string(),
  standing: z.enum(['overdue', 'due']),
  investigatorName: z.string().nullable(),
})
export type FollowUpQueueItem = z.infer<typeof followUpQueueItemSchema>

/** GET /api/follow-ups/due — the actor's due and overdue follow-ups (an investigator's cases; a supervisor's office). */
export const dueFollowUpsResponseSchema = z.object({
  today: isoDay,
  timeZone: z.string(),
  items: z.array(followUpQueueItemSchema),
})
export type DueFollowUpsResponse = z.infer<typeof dueFollowUpsResponseSchema>

/** GET /api/me/emails — what Quietband e-mails this person, from the table of mail kinds. */
export const myEmailsResponseSchema = z.object({
  role: z.enum(ROLES),
  address: z.string(),
  kinds: z.array(z.object({ kind: z.string(), when: z.string(), account: z.boolean() })),
})
export type MyEmailsResponse = z.infer<typeof myEmailsResponseSchema>

/**
 * Retention and legal hold as the API takes and answers them: an office's retention period,
 * a case's legal hold, and what a retention run erases and disposes of.
 */
import { z } from 'zod'
import { DISPOSAL_ACTIONS, ERASED_CASE_FIELDS, LEGAL_HOLD_ACTIONS, MAX_RETENTION_MONTHS } from '../domain/retention'
import { numberWithUnit } from './number-with-unit'
import { storableString } from './text'

const blankIsMissing = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v)
const plausibleYear = (d: string) => !/^\d{4}-\d{2}-\d{2}$/.test(d) || (d >= '1970-01-01' && d <= '2199-12-31')

const reason = (what: string) =>
  storableString()
    .trim()
    .min(1, { message: `Say why the legal hold is ${what}.` })
    .max(2000, { message: 'Keep the reason under 2000 characters.' })

/** POST /api/cases/:id/legal-hold */
export const setLegalHoldSchema = z.strictObject({
  reason: reason('set'),
  until: z.preprocess(
    blankIsMissing,
    z.iso
      .date({ message: 'Enter the last day of the hold as a date (YYYY-MM-DD), or leave it empty to hold until lifted.' })
      .refine(plausibleYear, { message: 'Check the year: the date must lie between 1970 and 2199.' })
      .optional(),
  ),
})
export type SetLegalHoldInput = z.infer<typeof setLegalHoldSchema>

/** POST /api/cases/:id/legal-hold/lift */
export const liftLegalHoldSchema = z.strictObject({ reason: reason('lifted') })
export type LiftLegalHoldInput = z.infer<typeof liftLegalHoldSchema>

/** PUT /api/offices/:id/retention — whole months after closing. */
export const setRetentionSchema = z.strictObject({
  retentionMonths: numberWithUnit({
    units: { months: 1 },
    defaultUnit: 'months',
    min: 1,
    max: MAX_RETENTION_MONTHS,
    integer: true,
    label: 'the retention period',
    example: '24',
    rangeMessage: `Enter the retention period as whole months from 1 to ${MAX_RETENTION_MONTHS}.`,
  }),
})
export type SetRetentionInput = z.input<typeof setRetentionSchema>

const isoDay = z.iso.date()
const isoTime = z.iso.datetime({ offset: true })

export const legalHoldEventViewSchema = z.object({
  action: z.enum(LEGAL_HOLD_ACTIONS),
  at: isoTime,
  byName: z.string(),
  reason: z.string(),
  until: isoDay.nullable(),
})
export type LegalHoldEventView = z.infer<typeof legalHoldEventViewSchema>

/** A case's legal hold: the hold in force (if any), its history, and what the viewer may do. */
export const legalHoldViewSchema = z.object({
  caseId: z.uuid(),
  active: z
    .object({ since: isoTime, byName: z.string(), reason: z.string(), until: isoDay.nullable() })
    .nullable(),
  history: z.array(legalHoldEventViewSchema),
  abilities: z.object({ set: z.boolean(), lift: z.boolean() }),
})
export type LegalHoldView = z.infer<typeof legalHoldViewSchema>

/** An office's retention period and the least it may be set to. */
export const retentionSettingViewSchema = z.object({
  officeId: z.uuid(),
  retentionMonths: z.number().int().min(1).max(MAX_RETENTION_MONTHS),
  /** The fewest months that keep every closed case until its furthest open follow-up is due; null: none constrains it. */
  minimumMonths: z.number().int().min(0).nullable(),
  /** The closed case whose open follow-up sets that minimum. */
  minimumBecause: z.object({ caseId: z.uuid(), reference: z.string(), closedAt: isoTime, dueOn: isoDay }).nullable(),
  abilities: z.object({ set: z.boolean() }),
})
export type RetentionSettingView = z.infer<typeof retentionSettingViewSchema>

export const retentionPlanCaseSchema = z.object({
  caseId: z.uuid(),
  reference: z.string(),
  officeId: z.uuid(),
  closedAt: isoTime,
  retentionEndedAt: isoTime,
  /** Case fields whose personal data goes (empty when only evidence is left to dispose of). */
  fields: z.array(z.enum(ERASED_CASE_FIELDS)),
  /** Timeline entries replaced by a redacted copy. */
  redactedEventIds: z.array(z.number().int()),
  /** Evidence objects deleted (with their thumbnails, a rendition the server made; each deletion recorded on its own). */
  evidence: z.array(z.object({ evidenceId: z.uuid(), objectKey: z.string(), sha256: z.string(), thumbnailKey: z.string().nullable() })),
  /** Entries of other cases' timelines written by a merge that quote this case's complainant, replaced by a redacted copy. */
  mergeEventIds: z.array(z.number().int()),
  /** The position the case keeps, rounded to 0.01° (its address becomes the marker); null when nothing is erased now. */
  coarsePosition: z.object({ latDeg: z.number(), lonDeg: z.number() }).nullable(),
  /** Evidence files whose original name becomes a marker (`erased-<sha256 prefix>.<ext>`). */
  fileNames: z.array(z.object({ evidenceId: z.uuid(), storedFileId: z.uuid(), name: z.string() })),
  /** E-mails about the case to the complainant still waiting in the queue: cancelled and deleted. */
  queuedMails: z.array(z.object({ jobId: z.string(), subject: z.string() })),
  /** The complainant's account: deactivated with its name and e-mail replaced, or kept and why; null when the case has none. */
  account: z
    .union([
      z.object({ outcome: z.literal('deactivated'), userId: z.uuid() }),
      z.object({ outcome: z.literal('kept'), userId: z.uuid(), reason: z.literal('other_cases'), otherCases: z.number().int().min(1) }),
      z.object({ outcome: z.literal('kept'), userId: z.uuid(), reason: z.literal('signed_in'), lastSignedInAt: isoTime }),
      z.object({ outcome: z.literal('kept'), userId: z.uuid(), reason: z.literal('not_a_complainant_account') }),
    ])
    .nullable(),
})
export type RetentionPlanCase = z.infer<typeof retentionPlanCaseSchema>

/** What a retention run erases and disposes of (a dry run: what it would). */
export const retentionRunViewSchema = z.object({
  dryRun: z.boolean(),
  at: isoTime,
  cases: z.array(retentionPlanCaseSchema),
  /** Expired cases the run leaves alone, and why. */
  kept: z.array(z.object({ caseId: z.uuid(), reference: z.string(), reason: z.enum(['legal_hold', 'open_follow_up']) })),
  /** Object deletions an earlier run recorded as pending (it stopped before the store deleted them), finished by this run. */
  pendingDisposals: z.array(z.object({ caseId: z.uuid(), action: z.enum(DISPOSAL_ACTIONS), evidenceId: z.uuid(), objectKey: z.string() })),
})
export type RetentionRunView = z.infer<typeof retentionRunViewSchema>

/** The answers of the routes, as sent. */
export const legalHoldResponseSchema = z.object({ legalHold: legalHoldViewSchema })
export const retentionSettingResponseSchema = z.object({ retention: retentionSettingViewSchema })
export const retentionRunResponseSchema = z.object({ run: retentionRunViewSchema })

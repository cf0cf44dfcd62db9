/**
 * Findings: the structured proposal an investigator sends for review (the `proposeFinding`
 * move's body), and the findings of a case as the API answers them.
 */
import { z } from 'zod'
import {
  DEADLINE_MAX_AHEAD_DAYS,
  DEADLINE_PAST_TOLERANCE_DAYS,
  MAX_FINDING_CALCULATIONS,
  RECOMMENDED_ACTIONS,
} from '../domain/findings'
import { latDegSpec, lonDegSpec } from './cases'
import { numberWithUnit } from './number-with-unit'
import { storableString } from './text'
import { calculationViewSchema } from './views'

const DAY_MS = 86_400_000
const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/
const isoDay = (at: number) => new Date(at).toISOString().slice(0, 10)

/** The earliest compliance deadline accepted now (ISO date: today in UTC, less the tolerance). */
export function earliestDeadline(now: Date = new Date()): string {
  return isoDay(now.getTime() - DEADLINE_PAST_TOLERANCE_DAYS * DAY_MS)
}
/** The latest compliance deadline accepted now (ISO date). */
export function latestDeadline(now: Date = new Date()): string {
  return isoDay(now.getTime() + DEADLINE_MAX_AHEAD_DAYS * DAY_MS)
}

const text = (max: number, what: string) => storableString().trim().max(max, { message: `${what}: at most ${max} characters.` })
/** An empty text field (as a form sends it) is the same as a missing one. */
const blankIsMissing = (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v)

const POSITION_FIELDS = ['sourceLatDeg', 'sourceLonDeg']

/** Most evidence files one finding links (a case's captures, photos and documents). */
export const MAX_FINDING_EVIDENCE = 100

/**
 * POST /api/cases/:id/propose-finding. The source position is optional, but both of its
 * coordinates or neither; the calculations must be records of the same case, and the evidence
 * files files of the same case that were not removed (checked by the server, which answers 400
 * naming the ids that are not).
 */
export const proposeFindingSchema = z
  .object({
    version: z.number({ message: 'The case version is required.' }).int().min(1),
    sourceDescription: text(2000, 'Source').min(3, { message: 'Describe the source you found (at least 3 characters).' }),
    sourceLatDeg: numberWithUnit({ ...latDegSpec, optional: true }),
    sourceLonDeg: numberWithUnit({ ...lonDegSpec, optional: true }),
    operator: z.preprocess(blankIsMissing, text(200, 'Operator or licensee').optional()),
    authorisedStationId: z.preprocess(blankIsMissing, z.uuid({ message: 'Not a valid station id.' }).optional()),
    calculationIds: z
      .array(z.uuid({ message: 'Not a valid calculation id.' }), { message: 'Send the linked calculations as a list of ids.' })
      // refinements, not size checks: a failing size check would stop the other fields' checks
      .refine((ids) => ids.length <= MAX_FINDING_CALCULATIONS, { message: `Link at most ${MAX_FINDING_CALCULATIONS} calculations.` })
      .refine((ids) => new Set(ids).size === ids.length, { message: 'A calculation is linked twice.' })
      .default([]),
    evidenceIds: z
      .array(z.uuid({ message: 'Not a valid evidence file id.' }), { message: 'Send the linked evidence files as a list of ids.' })
      .refine((ids) => ids.length <= MAX_FINDING_EVIDENCE, { message: `Link at most ${MAX_FINDING_EVIDENCE} evidence files.` })
      .refine((ids) => new Set(ids).size === ids.length, { message: 'An evidence file is linked twice.' })
      .default([]),
    recommendedAction: z.enum(RECOMMENDED_ACTIONS, { message: 'Choose the recommended action.' }),
    complianceDeadline: z.preprocess(
      blankIsMissing,
      z.iso
        .date({ message: 'Enter the deadline as a date (YYYY-MM-DD).' })
        // (only a well-formed date is compared, so a malformed one gets one message)
        .refine((d) => !ISO_DAY.test(d) || d >= earliestDeadline(), { message: 'The deadline cannot be in the past.' })
        .refine((d) => !ISO_DAY.test(d) || d <= latestDeadline(), { message: 'The deadline is more than ten years away; check the year.' })
        .optional(),
    ),
    summary: text(4000, 'Summary').min(3, { message: 'Summarise the finding (at least 3 characters).' }),
  })
  .superRefine((v, ctx) => {
    const lat = v.sourceLatDeg === undefined
    const lon = v.sourceLonDeg === undefined
    if (lat && !lon) ctx.addIssue({ code: 'custom', path: ['sourceLatDeg'], message: 'Enter the latitude too, or clear the longitude.' })
    if (lon && !lat) ctx.addIssue({ code: 'custom', path: ['sourceLonDeg'], message: 'Enter the longitude too, or clear the latitude.' })
  }, {
    // runs whenever both coordinates read well, so its error joins the other fields' errors
    when: (payload) => !payload.issues.some((i) => !i.path?.length || POSITION_FIELDS.includes(String(i.path[0]))),
  })
export type ProposeFindingInput = z.input<typeof proposeFindingSchema>
/** The proposal as the service takes it (the parsed body; a source position may be left out). */
export type ProposeFinding = Omit<z.output<typeof proposeFindingSchema>, 'sourceLatDeg' | 'sourceLonDeg'> & { sourceLatDeg?: number; sourceLonDeg?: number }

/** The fields of the form, in the order they are shown (for putting the server's errors beside them). */
export const PROPOSE_FINDING_FIELDS = [
  'sourceDescription',
  'sourceLatDeg',
  'sourceLonDeg',
  'operator',
  'authorisedStationId',
  'calculationIds',
  'evidenceIds',
  'recommendedAction',
  'complianceDeadline',
  'summary',
] as const

const id = z.uuid()
const instant = z.iso.datetime()

/** The supervisor's answer to one proposal, read from the timeline. */
export const findingReviewSchema = z.object({
  outcome: z.enum(['returned', 'approved']),
  at: instant,
  by: z.string(),
  /** The supervisor's comments (sent back) or the closing summary (approved). */
  comments: z.string().nullable(),
})

/** An evidence file a finding links, as the review shows it (a file removed later stays listed, marked). */
export const findingEvidenceSchema = z.object({
  id,
  /** The file's name as shown on the case. */
  name: z.string(),
  /** SHA-256 of the file as received, lowercase hex. */
  sha256: z.string().regex(/^[0-9a-f]{64}$/),
  removed: z.boolean(),
})
export type FindingEvidence = z.infer<typeof findingEvidenceSchema>

/** One proposal of a finding, with the stored calculations it links (outputs, interval, warnings, methods, library version). */
export const findingViewSchema = z.object({
  id,
  caseId: id,
  author: z.object({ id, name: z.string() }),
  at: instant,
  sourceDescription: z.string(),
  sourcePosition: z.object({ latDeg: z.number(), lonDeg: z.number() }).nullable(),
  operator: z.string().nullable(),
  authorisedStationId: id.nullable(),
  recommendedAction: z.enum(RECOMMENDED_ACTIONS),
  recommendedActionLabel: z.string(),
  complianceDeadline: z.iso.date().nullable(),
  summary: z.string(),
  calculations: z.array(calculationViewSchema),
  evidenceIds: z.array(z.string()),
  /** The linked evidence files, in the order linked. */
  evidence: z.array(findingEvidenceSchema),
  review: findingReviewSchema.nullable(),
})
export type FindingView = z.infer<typeof findingViewSchema>
export type FindingReview = z.infer<typeof findingReviewSchema>

/** GET /api/cases/:id/findings — the current finding (the latest proposal) and the earlier ones, newest first. */
export const findingsResponseSchema = z.object({ current: findingViewSchema.nullable(), earlier: z.array(findingViewSchema) })
export type FindingsResponse = z.infer<typeof findingsResponseSchema>

/**
 * The audit list for administrators: its query (filters in the URL, shared by the list and
 * its CSV) and its answers.
 */
import { z } from 'zod'
import { AUDIT_ACTIONS } from '../domain/audit'
import { numberWithUnit } from './number-with-unit'

export const AUDIT_PAGE_SIZE_MAX = 200
/** The CSV holds at most this many entries (newest first); narrow the filters for older ones. */
export const AUDIT_CSV_MAX_ROWS = 50_000

const DATE_ONLY = /^\d{4}-\d{2}-\d{2}$/

/**
 * A time bound: a date (`2026-03-01`, a whole UTC day) or an ISO date-time with its offset.
 * `end` reads a date as the end of that day, so from=to=one date is that whole day.
 */
const timeBound = (label: string, end: boolean) =>
  z
    .string()
    .trim()
    .optional()
    .transform((v, ctx) => {
      if (v === undefined || v === '') return undefined
      const dateOnly = DATE_ONLY.test(v)
      const okShape = dateOnly || z.iso.datetime({ offset: true }).safeParse(v).success
      const d = new Date(dateOnly ? `${v}T00:00:00Z` : v)
      if (!okShape || Number.isNaN(d.getTime()) || (dateOnly && d.toISOString().slice(0, 10) !== v)) {
        ctx.addIssue({ code: 'custom', message: `${label} must be a date (2026-03-01) or a date and time with its offset (2026-03-01T09:30:00Z).` })
        return z.NEVER
      }
      return dateOnly && end ? new Date(d.getTime() + 86_400_000) : d
    })

const wholeNumber = (label: string, min: number, max: number) => ({ label, min, max, integer: true, optional: true }) as const

const auditFilterShape = {
  action: z.enum(AUDIT_ACTIONS, { message: 'Choose an action from the list.' }).optional(),
  actorUserId: z.uuid({ message: 'Not a valid person id.' }).optional(),
  officeId: z.uuid({ message: 'Not a valid office id.' }).optional(),
  targetType: z
    .string()
    .trim()
    .max(40)
    .regex(/^[a-z_]*$/, 'A target type is written in lower case with underscores (case, user, office…).')
    .optional()
    .transform((v) => (v === '' ? undefined : v)),
  targetId: z
    .string()
    .trim()
    .max(100)
    .optional()
    .transform((v) => (v === '' ? undefined : v)),
  /** Inclusive. */
  from: timeBound('The start', false),
  /** Exclusive; a date means through the end of that day. */
  to: timeBound('The end', true),
}

const fromBeforeTo = (q: { from?: Date; to?: Date }) => !q.from || !q.to || q.from < q.to
const fromBeforeToMessage = { message: 'The end must come after the start.', path: ['to'] }

export const auditFilterSchema = z.object(auditFilterShape).refine(fromBeforeTo, fromBeforeToMessage)

export const auditListQuerySchema = z
  .object({
    ...auditFilterShape,
    page: numberWithUnit(wholeNumber('the page', 1, 100_000)).transform((v) => v ?? 1),
    pageSize: numberWithUnit(wholeNumber('the page size', 1, AUDIT_PAGE_SIZE_MAX)).transform((v) => v ?? 50),
  })
  .refine(fromBeforeTo, fromBeforeToMessage)
export type AuditListQuery = z.infer<typeof auditListQuerySchema>
export type AuditFilterQuery = z.infer<typeof auditFilterSchema>

export const auditEntrySchema = z.object({
  /** The entry's number in the log (increasing). */
  id: z.number().int(),
  at: z.iso.datetime({ offset: true }),
  action: z.enum(AUDIT_ACTIONS),
  actionLabel: z.string(),
  /** Null: the system (a scheduled job). */
  actor: z.object({ id: z.uuid(), name: z.string(), email: z.string() }).nullable(),
  targetType: z.string(),
  targetId: z.string().nullable(),
  officeId: z.uuid().nullable(),
  officeName: z.string().nullable(),
  details: z.record(z.string(), z.unknown()),
})
export type AuditEntryView = z.infer<typeof auditEntrySchema>

export const auditPageSchema = z.object({
  entries: z.array(auditEntrySchema),
  page: z.number().int(),
  pageSize: z.number().int(),
  total: z.number().int(),
})
export type AuditPageView = z.infer<typeof auditPageSchema>

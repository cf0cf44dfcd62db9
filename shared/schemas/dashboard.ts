/**
 * The supervisor's dashboard (GET /api/dashboard): the office's open work, its clocks, each
 * investigator's load, response performance against the targets, and open cases for the map.
 * Every count equals what GET /api/cases returns for the filters the web links the figure to.
 */
import { z } from 'zod'
import { CASE_CLOCK_NAMES } from '../domain/case-clocks'
import { CASE_STATES } from '../domain/case-lifecycle'
import { PRIORITIES } from '../domain/services'
import { areaSchema } from './region'

const instant = z.iso.datetime()
const id = z.uuid()
const count = z.number().int().min(0)
const priority = z.union(PRIORITIES.map((p) => z.literal(p)) as unknown as [z.ZodLiteral<1>, z.ZodLiteral<2>, z.ZodLiteral<3>, z.ZodLiteral<4>])
const hoursPerPriority = z.object({ p1: z.number(), p2: z.number(), p3: z.number(), p4: z.number() })

/** The performance windows, in 24-hour days back from now. */
export const DASHBOARD_WINDOWS_DAYS = [30, 90] as const

/** Most open cases the map shows (the most urgent, then the oldest, first). */
export const DASHBOARD_MAP_LIMIT = 2000

/** GET /api/dashboard?officeId= — an administrator may narrow to one office; staff see their own. */
export const dashboardQuerySchema = z.object({ officeId: z.uuid({ message: 'Choose an office from the list.' }).optional() })
export type DashboardQuery = z.infer<typeof dashboardQuerySchema>

export const dashboardViewSchema = z.object({
  /** The moment every figure was computed at. */
  asOf: instant,
  /** The office the figures cover; null: every office (an administrator without a filter). */
  officeId: id.nullable(),
  /** The offices in scope: the filter's choices, their time zones, areas and targets. */
  offices: z.array(
    z.object({
      id,
      name: z.string(),
      timeZone: z.string(),
      centreLatDeg: z.number(),
      centreLonDeg: z.number(),
      area: areaSchema.nullable(),
      firstResponseTargetsHours: hoursPerPriority,
      resolutionTargetsHours: hoursPerPriority,
    }),
  ),
  /** Every office an administrator may filter to (staff: their own only). */
  officeChoices: z.array(z.object({ id, name: z.string() })),
  /** Open cases by state and priority: every open state × every priority, zeros included. */
  openByStatePriority: z.array(z.object({ status: z.enum(CASE_STATES), priority, count })),
  clocks: z.object({
    /** Overdue on the resolution clock. */
    overdue: count,
    /** Resolution due within the next 24 hours (DUE_SOON_HOURS), not yet overdue. */
    dueSoon: count,
    /** Waiting for a first response past its target. */
    firstResponseOverdue: count,
    /** Received since midnight in the office's time zone. */
    receivedToday: count,
  }),
  /** Open cases per active investigator of the offices in scope (zeros included), most loaded first. */
  workload: z.array(z.object({ investigatorId: id, name: z.string(), officeName: z.string(), open: count, overdue: count })),
  /** Open cases with no investigator. */
  unassigned: z.object({ open: count, overdue: count }),
  /**
   * Time to first response (cases first answered in the window) and to closing (cases closed
   * in the window), per priority: PostgreSQL's percentile_cont (linear interpolation).
   */
  performance: z.array(
    z.object({
      windowDays: z.number().int(),
      clock: z.enum(CASE_CLOCK_NAMES),
      priority,
      count,
      medianHours: z.number().nullable(),
      p90Hours: z.number().nullable(),
      /** Of `count`, how many met their target (answered or closed by their due time). */
      metTarget: count,
    }),
  ),
  /**
   * Follow-ups (compliance deadlines of approved findings) due today or overdue on each office's
   * own calendar: joined from the follow-ups module, kept apart from the case figures above
   * (they are not case-list filters).
   */
  followUps: z.object({ due: count, overdue: count }),
  /** Open cases to map, most urgent first; `truncated` when more are open than DASHBOARD_MAP_LIMIT. */
  map: z.object({
    cases: z.array(z.object({ id, reference: z.string(), latDeg: z.number(), lonDeg: z.number(), priority, status: z.enum(CASE_STATES), overdue: z.boolean() })),
    truncated: z.boolean(),
  }),
})
export type DashboardView = z.infer<typeof dashboardViewSchema>

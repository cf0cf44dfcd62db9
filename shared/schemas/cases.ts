/** Contracts of reports and cases, used by the web forms and the server alike. */
import { z } from 'zod'
import { AFFECTED_SERVICES, EXPERIENCES, OCCURRENCE_PATTERNS, PRIORITIES } from '../domain/services'
import { CASE_STATES, CLOSE_RESOLUTIONS, DISMISS_RESOLUTIONS } from '../domain/case-lifecycle'
import { emailSchema } from './auth'
import { checkNumber, fromUnit, inBaseUnit, inUnit, numberWithUnit, writtenNumber, type WrittenNumber } from './number-with-unit'
import { storableString } from './text'

export const FREQUENCY_UNITS = { kHz: 1e3, MHz: 1e6, GHz: 1e9 } as const
export type FrequencyUnit = keyof typeof FREQUENCY_UNITS
/** Units a frequency may be written in (the unit select offers the three usual ones). */
export const FREQUENCY_WRITTEN_UNITS = { Hz: 1, kHz: 1e3, MHz: 1e6, GHz: 1e9, THz: 1e12 } as const
export type FrequencyWrittenUnit = keyof typeof FREQUENCY_WRITTEN_UNITS
/**
 * Highest frequency accepted in a report [Hz]: 3 THz, the top of the radio spectrum (ITU RR
 * No. 1.5: radio waves are "of frequencies arbitrarily lower than 3 000 GHz"). The same
 * definition sets no lower end, so any frequency above zero is accepted.
 */
export const MAX_FREQ_HZ = 3e12

const text = (max: number, what: string) => storableString().trim().max(max, { message: `${what}: at most ${max} characters.` })
const optionalText = (max: number, what: string) =>
  text(max, what).optional().transform((v) => (v === '' ? undefined : v))

/** Earliest start date a report may give (ISO date). */
export const EARLIEST_SINCE_DATE = '1900-01-01'
/**
 * How far past today's UTC date a start date may lie [days]: the complainant's calendar runs up
 * to 14 hours ahead of UTC (UTC+14), and their clock may be a little fast.
 */
export const SINCE_DATE_FUTURE_TOLERANCE_DAYS = 1

/** The latest start date a report may give now (ISO date, UTC plus the tolerance). */
export function latestSinceDate(now: Date = new Date()): string {
  return new Date(now.getTime() + SINCE_DATE_FUTURE_TOLERANCE_DAYS * 86_400_000).toISOString().slice(0, 10)
}

const FREQUENCY_SPEC = {
  units: FREQUENCY_WRITTEN_UNITS,
  min: 0,
  minExclusive: true,
  max: MAX_FREQ_HZ,
  example: '433.92',
  rangeMessage: 'Radio frequencies end at 3 THz.',
} as const
const frequencyFromSpec = { ...FREQUENCY_SPEC, label: 'the frequency', requiredMessage: 'Enter the frequency.', minExclusiveMessage: 'The frequency must be above zero.' }
const frequencyToSpec = { ...FREQUENCY_SPEC, label: 'the upper frequency', minExclusiveMessage: 'The upper frequency must be above zero.' }
const degrees = { '°': 1, deg: 1 } as const

export const latDegSpec = {
  units: degrees,
  defaultUnit: '°',
  min: -90,
  max: 90,
  label: 'the latitude',
  example: '48.1',
  requiredMessage: 'Enter the latitude or pick the place on the map.',
  rangeMessage: 'Latitude is between −90 and 90.',
} as const
export const lonDegSpec = {
  units: degrees,
  defaultUnit: '°',
  min: -180,
  max: 180,
  label: 'the longitude',
  example: '-31.35',
  requiredMessage: 'Enter the longitude or pick the place on the map.',
  rangeMessage: 'Longitude is between −180 and 180.',
} as const

const FREQUENCY_FIELDS = ['frequencyFrom', 'frequencyTo', 'frequencyUnit']

/**
 * The public report form. `website` is a honeypot: people leave it empty, robots fill it.
 * Numbers are read by `numberWithUnit` (strict: no booleans, arrays, hex or subnormals); a
 * frequency may carry its own unit ("433.92 MHz"), else it is in `frequencyUnit`. The parsed
 * report gives the frequencies in `frequencyUnit`, so it is itself a valid report again.
 */
export const reportSchema = z
  .object({
    name: text(120, 'Name').min(1, { message: 'Enter your name.' }),
    email: emailSchema,
    phone: optionalText(40, 'Phone'),
    organisation: optionalText(160, 'Organisation'),
    service: z.enum(AFFECTED_SERVICES, { message: 'Choose the affected service.' }),
    licenceRef: optionalText(80, 'Licence or station reference'),
    frequencyFrom: writtenNumber(frequencyFromSpec),
    frequencyTo: writtenNumber({ ...frequencyToSpec, optional: true }),
    frequencyUnit: z.enum(['kHz', 'MHz', 'GHz'], { message: 'Choose the unit: kHz, MHz or GHz.' }),
    address: text(300, 'Address').min(1, { message: 'Describe where it happens (an address or a place).' }),
    latDeg: numberWithUnit(latDegSpec),
    lonDeg: numberWithUnit(lonDegSpec),
    // PostgreSQL has no year 0000 (ISO dates allow it); no report reaches back past 1900 anyway
    since: z.iso
      .date({ message: 'Enter the date it started.' })
      .refine((d) => d >= EARLIEST_SINCE_DATE, { message: 'Enter a date from 1900 on.' })
      .refine((d) => d <= latestSinceDate(), { message: 'The date it started cannot be in the future.' }),
    pattern: z.enum(OCCURRENCE_PATTERNS, { message: 'Choose when it happens.' }),
    patternDetail: optionalText(200, 'Hours'),
    experience: z.enum(EXPERIENCES, { message: 'Choose what you experience.' }),
    description: text(4000, 'Description').min(10, { message: 'Describe what happens in a few words (at least 10 characters).' }),
    website: z.string().max(0, { message: 'Leave this field empty.' }).optional(),
  })
  .superRefine(
    (v, ctx) => {
      // runs as soon as the frequency fields read well, so its errors join the other fields' errors
      const fromHz = inBaseUnit(v.frequencyFrom, v.frequencyUnit, FREQUENCY_WRITTEN_UNITS)
      const fromProblem = checkNumber(fromHz, v.frequencyFrom.decimal.digits, frequencyFromSpec)
      if (fromProblem) ctx.addIssue({ code: 'custom', path: ['frequencyFrom'], message: fromProblem })
      if (v.frequencyTo === undefined) return
      const toHz = inBaseUnit(v.frequencyTo, v.frequencyUnit, FREQUENCY_WRITTEN_UNITS)
      const toProblem = checkNumber(toHz, v.frequencyTo.decimal.digits, frequencyToSpec)
      if (toProblem) ctx.addIssue({ code: 'custom', path: ['frequencyTo'], message: toProblem })
      else if (!fromProblem && toHz < fromHz) ctx.addIssue({ code: 'custom', path: ['frequencyTo'], message: 'The upper frequency must not be below the lower one.' })
    },
    // (not when the body is no object at all, or a frequency field already failed)
    { when: (payload) => !payload.issues.some((i) => !i.path?.length || FREQUENCY_FIELDS.includes(String(i.path[0]))) },
  )
  .superRefine((v, ctx) => {
    if (v.pattern === 'certain_hours' && !v.patternDetail) ctx.addIssue({ code: 'custom', path: ['patternDetail'], message: 'Say at which hours.' })
  })
  .transform(({ frequencyFrom, frequencyTo, ...rest }) => {
    const inChosenUnit = (n: WrittenNumber<FrequencyWrittenUnit>) => inUnit(inBaseUnit(n, rest.frequencyUnit, FREQUENCY_WRITTEN_UNITS), rest.frequencyUnit, FREQUENCY_UNITS)
    return { ...rest, frequencyFrom: inChosenUnit(frequencyFrom), frequencyTo: frequencyTo === undefined ? undefined : inChosenUnit(frequencyTo) }
  })
export type ReportInput = z.input<typeof reportSchema>
export type Report = z.output<typeof reportSchema>

/** Something the reporter should check about a report that was filed all the same (declared with the answers, in ./views). */
export type { ReportWarning } from './views'

/** The frequency range of a report in Hz (scaled in decimal: 433.92 MHz is exactly 433 920 000 Hz). */
export function reportFrequencyHz(r: Pick<Report, 'frequencyFrom' | 'frequencyTo' | 'frequencyUnit'>): { lowHz: number; highHz: number } {
  return { lowHz: fromUnit(r.frequencyFrom, r.frequencyUnit, FREQUENCY_UNITS), highHz: fromUnit(r.frequencyTo ?? r.frequencyFrom, r.frequencyUnit, FREQUENCY_UNITS) }
}

const version = z.number({ message: 'The case version is required.' }).int().min(1)
const reason = (what: string) => storableString().trim().min(3, { message: `${what} (at least 3 characters).` }).max(4000, { message: 'At most 4000 characters.' })

export const triageSchema = z.object({ version, priority: z.union(PRIORITIES.map((p) => z.literal(p)) as [z.ZodLiteral<1>, z.ZodLiteral<2>, z.ZodLiteral<3>, z.ZodLiteral<4>]), note: optionalText(2000, 'Note') })
export const assignSchema = z.object({ version, investigatorId: z.uuid({ message: 'Choose an investigator.' }) })
export const transferSchema = z.object({ version, officeId: z.uuid({ message: 'Choose an office.' }), reason: reason('Say why') })
export const mergeSchema = z.object({ version, intoCaseId: z.uuid({ message: 'Choose the case to merge into.' }) })
export const dismissSchema = z.object({
  version,
  resolution: z.enum(DISMISS_RESOLUTIONS as unknown as ['no_interference_found', 'referred'], { message: 'Choose the outcome.' }),
  reason: reason('Write a summary for the complainant'),
})
export const startFieldWorkSchema = z.object({ version })
export const returnFindingSchema = z.object({ version, reason: reason('Say what more is needed') })
export const closeSchema = z.object({
  version,
  resolution: z.enum(CLOSE_RESOLUTIONS as unknown as ['source_corrected', 'enforcement_action', 'no_interference_found', 'referred'], { message: 'Choose the outcome.' }),
  reason: reason('Write a summary for the complainant'),
})
export const reopenSchema = z.object({ version, reason: reason('Say why the case is reopened') })
export const withdrawSchema = z.object({ reason: optionalText(2000, 'Reason') })

/** A note on the timeline: internal to staff, or a message the complainant sees (and is e-mailed). */
export const noteSchema = z.object({
  body: text(4000, 'Note').min(1, { message: 'Write something.' }),
  visibility: z.enum(['internal', 'complainant']),
  /** A message that asks the complainant for information (e-mailed as such). */
  requestsInformation: z.boolean().optional(),
})
export const complainantInfoSchema = z.object({ body: text(4000, 'Information').min(1, { message: 'Write something.' }) })

/** A tracking link's `:token` path parameter (checked against the stored tokens, not by shape). */
export const trackingTokenParamSchema = z.object({ token: z.string() })

export const CASE_SORTS = ['reference', 'receivedAt', 'priority', 'dueAt', 'status', 'service', 'frequency'] as const
export type CaseSort = (typeof CASE_SORTS)[number]

const csv = <T extends z.ZodType>(item: T) =>
  z.preprocess((v) => (typeof v === 'string' ? (v === '' ? [] : v.split(',')) : v), z.array(item)).optional()

const wholeNumber = (label: string, min: number, max: number) => ({ label, min, max, integer: true, optional: true }) as const
const frequencyFilter = (label: string) =>
  numberWithUnit({ units: FREQUENCY_WRITTEN_UNITS, defaultUnit: 'Hz', min: 0, max: MAX_FREQ_HZ, label, example: '156800000', rangeMessage: 'Radio frequencies are from 0 to 3 THz.', optional: true })

/**
 * Query of the case list (all in the URL, so lists can be shared and bookmarked). Numbers are
 * read as strictly as the forms' (a frequency bound may carry its unit: `freqFromHz=156.8 MHz`).
 */
export const caseListQuerySchema = z.object({
  page: numberWithUnit(wholeNumber('the page', 1, 100_000)).transform((v) => v ?? 1),
  pageSize: numberWithUnit(wholeNumber('the page size', 1, 200)).transform((v) => v ?? 25),
  sort: z.enum(CASE_SORTS).default('receivedAt'),
  dir: z.enum(['asc', 'desc']).default('desc'),
  status: csv(z.enum(CASE_STATES)),
  priority: csv(numberWithUnit({ label: 'the priority', min: 1, max: 4, integer: true })),
  service: csv(z.enum(AFFECTED_SERVICES)),
  officeId: z.uuid().optional(),
  investigatorId: z.union([z.uuid(), z.literal('me'), z.literal('none')]).optional(),
  overdue: z.enum(['true', 'false']).optional().transform((v) => (v === undefined ? undefined : v === 'true')),
  open: z.enum(['true', 'false']).optional().transform((v) => (v === undefined ? undefined : v === 'true')),
  /** The resolution clock falls due within DUE_SOON_HOURS and is not overdue yet (shared/domain/case-clocks.ts). */
  dueSoon: z.literal('true').optional().transform((v) => (v === undefined ? undefined : true)),
  /** Overdue (or not) on the first-response clock. */
  firstResponseOverdue: z.enum(['true', 'false']).optional().transform((v) => (v === undefined ? undefined : v === 'true')),
  /** Received since the start of today in the case's office time zone. */
  receivedToday: z.literal('true').optional().transform((v) => (v === undefined ? undefined : true)),
  /** Closed within the last this many days (24-hour days back from now). */
  closedInLastDays: numberWithUnit(wholeNumber('the days since closing', 1, 366)),
  /** First answered within the last this many days. */
  respondedInLastDays: numberWithUnit(wholeNumber('the days since the first response', 1, 366)),
  freqFromHz: frequencyFilter('the lowest frequency'),
  freqToHz: frequencyFilter('the highest frequency'),
  q: storableString().trim().max(100).optional(),
})
export type CaseListQuery = z.infer<typeof caseListQuerySchema>

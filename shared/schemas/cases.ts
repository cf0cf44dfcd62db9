/** Contracts of reports and cases, used by the web forms and the server alike. */
import { z } from 'zod'
import { AFFECTED_SERVICES, EXPERIENCES, OCCURRENCE_PATTERNS, PRIORITIES } from '../domain/services'
import { CASE_STATES, CLOSE_RESOLUTIONS, DISMISS_RESOLUTIONS } from '../domain/case-lifecycle'
import { emailSchema } from './auth'
import { storableString } from './text'

export const FREQUENCY_UNITS = { kHz: 1e3, MHz: 1e6, GHz: 1e9 } as const
export type FrequencyUnit = keyof typeof FREQUENCY_UNITS
/** Highest frequency accepted in a report [Hz]: 3 THz, the top of the radio spectrum (ITU RR No. 1.5). */
export const MAX_FREQ_HZ = 3e12

/** A blank form field is missing, never 0 (a bare coerce would turn '' into 0). */
const blankIsMissing = <T extends z.ZodType>(inner: T) =>
  z.preprocess((v) => (v === null || (typeof v === 'string' && v.trim() === '') ? undefined : v), inner)

const text = (max: number, what: string) => storableString().trim().max(max, { message: `${what}: at most ${max} characters.` })
const optionalText = (max: number, what: string) =>
  text(max, what).optional().transform((v) => (v === '' ? undefined : v))

/** Earliest start date a report may give (ISO date). */
export const EARLIEST_SINCE_DATE = '1900-01-01'

/** The public report form. `website` is a honeypot: people leave it empty, robots fill it. */
export const reportSchema = z
  .object({
    name: text(120, 'Name').min(1, { message: 'Enter your name.' }),
    email: emailSchema,
    phone: optionalText(40, 'Phone'),
    organisation: optionalText(160, 'Organisation'),
    service: z.enum(AFFECTED_SERVICES, { message: 'Choose the affected service.' }),
    licenceRef: optionalText(80, 'Licence or station reference'),
    frequencyFrom: blankIsMissing(z.coerce.number({ message: 'Enter the frequency.' }).positive({ message: 'The frequency must be above zero.' })),
    frequencyTo: blankIsMissing(z.coerce.number().positive({ message: 'The upper frequency must be above zero.' }).optional()),
    frequencyUnit: z.enum(['kHz', 'MHz', 'GHz']),
    address: text(300, 'Address').min(1, { message: 'Describe where it happens (an address or a place).' }),
    latDeg: blankIsMissing(z.coerce.number({ message: 'Enter the latitude or pick the place on the map.' }).min(-90, { message: 'Latitude is between −90 and 90.' }).max(90, { message: 'Latitude is between −90 and 90.' })),
    lonDeg: blankIsMissing(z.coerce.number({ message: 'Enter the longitude or pick the place on the map.' }).min(-180, { message: 'Longitude is between −180 and 180.' }).max(180, { message: 'Longitude is between −180 and 180.' })),
    // PostgreSQL has no year 0000 (ISO dates allow it); no report reaches back past 1900 anyway
    since: z.iso.date({ message: 'Enter the date it started.' }).refine((d) => d >= EARLIEST_SINCE_DATE, { message: 'Enter a date from 1900 on.' }),
    pattern: z.enum(OCCURRENCE_PATTERNS, { message: 'Choose when it happens.' }),
    patternDetail: optionalText(200, 'Hours'),
    experience: z.enum(EXPERIENCES, { message: 'Choose what you experience.' }),
    description: text(4000, 'Description').min(10, { message: 'Describe what happens in a few words (at least 10 characters).' }),
    website: z.string().max(0, { message: 'Leave this field empty.' }).optional(),
  })
  .superRefine((v, ctx) => {
    const unit = FREQUENCY_UNITS[v.frequencyUnit]
    if (v.frequencyFrom * unit > MAX_FREQ_HZ) ctx.addIssue({ code: 'custom', path: ['frequencyFrom'], message: 'Radio frequencies end at 3 THz.' })
    if (v.frequencyTo !== undefined && v.frequencyTo < v.frequencyFrom) {
      ctx.addIssue({ code: 'custom', path: ['frequencyTo'], message: 'The upper frequency must not be below the lower one.' })
    }
    if (v.frequencyTo !== undefined && v.frequencyTo * unit > MAX_FREQ_HZ) ctx.addIssue({ code: 'custom', path: ['frequencyTo'], message: 'Radio frequencies end at 3 THz.' })
    if (v.pattern === 'certain_hours' && !v.patternDetail) ctx.addIssue({ code: 'custom', path: ['patternDetail'], message: 'Say at which hours.' })
  })
export type ReportInput = z.input<typeof reportSchema>
export type Report = z.output<typeof reportSchema>

/** The frequency range of a report in Hz. */
export function reportFrequencyHz(r: Pick<Report, 'frequencyFrom' | 'frequencyTo' | 'frequencyUnit'>): { lowHz: number; highHz: number } {
  const unit = FREQUENCY_UNITS[r.frequencyUnit]
  return { lowHz: r.frequencyFrom * unit, highHz: (r.frequencyTo ?? r.frequencyFrom) * unit }
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
export const proposeFindingSchema = z.object({ version, reason: reason('Summarise the finding') })
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

export const CASE_SORTS = ['reference', 'receivedAt', 'priority', 'dueAt', 'status', 'service', 'frequency'] as const
export type CaseSort = (typeof CASE_SORTS)[number]

const csv = <T extends z.ZodType>(item: T) =>
  z.preprocess((v) => (typeof v === 'string' ? (v === '' ? [] : v.split(',')) : v), z.array(item)).optional()

/** Query of the case list (all in the URL, so lists can be shared and bookmarked). */
export const caseListQuerySchema = z.object({
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(25),
  sort: z.enum(CASE_SORTS).default('receivedAt'),
  dir: z.enum(['asc', 'desc']).default('desc'),
  status: csv(z.enum(CASE_STATES)),
  priority: csv(z.coerce.number().int().min(1).max(4)),
  service: csv(z.enum(AFFECTED_SERVICES)),
  officeId: z.uuid().optional(),
  investigatorId: z.union([z.uuid(), z.literal('me'), z.literal('none')]).optional(),
  overdue: z.enum(['true', 'false']).optional().transform((v) => (v === undefined ? undefined : v === 'true')),
  open: z.enum(['true', 'false']).optional().transform((v) => (v === undefined ? undefined : v === 'true')),
  freqFromHz: z.coerce.number().min(0).optional(),
  freqToHz: z.coerce.number().min(0).optional(),
  q: storableString().trim().max(100).optional(),
})
export type CaseListQuery = z.infer<typeof caseListQuerySchema>

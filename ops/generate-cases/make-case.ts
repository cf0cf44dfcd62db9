/**
 * One synthetic case and its timeline (received, routed, then one event per move), drawn
 * from the tables in tables.ts with moves walked through the case lifecycle. The row shape
 * is the schema's own insert type (server/db/schema/cases.ts), not a copy of it.
 */
import { randomUUID } from 'node:crypto'
import type { CaseState, Resolution } from '../../shared/domain/case-lifecycle'
import { suggestPriority, type Priority } from '../../shared/domain/services'
import { nearestOffice } from '../../shared/radio/geo'
import type { caseEvents, cases } from '../../server/db/schema'
import { DEMO_REGION_BOX } from '../demo-data/region'
import type { Draw } from './draw'
import { walkTo } from './lifecycle-walk'
import {
  BANDS_HZ,
  CLOSED_SHARE_BY_AGE,
  EXPERIENCE_WEIGHTS,
  FINDINGS,
  FIRST,
  LAST,
  LICENCE_CODE,
  OPEN_STATE_WEIGHTS,
  OPEN_STATE_WEIGHTS_FIRST_DAY,
  ORGANISATIONS,
  PATTERN_DETAILS,
  PATTERN_WEIGHTS,
  PLACES,
  RESOLUTION_WEIGHTS,
  SERVICE_WEIGHTS,
  SOURCES,
  STREETS,
  SYMPTOMS,
} from './tables'

export const HOUR_MS = 3600_000
export const DAY_MS = 24 * HOUR_MS

export interface Office {
  id: string
  name: string
  centreLatDeg: number
  centreLonDeg: number
  targetsHours: Record<Priority, number>
  firstResponseHours: Record<Priority, number>
  investigators: { id: string; name: string }[]
  supervisor: { id: string; name: string } | null
}

type CaseInsert = typeof cases.$inferInsert
type EventInsert = typeof caseEvents.$inferInsert

/** The columns the generator fills (the reference and updated_at are set by the INSERT). */
export const GENERATED_CASE_COLUMNS = [
  'id', 'officeId', 'status', 'priority', 'suggestedPriority', 'service', 'licenceRef', 'freqLowHz', 'freqHighHz',
  'address', 'latDeg', 'lonDeg', 'sinceDate', 'pattern', 'patternDetail', 'experience', 'description',
  'complainantName', 'complainantEmail', 'complainantPhone', 'complainantOrganisation', 'investigatorId',
  'mergedIntoCaseId', 'resolution', 'closingSummary', 'receivedAt', 'dueAt', 'closedAt', 'version',
  'firstResponseDueAt', 'firstRespondedAt',
] as const satisfies readonly (keyof CaseInsert)[]

export const GENERATED_EVENT_COLUMNS = ['caseId', 'at', 'actorUserId', 'actorLabel', 'kind', 'fromState', 'toState', 'body', 'visibility'] as const satisfies readonly (keyof EventInsert)[]

export type GeneratedEvent = Required<Pick<EventInsert, Exclude<(typeof GENERATED_EVENT_COLUMNS)[number], 'caseId'>>>
export type GeneratedCase = Required<Pick<CaseInsert, (typeof GENERATED_CASE_COLUMNS)[number]>> & { id: string; events: GeneratedEvent[] }

/** Share of cases that are closed at this age. */
function closedShare(ageDays: number): number {
  return CLOSED_SHARE_BY_AGE.find(([minAgeDays]) => ageDays > minAgeDays)?.[1] ?? CLOSED_SHARE_BY_AGE[CLOSED_SHARE_BY_AGE.length - 1]![1]
}

export function makeCase(d: Draw, offices: Office[], receivedAt: Date, now: Date, serial: number, recentByOffice: Map<string, string[]>): GeneratedCase {
  const place = d.pick(PLACES)
  const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v))
  const latDeg = clamp(place.latDeg + d.between(-0.06, 0.06), DEMO_REGION_BOX.latMinDeg, DEMO_REGION_BOX.latMaxDeg)
  const lonDeg = clamp(place.lonDeg + d.between(-0.09, 0.09), DEMO_REGION_BOX.lonMinDeg, DEMO_REGION_BOX.lonMaxDeg)
  const nearest = nearestOffice({ point: { latDeg, lonDeg }, offices: offices.map((o) => ({ id: o.id, latDeg: o.centreLatDeg, lonDeg: o.centreLonDeg })) })
  const office = offices.find((o) => o.id === nearest.id)!

  const service = d.weighted(SERVICE_WEIGHTS)
  const [bandLo, bandHi] = d.pick(BANDS_HZ[service])
  const freqLowHz = Math.round(d.logUniform(bandLo, bandHi))
  const freqHighHz = d.chance(0.5) ? freqLowHz : Math.min(bandHi, Math.round(freqLowHz * d.between(1.0001, 1.05)))
  const experience = d.weighted(EXPERIENCE_WEIGHTS)
  const suggestedPriority = suggestPriority(service, experience)
  const triageChange = d.chance(0.12) ? d.pick([-1, 1]) : 0
  const priority = Math.min(4, Math.max(1, suggestedPriority + triageChange)) as Priority

  const ageDays = (now.getTime() - receivedAt.getTime()) / DAY_MS
  const closed = d.chance(closedShare(ageDays))
  const drawnResolution: Resolution | null = closed ? d.weighted(RESOLUTION_WEIGHTS) : null
  const status: CaseState = closed ? 'closed' : d.weighted(ageDays < 1 ? OPEN_STATE_WEIGHTS_FIRST_DAY : OPEN_STATE_WEIGHTS)
  const route = walkTo(status, drawnResolution)
  const hasInvestigator = route.some((s) => s.move === 'assign') && office.investigators.length > 0
  const investigator = hasInvestigator ? d.pick(office.investigators) : null

  // moves happen between receipt and closing (or now), in order
  const endMs = closed ? Math.min(now.getTime(), receivedAt.getTime() + d.logUniform(2 * HOUR_MS, 60 * DAY_MS)) : now.getTime()
  const span = Math.max(60_000, endMs - receivedAt.getTime())
  const times = route.map(() => receivedAt.getTime() + d.next() * span).sort((a, b) => a - b)
  if (closed && times.length) times[times.length - 1] = endMs
  const closedAt = closed ? new Date(endMs) : null

  const first = d.pick(FIRST)
  const last = d.pick(LAST)
  const name = `${first} ${last}`
  const orgs = ORGANISATIONS[service]
  const organisation = orgs && d.chance(0.6) ? d.pick(orgs) : null
  const code = LICENCE_CODE[service]
  const licenceRef = code && d.chance(0.8) ? `VC-${code}-${String(d.int(1, 9999)).padStart(4, '0')}` : service === 'amateur' && d.chance(0.9) ? `VC${d.int(1, 9)}${String.fromCharCode(65 + d.int(0, 25), 65 + d.int(0, 25), 65 + d.int(0, 25))}` : null
  const address = `${d.int(1, 240)} ${d.pick(STREETS)}, ${place.name}`
  const pattern = d.weighted(PATTERN_WEIGHTS)
  const description = `${d.pick(SYMPTOMS[service])} at ${place.name}. Started about ${d.int(1, 30)} days ago; we suspect ${d.pick(SOURCES)}.`

  // a duplicate joins an earlier case of the same office
  const earlier = recentByOffice.get(office.id) ?? []
  const mergedIntoCaseId = drawnResolution === 'duplicate' && earlier.length ? d.pick(earlier) : null
  // a duplicate with nothing earlier to join is withdrawn instead (same route up to triage)
  const resolution: Resolution | null = drawnResolution === 'duplicate' && !mergedIntoCaseId ? 'withdrawn' : drawnResolution
  const steps = resolution === drawnResolution ? route : walkTo(status, resolution)
  const id = randomUUID()
  earlier.push(id)
  if (earlier.length > 200) earlier.shift()
  recentByOffice.set(office.id, earlier)

  const supervisorLabel = office.supervisor?.name ?? 'Supervisor'
  const events: GeneratedEvent[] = [
    { at: receivedAt, actorUserId: null, actorLabel: 'Complainant', kind: 'received', fromState: null, toState: 'received', body: null, visibility: 'complainant' },
    { at: receivedAt, actorUserId: null, actorLabel: 'Quietband', kind: 'routed', fromState: null, toState: null, body: `Routed to ${office.name}, the nearest office (${(nearest.distanceM / 1000).toFixed(1)} km, geodesic).`, visibility: 'internal' },
  ]
  steps.forEach((step, i) => {
    const actor = step.by === 'complainant' ? { id: null, name: 'Complainant' } : step.by === 'assigned_investigator' && investigator ? { id: investigator.id, name: investigator.name } : { id: office.supervisor?.id ?? null, name: supervisorLabel }
    const body = step.to === 'closed' ? FINDINGS[resolution!] : step.move === 'assign' && investigator ? `Assigned to ${investigator.name}.` : step.move === 'proposeFinding' ? 'Finding proposed after measurements on site.' : step.move === 'returnFinding' ? 'More measurements needed.' : null
    events.push({ at: new Date(times[i]!), actorUserId: actor.id, actorLabel: actor.name, kind: step.move, fromState: step.from, toState: step.to, body, visibility: 'internal' })
  })

  return {
    id,
    officeId: office.id,
    status,
    priority,
    suggestedPriority,
    service,
    licenceRef,
    freqLowHz,
    freqHighHz,
    address,
    latDeg,
    lonDeg,
    sinceDate: new Date(receivedAt.getTime() - d.int(0, 30) * DAY_MS).toISOString().slice(0, 10),
    pattern,
    patternDetail: pattern === 'certain_hours' ? d.pick(PATTERN_DETAILS) : null,
    experience,
    description,
    complainantName: organisation ? `${name} (${organisation})` : name,
    complainantEmail: `${first}.${last}.${serial}@example.test`.toLowerCase().replace(/[^a-z0-9.@-]/g, ''),
    complainantPhone: d.chance(0.5) ? `+00 41 555 ${String(d.int(0, 9999)).padStart(4, '0')}` : null,
    complainantOrganisation: organisation,
    investigatorId: investigator?.id ?? null,
    mergedIntoCaseId,
    resolution,
    closingSummary: resolution ? FINDINGS[resolution] : null,
    receivedAt,
    dueAt: new Date(receivedAt.getTime() + office.targetsHours[priority] * HOUR_MS),
    firstResponseDueAt: new Date(receivedAt.getTime() + office.firstResponseHours[priority] * HOUR_MS),
    // the first response is the triage step, when the case went through one (shared/domain/case-clocks.ts)
    firstRespondedAt: events.find((e) => e.kind === 'triage')?.at ?? null,
    closedAt,
    version: steps.length + 1,
    events,
  }
}

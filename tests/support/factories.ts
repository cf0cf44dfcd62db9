/**
 * Test data a test owns: a fresh office, its people and its cases, built through the real
 * services (the same verbs the product uses), so no test reads or changes rows another test
 * file relies on. The demo data is left to the demo's own test and the browser tests.
 *
 * - `makeOffice` places each office on a point of its own, far from the demo region, and
 *   `reportNear(office)` is a place a few metres from it: a report filed there routes to that
 *   office and no other.
 * - `makeUser` creates staff through the administrator's verb (an invitation) and sets the
 *   password through the invitation link; a complainant registers and confirms the address.
 * - `makeCase` files a report through the public route and walks it to the wanted state
 *   through the move services, along the lifecycle's own moves (`CASE_MOVES`).
 */
import type { AreaGeometry } from '../../shared/schemas/region'
import { randomUUID } from 'node:crypto'
import request from 'supertest'
import { expect } from 'vitest'
import { CASE_MOVES, type CaseMoveName, type CaseState } from '../../shared/domain/case-lifecycle'
import type { Priority } from '../../shared/domain/services'
import type { Role } from '../../shared/domain/roles'
import type { ReportInput } from '../../shared/schemas/cases'
import { eq } from 'drizzle-orm'
import { bandLimits, offices, type BandLimitRow, type Office } from '../../server/db/schema'
import type { BandLimitEntry } from '../../shared/radio/compliance/band-limits'
import { seedBandLimits } from '../../server/modules/band-limits/band-limits.seed'
import type { Actor } from '../../server/policy/policy'
import { createStaffUser } from '../../server/modules/users/users.service'
import { confirmEmailWithToken, registerComplainant, setPasswordWithToken } from '../../server/modules/auth/auth.service'
import { assignCase, closeCase, proposeFinding, returnFinding, startFieldWork, triageCase } from '../../server/modules/cases/case-moves.service'
import { uniqueAddress, type TestContext } from './harness'
import { fileReport, type Filed } from './cases'
import { queuedTokens } from './accounts'
import { localDay, localHour } from '../../shared/domain/follow-ups'

let made = 0
/** A word no other test process or run uses (process id, a counter, a random part). */
export function uniqueWord(prefix = 'f'): string {
  made += 1
  return `${prefix}${process.pid.toString(36)}x${made.toString(36)}x${randomUUID().slice(0, 6)}`
}

/**
 * A point of its own for a new office: somewhere between 60° S and 30° N (the demo region lies
 * at 47–49° N), drawn at random to a millionth of a degree, so two offices practically never
 * share one and a report filed beside an office is nearest to it.
 */
function officePoint(): { centreLatDeg: number; centreLonDeg: number } {
  const round = (x: number) => Math.round(x * 1e6) / 1e6
  return { centreLatDeg: round(-60 + Math.random() * 90), centreLonDeg: round(-179 + Math.random() * 358) }
}

/**
 * A place more than 4,000 km from every test office (they lie south of 30° N) and from the
 * demo region (47–49° N, 30–32° W): a report filed there is far from every office.
 */
export const FAR_FROM_EVERY_TEST_OFFICE = { latDeg: 75, lonDeg: 100 } as const

/**
 * A fresh office with a unique name on a point of its own (see `reportNear`). No service
 * creates offices (they come with an installation, as the demo seed writes them), so the row
 * is inserted as the application role.
 */
export async function makeOffice(t: TestContext, over: Partial<typeof offices.$inferInsert> = {}): Promise<Office> {
  const word = uniqueWord('office')
  const point = { ...officePoint(), ...over }
  const [o] = await t.services.db
    .insert(offices)
    .values({ name: `Test office ${word}`, regionName: `Test area ${word}`, area: areaAround(point), ...point })
    .returning()
  return o!
}

/**
 * A small area (±0.05°, about 5 km) around an office's point, as every office has one: a report
 * filed beside the office lies inside it and is routed by the area, with no warning.
 */
function areaAround(p: { centreLatDeg: number; centreLonDeg: number }): AreaGeometry {
  const [s, n, w, e] = [p.centreLatDeg - 0.05, p.centreLatDeg + 0.05, p.centreLonDeg - 0.05, p.centreLonDeg + 0.05]
  return { type: 'Polygon', coordinates: [[[w, s], [e, s], [e, n], [w, n], [w, s]]] }
}

/** A place about 10 m from the office: a report filed there is routed to it. */
export function reportNear(office: Pick<Office, 'centreLatDeg' | 'centreLonDeg'>): { latDeg: number; lonDeg: number } {
  return { latDeg: office.centreLatDeg + 0.0001, lonDeg: office.centreLonDeg }
}

export interface TestUser {
  id: string
  email: string
  name: string
  password: string
  role: Role
  officeId: string | null
  /** The user as the services' actor. */
  actor: Actor
}

/** An administrator the factories act as when they create staff (the policy looks at the role only). */
const factoryAdmin: Actor = { id: randomUUID(), role: 'admin', officeId: null }
/**
 * The factory administrator's account, made once per pool, inactive (it signs nobody in and
 * counts as no one's administrator): the audit log names it as the one who invited.
 */
const factoryAdminMade = new WeakSet<object>()
async function ensureFactoryAdmin(t: TestContext): Promise<void> {
  if (factoryAdminMade.has(t.pool)) return
  await t.pool.query(`INSERT INTO users (id, email, name, role, active) VALUES ($1, $2, 'Test factory administrator', 'admin', false) ON CONFLICT (id) DO NOTHING`, [
    factoryAdmin.id,
    `factory-admin-${factoryAdmin.id}@example.test`,
  ])
  factoryAdminMade.add(t.pool)
}

/**
 * A user of the given role. Staff and administrators are invited through the administrator's
 * verb and choose their password through the e-mailed link (which confirms the address);
 * a complainant registers and confirms the address from the e-mailed link.
 */
export async function makeUser(
  t: TestContext,
  opts: { role: Role; office?: Pick<Office, 'id'> | null; password?: string; name?: string; email?: string },
): Promise<TestUser> {
  const { role } = opts
  const word = uniqueWord(role)
  const email = opts.email ?? `${word}@example.test`
  const name = opts.name ?? `Test ${role} ${word}`
  const password = opts.password ?? `password-${word}`
  if ((role === 'investigator' || role === 'supervisor') && !opts.office) throw new Error(`makeUser: a ${role} belongs to an office`)
  let id: string
  if (role === 'complainant') {
    await registerComplainant(t.services, { name, email, password })
    const [token] = await queuedTokens(t, email, 'confirm-email')
    expect(token, `a confirmation link was queued to ${email}`).toBeDefined()
    id = (await confirmEmailWithToken(t.services, token!)).id
  } else {
    const officeId = role === 'admin' ? null : opts.office!.id
    await ensureFactoryAdmin(t)
    id = (await createStaffUser(t.services, factoryAdmin, { name, email, role, officeId })).id
    const [token] = await queuedTokens(t, email, 'set-password')
    expect(token, `an invitation was queued to ${email}`).toBeDefined()
    await setPasswordWithToken(t.services, token!, password)
  }
  const officeId = role === 'investigator' || role === 'supervisor' ? opts.office!.id : null
  return { id, email, name, password, role, officeId, actor: { id, role, officeId } }
}

/** A supertest agent signed in as the user, from a client address of its own. */
export async function signIn(t: TestContext, user: Pick<TestUser, 'email' | 'password'>) {
  const agent = request.agent(t.app).set('X-Forwarded-For', uniqueAddress())
  const res = await agent.post('/api/auth/sign-in').send({ email: user.email, password: user.password })
  if (res.status !== 200) throw new Error(`sign-in as ${user.email} failed: ${res.status} ${JSON.stringify(res.body)}`)
  return agent
}
export type Agent = Awaited<ReturnType<typeof signIn>>

/** The moves makeCase walks along: the ordinary path of a case, no transfer, merge or early close. */
const WALK_MOVES = ['triage', 'assign', 'startFieldWork', 'proposeFinding', 'returnFinding', 'close'] as const satisfies readonly CaseMoveName[]
type WalkMove = (typeof WALK_MOVES)[number]

/** The shortest run of moves from `received` to the state, read from the lifecycle's data. */
export function pathTo(state: CaseState): WalkMove[] {
  const paths = new Map<CaseState, WalkMove[]>([['received', []]])
  const queue: CaseState[] = ['received']
  while (queue.length > 0) {
    const from = queue.shift()!
    for (const move of WALK_MOVES) {
      const m = CASE_MOVES[move]
      if (!(m.from as readonly CaseState[]).includes(from) || paths.has(m.to)) continue
      paths.set(m.to, [...paths.get(from)!, move])
      queue.push(m.to)
    }
  }
  const path = paths.get(state)
  if (!path) throw new Error(`makeCase: no ordinary path reaches ${state}`)
  return path
}

export interface TestCase extends Filed {
  state: CaseState
  version: number
  office: Office
  /** The office's supervisor and the assigned investigator who made the moves (when any were needed). */
  supervisor?: TestUser
  investigator?: TestUser
}

/**
 * A case of the office: a report filed beside the office through the public route, then
 * walked to `state` (default `received`) by the office's supervisor and an investigator of
 * the office, through the move services. Supervisor and investigator are made when not given.
 */
export async function makeCase(
  t: TestContext,
  opts: {
    office: Office
    state?: CaseState
    report?: Partial<ReportInput>
    supervisor?: TestUser
    investigator?: TestUser
    /** Set at triage (the case is triaged first); otherwise the suggested priority stays. */
    priority?: Priority
  },
): Promise<TestCase> {
  const state = opts.state ?? 'received'
  if (opts.priority !== undefined && state === 'received') throw new Error('makeCase: a priority is set at triage; ask for a triaged state or later')
  const filed = await fileReport(t, { ...reportNear(opts.office), ...opts.report })
  const { rows } = await t.pool.query<{ office_id: string }>(`SELECT office_id FROM cases WHERE id = $1`, [filed.id])
  if (rows[0]!.office_id !== opts.office.id) throw new Error(`makeCase: the report was routed to another office than ${opts.office.name}`)
  // a priority asked for is set at triage, first, whatever the path
  const path = opts.priority !== undefined && pathTo(state)[0] !== 'triage' ? (['triage', ...pathTo(state)] as WalkMove[]) : pathTo(state)
  let { supervisor, investigator } = opts
  if (path.length > 0) supervisor ??= await makeUser(t, { role: 'supervisor', office: opts.office })
  if (path.some((m) => m !== 'triage')) investigator ??= await makeUser(t, { role: 'investigator', office: opts.office })
  let version = 1
  const ctx = t.services
  for (const move of path) {
    const sup = supervisor!.actor
    const inv = investigator?.actor
    switch (move) {
      case 'triage':
        version = (await triageCase(ctx, sup, filed.id, { version, priority: opts.priority ?? 3 })).version
        break
      case 'assign':
        version = (await assignCase(ctx, sup, filed.id, { version, investigatorId: investigator!.id })).version
        break
      case 'startFieldWork':
        version = (await startFieldWork(ctx, inv!, filed.id, { version })).version
        break
      case 'proposeFinding':
        version = (
          await proposeFinding(ctx, inv!, filed.id, {
            version,
            sourceDescription: 'A faulty amplifier on a neighbour’s mast',
            recommendedAction: 'advise_operator',
            calculationIds: [],
            evidenceIds: [],
            summary: 'Source found on site; details in the notes.',
          })
        ).version
        break
      case 'returnFinding':
        version = (await returnFinding(ctx, sup, filed.id, { version, reason: 'Measure once more at the other address.' })).version
        break
      case 'close':
        version = (await closeCase(ctx, sup, filed.id, { version, resolution: 'source_corrected', reason: 'The owner switched the device off.' })).version
        break
    }
  }
  return { ...filed, state, version, office: opts.office, supervisor, investigator }
}

/**
 * A band limit of the test's own (a key no other test uses), added to the national list the
 * way the library's entries are (the start-time seed), so edits never touch a seeded entry.
 */
export async function makeBandLimit(t: TestContext, over: Partial<BandLimitEntry> = {}): Promise<BandLimitRow> {
  const key = uniqueWord('band-limit')
  const entry: BandLimitEntry = {
    id: key,
    title: `Test limit ${key}`,
    bandsHz: [{ lowHz: 433.05e6, highHz: 434.79e6 }],
    spec: { kind: 'erp', erpDbm: 10 },
    citation: 'Test citation, clause 1',
    status: '[M]',
    statusNote: 'Made by a test.',
    ...over,
  }
  expect(await seedBandLimits(t.services.db, [entry])).toBe(1)
  const [row] = await t.services.db.select().from(bandLimits).where(eq(bandLimits.key, entry.id))
  return row!
}

// Enforcement records: a case closed with an approved finding that carries a compliance
// deadline (through the real move services), and the instant an office's wall clock shows a given day and time.
const DAY_MS = 86_400_000

/** The ISO day `days` after today (UTC). */
export const dayFromToday = (days: number, from = new Date()) => new Date(from.getTime() + days * DAY_MS).toISOString().slice(0, 10)

/** A case of the office closed by its supervisor approving a finding with this compliance deadline. */
export async function closedWithDeadline(t: TestContext, office: Office, complianceDeadline: string): Promise<TestCase> {
  const c = await makeCase(t, { office, state: 'field_work' })
  const proposed = await proposeFinding(t.services, c.investigator!.actor, c.id, {
    version: c.version,
    sourceDescription: 'A masthead amplifier oscillating on the boathouse roof',
    operator: 'Harbour boat club',
    recommendedAction: 'formal_warning',
    complianceDeadline,
    calculationIds: [],
    evidenceIds: [],
    summary: 'The amplifier oscillates when the mast heater runs; the owner must replace it.',
  })
  const closed = await closeCase(t.services, c.supervisor!.actor, c.id, { version: proposed.version, resolution: 'enforcement_action', reason: 'Formal warning: replace the amplifier.' })
  return { ...c, state: 'closed', version: closed.version }
}

/** The instant at which the wall clock in `timeZone` reads `day` at hh:mm (searched minute by minute near the guess). */
export function atLocal(day: string, hh: number, mm: number, timeZone: string): Date {
  const [y, m, d] = day.split('-').map(Number) as [number, number, number]
  const guess = Date.UTC(y, m - 1, d, hh, mm)
  // every zone lies within UTC−12…UTC+14: search that window in 15-minute steps
  for (let off = -14 * 60; off <= 12 * 60; off += 15) {
    const at = new Date(guess + off * 60_000)
    const minute = Number(new Intl.DateTimeFormat('en-GB', { timeZone, minute: '2-digit' }).format(at))
    if (localDay(at, timeZone) === day && localHour(at, timeZone) === hh && minute === mm) return at
  }
  throw new Error(`atLocal: no instant shows ${day} ${hh}:${mm} in ${timeZone}`)
}

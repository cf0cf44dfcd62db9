/**
 * Test helpers for enforcement records: a case closed with an approved finding that carries a
 * compliance deadline (through the real move services), and the instant at which an office's
 * wall clock shows a given day and time.
 */
import { closeCase, proposeFinding } from '../../server/modules/cases/case-moves.service'
import type { Office } from '../../server/db/schema'
import { localDay, localHour } from '../../shared/domain/follow-ups'
import type { TestContext } from './harness'
import { makeCase, type TestCase } from './factories'

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

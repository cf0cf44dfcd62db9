import { describe, expect, it } from 'vitest'
import { CASE_STATES } from '../../../shared/domain/case-lifecycle'
import { CASE_CLOCKS, DUE_SOON_HOURS, clockRuns, dueAtFor, isDueSoon, isOverdue } from '../../../shared/domain/case-clocks'
import { EXACT_TOTAL_UP_TO, formatCaseTotal } from '../../../shared/domain/case-list'

const targets = { 1: 4, 2: 24, 3: 72, 4: 240 } as const

describe('the resolution clock', () => {
  it('is due the office’s target hours after receipt, for each priority', () => {
    const received = new Date('2026-03-28T23:30:00Z') // across a European clock change: hours are hours
    expect(dueAtFor(received, 1, targets).toISOString()).toBe('2026-03-29T03:30:00.000Z')
    expect(dueAtFor(received, 4, targets).toISOString()).toBe('2026-04-07T23:30:00.000Z')
  })

  it('runs in every state but the ones it stops in', () => {
    expect(CASE_STATES.filter((s) => !clockRuns('resolution', s))).toEqual([...CASE_CLOCKS.resolution.stopsIn])
  })

  it('makes an open case overdue only after its due time, and a closed case never', () => {
    const dueAt = new Date('2026-06-01T12:00:00Z')
    const at = (ms: number) => new Date(dueAt.getTime() + ms)
    expect([-1000, 0, 1000].map((ms) => isOverdue('resolution', { status: 'field_work', dueAt }, at(ms)))).toEqual([false, false, true])
    expect(isOverdue('resolution', { status: 'closed', dueAt }, at(86_400_000))).toBe(false)
  })
})

describe('the first-response clock', () => {
  it('stops at the first response, or when the case closes', () => {
    const dueAt = new Date('2026-06-01T12:00:00Z')
    const later = new Date('2026-06-02T12:00:00Z')
    expect(isOverdue('firstResponse', { status: 'received', dueAt, stoppedAt: null }, later)).toBe(true)
    expect(isOverdue('firstResponse', { status: 'received', dueAt, stoppedAt: new Date('2026-06-01T13:00:00Z') }, later)).toBe(false)
    expect(isOverdue('firstResponse', { status: 'closed', dueAt, stoppedAt: null }, later)).toBe(false)
    // the resolution clock takes no notice of a first response
    expect(isOverdue('resolution', { status: 'assigned', dueAt, stoppedAt: new Date('2026-06-01T13:00:00Z') }, later)).toBe(true)
    expect(clockRuns('firstResponse', 'triaged', null)).toBe(true)
  })
})

describe('due soon', () => {
  it('is a running clock due from now to 24 hours ahead, both ends included, and never an overdue one', () => {
    const now = new Date('2026-06-01T12:00:00Z')
    const due = (hours: number) => ({ status: 'assigned' as const, dueAt: new Date(now.getTime() + hours * 3_600_000) })
    expect(DUE_SOON_HOURS).toBe(24)
    expect([-0.001, 0, 12, 24, 24.001].map((h) => isDueSoon('resolution', due(h), now))).toEqual([false, true, true, true, false])
    expect(isDueSoon('resolution', { ...due(1), status: 'closed' }, now)).toBe(false)
    expect(isDueSoon('firstResponse', { ...due(1), status: 'received', stoppedAt: now }, now)).toBe(false)
  })
})

describe('the case list’s total as shown', () => {
  it('reads "10,000+" when the server stopped counting, and the number itself otherwise', () => {
    expect(formatCaseTotal(EXACT_TOTAL_UP_TO, true)).toBe('10,000+')
    expect(formatCaseTotal(9_999, false)).toBe('9,999')
    expect(formatCaseTotal(0, false)).toBe('0')
  })
})

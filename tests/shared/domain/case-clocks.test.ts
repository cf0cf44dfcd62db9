import { describe, expect, it } from 'vitest'
import { CASE_STATES } from '../../../shared/domain/case-lifecycle'
import { CASE_CLOCKS, clockRuns, dueAtFor, isOverdue } from '../../../shared/domain/case-clocks'
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

describe('the case list’s total as shown', () => {
  it('reads "10,000+" when the server stopped counting, and the number itself otherwise', () => {
    expect(formatCaseTotal(EXACT_TOTAL_UP_TO, true)).toBe('10,000+')
    expect(formatCaseTotal(9_999, false)).toBe('9,999')
    expect(formatCaseTotal(0, false)).toBe('0')
  })
})

import { describe, expect, it } from 'vitest'
import { formatTargetHours, responseClock } from '@/lib/response-clock'

const received = '2026-11-20T10:00:00.000Z'
const due = '2026-11-20T14:00:00.000Z' // a 4 h target

describe('responseClock', () => {
  it('reads the target as the span from receipt to due', () => {
    const c = responseClock({ status: 'assigned', receivedAt: received, dueAt: due, closedAt: null, now: new Date('2026-11-20T13:00:00Z') })
    expect(c.targetHours).toBe(4)
    expect(c.elapsedHours).toBe(3)
    expect(c.usedFraction).toBeCloseTo(0.75, 10)
    expect(c.overdue).toBe(false)
    expect(c.standingText).toBe('due in about 1 hour')
  })

  it('flags an open case past its due time as overdue', () => {
    const c = responseClock({ status: 'assigned', receivedAt: received, dueAt: due, closedAt: null, now: new Date('2026-11-22T14:00:00Z') })
    expect(c.overdue).toBe(true)
    expect(c.standingText).toBe('2 days past the target')
    expect(c.usedFraction).toBeGreaterThan(1)
  })

  it('stops the clock when the case closes and never calls a closed case overdue', () => {
    const c = responseClock({ status: 'closed', receivedAt: received, dueAt: due, closedAt: '2026-11-20T12:00:00.000Z', now: new Date('2026-12-30T00:00:00Z') })
    expect(c.overdue).toBe(false)
    expect(c.elapsedHours).toBe(2)
    expect(c.standingText).toBe('closed within the target')
  })

  it('says when a case closed after its target', () => {
    const c = responseClock({ status: 'closed', receivedAt: received, dueAt: due, closedAt: '2026-11-20T19:00:00.000Z', now: new Date('2026-12-30T00:00:00Z') })
    expect(c.standingText).toBe('closed about 5 hours after the target')
  })
})

describe('formatTargetHours', () => {
  it('writes short targets in hours and long ones in days', () => {
    expect(formatTargetHours(4)).toBe('4 h')
    expect(formatTargetHours(36)).toBe('36 h')
    expect(formatTargetHours(240)).toBe('10 days')
    expect(formatTargetHours(84)).toBe('3.5 days')
  })
})

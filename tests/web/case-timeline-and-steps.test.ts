import { describe, expect, it } from 'vitest'
import { CASE_STATES, COMPLAINANT_STEP_OF_STATE } from '../../shared/domain/case-lifecycle'
import { eventTitle, laneOf } from '@/features/case-page/lib/timeline'
import { COMPLAINANT_STEPS, stepIndexFor } from '@/features/tracking/lib/steps'

const ev = (kind: string, visibility: 'internal' | 'complainant', data: Record<string, unknown> | null = null) => ({ kind, visibility, toState: null, data })

describe('timeline lanes', () => {
  it('keeps staff notes and moves in the internal lane', () => {
    expect(laneOf(ev('note', 'internal'))).toBe('internal')
    expect(laneOf(ev('triage', 'internal'))).toBe('internal')
  })

  it('marks messages and questions as sent to the complainant', () => {
    expect(laneOf(ev('message', 'complainant'))).toBe('to_complainant')
    expect(laneOf(ev('information_requested', 'complainant'))).toBe('to_complainant')
  })

  it('marks a closing or reopening summary as sent, since its words are e-mailed to the complainant', () => {
    expect(laneOf(ev('close', 'internal'))).toBe('to_complainant')
    expect(laneOf(ev('dismiss', 'internal'))).toBe('to_complainant')
    expect(laneOf(ev('reopen', 'internal'))).toBe('to_complainant')
    expect(laneOf(ev('returnFinding', 'internal'))).toBe('internal')
  })

  it('marks the report itself, added information and a withdrawal as from the complainant', () => {
    expect(laneOf(ev('received', 'complainant'))).toBe('from_complainant')
    expect(laneOf(ev('complainant_information', 'complainant'))).toBe('from_complainant')
    expect(laneOf(ev('withdraw', 'internal'))).toBe('from_complainant')
  })

  it('names the facts a move stored', () => {
    expect(eventTitle(ev('triage', 'internal', { priority: 1 }))).toBe('Harm class set: Safety of life')
    expect(eventTitle(ev('assign', 'internal', { investigatorName: 'Marta Ferreira' }))).toBe('Assigned to Marta Ferreira')
    expect(eventTitle(ev('calculation_stored', 'internal', { calculationKind: 'eirp_fit' }))).toBe('Calculation stored')
    expect(eventTitle(ev('close', 'internal', { resolution: 'source_corrected' }))).toBe('Approved and closed: Source found and corrected')
    expect(eventTitle(ev('proposeFinding', 'internal', { recommendedAction: 'formal_warning' }))).toBe('Finding proposed: Send a formal warning')
    expect(eventTitle(ev('proposeFinding', 'internal', { recommendedAction: 'shrug' }))).toBe('Finding proposed')
  })

  it('names a merged report following its case, and a report filed far from every office', () => {
    expect(eventTitle(ev('merge_followed', 'internal', { intoReference: 'QB-26-000042' }))).toBe('Now part of QB-26-000042')
    expect(eventTitle(ev('far_from_offices', 'internal'))).toBe('Check the location: far from every office')
  })

  it('says how a report was routed: by an area, in an overlap, or to the nearest office outside every area', () => {
    expect(eventTitle(ev('routed', 'internal', { basis: 'inside_area' }))).toBe('Routed to the office whose area holds the place')
    expect(eventTitle(ev('routed', 'internal', { basis: 'inside_overlap' }))).toBe('Routed to the nearest office of overlapping areas')
    expect(eventTitle(ev('routed', 'internal', { basis: 'outside_areas' }))).toBe('Routed to the nearest office')
    expect(eventTitle(ev('routed', 'internal'))).toBe('Routed to the nearest office')
    expect(eventTitle(ev('outside_office_areas', 'internal'))).toBe('Check the location: outside every office area')
  })
})

describe('complainant steps', () => {
  it('has five plain steps from received to closed', () => {
    expect(COMPLAINANT_STEPS).toEqual(['Received', 'Accepted', 'Engineer on it', 'Under investigation', 'Closed'])
  })

  it('places every case state on a step, never going backwards along the flow', () => {
    const indices = CASE_STATES.map((s) => stepIndexFor(COMPLAINANT_STEP_OF_STATE[s]))
    expect(indices).toEqual([0, 1, 2, 3, 3, 3, 4])
  })
})

import { describe, expect, it } from 'vitest'
import { apiQueryFromListState, parseListState } from '@/lib/case-list-query'
import { DEFAULT_LIST_STATE, hasFilters, listStateToSearchParams, type CaseListState } from '@/lib/case-list-state'

const UUID = '6f1c2a34-1b2c-4d5e-8f90-123456789abc'

describe('case list state in the URL', () => {
  it('reads an empty address as the default list', () => {
    expect(parseListState(new URLSearchParams())).toEqual(DEFAULT_LIST_STATE)
    expect(listStateToSearchParams(DEFAULT_LIST_STATE).toString()).toBe('')
  })

  it('round-trips every filter, the sort and the page through the address', () => {
    const state: CaseListState = {
      page: 3,
      pageSize: 50,
      sort: 'priority',
      dir: 'asc',
      status: ['received', 'triaged'],
      priority: [1, 2],
      service: ['maritime', 'aeronautical'],
      officeId: UUID,
      investigatorId: 'me',
      overdue: true,
      open: false,
      dueSoon: true,
      firstResponseOverdue: false,
      receivedToday: true,
      closedInLastDays: 30,
      respondedInLastDays: 90,
      freqFrom: 156,
      freqTo: 162.5,
      freqUnit: 'MHz',
      q: 'harbour',
    }
    const back = parseListState(new URLSearchParams(listStateToSearchParams(state).toString()))
    expect(back).toEqual(state)
  })

  it('keeps shared links short by leaving defaults out', () => {
    const p = listStateToSearchParams({ ...DEFAULT_LIST_STATE, investigatorId: 'me', open: true })
    expect(p.toString()).toBe('investigatorId=me&open=true')
  })

  it('ignores values it does not know instead of failing', () => {
    const s = parseListState(new URLSearchParams('status=received,bogus&priority=0,2,9&sort=colour&dir=up&page=-4&pageSize=9999&investigatorId=bob&officeId=x&overdue=maybe&freqFrom=-3&freqUnit=THz'))
    expect(s.status).toEqual(['received'])
    expect(s.priority).toEqual([2])
    expect(s.sort).toBe('receivedAt')
    expect(s.dir).toBe('desc')
    expect(s.page).toBe(1)
    expect(s.pageSize).toBe(25)
    expect(s.investigatorId).toBeNull()
    expect(s.officeId).toBeNull()
    expect(s.overdue).toBeNull()
    expect(s.freqFrom).toBeNull()
    expect(s.freqUnit).toBe('MHz')
  })

  it('sends the frequency filter to the API in Hz', () => {
    const q = apiQueryFromListState({ ...DEFAULT_LIST_STATE, freqFrom: 5.725, freqTo: 5.875, freqUnit: 'GHz' })
    expect(q.get('freqFromHz')).toBe('5725000000')
    expect(q.get('freqToHz')).toBe('5875000000')
    expect(q.has('freqFrom')).toBe(false)
  })

  it('gives the CSV export the same filters and sort but no paging', () => {
    const state = { ...DEFAULT_LIST_STATE, page: 4, status: ['closed' as const], sort: 'dueAt' as const }
    const list = apiQueryFromListState(state)
    const csv = apiQueryFromListState(state, { paging: false })
    expect(list.get('page')).toBe('4')
    expect(csv.has('page')).toBe(false)
    expect(csv.has('pageSize')).toBe(false)
    expect(csv.get('status')).toBe('closed')
    expect(csv.get('sort')).toBe('dueAt')
  })

  it('tells a filtered list from a merely sorted one', () => {
    expect(hasFilters({ ...DEFAULT_LIST_STATE, sort: 'priority', page: 2 })).toBe(false)
    expect(hasFilters({ ...DEFAULT_LIST_STATE, q: 'x' })).toBe(true)
  })
})

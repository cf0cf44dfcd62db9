import { QueryClient } from '@tanstack/react-query'
import { describe, expect, it } from 'vitest'
import { DEFAULT_LIST_STATE } from '@/lib/case-list-state'
import { caseKeys, officeKeys } from '@/lib/query-keys'

const CASE = '6f1c2a34-1b2c-4d5e-8f90-123456789abc'

/** A cache holding one case list, one case page and the offices, all fresh. */
function filledCache() {
  const client = new QueryClient()
  client.setQueryData(caseKeys.list({ ...DEFAULT_LIST_STATE, open: true }), { items: [] })
  client.setQueryData(caseKeys.detail(CASE), { id: CASE })
  client.setQueryData(officeKeys.all, { offices: [] })
  const stale = () => ({
    list: client.getQueryState(caseKeys.list({ ...DEFAULT_LIST_STATE, open: true }))?.isInvalidated,
    detail: client.getQueryState(caseKeys.detail(CASE))?.isInvalidated,
    offices: client.getQueryState(officeKeys.all)?.isInvalidated,
  })
  return { client, stale }
}

describe('caseKeys', () => {
  it('give two list states that ask the same thing one cache entry, and different filters another', () => {
    expect(caseKeys.list({ ...DEFAULT_LIST_STATE, freqUnit: 'kHz' })).toEqual(caseKeys.list(DEFAULT_LIST_STATE))
    expect(caseKeys.list({ ...DEFAULT_LIST_STATE, open: true })).not.toEqual(caseKeys.list(DEFAULT_LIST_STATE))
  })

  it('refresh every list but not the case pages when a move invalidates the lists', async () => {
    const { client, stale } = filledCache()
    await client.invalidateQueries({ queryKey: caseKeys.lists() })
    expect(stale()).toEqual({ list: true, detail: false, offices: false })
  })

  it('refresh lists and case pages, and nothing else, when all cases are invalidated', async () => {
    const { client, stale } = filledCache()
    await client.invalidateQueries({ queryKey: caseKeys.all })
    expect(stale()).toEqual({ list: true, detail: true, offices: false })
  })
})

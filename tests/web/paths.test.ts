import { matchPath, type RouteObject } from 'react-router-dom'
import { describe, expect, it } from 'vitest'
import { routes } from '@/app/router'
import { parseListState } from '@/lib/case-list-query'
import { DEFAULT_LIST_STATE } from '@/lib/case-list-state'
import { paths } from '@/lib/paths'

/** Every path pattern the router declares, at any depth (the catch-all aside). */
function routePatterns(list: RouteObject[]): string[] {
  return list.flatMap((r) => [...(r.path && r.path !== '*' ? [r.path] : []), ...routePatterns(r.children ?? [])])
}

const patterns = Object.values(paths).map((p) => p.path)

/** The value the router reads for `param` in `url` under `pattern`, decoded as it hands it to the page. */
const paramOf = (pattern: string, url: string, param: string) => {
  const raw = matchPath(pattern, url)?.params[param]
  return raw === undefined ? undefined : decodeURIComponent(raw)
}

describe('paths', () => {
  it('are the patterns of the router, each once, and the router has a page for each', () => {
    expect([...routePatterns(routes)].sort()).toEqual([...patterns].sort())
    expect(new Set(patterns).size).toBe(patterns.length)
  })

  it('build links that the router matches back to the same id or token, however it is spelt', () => {
    const token = 'a/b?c=d&e#f g'
    expect(paramOf(paths.trackReport.path, paths.trackReport.href(token), 'token')).toBe(token)
    expect(paramOf(paths.case.path, paths.case.href('6f1c2a34-1b2c-4d5e-8f90-123456789abc'), 'id')).toBe('6f1c2a34-1b2c-4d5e-8f90-123456789abc')
    expect(paramOf(paths.myReport.path, paths.myReport.href('r 1'), 'id')).toBe('r 1')
  })

  it('write case-list filters as the list reads them, and nothing for the defaults', () => {
    expect(paths.cases.href()).toBe('/cases')
    expect(paths.cases.href({ open: true })).toBe('/cases?open=true')
    const filters = { investigatorId: 'me', open: true, status: ['received' as const], freqFrom: 144, freqTo: 146, q: 'Harbour & pier' }
    const href = paths.cases.href(filters)
    expect(href.startsWith('/cases?')).toBe(true)
    expect(parseListState(new URL(href, 'http://localhost').searchParams)).toEqual({ ...DEFAULT_LIST_STATE, ...filters })
  })

  it('carry a token or a return address as a query value only when one is given', () => {
    expect(paths.setPassword.href()).toBe('/set-password')
    expect(new URL(paths.setPassword.href('t&k=1'), 'http://localhost').searchParams.get('token')).toBe('t&k=1')
    expect(paths.signIn.href()).toBe('/sign-in')
  })
})

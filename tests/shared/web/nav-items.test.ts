import { describe, expect, it } from 'vitest'
import { navItemsFor } from '../../../web/src/app/layout/nav-items'

const labels = (role: Parameters<typeof navItemsFor>[0]) => navItemsFor(role).map((i) => `${i.label} → ${i.to}`)

describe('navItemsFor', () => {
  it('offers an anonymous visitor reporting, following and signing in', () => {
    expect(labels(null)).toEqual(['Report interference → /report', 'Follow a report → /track', 'Sign in → /sign-in'])
  })

  it('gives each role its own main links', () => {
    expect(labels('complainant')).toEqual(['My reports → /my-reports', 'Report interference → /report'])
    expect(labels('investigator')).toEqual(['My cases → /work'])
    expect(labels('supervisor')).toEqual(['Office queue → /work', 'Cases → /cases'])
    expect(labels('admin')).toEqual(['Users → /admin/users', 'Offices → /admin/offices', 'Cases → /cases'])
  })

  it('never shows Sign in to someone already signed in', () => {
    for (const role of ['complainant', 'investigator', 'supervisor', 'admin'] as const) {
      expect(navItemsFor(role).some((i) => i.to === '/sign-in')).toBe(false)
    }
  })
})

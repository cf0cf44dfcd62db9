/**
 * The audit list's filters as the page's URL holds them (so a filtered list can be shared and
 * bookmarked) and as the API reads them. Dates are whole days (YYYY-MM-DD): the server reads
 * `from` as the start of that UTC day and `to` as its end.
 */
export const AUDIT_FILTER_NAMES = ['action', 'actorUserId', 'officeId', 'targetType', 'targetId', 'from', 'to'] as const
export type AuditFilterName = (typeof AUDIT_FILTER_NAMES)[number]
export type AuditFilters = Partial<Record<AuditFilterName, string>>

export const AUDIT_PAGE_SIZE = 50

/** The filters set in a URL search (empty values left out). */
export function auditFiltersOf(search: URLSearchParams): AuditFilters {
  const out: AuditFilters = {}
  for (const name of AUDIT_FILTER_NAMES) {
    const v = search.get(name)?.trim()
    if (v) out[name] = v
  }
  return out
}

/** The page number in a URL search (1 when missing or not a whole number ≥ 1). */
export function auditPageOf(search: URLSearchParams): number {
  const raw = search.get('page')
  return raw && /^[1-9]\d{0,5}$/.test(raw) ? Number(raw) : 1
}

/** The URL search (or API query) for filters and a page; `page` null or 1 is left out. */
export function auditSearch(filters: AuditFilters, page: number | null): URLSearchParams {
  const p = new URLSearchParams()
  for (const name of AUDIT_FILTER_NAMES) {
    const v = filters[name]
    if (v) p.set(name, v)
  }
  if (page && page > 1) p.set('page', String(page))
  return p
}

/** The API's query: the filters, the page and the page size. */
export function auditApiQuery(filters: AuditFilters, page: number | null): string {
  const p = auditSearch(filters, page)
  if (page !== null) p.set('pageSize', String(AUDIT_PAGE_SIZE))
  return p.toString()
}

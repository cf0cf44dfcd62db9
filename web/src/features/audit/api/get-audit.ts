/** GET /api/admin/audit — a page of the audit log; and the CSV link for the same filters. */
import { keepPreviousData, useQuery } from '@tanstack/react-query'
import type { AuditPageView } from '@shared/schemas/audit'
import { api } from '@/lib/api-client'
import { auditKeys } from '@/lib/query-keys'
import { auditApiQuery, type AuditFilters } from '../lib/audit-filters'

export const getAudit = (query: string, signal?: AbortSignal) => api.get<AuditPageView>(`/api/admin/audit${query ? `?${query}` : ''}`, signal)

export function useAudit(filters: AuditFilters, page: number) {
  const query = auditApiQuery(filters, page)
  return useQuery({ queryKey: auditKeys.list(query), queryFn: ({ signal }) => getAudit(query, signal), placeholderData: keepPreviousData })
}

/** The same filters as CSV (every page, newest first). */
export const auditCsvHref = (filters: AuditFilters) => {
  const query = auditApiQuery(filters, null)
  return `/api/admin/audit.csv${query ? `?${query}` : ''}`
}

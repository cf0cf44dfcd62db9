/** The audit list: filters in the URL, a page of entries, paging, and the CSV of the same filters. */
import { useMemo } from 'react'
import { useSearchParams } from 'react-router-dom'
import { isApiError } from '@/lib/api-client'
import { Button } from '@/components/ui/button'
import { Loading } from '@/components/ui/loading'
import { QueryError } from '@/components/ui/query-error'
import { auditCsvHref, useAudit } from '../api/get-audit'
import { AUDIT_FILTER_NAMES, auditFiltersOf, auditPageOf, auditSearch, type AuditFilterName, type AuditFilters } from '../lib/audit-filters'
import { AuditEntries } from './audit-entries'
import { AuditFiltersForm } from './audit-filters-form'

export function AuditView({ people, offices }: { people: { id: string; name: string }[]; offices: { id: string; name: string }[] }) {
  const [params, setParams] = useSearchParams()
  const search = params.toString()
  // one filters object per URL, so the form only resets when the URL changes
  const filters = useMemo(() => auditFiltersOf(new URLSearchParams(search)), [search])
  const page = auditPageOf(params)
  const audit = useAudit(filters, page)
  const go = (next: AuditFilters, nextPage: number) => setParams(auditSearch(next, nextPage))

  const refused = audit.isError && isApiError(audit.error) && audit.error.code === 'validation_failed' ? audit.error.details : []
  const errors: Partial<Record<AuditFilterName, string>> = {}
  for (const d of refused) if ((AUDIT_FILTER_NAMES as readonly string[]).includes(d.path)) errors[d.path as AuditFilterName] = d.message

  const total = audit.data?.total ?? 0
  const pages = audit.data ? Math.max(1, Math.ceil(total / audit.data.pageSize)) : 1
  return (
    <div className="flex flex-col gap-4">
      <AuditFiltersForm filters={filters} people={people} offices={offices} errors={errors} onApply={(f) => go(f, 1)} />
      <div className="flex flex-wrap items-center gap-3">
        <p aria-live="polite" className="text-sm">
          {audit.data ? `${total} ${total === 1 ? 'entry' : 'entries'}` : ''}
        </p>
        <a href={auditCsvHref(filters)} download className="ml-auto font-semibold">
          Download CSV
        </a>
      </div>
      {audit.isPending && <Loading label="Loading the audit list…" />}
      {audit.isError && <QueryError error={audit.error} what="the audit list" onRetry={() => void audit.refetch()} />}
      {audit.data && <AuditEntries entries={audit.data.entries} />}
      {audit.data && pages > 1 && (
        <nav aria-label="Pages of the audit list" className="flex flex-wrap items-center gap-3">
          <Button variant="secondary" disabled={page <= 1} onClick={() => go(filters, page - 1)}>
            Newer
          </Button>
          <span className="text-sm">
            Page {page} of {pages}
          </span>
          <Button variant="secondary" disabled={page >= pages} onClick={() => go(filters, page + 1)}>
            Older
          </Button>
        </nav>
      )}
    </div>
  )
}

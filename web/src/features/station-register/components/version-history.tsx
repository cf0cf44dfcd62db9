/** Every import of the register, newest first: who, when, which file (its SHA-256), how many rows, and the rejected rows by line. */
import { useState } from 'react'
import { Button } from '@/components/ui/button'
import { Loading } from '@/components/ui/loading'
import { QueryError } from '@/components/ui/query-error'
import { useRegisterVersion, useRegisterVersions, type RegisterVersion } from '../api/get-register-versions'
import { formatDate } from '../lib/format'
import { RejectedRows } from './rejected-rows'

function VersionItem({ v }: { v: RegisterVersion }) {
  const [open, setOpen] = useState(false)
  const detail = useRegisterVersion(v.version, open && v.rejectedCount > 0)
  return (
    <li className="flex flex-col gap-2 rounded-panel border border-rule bg-surface p-4">
      <p className="font-semibold">
        Version {v.version}
        {v.current && <span className="ml-2 rounded-control border border-ok bg-ok-soft px-2 py-0.5 text-sm text-ok">In force</span>}
      </p>
      <p>
        {formatDate(v.importedAt)} by {v.importedBy}: {v.acceptedCount} stations, {v.rejectedCount} rows rejected
      </p>
      <p className="text-sm break-all text-ink-muted">
        {v.fileName} · SHA-256 {v.sha256}
      </p>
      {v.rejectedCount > 0 && (
        <div>
          <Button variant="quiet" aria-expanded={open} onClick={() => setOpen((o) => !o)}>
            {open ? 'Hide the rejected rows' : 'Show the rejected rows'}
          </Button>
        </div>
      )}
      {open && detail.isPending && <Loading label="Loading the report…" />}
      {open && detail.isError && <QueryError error={detail.error} what="the import report" />}
      {open && detail.data && <RejectedRows rows={detail.data.rejected} total={v.rejectedCount} />}
    </li>
  )
}

export function VersionHistory() {
  const versions = useRegisterVersions()
  return (
    <section aria-labelledby="versions-heading" className="flex flex-col gap-3">
      <h2 id="versions-heading" className="text-xl font-semibold">
        Versions
      </h2>
      {versions.isPending && <Loading label="Loading the versions…" />}
      {versions.isError && <QueryError error={versions.error} what="the register's versions" onRetry={() => void versions.refetch()} />}
      {versions.data && versions.data.versions.length === 0 && <p className="text-ink-muted">No version yet.</p>}
      {versions.data && versions.data.versions.length > 0 && (
        <ul className="flex flex-col gap-3">
          {versions.data.versions.map((v) => (
            <VersionItem key={v.version} v={v} />
          ))}
        </ul>
      )}
    </section>
  )
}

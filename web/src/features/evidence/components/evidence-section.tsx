/**
 * A case's evidence files for staff: the upload area, the list (read again every few seconds
 * while a file is being processed), and the case's bundle of every file with its manifest.
 */
import { useQueryClient } from '@tanstack/react-query'
import { useCallback } from 'react'
import { EvidenceUploader } from '@/components/uploads/evidence-uploader'
import { buttonClass } from '@/components/ui/button'
import { Loading } from '@/components/ui/loading'
import { QueryError } from '@/components/ui/query-error'
import { caseKeys } from '@/lib/query-keys'
import { evidencePath, useEvidence } from '../api/get-evidence'
import { EvidenceCard } from './evidence-card'

export function EvidenceSection({ caseId }: { caseId: string }) {
  const list = useEvidence(caseId)
  const queryClient = useQueryClient()
  const reload = useCallback(
    () => void Promise.all([queryClient.invalidateQueries({ queryKey: caseKeys.evidence(caseId) }), queryClient.invalidateQueries({ queryKey: caseKeys.detail(caseId) })]),
    [queryClient, caseId],
  )
  const files = list.data?.evidence ?? []
  const kept = files.filter((e) => !e.removed)

  return (
    <section aria-labelledby={`evidence-${caseId}`} className="flex flex-col gap-4 rounded-panel border border-rule bg-surface p-4 sm:p-5">
      <header className="flex flex-wrap items-center justify-between gap-3">
        <h2 id={`evidence-${caseId}`} className="text-xl font-semibold">
          Evidence files
        </h2>
        {kept.length > 0 && (
          <a href={`/api/cases/${encodeURIComponent(caseId)}/evidence-bundle`} className={buttonClass('secondary', 'w-full sm:w-auto')} download>
            Download the bundle (ZIP)
          </a>
        )}
      </header>
      <EvidenceUploader uploadPath={evidencePath(caseId)} onUploaded={reload} />
      {list.isPending && <Loading label="Loading the evidence files…" />}
      {list.isError && <QueryError error={list.error} what="the evidence files" onRetry={() => void list.refetch()} />}
      {list.data && files.length === 0 && <p className="text-ink-muted">No file on this case yet.</p>}
      {files.length > 0 && (
        <ol aria-label="Evidence files" className="flex flex-col gap-3">
          {files.map((e) => (
            <EvidenceCard key={e.id} e={e} caseId={caseId} />
          ))}
        </ol>
      )}
    </section>
  )
}

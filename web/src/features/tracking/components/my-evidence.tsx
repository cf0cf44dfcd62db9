/** The complainant's own files on their report: an upload area and the list of what they sent. */
import { useQueryClient } from '@tanstack/react-query'
import { format, parseISO } from 'date-fns'
import { useCallback } from 'react'
import { EVIDENCE_KIND_LABELS } from '@shared/domain/evidence'
import { EvidenceUploader } from '@/components/uploads/evidence-uploader'
import { formatBytes } from '@/components/uploads/format-bytes'
import { Loading } from '@/components/ui/loading'
import { QueryError } from '@/components/ui/query-error'
import type { ReportSource } from '../api/get-complainant-report'
import { myEvidenceKey, myEvidencePath, useMyEvidence } from '../api/get-my-evidence'

export function MyEvidence({ source }: { source: ReportSource }) {
  const list = useMyEvidence(source)
  const queryClient = useQueryClient()
  const reload = useCallback(() => void queryClient.invalidateQueries({ queryKey: myEvidenceKey(source) }), [queryClient, source])
  const files = list.data?.evidence ?? []
  return (
    <div className="flex flex-col gap-4">
      <p>Photos, recordings or screenshots of the interference help the office. Each file is kept unchanged, with a fingerprint (SHA-256) taken when it arrives.</p>
      <EvidenceUploader uploadPath={myEvidencePath(source)} onUploaded={reload} defaultKind="photo" title="Choose files to send" />
      {list.isPending && <Loading label="Loading your files…" />}
      {list.isError && <QueryError error={list.error} what="your files" onRetry={() => void list.refetch()} />}
      {list.data && files.length === 0 && <p className="text-ink-muted">You have not sent any file yet.</p>}
      {files.length > 0 && (
        <ul aria-label="Files you sent" className="flex flex-col gap-2">
          {files.map((e) => (
            <li key={e.id} className="flex flex-col gap-1 rounded-control border border-rule p-3">
              <span className="break-all font-semibold">{e.originalName}</span>
              <span className="text-sm">
                {EVIDENCE_KIND_LABELS[e.kind]} · {formatBytes(e.sizeBytes)} · sent {format(parseISO(e.uploadedAt), 'd MMM yyyy, HH:mm')}
                {e.removed ? ' · taken off the case by the office' : ''}
              </span>
              <code title={e.sha256} className="font-mono text-sm text-ink-muted">
                SHA-256 {e.sha256.slice(0, 12)}…
              </code>
            </li>
          ))}
        </ul>
      )}
    </div>
  )
}

/**
 * The complainant's files on their report: an upload area, the list of what they sent, and the
 * files the office shared with them (each with a download link).
 */
import { useQueryClient } from '@tanstack/react-query'
import { format, parseISO } from 'date-fns'
import { useCallback } from 'react'
import { EVIDENCE_KIND_LABELS } from '@shared/domain/evidence'
import type { EvidenceView } from '@shared/schemas/evidence'
import { EvidenceUploader } from '@/components/uploads/evidence-uploader'
import { formatBytes } from '@/components/uploads/format-bytes'
import { buttonClass } from '@/components/ui/button'
import { Loading } from '@/components/ui/loading'
import { QueryError } from '@/components/ui/query-error'
import type { ReportSource } from '../api/get-complainant-report'
import { myEvidenceKey, myEvidencePath, sharedEvidenceDownloadPath, useMyEvidence } from '../api/get-my-evidence'

const when = (iso: string) => format(parseISO(iso), 'd MMM yyyy, HH:mm')

export function MyEvidence({ source }: { source: ReportSource }) {
  const list = useMyEvidence(source)
  const queryClient = useQueryClient()
  const reload = useCallback(() => void queryClient.invalidateQueries({ queryKey: myEvidenceKey(source) }), [queryClient, source])
  const all = list.data?.evidence ?? []
  const files = all.filter((e) => e.uploadedBy.role === 'complainant')
  const shared = all.filter((e) => e.uploadedBy.role === 'staff')
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
                {EVIDENCE_KIND_LABELS[e.kind]} · {formatBytes(e.sizeBytes)} · sent {when(e.uploadedAt)}
                {e.removed ? ' · taken off the case by the office' : ''}
              </span>
              <ShortHash e={e} />
            </li>
          ))}
        </ul>
      )}
      {shared.length > 0 && <SharedFiles source={source} files={shared} />}
    </div>
  )
}

function ShortHash({ e }: { e: EvidenceView }) {
  return (
    <code title={e.sha256} className="font-mono text-sm text-ink-muted">
      SHA-256 {e.sha256.slice(0, 12)}…
    </code>
  )
}

/** Files the office shared: the server says which the complainant may download. */
function SharedFiles({ source, files }: { source: ReportSource; files: EvidenceView[] }) {
  return (
    <section aria-labelledby="shared-files-heading" className="flex flex-col gap-2">
      <h3 id="shared-files-heading" className="font-semibold">
        Files the office shared with you
      </h3>
      <ul aria-label="Files the office shared with you" className="flex flex-col gap-2">
        {files.map((e) => (
          <li key={e.id} className="flex flex-col gap-2 rounded-control border border-rule p-3 sm:flex-row sm:items-center sm:justify-between">
            <div className="flex min-w-0 flex-col gap-1">
              <span className="break-all font-semibold">{e.originalName}</span>
              <span className="text-sm">
                {EVIDENCE_KIND_LABELS[e.kind]} · {formatBytes(e.sizeBytes)} · shared by the office · added {when(e.uploadedAt)}
              </span>
              <ShortHash e={e} />
            </div>
            {e.abilities.download && (
              <a href={sharedEvidenceDownloadPath(source, e.id)} className={buttonClass('secondary', 'w-full sm:w-auto')} download aria-label={`Download ${e.originalName}`}>
                Download
              </a>
            )}
          </li>
        ))}
      </ul>
    </section>
  )
}

/**
 * Putting files on a case: drop them on the area or pick them with the button (the button is
 * the way on a phone), several at once, one kind for the batch. Each file shows its own bar
 * with the bytes sent and the speed, can be cancelled while it goes, and retried when it
 * failed; a refusal is shown beside the file in the server's own words (too large, a type
 * the office does not take, the store unavailable).
 */
import { useCallback, useEffect, useId, useRef, useState, type DragEvent } from 'react'
import { EVIDENCE_KINDS, EVIDENCE_KIND_LABELS, type EvidenceKind } from '@shared/domain/evidence'
import { Button, buttonClass } from '@/components/ui/button'
import { SelectField } from '@/components/ui/select-field'
import { isApiError } from '@/lib/api-client'
import { formatBytes, formatSpeed } from './format-bytes'
import { startUpload, type UploadHandle } from './upload-request'

type ItemStatus = 'uploading' | 'done' | 'failed' | 'cancelled'

interface UploadItem {
  key: string
  file: File
  kind: EvidenceKind
  status: ItemStatus
  sentBytes: number
  totalBytes: number
  bytesPerSecond: number | null
  error: string | null
}

const KIND_OPTIONS = EVIDENCE_KINDS.map((k) => ({ value: k, label: EVIDENCE_KIND_LABELS[k] }))

/** The words shown beside a refused file: the server's message, with what to do for the common refusals. */
function refusalText(e: unknown): string {
  if (!isApiError(e)) return 'The upload failed. Try again.'
  const hint =
    e.status === 413 ? 'Make the file smaller or split it, then upload again.' : e.status === 415 ? 'Choose another file type.' : e.status === 503 ? 'Retry in a moment.' : ''
  const details = e.details.map((d) => d.message).join(' ')
  return [e.message, details, hint].filter(Boolean).join(' ')
}

let counter = 0

export function EvidenceUploader({
  uploadPath,
  onUploaded,
  title = 'Add files',
  defaultKind = 'spectrum_capture',
}: {
  /** Same-origin API path taking a multipart form (field `file`, text field `kind`). */
  uploadPath: string
  /** Called after each file the server kept (e.g. to reload the list). */
  onUploaded?: () => void
  title?: string
  defaultKind?: EvidenceKind
}) {
  const baseId = useId()
  const inputRef = useRef<HTMLInputElement>(null)
  const [kind, setKind] = useState<EvidenceKind>(defaultKind)
  const [items, setItems] = useState<UploadItem[]>([])
  const [dragging, setDragging] = useState(false)
  const handles = useRef(new Map<string, UploadHandle<unknown>>())

  // leaving the page stops what is still going
  useEffect(() => {
    const running = handles.current
    return () => running.forEach((h) => h.abort())
  }, [])

  const patch = (key: string, change: Partial<UploadItem>) => setItems((all) => all.map((it) => (it.key === key ? { ...it, ...change } : it)))

  const send = useCallback(
    (key: string, file: File, itemKind: EvidenceKind) => {
      const form = new FormData()
      form.append('kind', itemKind)
      form.append('file', file, file.name)
      const startedAt = performance.now()
      const handle = startUpload<unknown>({
        path: uploadPath,
        form,
        onProgress: ({ sentBytes, totalBytes }) => {
          const seconds = (performance.now() - startedAt) / 1000
          patch(key, { sentBytes, totalBytes, bytesPerSecond: seconds > 0.05 ? sentBytes / seconds : null })
        },
      })
      handles.current.set(key, handle)
      handle.done.then(
        () => {
          handles.current.delete(key)
          patch(key, { status: 'done', sentBytes: file.size, totalBytes: file.size })
          onUploaded?.()
        },
        (e: unknown) => {
          handles.current.delete(key)
          if (e instanceof Error && e.name === 'AbortError') patch(key, { status: 'cancelled', error: null })
          else patch(key, { status: 'failed', error: refusalText(e) })
        },
      )
    },
    [uploadPath, onUploaded],
  )

  const add = (files: FileList | File[] | null) => {
    if (!files) return
    const fresh: UploadItem[] = Array.from(files).map((file) => ({
      key: `${baseId}-${++counter}`,
      file,
      kind,
      status: 'uploading',
      sentBytes: 0,
      totalBytes: file.size,
      bytesPerSecond: null,
      error: null,
    }))
    if (fresh.length === 0) return
    setItems((all) => [...fresh, ...all])
    fresh.forEach((it) => send(it.key, it.file, it.kind))
  }

  const retry = (it: UploadItem) => {
    patch(it.key, { status: 'uploading', sentBytes: 0, bytesPerSecond: null, error: null })
    send(it.key, it.file, it.kind)
  }

  const onDrop = (e: DragEvent<HTMLDivElement>) => {
    e.preventDefault()
    setDragging(false)
    add(e.dataTransfer.files)
  }

  const finished = items.some((it) => it.status === 'done' || it.status === 'cancelled')

  return (
    <div className="flex flex-col gap-3">
      <div className="grid gap-3 sm:grid-cols-[minmax(0,16rem)_1fr] sm:items-end">
        <SelectField
          label="Kind of file"
          name={`${baseId}-kind`}
          hint="Applies to the files you add next."
          options={KIND_OPTIONS}
          value={kind}
          onChange={(e) => setKind(e.target.value as EvidenceKind)}
        />
      </div>
      <div
        onDragOver={(e) => {
          e.preventDefault()
          setDragging(true)
        }}
        onDragLeave={() => setDragging(false)}
        onDrop={onDrop}
        className={`flex flex-col items-stretch gap-2 rounded-panel border-2 border-dashed p-4 sm:flex-row sm:items-center ${dragging ? 'border-signal bg-signal-soft' : 'border-field bg-paper'}`}
      >
        <input
          ref={inputRef}
          id={`${baseId}-input`}
          type="file"
          multiple
          className="peer sr-only"
          aria-label={title}
          onChange={(e) => {
            add(e.target.files)
            e.target.value = ''
          }}
        />
        {/* the input is hidden; its label is the button, and shows the focus ring the input has */}
        <label htmlFor={`${baseId}-input`} className={buttonClass('primary', 'w-full cursor-pointer sm:w-auto peer-focus-visible:outline-3 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-signal peer-focus-visible:outline-solid')}>
          {title}
        </label>
        <p className="text-sm text-ink-muted">or drop files here. Several at once is fine.</p>
      </div>

      {items.length > 0 && (
        <ul aria-label="Uploads" className="flex flex-col gap-2">
          {items.map((it) => (
            <UploadRow key={it.key} item={it} onCancel={() => handles.current.get(it.key)?.abort()} onRetry={() => retry(it)} onDismiss={() => setItems((all) => all.filter((x) => x.key !== it.key))} />
          ))}
        </ul>
      )}
      {finished && (
        <p>
          <Button variant="quiet" onClick={() => setItems((all) => all.filter((it) => it.status === 'uploading' || it.status === 'failed'))}>
            Clear finished uploads
          </Button>
        </p>
      )}
    </div>
  )
}

function UploadRow({ item, onCancel, onRetry, onDismiss }: { item: UploadItem; onCancel: () => void; onRetry: () => void; onDismiss: () => void }) {
  const errorId = useId()
  const pct = item.totalBytes > 0 ? Math.min(100, Math.round((item.sentBytes / item.totalBytes) * 100)) : 0
  const statusText =
    item.status === 'uploading'
      ? `${formatBytes(item.sentBytes)} of ${formatBytes(item.totalBytes)} sent${item.bytesPerSecond ? ` · ${formatSpeed(item.bytesPerSecond)}` : ''}`
      : item.status === 'done'
        ? `Uploaded · ${formatBytes(item.totalBytes)}`
        : item.status === 'cancelled'
          ? 'Cancelled'
          : 'Not uploaded'
  return (
    <li
      className={`flex flex-col gap-2 rounded-control border p-3 ${item.status === 'failed' ? 'border-danger bg-danger-soft' : 'border-rule bg-surface'}`}
      aria-describedby={item.error ? errorId : undefined}
    >
      <div className="flex flex-wrap items-baseline justify-between gap-x-3 gap-y-1">
        <span className="min-w-0 break-all font-semibold">{item.file.name}</span>
        <span className="text-sm text-ink-muted">{EVIDENCE_KIND_LABELS[item.kind]}</span>
      </div>
      <div
        role="progressbar"
        aria-label={`Upload of ${item.file.name}`}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={pct}
        className="h-2 w-full overflow-hidden rounded-full bg-signal-soft"
      >
        <div className={`h-full ${item.status === 'failed' ? 'bg-danger' : item.status === 'done' ? 'bg-ok' : 'bg-signal'}`} style={{ width: `${item.status === 'done' ? 100 : pct}%` }} />
      </div>
      <p className="text-sm" aria-live="polite">
        {statusText}
      </p>
      {item.error && (
        <p id={errorId} role="alert" className="text-sm font-semibold text-danger">
          {item.error}
        </p>
      )}
      <div className="flex flex-wrap gap-2">
        {item.status === 'uploading' && (
          <Button variant="secondary" onClick={onCancel} className="w-full sm:w-auto">
            Cancel
          </Button>
        )}
        {(item.status === 'failed' || item.status === 'cancelled') && (
          <Button variant="secondary" onClick={onRetry} className="w-full sm:w-auto">
            Retry
          </Button>
        )}
        {item.status !== 'uploading' && item.status !== 'done' && (
          <Button variant="quiet" onClick={onDismiss} className="w-full sm:w-auto">
            Dismiss
          </Button>
        )}
      </div>
    </li>
  )
}

/**
 * One evidence file for staff: what it is, who put it on the case and when, its SHA-256 (short,
 * the full value on hover and copy), processing and integrity state, and the actions the
 * server's abilities allow: download, verify, share with the complainant (or stop), remove (with
 * a reason), and its custody log.
 */
import { format, parseISO } from 'date-fns'
import { useState, type FormEvent } from 'react'
import { CUSTODY_ACTION_LABELS, EVIDENCE_KIND_LABELS, EVIDENCE_PROCESSING_STATE_LABELS } from '@shared/domain/evidence'
import { formatBytes } from '@/components/uploads/format-bytes'
import { Button, buttonClass } from '@/components/ui/button'
import { Loading } from '@/components/ui/loading'
import { QueryError } from '@/components/ui/query-error'
import { TextAreaField } from '@/components/ui/text-area-field'
import { isApiError } from '@/lib/api-client'
import { useCustody } from '../api/get-custody'
import type { Evidence } from '../api/get-evidence'
import { useRemoveEvidence } from '../api/remove-evidence'
import { useShareEvidence } from '../api/share-evidence'
import { useVerifyEvidence } from '../api/verify-evidence'
import { SpectrumView, hasSpectrum } from './spectrum-view'

const when = (iso: string) => format(parseISO(iso), 'd MMM yyyy, HH:mm')

/** The first 12 hex digits: enough to tell files apart at a glance. */
export const shortHash = (sha256: string) => sha256.slice(0, 12)

export function EvidenceCard({ e, caseId }: { e: Evidence; caseId: string }) {
  const [custodyOpen, setCustodyOpen] = useState(false)
  const [removing, setRemoving] = useState(false)
  const [copied, setCopied] = useState(false)
  const [spectrumOpen, setSpectrumOpen] = useState(false)
  const showsSpectrum = hasSpectrum(e) && e.abilities.download
  const verify = useVerifyEvidence(caseId)
  const share = useShareEvidence(caseId)
  const shared = e.sharedWithComplainant === true
  const processing = e.processing
  const busy = processing.state === 'queued' || processing.state === 'running'

  const copy = () => {
    void navigator.clipboard?.writeText(e.sha256).then(() => setCopied(true), () => setCopied(false))
  }

  return (
    <li className={`flex min-w-0 flex-col gap-3 rounded-control border p-4 ${e.removed ? 'border-rule bg-paper' : 'border-rule bg-surface'}`} aria-label={e.originalName}>
      <div className="flex flex-wrap items-baseline justify-between gap-x-3 gap-y-1">
        <h3 className={`min-w-0 break-all font-semibold ${e.removed ? 'text-ink-muted line-through' : ''}`}>{e.originalName}</h3>
        <span className="text-sm font-semibold">{EVIDENCE_KIND_LABELS[e.kind]}</span>
      </div>
      {e.thumbnail?.state === 'done' && (
        // a thumbnail made by the server; viewing it is not a download of the evidence
        <img
          src={`/api/evidence/${encodeURIComponent(e.id)}/thumbnail`}
          alt={`Thumbnail of the photo ${e.originalName}`}
          loading="lazy"
          decoding="async"
          width={e.thumbnail.widthPx}
          height={e.thumbnail.heightPx}
          className="h-auto max-h-48 w-auto max-w-full self-start rounded-control border border-rule object-contain"
        />
      )}
      {e.thumbnail?.state === 'failed' && <p className="text-sm text-ink-muted">{e.thumbnail.message}</p>}
      <dl className="grid grid-cols-[7rem_minmax(0,1fr)] gap-x-4 gap-y-1 text-sm sm:grid-cols-[8rem_minmax(0,1fr)_8rem_minmax(0,1fr)]">
        <dt className="font-semibold">Size</dt>
        <dd>{formatBytes(e.sizeBytes)}</dd>
        <dt className="font-semibold">SHA-256</dt>
        <dd className="flex flex-wrap items-center gap-2">
          <code title={e.sha256} className="font-mono">
            {shortHash(e.sha256)}…
          </code>
          <button type="button" onClick={copy} className="text-signal underline underline-offset-4" aria-label={`Copy the full SHA-256 of ${e.originalName}`}>
            {copied ? 'Copied' : 'Copy'}
          </button>
        </dd>
        <dt className="font-semibold">Uploaded by</dt>
        <dd>
          {e.uploadedBy.name}
          {e.uploadedBy.role === 'complainant' ? ' (complainant)' : ''}
        </dd>
        <dt className="font-semibold">Uploaded</dt>
        <dd>{when(e.uploadedAt)}</dd>
        {e.uploadedBy.role === 'staff' && (
          <>
            <dt className="font-semibold">Complainant</dt>
            <dd>{shared ? <span className="font-semibold">Shared with the complainant</span> : <span className="text-ink-muted">Not shared</span>}</dd>
          </>
        )}
        <dt className="font-semibold">Processing</dt>
        <dd className="flex flex-col gap-1">
          <span className={processing.state === 'failed' ? 'text-danger' : ''}>
            {EVIDENCE_PROCESSING_STATE_LABELS[processing.state]}
            {busy ? ` · ${Math.round(processing.progress * 100)} %` : ''}
            {processing.message ? ` — ${processing.message}` : ''}
          </span>
          {busy && (
            <span role="progressbar" aria-label={`Processing of ${e.originalName}`} aria-valuemin={0} aria-valuemax={100} aria-valuenow={Math.round(processing.progress * 100)} className="block h-2 w-full max-w-48 overflow-hidden rounded-full bg-signal-soft">
              <span className="block h-full bg-signal" style={{ width: `${Math.round(processing.progress * 100)}%` }} />
            </span>
          )}
        </dd>
        <dt className="font-semibold">Integrity</dt>
        <dd>
          {e.verification === null ? (
            <span className="text-ink-muted">Not checked since intake</span>
          ) : e.verification.outcome === 'verified' ? (
            <span className="font-semibold text-ok">Verified {when(e.verification.at)} by {e.verification.by}</span>
          ) : (
            <span className="font-semibold text-danger">Check failed {when(e.verification.at)} ({e.verification.by}): the stored file no longer matches its hash</span>
          )}
        </dd>
      </dl>
      {e.removed && (
        <p className="text-sm">
          <span className="font-semibold">Removed</span> {when(e.removed.at)} by {e.removed.by}: {e.removed.reason}
        </p>
      )}
      {share.isError && (
        <p role="alert" className="text-sm text-danger">
          {isApiError(share.error) ? share.error.message : 'The sharing could not be changed.'}
        </p>
      )}
      {verify.isError && (
        <p role="alert" className="text-sm text-danger">
          {isApiError(verify.error) ? verify.error.message : 'The check could not be run.'}
        </p>
      )}
      <div className="flex flex-col gap-2 sm:flex-row sm:flex-wrap">
        {e.abilities.download && (
          <a href={`/api/evidence/${encodeURIComponent(e.id)}/download`} className={buttonClass('secondary', 'w-full sm:w-auto')} download>
            Download
          </a>
        )}
        {e.abilities.verify && (
          <Button variant="secondary" className="w-full sm:w-auto" disabled={verify.isPending} onClick={() => verify.mutate(e.id)}>
            {verify.isPending ? 'Checking…' : 'Verify integrity'}
          </Button>
        )}
        {e.abilities.share && (
          <Button variant="secondary" className="w-full sm:w-auto" disabled={share.isPending} onClick={() => share.mutate({ evidenceId: e.id, shared: !shared })}>
            {share.isPending ? 'Saving…' : shared ? 'Stop sharing' : 'Share with the complainant'}
          </Button>
        )}
        {e.abilities.remove && !removing && (
          <Button variant="danger" className="w-full sm:w-auto" onClick={() => setRemoving(true)}>
            Remove from the case
          </Button>
        )}
        {showsSpectrum && (
          <Button variant="secondary" className="w-full sm:w-auto" aria-expanded={spectrumOpen} onClick={() => setSpectrumOpen((o) => !o)}>
            {spectrumOpen ? 'Hide the spectrum' : 'Show the spectrum'}
          </Button>
        )}
        <Button variant="quiet" className="w-full sm:w-auto" aria-expanded={custodyOpen} onClick={() => setCustodyOpen((o) => !o)}>
          {custodyOpen ? 'Hide custody log' : 'Custody log'}
        </Button>
      </div>
      {removing && <RemoveForm caseId={caseId} e={e} onClose={() => setRemoving(false)} />}
      {showsSpectrum && spectrumOpen && <SpectrumView caseId={caseId} evidence={e} />}
      {custodyOpen && <CustodyLog evidenceId={e.id} />}
    </li>
  )
}

function RemoveForm({ caseId, e, onClose }: { caseId: string; e: Evidence; onClose: () => void }) {
  const remove = useRemoveEvidence(caseId)
  const [reason, setReason] = useState('')
  const [error, setError] = useState<string | undefined>()
  const submit = (ev: FormEvent) => {
    ev.preventDefault()
    if (reason.trim().length < 3) return setError('Say why the file is removed (at least 3 characters).')
    setError(undefined)
    remove.mutate(
      { evidenceId: e.id, reason: reason.trim() },
      {
        onSuccess: onClose,
        onError: (err) => setError(isApiError(err) ? [err.message, ...err.details.map((d) => d.message)].join(' ') : 'The file could not be removed.'),
      },
    )
  }
  return (
    <form onSubmit={submit} className="flex flex-col gap-3 rounded-control border border-danger p-3" noValidate>
      <p className="text-sm">The file stays in the store and in the custody log; it leaves the case’s list and its bundle.</p>
      <TextAreaField label="Reason for removing it" name={`remove-reason-${e.id}`} rows={2} value={reason} onChange={(ev) => setReason(ev.target.value)} error={error} />
      <div className="flex flex-col gap-2 sm:flex-row">
        <Button type="submit" variant="danger" disabled={remove.isPending} className="w-full sm:w-auto">
          {remove.isPending ? 'Removing…' : 'Remove the file'}
        </Button>
        <Button variant="quiet" onClick={onClose} className="w-full sm:w-auto">
          Keep it
        </Button>
      </div>
    </form>
  )
}

function CustodyLog({ evidenceId }: { evidenceId: string }) {
  const q = useCustody(evidenceId, true)
  if (q.isPending) return <Loading label="Loading the custody log…" />
  if (q.isError) return <QueryError error={q.error} what="the custody log" onRetry={() => void q.refetch()} />
  return (
    <ol aria-label="Custody log" className="flex min-w-0 flex-col gap-1 border-l-2 border-rule pl-3 text-sm wrap-anywhere">
      {q.data.custody.map((c, i) => (
        <li key={`${c.at}-${i}`}>
          <span className="font-mono">{when(c.at)}</span> · <span className="font-semibold">{CUSTODY_ACTION_LABELS[c.action]}</span> · {c.actor}
          {c.from ? ` · from ${c.from}` : ''}
          {c.detail ? ` — ${c.detail}` : ''}
        </li>
      ))}
    </ol>
  )
}

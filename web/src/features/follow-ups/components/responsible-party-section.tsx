/**
 * "Responsible party and notices" on the case page: who is responsible for the source (with
 * every earlier version), the notices served on them and their replies — the proof of notice
 * enforcement rests on. Staff of the office record; administrators read.
 */
import { useState } from 'react'
import type { ResponsiblePartyView } from '@shared/schemas/follow-ups'
import { EnforcementCaution } from '@/components/cautions/enforcement-caution'
import { Button } from '@/components/ui/button'
import { Loading } from '@/components/ui/loading'
import { QueryError } from '@/components/ui/query-error'
import { useResponsibleParty } from '../api/get-responsible-party'
import { NoticeForm } from './notice-form'
import { PartyForm } from './party-form'
import { ReplyForm } from './reply-form'

type Open = 'party' | 'notice' | 'reply' | null

function PartyCard({ p }: { p: ResponsiblePartyView }) {
  return (
    <div className="flex flex-col gap-1">
      <p className="font-semibold">{p.name}</p>
      {p.address && <p className="whitespace-pre-line">{p.address}</p>}
      {(p.email || p.phone) && <p className="break-words">{[p.email, p.phone].filter(Boolean).join(' · ')}</p>}
      <p className="text-sm text-ink-muted">
        Version {p.version}, recorded by {p.recordedBy} on {p.recordedAt.slice(0, 10)}
      </p>
    </div>
  )
}

export function ResponsiblePartySection({ caseId }: { caseId: string }) {
  const q = useResponsibleParty(caseId)
  const [open, setOpen] = useState<Open>(null)
  const d = q.data
  const close = () => setOpen(null)
  return (
    <section aria-labelledby={`party-${caseId}`} className="flex flex-col gap-4 rounded-panel border border-rule bg-surface p-4 sm:p-5">
      <h2 id={`party-${caseId}`} className="text-xl font-semibold">
        Responsible party and notices
      </h2>
      {q.isPending && <Loading label="Loading the responsible party…" />}
      {q.isError && <QueryError error={q.error} what="the responsible party" onRetry={() => void q.refetch()} />}
      {d && (
        <>
          {d.current ? <PartyCard p={d.current} /> : <p className="text-ink-muted">No responsible party recorded yet.</p>}
          {d.earlier.length > 0 && (
            <details>
              <summary className="cursor-pointer">Earlier versions ({d.earlier.length})</summary>
              <ol className="mt-2 flex flex-col gap-3 border-l-2 border-rule pl-3">
                {d.earlier.map((p) => (
                  <li key={p.id}>
                    <PartyCard p={p} />
                  </li>
                ))}
              </ol>
            </details>
          )}
          <h3 className="text-lg font-semibold">Notices served</h3>
          {d.notices.length === 0 ? (
            <p className="text-ink-muted">No notice recorded.</p>
          ) : (
            <ol aria-label="Notices served" className="flex flex-col gap-3">
              {d.notices.map((n) => (
                <li key={n.id} className="rounded-control border border-rule p-3">
                  <p className="font-semibold">
                    {n.servedOn} · {n.method === 'other' ? n.methodOther : n.methodLabel}
                    {n.reference && <span className="font-normal"> · ref. {n.reference}</span>}
                  </p>
                  <p>{n.summary}</p>
                  <p className="text-sm text-ink-muted">
                    Served by {n.servedBy}; recorded by {n.recordedBy}
                    {n.evidenceId && ' · copy among the evidence'}
                  </p>
                </li>
              ))}
            </ol>
          )}
          <h3 className="text-lg font-semibold">Replies</h3>
          {d.replies.length === 0 ? (
            <p className="text-ink-muted">No reply recorded.</p>
          ) : (
            <ol aria-label="Replies" className="flex flex-col gap-3">
              {d.replies.map((r) => (
                <li key={r.id} className="rounded-control border border-rule p-3">
                  <p className="font-semibold">Received {r.receivedOn}</p>
                  <p>{r.summary}</p>
                  <p className="text-sm text-ink-muted">Recorded by {r.recordedBy}</p>
                </li>
              ))}
            </ol>
          )}
          {d.abilities.record && open === null && (
            <div className="flex flex-col gap-3 sm:flex-row sm:flex-wrap">
              <Button variant="secondary" onClick={() => setOpen('party')}>
                {d.current ? 'Update the party' : 'Record the party'}
              </Button>
              {d.current && (
                <Button variant="secondary" onClick={() => setOpen('notice')}>
                  Record a notice served
                </Button>
              )}
              {d.current && (
                <Button variant="secondary" onClick={() => setOpen('reply')}>
                  Record a reply
                </Button>
              )}
            </div>
          )}
          {open === 'party' && <PartyForm caseId={caseId} current={d.current} onDone={close} />}
          {open === 'notice' && (
            <>
              <EnforcementCaution />
              <NoticeForm caseId={caseId} onDone={close} />
            </>
          )}
          {open === 'reply' && <ReplyForm caseId={caseId} notices={d.notices} onDone={close} />}
        </>
      )}
    </section>
  )
}

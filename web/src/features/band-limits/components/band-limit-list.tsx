/**
 * The band-limit list as cards (readable at phone width): the limit, its ranges, the citation,
 * and an unverified entry marked in words, not colour alone. Editors open a form per entry;
 * everyone may open its history.
 */
import { useState } from 'react'
import { Button } from '@/components/ui/button'
import type { BandLimit } from '../api/get-band-limits'
import { describeLimit, formatBands } from '../lib/describe-limit'
import { BandLimitForm } from './band-limit-form'
import { BandLimitHistory } from './band-limit-history'

function VerifiedTag({ verified }: { verified: boolean }) {
  return verified ? (
    <span className="rounded-control border border-ok bg-ok-soft px-2 py-0.5 text-sm font-semibold text-ok">Verified</span>
  ) : (
    <span className="rounded-control border border-caution bg-caution-soft px-2 py-0.5 text-sm font-semibold text-caution">⚠ Unverified — check the regulation’s text</span>
  )
}

function BandLimitCard({ bandLimit: b, canEdit }: { bandLimit: BandLimit; canEdit: boolean }) {
  const [editing, setEditing] = useState(false)
  const [historyOpen, setHistoryOpen] = useState(false)
  const headingId = `band-limit-${b.id}`
  return (
    <li>
      <article aria-labelledby={headingId} className="flex flex-col gap-3 rounded-panel border border-rule bg-surface p-4 sm:p-5">
        <header className="flex flex-col gap-2">
          <h2 id={headingId} className="text-lg font-semibold break-words">
            {b.title}
          </h2>
          <div className="flex flex-wrap items-center gap-2">
            <VerifiedTag verified={b.verified} />
            <code className="text-sm break-all text-ink-muted">{b.key}</code>
          </div>
        </header>
        <dl className="grid gap-2 sm:grid-cols-[12rem_1fr]">
          <dt className="font-semibold">Frequencies</dt>
          <dd>{formatBands(b.bandsHz)}</dd>
          <dt className="font-semibold">Limit</dt>
          <dd>
            {describeLimit(b.spec).map((line, i) => (
              <span key={i} className="block">
                {line}
              </span>
            ))}
          </dd>
          <dt className="font-semibold">Citation</dt>
          <dd className="break-words">{b.citation}</dd>
          {b.conditions && (
            <>
              <dt className="font-semibold">Conditions</dt>
              <dd>{b.conditions}</dd>
            </>
          )}
          <dt className="font-semibold">Verification</dt>
          <dd className="break-words">{b.statusNote}</dd>
          <dt className="font-semibold">Last change</dt>
          <dd>{b.updatedBy ? `${b.updatedBy}, ${new Date(b.updatedAt).toLocaleDateString('en-GB', { dateStyle: 'medium' })} (version ${b.version})` : 'As taken from the radio library'}</dd>
        </dl>
        <div className="flex flex-wrap gap-3">
          {canEdit && !editing && <Button onClick={() => setEditing(true)}>Edit</Button>}
          <Button variant="secondary" aria-expanded={historyOpen} onClick={() => setHistoryOpen((o) => !o)}>
            {historyOpen ? 'Hide history' : 'History'}
          </Button>
        </div>
        {editing && <BandLimitForm bandLimit={b} onDone={() => setEditing(false)} />}
        <BandLimitHistory bandLimitId={b.id} open={historyOpen} />
      </article>
    </li>
  )
}

export function BandLimitList({ bandLimits, canEdit }: { bandLimits: BandLimit[]; canEdit: boolean }) {
  if (bandLimits.length === 0) return <p className="text-ink-muted">The list is empty.</p>
  const unverified = bandLimits.filter((b) => !b.verified).length
  return (
    <>
      <p>
        {bandLimits.length} limits, {unverified} of them not verified against the regulation’s text.
      </p>
      <ul className="flex flex-col gap-4">
        {bandLimits.map((b) => (
          <BandLimitCard key={b.id} bandLimit={b} canEdit={canEdit} />
        ))}
      </ul>
    </>
  )
}

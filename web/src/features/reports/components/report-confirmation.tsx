/**
 * After a report is sent: its reference (large, copyable), the office, the tracking link, and
 * a place to attach photos, recordings or screenshots straight away (sent through the link).
 */
import { useEffect, useRef, useState } from 'react'
import { Link } from 'react-router-dom'
import { EvidenceUploader } from '@/components/uploads/evidence-uploader'
import { Button, buttonClass } from '@/components/ui/button'
import { Notice } from '@/components/ui/notice'
import { Sign } from '@/components/ui/sign'
import { paths } from '@/lib/paths'
import type { SubmittedReport } from '../api/submit-report'

export function ReportConfirmation({ result, email }: { result: SubmittedReport; email: string }) {
  const headingRef = useRef<HTMLHeadingElement>(null)
  const [copied, setCopied] = useState<'reference' | 'link' | null>(null)
  useEffect(() => headingRef.current?.focus(), [])
  const trackingPath = pathOf(result.trackingUrl)

  const copy = async (what: 'reference' | 'link', text: string) => {
    try {
      await navigator.clipboard.writeText(text)
      setCopied(what)
    } catch {
      setCopied(null)
    }
  }

  return (
    <section aria-labelledby="report-sent" className="flex flex-col gap-5 rounded-panel border-2 border-ok bg-surface p-6">
      <h2 id="report-sent" ref={headingRef} tabIndex={-1} className="flex items-center gap-2 text-2xl font-bold focus:outline-none">
        <span className="text-ok">
          <Sign kind="ok" sizePx={26} />
        </span>
        Report received
      </h2>
      <dl className="flex flex-col gap-1">
        <dt className="text-ink-muted">Your reference</dt>
        <dd className="flex flex-wrap items-center gap-3">
          <span className="select-all font-mono text-4xl font-semibold tracking-wide">{result.reference}</span>
          <Button variant="secondary" onClick={() => void copy('reference', result.reference)}>
            Copy reference
          </Button>
        </dd>
      </dl>
      {result.warnings?.map((w) => (
        <Notice key={w.code} tone="caution" title="Please check the place you gave" live>
          <p>{w.message}</p>
        </Notice>
      ))}
      <p className="text-lg">
        It went to the <strong>{result.officeName}</strong> field office, the one nearest the place you gave.
      </p>
      <div className="flex flex-col gap-2">
        <p className="font-semibold">Your private tracking link</p>
        <p className="break-all rounded-control bg-paper px-3 py-2 font-mono text-sm">{result.trackingUrl}</p>
        <div className="flex flex-wrap gap-3">
          <Link to={trackingPath} className={buttonClass('primary')}>
            Open your tracking page
          </Link>
          <Button variant="secondary" onClick={() => void copy('link', result.trackingUrl)}>
            Copy link
          </Button>
        </div>
      </div>
      <p role="status" className="text-sm font-semibold text-ok">
        {copied === 'reference' ? 'Reference copied.' : copied === 'link' ? 'Link copied.' : ''}
      </p>
      <section aria-labelledby="report-files" className="flex flex-col gap-3 border-t border-rule pt-4">
        <h3 id="report-files" className="text-lg font-bold">
          Add photos, recordings or screenshots
        </h3>
        <p>If you have them, they help the office. Each file is kept unchanged, with a fingerprint (SHA-256) taken when it arrives. You can also add files later from your tracking page.</p>
        <EvidenceUploader uploadPath={`/api${trackingPath}/evidence`} defaultKind="photo" title="Choose files to send" />
      </section>
      <p>
        We have e-mailed you this link{email ? <> at <span className="font-mono">{email}</span></> : null}. Keep it private: anyone with the link can
        read your report. Use it to follow progress, add what you notice later, or withdraw the report.
      </p>
    </section>
  )
}

/** The tracking page's path, so the link stays on this site whatever host the server named. */
function pathOf(url: string): string {
  try {
    return new URL(url, window.location.origin).pathname
  } catch {
    return paths.track.href()
  }
}

/**
 * "E-mails Quietband sends you": the kinds of message this person can receive, from the server's
 * table of mail kinds (the one the templates are held to), so the list cannot drift.
 */
import { Loading } from '@/components/ui/loading'
import { QueryError } from '@/components/ui/query-error'
import { useMyEmails } from '../api/get-my-emails'

export function MyEmailsPanel() {
  const q = useMyEmails()
  const d = q.data
  const caseKinds = d?.kinds.filter((k) => !k.account) ?? []
  const accountKinds = d?.kinds.filter((k) => k.account) ?? []
  return (
    <section aria-labelledby="my-emails" className="flex flex-col gap-3 rounded-panel border border-rule bg-surface p-4 sm:p-5">
      <h2 id="my-emails" className="text-xl font-semibold">
        What makes Quietband write to you
      </h2>
      {q.isPending && <Loading label="Loading…" />}
      {q.isError && <QueryError error={q.error} what="the list of e-mails" onRetry={() => void q.refetch()} />}
      {d && (
        <>
          <p>
            To <span className="break-all font-mono">{d.address}</span>. Quietband writes only when something happens that you need to know:
          </p>
          <h3 className="font-semibold">About the work</h3>
          <ul className="list-disc pl-5">
            {caseKinds.map((k) => (
              <li key={k.kind}>{k.when}</li>
            ))}
          </ul>
          <h3 className="font-semibold">About your account</h3>
          <ul className="list-disc pl-5">
            {accountKinds.map((k) => (
              <li key={k.kind}>{k.when}</li>
            ))}
          </ul>
        </>
      )}
    </section>
  )
}

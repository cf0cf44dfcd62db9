/** "Recompute with the current library": every stored figure beside the one the library gives now, differences marked. */
import { useState } from 'react'
import { Button } from '@/components/ui/button'
import { Notice } from '@/components/ui/notice'
import { QueryError } from '@/components/ui/query-error'
import { useRecompute } from '../api/recompute-calculation'
import { outputPathLabel } from '../lib/output-path'

const show = (v: unknown) => (v === undefined ? '(none)' : typeof v === 'number' ? String(+v.toPrecision(10)) : JSON.stringify(v))

export function RecomputePanel({ calculationId }: { calculationId: string }) {
  const [asked, setAsked] = useState(false)
  const q = useRecompute(calculationId, asked)
  const r = q.data?.recompute
  const numbers = r?.differences.filter((d) => typeof d.stored === 'number' || typeof d.now === 'number' || d.differs) ?? []
  return (
    <div className="flex min-w-0 flex-col gap-3">
      <div>
        <Button variant="secondary" onClick={() => (asked ? void q.refetch() : setAsked(true))} disabled={q.isFetching}>
          {q.isFetching ? 'Recomputing…' : 'Recompute with the current library'}
        </Button>
      </div>
      {q.isError && <QueryError error={q.error} what="the recomputation" onRetry={() => void q.refetch()} />}
      {r && (
        <>
          {r.refused ? (
            <Notice tone="danger" title="The record cannot be run again">
              <p>{r.refused}</p>
            </Notice>
          ) : (
            <Notice tone={r.differs ? 'caution' : 'ok'} title={r.differs ? 'The current library gives a different result' : 'The current library gives the same result'}>
              <p>
                Stored with library {r.storedLibraryVersion}; now {r.currentLibraryVersion}
                {r.sameLibraryVersion ? ' (the same version)' : ''}. {r.largestRelativeDifference === 0 ? 'Every value is identical.' : `Largest relative difference ${r.largestRelativeDifference.toExponential(2)}.`}
              </p>
            </Notice>
          )}
          {numbers.length > 0 && (
            <div className="overflow-x-auto rounded-control border border-rule">
              <table className="w-full min-w-[30rem] border-collapse text-left text-sm">
                <caption className="sr-only">Stored and recomputed values</caption>
                <thead className="border-b-2 border-ink">
                  <tr>
                    <th scope="col" className="px-3 py-2">Value [unit]</th>
                    <th scope="col" className="px-3 py-2 text-right">Stored</th>
                    <th scope="col" className="px-3 py-2 text-right">Now</th>
                    <th scope="col" className="px-3 py-2">Differs</th>
                  </tr>
                </thead>
                <tbody>
                  {numbers.map((d) => (
                    <tr key={d.path} className={`border-b border-rule ${d.differs ? 'bg-caution-soft' : ''}`}>
                      <td className="px-3 py-2 break-words">{outputPathLabel(d.path)}</td>
                      <td className="px-3 py-2 text-right font-mono">{show(d.stored)}</td>
                      <td className="px-3 py-2 text-right font-mono">{show(d.now)}</td>
                      <td className="px-3 py-2">{d.differs ? `yes${d.relativeDifference !== null ? ` (${d.relativeDifference.toExponential(1)} relative)` : ''}` : 'no'}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
          {r.warningsNow.length > 0 && (
            <p className="text-sm">
              <span className="font-semibold">Warnings now:</span> {r.warningsNow.join(' ')}
            </p>
          )}
        </>
      )}
    </div>
  )
}

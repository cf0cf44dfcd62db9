/**
 * The register in force (or an older version), searched by licensee or station code and by a
 * frequency its authorised range holds; a table on wide screens, cards on phones; paged.
 */
import { useState, type FormEvent } from 'react'
import { Button } from '@/components/ui/button'
import { Loading } from '@/components/ui/loading'
import { QueryError } from '@/components/ui/query-error'
import { TableFrame } from '@/components/ui/table'
import { TextField } from '@/components/ui/text-field'
import { isApiError } from '@/lib/api-client'
import { useStations, type Station, type StationSearchState } from '../api/get-stations'
import { describeLicence, formatDbm, formatRange } from '../lib/format'

function Position({ s }: { s: Station }) {
  return (
    <span className="font-mono text-sm">
      {s.latitudeDeg.toFixed(4)}, {s.longitudeDeg.toFixed(4)}
    </span>
  )
}

function StationCard({ s }: { s: Station }) {
  return (
    <li className="flex flex-col gap-1 rounded-panel border border-rule bg-surface p-4">
      <p className="font-semibold break-words">
        {s.stationCode} · {s.licensee}
      </p>
      <p className="text-ink-muted">{s.service || 'Service not stated'}</p>
      <p>{formatRange(s)}</p>
      <p>{describeLicence(s)}</p>
      <p className="text-sm">
        Authorised EIRP {formatDbm(s.authorisedEirpDbm)} · <Position s={s} />
        {s.antennaHeightM !== null && ` · ${s.antennaHeightM} m`}
      </p>
    </li>
  )
}

export function StationList({ version }: { version?: number }) {
  const [search, setSearch] = useState<StationSearchState>({ page: 1, version })
  const [q, setQ] = useState('')
  const [freq, setFreq] = useState('')
  const stations = useStations({ ...search, version })
  const freqError = stations.isError && isApiError(stations.error) ? stations.error.details.find((d) => d.path === 'freq')?.message : undefined

  const submit = (e: FormEvent) => {
    e.preventDefault()
    setSearch({ q: q.trim() || undefined, freq: freq.trim() || undefined, page: 1, version })
  }
  const data = stations.data
  const pages = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1
  const page = search.page ?? 1
  return (
    <section aria-labelledby="stations-heading" className="flex flex-col gap-4">
      <h2 id="stations-heading" className="text-xl font-semibold">
        {data?.registerVersion ? `Authorised stations (version ${data.registerVersion})` : 'Authorised stations'}
      </h2>
      <form onSubmit={submit} role="search" className="grid items-end gap-3 md:grid-cols-[1fr_16rem_auto]">
        <TextField label="Licensee or station code" name="q" value={q} onChange={(e) => setQ(e.target.value)} maxLength={100} />
        <TextField label="Frequency in the authorised range" name="freq" value={freq} onChange={(e) => setFreq(e.target.value)} hint="With its unit, e.g. 446.1 MHz" error={freqError} />
        <Button type="submit">Search</Button>
      </form>
      {stations.isPending && <Loading label="Loading the register…" />}
      {stations.isError && !freqError && <QueryError error={stations.error} what="the licence register" onRetry={() => void stations.refetch()} />}
      {data && data.registerVersion === null && <p className="text-ink-muted">No licence register has been imported yet.</p>}
      {data && data.registerVersion !== null && (
        <>
          <p aria-live="polite">
            {data.total === 0 ? 'No station matches.' : `${data.total} station${data.total === 1 ? '' : 's'}${pages > 1 ? `, page ${page} of ${pages}` : ''}.`}
          </p>
          <ul className="flex flex-col gap-3 md:hidden">
            {data.stations.map((s) => (
              <StationCard key={s.id} s={s} />
            ))}
          </ul>
          <div className="hidden md:block">
            <TableFrame
              caption="Authorised stations"
              head={
                <tr>
                  {['Code', 'Licensee', 'Service', 'Frequencies', 'Licence', 'Authorised EIRP', 'Position'].map((h) => (
                    <th key={h} scope="col" className="px-3 py-2">
                      {h}
                    </th>
                  ))}
                </tr>
              }
            >
              {data.stations.map((s) => (
                <tr key={s.id} className="border-b border-rule align-top">
                  <td className="px-3 py-2 font-mono text-sm whitespace-nowrap">{s.stationCode}</td>
                  <td className="px-3 py-2">{s.licensee}</td>
                  <td className="px-3 py-2">{s.service}</td>
                  <td className="px-3 py-2 whitespace-nowrap">{formatRange(s)}</td>
                  <td className="px-3 py-2">{describeLicence(s)}</td>
                  <td className="px-3 py-2 whitespace-nowrap">{formatDbm(s.authorisedEirpDbm)}</td>
                  <td className="px-3 py-2 whitespace-nowrap">
                    <Position s={s} />
                  </td>
                </tr>
              ))}
            </TableFrame>
          </div>
          {pages > 1 && (
            <nav aria-label="Pages of the register" className="flex flex-wrap gap-3">
              <Button variant="secondary" disabled={page <= 1} onClick={() => setSearch((s) => ({ ...s, page: page - 1 }))}>
                Previous page
              </Button>
              <Button variant="secondary" disabled={page >= pages} onClick={() => setSearch((s) => ({ ...s, page: page + 1 }))}>
                Next page
              </Button>
            </nav>
          )}
        </>
      )}
    </section>
  )
}

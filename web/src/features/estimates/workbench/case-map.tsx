/**
 * The case on the map: the complainant's position, the measuring points with their bearings,
 * the latest located source with its 95 % ellipse, and the candidate stations of the latest
 * candidate search; the offices with their areas, and the office's other open cases within 10 km
 * (each named with its reference and distance). Folded until opened, so the map (and its tiles,
 * and the nearby cases) load only when someone looks.
 */
import { useState } from 'react'
import { z } from 'zod'
import type { MeasurementView } from '@shared/schemas/measurements'
import type { CalculationView, CaseDetail } from '@shared/schemas/views'
import { sourceLocateOutputSchema } from '@shared/calculations'
import { FieldMap, type MapBearing, type MapCandidateStation, type MapEstimatedSource, type MapMeasurement, type MapNearbyCase } from '@/components/map'
import { formatDistanceM } from '@/lib/coordinates'
import { Loading } from '@/components/ui/loading'
import { useNearbyCases } from '../api/get-nearby-cases'
import { measurementLevel } from './measurement-checklist'

/** How far a bearing line is drawn on the map [m] (a display choice, not a finding). */
const BEARING_LINE_M = 5000

const stationPositions = z.object({ stations: z.array(z.object({ id: z.string(), stationCode: z.string(), licensee: z.string(), latitudeDeg: z.number(), longitudeDeg: z.number() })) })

function candidateStations(records: CalculationView[]): MapCandidateStation[] {
  const latest = [...records].filter((r) => r.kind === 'candidate_sources').sort((a, b) => b.at.localeCompare(a.at))[0]
  const p = latest ? stationPositions.safeParse(latest.references) : null
  return p?.success ? p.data.stations.map((s) => ({ id: s.id, at: { latDeg: s.latitudeDeg, lonDeg: s.longitudeDeg }, label: `${s.stationCode} (${s.licensee})` })) : []
}

function latestSource(records: CalculationView[]): MapEstimatedSource | null {
  const latest = [...records].filter((r) => r.kind === 'source_locate').sort((a, b) => b.at.localeCompare(a.at))[0]
  const p = latest ? sourceLocateOutputSchema.safeParse(latest.outputs.value) : null
  if (!p?.success) return null
  const e = p.data.ellipse95
  return { at: { latDeg: p.data.latDeg, lonDeg: p.data.lonDeg }, ellipse: { semiMajorM: e.semiMajorM, semiMinorM: e.semiMinorM, orientationDeg: e.orientationDeg }, label: 'Latest located source' }
}

export function CaseMap({ detail, measurements, records }: { detail: CaseDetail; measurements: MeasurementView[]; records: CalculationView[] }) {
  const [open, setOpen] = useState(false)
  const nearby = useNearbyCases(detail.id, { enabled: open })
  // without the nearby cases (still loading, or refused) the map shows the rest all the same
  const nearbyCases: MapNearbyCase[] = (nearby.data?.cases ?? []).map((c) => ({
    id: c.id,
    at: { latDeg: c.latDeg, lonDeg: c.lonDeg },
    label: `${c.reference}, ${formatDistanceM(c.distanceM)} away (${c.statusLabel})`,
  }))
  const current = measurements.filter((m) => m.supersededById === null)
  const points: MapMeasurement[] = current.map((m, i) => ({ id: m.id, at: { latDeg: m.latDeg, lonDeg: m.lonDeg }, label: `M${i + 1} ${measurementLevel(m)}` }))
  const bearings: MapBearing[] = current
    .filter((m) => m.bearingDeg !== null)
    .map((m, i) => ({ id: m.id, from: { latDeg: m.latDeg, lonDeg: m.lonDeg }, bearingDeg: m.bearingDeg!, lengthM: BEARING_LINE_M, label: `Bearing ${i + 1}: ${m.bearingDeg}°` }))
  return (
    <details className="rounded-control border border-rule" onToggle={(e) => setOpen(e.currentTarget.open)}>
      <summary className="min-h-11 cursor-pointer px-4 py-2 font-semibold">Map of the case</summary>
      <div className="px-4 pb-4">
        {open && nearby.isPending && <Loading label="Loading the map…" />}
        {open && nearby.isError && <p className="mb-2 text-sm text-ink-muted">The other open cases nearby could not be loaded just now; the map shows this case only.</p>}
        {open && !nearby.isPending && (
          <FieldMap
            label={`Map of case ${detail.reference}`}
            victim={{ at: { latDeg: detail.latDeg, lonDeg: detail.lonDeg } }}
            measurements={points}
            bearings={bearings}
            candidateStations={candidateStations(records)}
            estimatedSource={latestSource(records)}
            offices="region"
            nearbyCases={nearbyCases}
            heightPx={380}
          />
        )}
      </div>
    </details>
  )
}

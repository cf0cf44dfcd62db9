/** The map's key: one row per layer shown, its symbol (shape and colour) and its name. */
import { PRIORITIES, PRIORITY_LABELS } from '@shared/domain/services'
import type { FieldMapProps } from './map-types'
import { symbolSvg, type SymbolKind } from './lib/symbols'

export interface LegendEntry {
  kind: SymbolKind
  label: string
}

/** The entries for the layers that hold something, in drawing order. Pure. */
export function legendEntries(p: Omit<FieldMapProps, 'offices' | 'label'> & { officeCount: number; officeAreas: boolean; region: boolean }): LegendEntry[] {
  const n = (count: number, one: string, many: string) => `${count} ${count === 1 ? one : many}`
  const out: LegendEntry[] = []
  if (p.region) out.push({ kind: 'region', label: 'Region boundary and land' })
  if (p.officeCount) out.push({ kind: 'office', label: n(p.officeCount, 'field office', 'field offices') })
  if (p.officeAreas) out.push({ kind: 'officeArea', label: 'Office area' })
  if (p.areaEditor && (p.areaEditor.vertices.length || p.areaEditor.fixedArea)) out.push({ kind: 'areaDraft', label: 'The area being edited' })
  if (p.areaEditor?.crossings?.length) out.push({ kind: 'crossing', label: 'Where the outline crosses itself' })
  if (p.victim) out.push({ kind: 'victim', label: p.victim.label ?? 'Complainant’s position' })
  if (p.measurements?.length) out.push({ kind: 'measurement', label: n(p.measurements.length, 'measurement site', 'measurement sites') })
  if (p.bearings?.length) out.push({ kind: 'bearing', label: n(p.bearings.length, 'bearing line', 'bearing lines') })
  if (p.estimatedSource) out.push({ kind: 'source', label: p.estimatedSource.label ?? 'Estimated source' })
  if (p.estimatedSource?.ellipse) out.push({ kind: 'ellipse', label: '95 % confidence ellipse' })
  if (p.candidateStations?.length) out.push({ kind: 'station', label: n(p.candidateStations.length, 'candidate station', 'candidate stations') })
  const noun = p.casesNoun ?? { one: 'nearby case', many: 'nearby cases' }
  const plain = p.nearbyCases?.filter((c) => !c.priority) ?? []
  if (plain.length) out.push({ kind: 'nearbyCase', label: n(plain.length, noun.one, noun.many) })
  for (const level of PRIORITIES) {
    const count = p.nearbyCases?.filter((c) => c.priority === level).length ?? 0
    if (count) out.push({ kind: `harm${level}`, label: `${n(count, noun.one, noun.many)}: ${PRIORITY_LABELS[level].short}` })
  }
  return out
}

export function MapLegend({ entries, label }: { entries: LegendEntry[]; label: string }) {
  if (entries.length === 0) return null
  return (
    <ul aria-label={label} className="flex flex-wrap gap-x-4 gap-y-1 text-sm text-ink">
      {entries.map((e) => (
        <li key={e.kind} className="flex items-center gap-1.5">
          {/* the symbols are the project's own constant markup */}
          <span className="inline-flex h-5 w-5 items-center justify-center" dangerouslySetInnerHTML={{ __html: symbolSvg(e.kind, 20) }} />
          {e.label}
        </li>
      ))}
    </ul>
  )
}

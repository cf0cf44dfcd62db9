/**
 * The office's area in the form: drawn on the map (Undo last point, Clear), or read from a
 * GeoJSON file or pasted text; its size in km²; where the outline crosses itself (which blocks
 * saving); and, once the drawing rests, the server's check of overlaps with other offices' areas.
 */
import type { AreaGeometry } from '@shared/schemas/region'
import { formatKm2 } from '@shared/domain/office-areas'
import { Button } from '@/components/ui/button'
import { FieldError } from '@/components/ui/field'
import { isApiError } from '@/lib/api-client'
import { withoutLastVertex } from '@/components/map/lib/area-vertices'
import type { useAreaCheck } from '../api/check-area'
import { draftOfArea, type AreaDraft, type DraftState } from '../lib/area-draft'
import { AreaUpload } from './area-upload'
import { AreaWarnings } from './area-warnings'

export const AREA_ERROR_ID = 'office-area-error'

export function AreaSection(props: {
  draft: AreaDraft
  state: DraftState
  onDraft: (draft: AreaDraft) => void
  check: ReturnType<typeof useAreaCheck>
  /** The server's word on the area after a save (a 400 on path 'area'). */
  serverError?: string
  /** Where the area came from when it was not drawn ("tarnwick.geojson"). */
  source: string | null
  onSource: (source: string | null) => void
}) {
  const { draft, state, onDraft, check, serverError, source, onSource } = props
  const corners = draft.kind === 'corners' ? draft.vertices.length : 0
  const onArea = (area: AreaGeometry, from: string) => {
    onDraft(draftOfArea(area))
    onSource(from)
  }
  const error = state.problem ?? serverError
  return (
    <fieldset className="flex min-w-0 flex-col gap-4 rounded-panel border border-rule bg-surface p-5" aria-describedby={error ? AREA_ERROR_ID : undefined}>
      <legend className="px-1 text-lg font-bold">Area</legend>
      <p className="text-sm text-ink-muted">
        Reports from a place inside the area go to this office. A place outside every office’s area goes to the nearest office, and its case carries a warning. An office may have no area.
      </p>
      {draft.kind === 'fixed' ? (
        <p>
          This area has several parts or holes: it is shown on the map and changed by uploading another file{source ? ` (now from ${source})` : ''}.
        </p>
      ) : (
        <>
          <p className="font-semibold">Click the map to add the corners of the area in order.</p>
          <p aria-live="polite" className="text-sm">
            {corners === 0 ? 'No corners yet.' : `${corners} ${corners === 1 ? 'corner' : 'corners'}${source ? `, from ${source}` : ''}.`}
          </p>
        </>
      )}
      <div className="flex flex-wrap gap-3">
        <Button variant="secondary" disabled={corners === 0} onClick={() => draft.kind === 'corners' && onDraft({ kind: 'corners', vertices: withoutLastVertex(draft.vertices) })}>
          Undo last point
        </Button>
        <Button
          variant="secondary"
          disabled={draft.kind === 'none' || (draft.kind === 'corners' && corners === 0)}
          onClick={() => {
            onDraft({ kind: 'corners', vertices: [] })
            onSource(null)
          }}
        >
          Clear the area
        </Button>
      </div>
      {state.km2 !== null && (
        <p>
          Size: <span className="font-mono">{formatKm2(state.km2)}</span>
        </p>
      )}
      <FieldError id={AREA_ERROR_ID} message={error} />
      <AreaCheckResult check={check} />
      <AreaUpload onArea={onArea} />
    </fieldset>
  )
}

function AreaCheckResult({ check }: { check: ReturnType<typeof useAreaCheck> }) {
  if (check.waiting || check.isFetching) return <p role="status" className="text-sm text-ink-muted">Checking the area against the other offices’ areas…</p>
  if (check.isError) {
    const said = isApiError(check.error) ? check.error.details.find((d) => d.path.startsWith('area'))?.message : undefined
    return <p className="text-sm text-ink-muted">{said ?? 'The overlap check could not run just now; the area is checked again when you save.'}</p>
  }
  if (!check.data) return null
  if (check.data.warnings.length === 0) return <p role="status" className="text-sm">No overlap with other offices’ areas.</p>
  return <AreaWarnings title="Worth a look before saving (it can be saved all the same)" warnings={check.data.warnings} />
}

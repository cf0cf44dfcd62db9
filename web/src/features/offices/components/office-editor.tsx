/**
 * A new office, or an office's details and area, on one page: the form, and the map on which
 * the area is drawn and the position picked (beside the form on a wide screen, above it on a
 * phone). Saving sends everything at once; the answer's warnings go back with the office.
 */
import { useMemo, useState } from 'react'
import { useForm } from 'react-hook-form'
import { Link } from 'react-router-dom'
import { FieldMap } from '@/components/map'
import { FormAlert } from '@/components/ui/form-alert'
import { SubmitButton } from '@/components/ui/submit-button'
import { isApiError } from '@/lib/api-client'
import { formProblem, type FormProblem } from '@/lib/form-errors'
import { paths } from '@/lib/paths'
import { useMediaQuery } from '@/lib/use-media-query'
import type { Office } from '../api/get-offices'
import { useAreaCheck } from '../api/check-area'
import { useSaveOffice, type OfficeSaved } from '../api/save-office'
import { cornersOf, draftOfArea, draftState, type AreaDraft } from '../lib/area-draft'
import { fieldOfPath, formValuesOf, officeInputOf, positionOf, type OfficeFieldErrors, type OfficeFormValues } from '../lib/office-form'
import { AreaSection, AREA_ERROR_ID } from './area-section'
import { OfficeDetailsFields } from './office-details-fields'

export const STALE_MESSAGE = 'Someone saved this office while you were editing; reload to see their change.'

/** The zone of the browser, a fair first guess for a new office in the same region. */
const browserZone = () => Intl.DateTimeFormat().resolvedOptions().timeZone || 'UTC'

export function OfficeEditor({ office, onSaved }: { office: Office | null; onSaved: (saved: OfficeSaved) => void }) {
  const save = useSaveOffice()
  const form = useForm<OfficeFormValues>({ defaultValues: formValuesOf(office, browserZone()) })
  const [draft, setDraft] = useState<AreaDraft>(() => draftOfArea(office?.area ?? null))
  const [source, setSource] = useState<string | null>(null)
  const [picking, setPicking] = useState(false)
  const [problem, setProblem] = useState<FormProblem | null>(null)
  const [areaError, setAreaError] = useState<string | undefined>()
  const wide = useMediaQuery('(min-width: 1024px)', true)

  const state = useMemo(() => draftState(draft), [draft])
  const position = positionOf({ latDeg: form.watch('latDeg'), lonDeg: form.watch('lonDeg') })
  const check = useAreaCheck(state.area ? { area: state.area, ...(position ?? {}), ...(office ? { officeId: office.id } : {}) } : null)

  const changeDraft = (next: AreaDraft) => {
    setDraft(next)
    setAreaError(undefined)
  }
  const showErrors = (errors: OfficeFieldErrors) => {
    let focused = false
    for (const [field, message] of Object.entries(errors) as [keyof OfficeFieldErrors, string][]) {
      if (field === 'area') setAreaError(message)
      else {
        form.setError(field, { type: 'server', message }, { shouldFocus: !focused })
        focused = true
      }
    }
    if (!focused && errors.area) document.getElementById(AREA_ERROR_ID)?.scrollIntoView?.({ block: 'center' })
  }

  const onSubmit = form.handleSubmit(async (values) => {
    setProblem(null)
    setAreaError(undefined)
    const built = officeInputOf(values, state)
    if ('errors' in built) return showErrors(built.errors)
    try {
      const saved = await save.mutateAsync(office ? { officeId: office.id, update: { ...built.input, version: office.version } } : { officeId: null, input: built.input })
      onSaved(saved)
    } catch (error) {
      if (isApiError(error) && error.code === 'office_name_taken') return showErrors({ name: error.message })
      if (isApiError(error) && error.details.length > 0) {
        const placed: OfficeFieldErrors = {}
        for (const d of error.details) {
          const field = fieldOfPath(d.path)
          if (field && !placed[field]) placed[field] = d.message
        }
        if (Object.keys(placed).length > 0) return showErrors(placed)
      }
      setProblem(formProblem(error, { byCode: { stale_version: STALE_MESSAGE } }))
    }
  })

  const onPick = (latDeg: number, lonDeg: number) => {
    const opts = { shouldDirty: true, shouldValidate: false }
    form.setValue('latDeg', String(latDeg), opts)
    form.setValue('lonDeg', String(lonDeg), opts)
    form.clearErrors(['latDeg', 'lonDeg'])
    setPicking(false)
  }

  const name = office?.name ?? 'the new office'
  return (
    <div className="grid gap-6 lg:grid-cols-2 lg:items-start">
      <div className="flex min-w-0 flex-col gap-2 lg:sticky lg:top-4 lg:order-2">
        <FieldMap
          label={`Map: the area and position of ${name}`}
          offices="region"
          heightPx={wide ? 560 : 340}
          onPick={picking ? onPick : undefined}
          areaEditor={{
            vertices: cornersOf(draft),
            onChange: (vertices) => changeDraft({ kind: 'corners', vertices }),
            crossings: state.crossings,
            fixedArea: draft.kind === 'fixed' ? draft.area : null,
            // the map writes "<name> office" beside the point
            office: { name: office?.name ?? 'The new', at: position },
          }}
        />
      </div>
      <form noValidate onSubmit={onSubmit} aria-label={office ? `Details and area of ${office.name}` : 'New office'} className="flex min-w-0 flex-col gap-6 lg:order-1">
        <OfficeDetailsFields form={form} picking={picking} onPicking={setPicking} />
        <AreaSection draft={draft} state={state} onDraft={changeDraft} check={check} serverError={areaError} source={source} onSource={setSource} />
        <FormAlert problem={problem} />
        <div className="flex flex-wrap items-center gap-4">
          <SubmitButton submitting={save.isPending} pendingLabel="Saving…">
            {office ? 'Save the office' : 'Create the office'}
          </SubmitButton>
          <Link to={paths.adminOffices.href(office?.id)}>Back to the offices without saving</Link>
        </div>
      </form>
    </div>
  )
}

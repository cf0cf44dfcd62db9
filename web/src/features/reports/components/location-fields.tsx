/** Where it happens: an address or place, and latitude/longitude typed or picked on the map. */
import type { ReactNode } from 'react'
import { latDegSpec, lonDegSpec } from '@shared/schemas/cases'
import { readNumberWithUnit } from '@shared/schemas/number-with-unit'
import type { UseFormReturn } from 'react-hook-form'
import { TextField } from '@/components/ui/text-field'
import { FormSection, figureOrUndefined } from './form-section'
import type { LocationPickerArgs, ReportFormInput, ReportFormOutput } from './report-form-types'

export function LocationFields({
  form,
  renderLocationPicker,
}: {
  form: UseFormReturn<ReportFormInput, unknown, ReportFormOutput>
  renderLocationPicker: (args: LocationPickerArgs) => ReactNode
}) {
  const { register, formState, watch, setValue } = form
  const e = formState.errors
  const value = positionOf(watch('latDeg'), watch('lonDeg'))
  const onPick = (p: { latDeg: number; lonDeg: number }) => {
    const opts = { shouldDirty: true, shouldValidate: formState.isSubmitted }
    setValue('latDeg', String(p.latDeg), opts)
    setValue('lonDeg', String(p.lonDeg), opts)
  }
  return (
    <FormSection title="Where it happens" lead={<p>The report goes to the field office nearest this place.</p>}>
      <TextField label="Address or place" autoComplete="street-address" hint="A street address, a harbour berth, a hill top, a stretch of road…" error={e.address?.message} {...register('address')} />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          label="Latitude"
          inputMode="decimal"
          autoComplete="off"
          hint="Decimal degrees: north positive, south negative."
          error={e.latDeg?.message}
          className="font-mono"
          {...register('latDeg', { setValueAs: figureOrUndefined })}
        />
        {/* No decimal keypad here: on some phones it has no minus sign, which west longitudes need. */}
        <TextField
          label="Longitude"
          autoComplete="off"
          hint="Decimal degrees: east positive, west negative."
          error={e.lonDeg?.message}
          className="font-mono"
          {...register('lonDeg', { setValueAs: figureOrUndefined })}
        />
      </div>
      {renderLocationPicker({ value, onPick })}
    </FormSection>
  )
}

/** The typed pair as numbers (read as the form reads them), or null while either is blank or wrong. */
function positionOf(lat: unknown, lon: unknown): { latDeg: number; lonDeg: number } | null {
  const latDeg = readNumberWithUnit(lat, latDegSpec)
  const lonDeg = readNumberWithUnit(lon, lonDegSpec)
  return latDeg.ok && lonDeg.ok ? { latDeg: latDeg.value, lonDeg: lonDeg.value } : null
}

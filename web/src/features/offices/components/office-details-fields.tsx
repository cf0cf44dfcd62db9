/** The office's name, area name, postal address, position (typed, or picked on the map) and time zone. */
import { useState } from 'react'
import type { UseFormReturn } from 'react-hook-form'
import { Button } from '@/components/ui/button'
import { SelectField } from '@/components/ui/select-field'
import { TextField } from '@/components/ui/text-field'
import { TextAreaField } from '@/components/ui/text-area-field'
import type { OfficeFormValues } from '../lib/office-form'
import { zoneOptions } from './time-zone-form'

export function OfficeDetailsFields({ form, picking, onPicking }: { form: UseFormReturn<OfficeFormValues>; picking: boolean; onPicking: (on: boolean) => void }) {
  const { register, formState, getValues } = form
  const e = formState.errors
  // the list is long and fixed: made once (the office's own zone kept in it)
  const [zones] = useState(() => zoneOptions(getValues('timeZone')))
  return (
    <fieldset className="flex min-w-0 flex-col gap-4 rounded-panel border border-rule bg-surface p-5">
      <legend className="px-1 text-lg font-bold">Office</legend>
      <TextField id="office-name" label="Name" autoComplete="off" maxLength={80} error={e.name?.message} {...register('name')} />
      <TextField id="office-region-name" label="Area name (optional)" hint="What the area is called, e.g. Vellmark Coast — north." autoComplete="off" maxLength={120} error={e.regionName?.message} {...register('regionName')} />
      <TextAreaField id="office-address" label="Postal address (optional)" rows={3} maxLength={300} autoComplete="street-address" error={e.address?.message} {...register('address')} />
      <fieldset className="flex min-w-0 flex-col gap-3">
        <legend className="mb-1 font-semibold">Position</legend>
        <p className="text-sm text-ink-muted">Where the office is, in decimal degrees (WGS 84). A report outside every area goes to the nearest office, measured from here.</p>
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField id="office-lat" label="Latitude (°)" inputMode="decimal" autoComplete="off" hint="North positive, south negative." className="font-mono" error={e.latDeg?.message} {...register('latDeg')} />
          {/* no decimal keypad: on some phones it has no minus sign, which west longitudes need */}
          <TextField id="office-lon" label="Longitude (°)" autoComplete="off" hint="East positive, west negative." className="font-mono" error={e.lonDeg?.message} {...register('lonDeg')} />
        </div>
        <div className="flex flex-wrap items-center gap-3">
          <Button variant="secondary" aria-pressed={picking} onClick={() => onPicking(!picking)}>
            Pick on map
          </Button>
          <p aria-live="polite" className="text-sm text-ink-muted">
            {picking ? 'Click the map where the office is (press the button again to stop); after that, clicks add corners again.' : ''}
          </p>
        </div>
      </fieldset>
      <div className="max-w-sm">
        <SelectField id="office-time-zone" label="Time zone" hint="The office’s day: “today” on the dashboard and the daily digest follow it." options={zones} error={e.timeZone?.message} {...register('timeZone')} />
      </div>
    </fieldset>
  )
}

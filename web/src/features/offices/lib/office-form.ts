/**
 * The office form's values (as typed: figures are text until read) and the request they make.
 * Latitude and longitude are read with the strict number parser (degrees, an optional "°");
 * the rest is checked with the shared officeInputSchema, so the form refuses what the server
 * would and says so beside the same fields. Pure.
 */
import { readNumberWithUnit } from '@shared/schemas/number-with-unit'
import { latDegSpec, lonDegSpec } from '@shared/schemas/cases'
import { officeInputSchema, type OfficeInput } from '@shared/schemas/offices'
import type { OfficeView } from '@shared/schemas/views'

export interface OfficeFormValues {
  name: string
  regionName: string
  address: string
  latDeg: string
  lonDeg: string
  timeZone: string
}

/** The fields a message can stand beside (server details use the same paths). */
export const OFFICE_FIELDS = ['name', 'regionName', 'address', 'latDeg', 'lonDeg', 'timeZone', 'area'] as const
export type OfficeField = (typeof OFFICE_FIELDS)[number]
export type OfficeFieldErrors = Partial<Record<OfficeField, string>>

/** The form filled from an office, or blank for a new one (its time zone: `defaultTimeZone`). */
export function formValuesOf(office: OfficeView | null, defaultTimeZone: string): OfficeFormValues {
  if (!office) return { name: '', regionName: '', address: '', latDeg: '', lonDeg: '', timeZone: defaultTimeZone }
  return {
    name: office.name,
    regionName: office.regionName,
    address: office.address,
    latDeg: String(office.centreLatDeg),
    lonDeg: String(office.centreLonDeg),
    timeZone: office.timeZone,
  }
}

const POSITION_SPECS = {
  latDeg: { ...latDegSpec, requiredMessage: 'Enter the latitude or pick the office’s position on the map.' },
  lonDeg: { ...lonDegSpec, requiredMessage: 'Enter the longitude or pick the office’s position on the map.' },
}

/** The typed position as numbers, or null while either figure is blank or wrong. */
export function positionOf(values: Pick<OfficeFormValues, 'latDeg' | 'lonDeg'>): { latDeg: number; lonDeg: number } | null {
  const latDeg = readNumberWithUnit(values.latDeg, POSITION_SPECS.latDeg)
  const lonDeg = readNumberWithUnit(values.lonDeg, POSITION_SPECS.lonDeg)
  return latDeg.ok && lonDeg.ok ? { latDeg: latDeg.value, lonDeg: lonDeg.value } : null
}

/** The field a server issue's path belongs to ("area.coordinates.0" is the area's), or null. */
export function fieldOfPath(path: string): OfficeField | null {
  const head = path.split('.')[0] ?? ''
  return (OFFICE_FIELDS as readonly string[]).includes(head) ? (head as OfficeField) : null
}

/**
 * The request body for the values and the area (null: none), or every problem by field. An
 * `areaProblem` (too few corners, a crossing outline) keeps the form from being sent.
 */
export function officeInputOf(values: OfficeFormValues, area: { area: OfficeInput['area'] | undefined; problem: string | null }): { input: OfficeInput } | { errors: OfficeFieldErrors } {
  const errors: OfficeFieldErrors = {}
  const latDeg = readNumberWithUnit(values.latDeg, POSITION_SPECS.latDeg)
  const lonDeg = readNumberWithUnit(values.lonDeg, POSITION_SPECS.lonDeg)
  if (!latDeg.ok) errors.latDeg = latDeg.message
  if (!lonDeg.ok) errors.lonDeg = lonDeg.message
  if (area.problem) errors.area = area.problem
  const parsed = officeInputSchema.safeParse({
    name: values.name,
    regionName: values.regionName,
    address: values.address,
    latDeg: latDeg.ok ? latDeg.value : 0,
    lonDeg: lonDeg.ok ? lonDeg.value : 0,
    timeZone: values.timeZone,
    area: area.area ?? null,
  })
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const field = fieldOfPath(issue.path.map(String).join('.'))
      if (field && !errors[field]) errors[field] = issue.message
    }
  }
  if (Object.keys(errors).length > 0 || !parsed.success) return { errors }
  return { input: parsed.data }
}

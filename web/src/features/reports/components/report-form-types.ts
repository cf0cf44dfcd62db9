/**
 * The report form's value types, apart from the form itself so that its field components
 * can name them without importing the form that imports them.
 */
import type { z } from 'zod'
import type { reportSchema } from '@shared/schemas/cases'

export type ReportFormInput = z.input<typeof reportSchema>
export type ReportFormOutput = z.output<typeof reportSchema>

export interface LocationPickerArgs {
  value: { latDeg: number; lonDeg: number } | null
  onPick: (p: { latDeg: number; lonDeg: number }) => void
}

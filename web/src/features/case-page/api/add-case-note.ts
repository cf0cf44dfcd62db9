/** POST /api/cases/:id/notes — an internal note, or a message the complainant reads and is e-mailed. */
import type { z } from 'zod'
import type { noteSchema } from '@shared/schemas/cases'
import { postCaseAction, useCaseAction } from './case-move'

export type CaseNoteBody = z.input<typeof noteSchema>

export const addCaseNote = (caseId: string, body: CaseNoteBody) => postCaseAction(caseId, 'notes', body)

export const useAddCaseNote = (caseId: string) => useCaseAction<CaseNoteBody>(caseId, 'notes')

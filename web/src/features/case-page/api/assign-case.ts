/** POST /api/cases/:id/assign — Gives the case to an investigator of its office. */
import type { z } from 'zod'
import type { assignSchema } from '@shared/schemas/cases'
import { postCaseAction, useCaseAction } from './case-move'

export type AssignCaseBody = z.input<typeof assignSchema>

export const assignCase = (caseId: string, body: AssignCaseBody) => postCaseAction(caseId, 'assign', body)

export const useAssignCase = (caseId: string) => useCaseAction<AssignCaseBody>(caseId, 'assign')

/** POST /api/cases/:id/triage — Sets (or confirms) the priority; the response target follows it. */
import type { z } from 'zod'
import type { triageSchema } from '@shared/schemas/cases'
import { postCaseAction, useCaseAction } from './case-move'

export type TriageCaseBody = z.input<typeof triageSchema>

export const triageCase = (caseId: string, body: TriageCaseBody) => postCaseAction(caseId, 'triage', body)

export const useTriageCase = (caseId: string) => useCaseAction<TriageCaseBody>(caseId, 'triage')

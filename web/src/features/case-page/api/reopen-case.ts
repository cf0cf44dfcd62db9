/** POST /api/cases/:id/reopen — Reopens a closed case (supervisor). */
import type { z } from 'zod'
import type { reopenSchema } from '@shared/schemas/cases'
import { postCaseAction, useCaseAction } from './case-move'

export type ReopenCaseBody = z.input<typeof reopenSchema>

export const reopenCase = (caseId: string, body: ReopenCaseBody) => postCaseAction(caseId, 'reopen', body)

export const useReopenCase = (caseId: string) => useCaseAction<ReopenCaseBody>(caseId, 'reopen')

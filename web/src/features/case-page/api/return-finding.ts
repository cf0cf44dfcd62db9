/** POST /api/cases/:id/return-finding — Sends a proposed finding back for more work (supervisor). */
import type { z } from 'zod'
import type { returnFindingSchema } from '@shared/schemas/cases'
import { postCaseAction, useCaseAction } from './case-move'

export type ReturnFindingBody = z.input<typeof returnFindingSchema>

export const returnFinding = (caseId: string, body: ReturnFindingBody) => postCaseAction(caseId, 'return-finding', body)

export const useReturnFinding = (caseId: string) => useCaseAction<ReturnFindingBody>(caseId, 'return-finding')

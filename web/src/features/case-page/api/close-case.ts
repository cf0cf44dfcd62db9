/** POST /api/cases/:id/close — Approves the finding and closes the case with a summary for the complainant (supervisor). */
import type { z } from 'zod'
import type { closeSchema } from '@shared/schemas/cases'
import { postCaseAction, useCaseAction } from './case-move'

export type CloseCaseBody = z.input<typeof closeSchema>

export const closeCase = (caseId: string, body: CloseCaseBody) => postCaseAction(caseId, 'close', body)

export const useCloseCase = (caseId: string) => useCaseAction<CloseCaseBody>(caseId, 'close')

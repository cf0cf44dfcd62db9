/** POST /api/cases/:id/start-field-work — Starts field work (assigned investigator). */
import type { z } from 'zod'
import type { startFieldWorkSchema } from '@shared/schemas/cases'
import { postCaseAction, useCaseAction } from './case-move'

export type StartFieldWorkBody = z.input<typeof startFieldWorkSchema>

export const startFieldWork = (caseId: string, body: StartFieldWorkBody) => postCaseAction(caseId, 'start-field-work', body)

export const useStartFieldWork = (caseId: string) => useCaseAction<StartFieldWorkBody>(caseId, 'start-field-work')

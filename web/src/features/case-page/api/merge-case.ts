/** POST /api/cases/:id/merge — Joins a new report to an open case; the report closes as a duplicate. */
import type { z } from 'zod'
import type { mergeSchema } from '@shared/schemas/cases'
import { postCaseAction, useCaseAction } from './case-move'

export type MergeCaseBody = z.input<typeof mergeSchema>

export const mergeCase = (caseId: string, body: MergeCaseBody) => postCaseAction(caseId, 'merge', body)

export const useMergeCase = (caseId: string) => useCaseAction<MergeCaseBody>(caseId, 'merge')

/** POST /api/cases/:id/dismiss — Closes a report at triage with a summary for the complainant. */
import type { z } from 'zod'
import type { dismissSchema } from '@shared/schemas/cases'
import { postCaseAction, useCaseAction } from './case-move'

export type DismissReportBody = z.input<typeof dismissSchema>

export const dismissReport = (caseId: string, body: DismissReportBody) => postCaseAction(caseId, 'dismiss', body)

export const useDismissReport = (caseId: string) => useCaseAction<DismissReportBody>(caseId, 'dismiss')

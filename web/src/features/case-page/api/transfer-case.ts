/** POST /api/cases/:id/transfer — Hands a new report to another office, which triages it afresh. */
import type { z } from 'zod'
import type { transferSchema } from '@shared/schemas/cases'
import { postCaseAction, useCaseAction } from './case-move'

export type TransferCaseBody = z.input<typeof transferSchema>

export const transferCase = (caseId: string, body: TransferCaseBody) => postCaseAction(caseId, 'transfer', body)

export const useTransferCase = (caseId: string) => useCaseAction<TransferCaseBody>(caseId, 'transfer')

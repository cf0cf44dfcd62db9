/** POST /api/cases/:id/propose-finding — Proposes a finding for the supervisor's review (assigned investigator). */
import type { z } from 'zod'
import type { proposeFindingSchema } from '@shared/schemas/cases'
import { postCaseAction, useCaseAction } from './case-move'

export type ProposeFindingBody = z.input<typeof proposeFindingSchema>

export const proposeFinding = (caseId: string, body: ProposeFindingBody) => postCaseAction(caseId, 'propose-finding', body)

export const useProposeFinding = (caseId: string) => useCaseAction<ProposeFindingBody>(caseId, 'propose-finding')

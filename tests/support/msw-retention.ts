/** Answers of the retention and legal-hold routes for component tests, built from the shared schemas. */
import { legalHoldResponseSchema, retentionSettingResponseSchema, type LegalHoldView, type RetentionSettingView } from '../../shared/schemas/retention'
import { IDS } from './msw-views'

export function legalHoldResponse(changes: Partial<LegalHoldView> = {}) {
  return legalHoldResponseSchema.parse({ legalHold: { caseId: IDS.case, active: null, history: [], abilities: { set: false, lift: false }, ...changes } })
}

export function retentionSettingResponse(changes: Partial<RetentionSettingView> = {}) {
  return retentionSettingResponseSchema.parse({
    retention: { officeId: IDS.tarnwickOffice, retentionMonths: 24, minimumMonths: null, minimumBecause: null, abilities: { set: false }, ...changes },
  })
}

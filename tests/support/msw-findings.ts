/**
 * What the mocked API answers about calculations and findings, built through the shared view
 * schemas (as msw-views.ts does for cases): a builder that no longer fits its schema fails here.
 * The figures are invented screen data, not checked values: the numbers a finding rests on are
 * computed by the server and checked in the server and radio tests.
 */
import { calculationsResponseSchema, calculationViewSchema, type CalculationView } from '../../shared/schemas/views'
import { findingsResponseSchema, findingViewSchema, type FindingView } from '../../shared/schemas/findings'
import { IDS } from './msw-views'

export const FINDING_IDS = {
  eirpCalculation: '5d4c3b2a-1f0e-4d9c-8b7a-6f5e4d3c2b1a',
  verdictCalculation: '6e5d4c3b-2a1f-4e0d-9c8b-7a6f5e4d3c2b',
  finding: '3c2b1a0f-9e8d-4c7b-8a6f-5e4d3c2b1a09',
  earlierFinding: '8a7b6c5d-4e3f-4a2b-9c1d-0e9f8a7b6c5d',
} as const

/** A stored EIRP record with its interval and one warning, with the test's changes. */
export function calculationView(changes: Partial<CalculationView> = {}): CalculationView {
  return calculationViewSchema.parse({
    id: FINDING_IDS.eirpCalculation,
    caseId: IDS.case,
    kind: 'eirp_single_point',
    kindLabel: 'EIRP from one measured level',
    inputs: { distanceM: 1000 },
    outputs: {
      value: { eirpDbm: 23.41, distanceM: 1000, modelMethodId: 'itu-r-p525-free-space' },
      interval: { quantity: 'eirpDbm', low: 21.9, high: 24.93, basis: 'GUM U = k·u_c, k = 2 (about 95 %)' },
    },
    warnings: ['The distance is inside the near field of a large antenna; the estimate may be high.'],
    methods: [{ id: 'itu-r-p525-free-space', source: 'ITU-R P.525' }],
    libraryVersion: '0.3.0',
    author: { id: IDS.investigatorIlse, name: 'Ilse Brannock' },
    at: '2026-12-01T10:00:00.000Z',
    references: {},
    measurementIds: [],
    evidenceIds: [],
    ...changes,
  })
}

/** GET /api/cases/:id/calculations */
export function calculationsResponse(list: CalculationView[] = [calculationView()]) {
  return calculationsResponseSchema.parse({ calculations: list })
}

/** One proposal of a finding, with the test's changes. */
export function findingView(changes: Partial<FindingView> = {}): FindingView {
  return findingViewSchema.parse({
    id: FINDING_IDS.finding,
    caseId: IDS.case,
    author: { id: IDS.investigatorIlse, name: 'Ilse Brannock' },
    at: '2026-12-02T09:00:00.000Z',
    sourceDescription: 'A faulty masthead amplifier on the Tarnwick boat club roof',
    sourcePosition: { latDeg: 48.1021, lonDeg: -31.3504 },
    operator: 'Tarnwick Boat Club',
    authorisedStationId: null,
    recommendedAction: 'advise_operator',
    recommendedActionLabel: 'Give the operator advice',
    complianceDeadline: '2026-12-20',
    summary: 'The amplifier oscillates when the mast heater runs.',
    calculations: [calculationView()],
    evidenceIds: [],
    evidence: [],
    review: null,
    ...changes,
  })
}

/** GET /api/cases/:id/findings — no finding by default. */
export function findingsResponse(current: FindingView | null = null, earlier: FindingView[] = []) {
  return findingsResponseSchema.parse({ current, earlier })
}

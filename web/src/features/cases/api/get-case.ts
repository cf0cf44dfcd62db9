/** GET /api/cases/:id — the case page: details, timeline and what the viewer may do (`abilities`). */
import { queryOptions, useQuery } from '@tanstack/react-query'
import type { CaseMoveName, CaseState } from '../../../../../shared/domain/case-lifecycle'
import { api } from '../../../lib/api-client'

export interface TimelineEvent {
  id: number
  at: string
  actor: string
  kind: string
  fromState: string | null
  toState: string | null
  body: string | null
  visibility: 'internal' | 'complainant'
  data: Record<string, unknown> | null
}

export type CaseAbilities = Record<CaseMoveName, boolean> & { addInternalNote: boolean; messageComplainant: boolean }

export interface CaseDetail {
  id: string
  reference: string
  /** Sent back with every move; the server refuses a stale one (409 stale_version). */
  version: number
  status: CaseState
  statusLabel: string
  priority: 1 | 2 | 3 | 4
  suggestedPriority: 1 | 2 | 3 | 4
  service: string
  licenceRef: string | null
  freqLowHz: number
  freqHighHz: number
  address: string
  latDeg: number
  lonDeg: number
  sinceDate: string
  pattern: string
  patternDetail: string | null
  experience: string
  description: string
  complainant: { name: string; email: string; phone: string | null; organisation: string | null; hasAccount: boolean }
  officeId: string
  officeName: string
  investigatorId: string | null
  investigatorName: string | null
  mergedIntoCaseId: string | null
  mergedIntoReference: string | null
  resolution: string | null
  resolutionLabel: string | null
  closingSummary: string | null
  receivedAt: string
  dueAt: string
  closedAt: string | null
  overdue: boolean
  abilities: CaseAbilities
  timeline: TimelineEvent[]
}

export const caseQueryKey = (id: string) => ['cases', 'detail', id] as const

export const getCase = (id: string, signal?: AbortSignal) =>
  api.get<{ case: CaseDetail }>(`/api/cases/${encodeURIComponent(id)}`, signal).then((r) => r.case)

export const caseQueryOptions = (id: string) => queryOptions({ queryKey: caseQueryKey(id), queryFn: ({ signal }) => getCase(id, signal), staleTime: 10_000 })

export const useCase = (id: string) => useQuery(caseQueryOptions(id))

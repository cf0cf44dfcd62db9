/**
 * What every action form on the case page needs: the case as last loaded (its id and
 * version), a way to reload it after a conflict, and a way to announce a finished move.
 */
import { createContext, use } from 'react'
import type { CaseDetail } from '../api/get-case'

export interface CaseActionContextValue {
  detail: CaseDetail
  reload: () => void
  reloading: boolean
  /** Announces a finished move ("Priority set.") and moves focus to the announcement. */
  announce: (message: string) => void
}

export const CaseActionContext = createContext<CaseActionContextValue | null>(null)

export function useCaseActionContext(): CaseActionContextValue {
  const value = use(CaseActionContext)
  if (!value) throw new Error('Case action forms must sit inside <CaseActionContext>.')
  return value
}

/**
 * The workbench form's entries kept in this tab's session storage per case, so a reload (a
 * dropped connection in the field) loses nothing typed.
 */
import { useEffect, useState } from 'react'
import type { FormState } from '../lib/form-state'

interface Kept {
  kind: string
  state: FormState
}

function read(key: string, fallback: Kept): Kept {
  try {
    const raw = window.sessionStorage.getItem(key)
    const v = raw ? (JSON.parse(raw) as Partial<Kept>) : null
    if (v && typeof v.kind === 'string' && v.state && typeof v.state === 'object') return { kind: v.kind, state: v.state }
  } catch {
    // storage refused or unreadable: start afresh
  }
  return fallback
}

export function useKeptForm(caseId: string, fallback: Kept): [Kept, (next: Kept) => void] {
  const key = `quietband.workbench.${caseId}`
  const [kept, setKept] = useState<Kept>(() => read(key, fallback))
  useEffect(() => {
    try {
      window.sessionStorage.setItem(key, JSON.stringify(kept))
    } catch {
      // private mode or full: the form still works, it is just not kept
    }
  }, [key, kept])
  return [kept, setKept]
}

/**
 * The quick calculator's state in the URL: the kind, every form entry, and `run` once the
 * inputs were run, so a shared link reopens the same inputs and the same result.
 */
import type { FormState } from './form-state'

export interface CalculatorUrlState {
  kind: string | null
  state: FormState
  /** The inputs were run: the link shows the result too. */
  ran: boolean
}

const KIND = 'kind'
const RAN = 'run'

export function readCalculatorUrl(params: URLSearchParams): CalculatorUrlState {
  const state: FormState = {}
  for (const [k, v] of params) if (k !== KIND && k !== RAN) state[k] = v
  return { kind: params.get(KIND), state, ran: params.get(RAN) === '1' }
}

export function writeCalculatorUrl(s: CalculatorUrlState): URLSearchParams {
  const p = new URLSearchParams()
  if (s.kind) p.set(KIND, s.kind)
  for (const [k, v] of Object.entries(s.state).sort(([a], [b]) => a.localeCompare(b))) if (v !== '') p.set(k, v)
  if (s.ran) p.set(RAN, '1')
  return p
}

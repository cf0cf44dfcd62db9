/** What each kind's form gives the estimate panel: its first state, its fields, and its inputs as the schema reads them. */
import type { ComponentType } from 'react'
import type { FormState } from '../lib/form-state'

/** What the place around the form offers it: on a case, its stored estimates, chosen measurements and position. */
export interface EstimateSources {
  /** Stored estimates of the case whose EIRP a verdict can take (by id: the record keeps a copy). */
  eirpEstimates?: { id: string; label: string }[]
  /** Measurements chosen on the workbench (by id: the record keeps a copy). */
  measurements?: { id: string; label: string }[]
  /** The case's victim position and frequency range, to start a candidate search from. */
  victim?: { latDeg: number; lonDeg: number; lowFreqHz: number; highFreqHz: number }
}

export interface KindForm {
  kind: string
  label: string
  /** One line under the kind's name. */
  purpose: string
  /** Needs the server's registers (the licence register): not offered in the calculator. */
  needsServer?: boolean
  initial: FormState
  Fields: ComponentType<{ sources: EstimateSources }>
  /** The inputs as the schema reads them; `sources` gives the ids of the ticked measurements. */
  toInputs(state: FormState, sources: EstimateSources): Record<string, unknown>
}

/**
 * The quick calculator: the workbench's forms without a case. The form lives in the URL, so a
 * link reopens the same inputs and, once run, the same result (computed again in the browser,
 * deterministic); nothing is stored.
 */
import { useMemo } from 'react'
import { useSearchParams } from 'react-router-dom'
import { Notice } from '@/components/ui/notice'
import { BROWSER_KIND_FORMS } from '../forms/registry'
import { computeInBrowser, runInBrowser, type EstimateOutcome } from '../lib/run-estimate'
import { readCalculatorUrl, writeCalculatorUrl } from '../lib/url-state'
import { EstimateWorkspace } from './estimate-workspace'

const formOf = (kind: string | null) => BROWSER_KIND_FORMS.find((f) => f.kind === kind)

function outcomeOf(kind: string, state: Record<string, string>): EstimateOutcome | null {
  const form = formOf(kind)
  if (!form) return null
  try {
    return computeInBrowser({ kind, inputs: form.toInputs(state, {}) })
  } catch {
    return null
  }
}

export function QuickCalculator() {
  const [params, setParams] = useSearchParams()
  const url = readCalculatorUrl(params)
  const form = formOf(url.kind) ?? BROWSER_KIND_FORMS[0]!
  const state = url.kind && formOf(url.kind) ? url.state : form.initial
  const key = params.toString()
  // the result of a shared link: the same inputs through the same library give the same result
  // (computed once per URL: the state object is rebuilt on every render, the query is not)
  const outcome = useMemo(() => (url.ran ? outcomeOf(form.kind, state) : null), [key]) // the key carries kind, state and ran

  return (
    <div className="flex min-w-0 flex-col gap-4">
      <Notice tone="info" title="Nothing here is stored">
        <p>
          The calculator runs the same methods as a case's workbench, in this browser, with the radio library's own band-limit list. Copy the address to share these inputs and
          their result. To keep an estimate as evidence, run it on the case.
        </p>
      </Notice>
      <EstimateWorkspace
        kind={form.kind}
        state={state}
        onChange={(kind, next) => setParams(writeCalculatorUrl({ kind, state: next, ran: false }), { replace: true })}
        run={runInBrowser}
        outcome={outcome}
        onOutcome={(o) => setParams(writeCalculatorUrl({ kind: o?.kind ?? form.kind, state, ran: o !== null }), { replace: true })}
        runLabel="Calculate"
        idPrefix="calc"
        forms={BROWSER_KIND_FORMS}
        emptyResult="The result appears here once you calculate."
      />
    </div>
  )
}

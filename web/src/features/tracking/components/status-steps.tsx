/**
 * Where a report stands, in five plain steps. Done steps carry a tick, the current one a
 * ring and the word "now", later ones an open dot — so the state reads without colour.
 */
import { COMPLAINANT_STEPS, stepIndexFor } from '../lib/steps'

export function StatusSteps({ step }: { step: string }) {
  const current = stepIndexFor(step)
  const finished = step === 'closed'
  return (
    <ol aria-label="Progress of your report" className="flex flex-col gap-0 sm:flex-row sm:gap-0">
      {COMPLAINANT_STEPS.map((label, i) => {
        const state = i < current || (finished && i === current) ? 'done' : i === current ? 'now' : 'later'
        return (
          <li key={label} aria-current={i === current ? 'step' : undefined} className="relative flex flex-1 items-center gap-3 py-1 sm:flex-col sm:items-center sm:gap-2 sm:py-0 sm:text-center">
            {i > 0 && <Connector done={i <= current} />}
            <Node state={state} />
            <span className={`text-sm leading-tight ${state === 'later' ? 'text-ink-muted' : 'font-semibold text-ink'}`}>
              {label}
              <span className="block text-xs font-normal text-ink-muted">{state === 'done' ? 'done' : state === 'now' ? 'now' : 'to come'}</span>
            </span>
          </li>
        )
      })}
    </ol>
  )
}

function Node({ state }: { state: 'done' | 'now' | 'later' }) {
  return (
    <svg aria-hidden="true" width="30" height="30" viewBox="0 0 30 30" className="relative z-10 shrink-0 bg-surface">
      {state === 'done' && (
        <>
          <rect x="3" y="3" width="24" height="24" rx="6" className="fill-signal" />
          <path d="m9 15.5 4 4 8-9" fill="none" strokeWidth="3" strokeLinecap="round" strokeLinejoin="round" className="stroke-surface" />
        </>
      )}
      {state === 'now' && (
        <>
          <rect x="2" y="2" width="26" height="26" rx="7" fill="none" strokeWidth="3" className="stroke-signal" />
          <rect x="9" y="9" width="12" height="12" rx="3" className="fill-signal" />
        </>
      )}
      {state === 'later' && <rect x="7" y="7" width="16" height="16" rx="4" fill="none" strokeWidth="2" className="stroke-field" />}
    </svg>
  )
}

/** The line from the previous step: solid when reached, dotted when still ahead. */
function Connector({ done }: { done: boolean }) {
  return (
    <span
      aria-hidden="true"
      className={`absolute left-[14px] top-[-50%] h-full w-0 border-l-2 sm:left-[-50%] sm:top-[14px] sm:h-0 sm:w-full sm:border-l-0 sm:border-t-2 ${
        done ? 'border-signal' : 'border-dotted border-field'
      }`}
    />
  )
}

/**
 * The levels derived as the investigator types, beside the form (a panel on wide screens, a bar
 * kept at the bottom of the screen on a phone). Display only: the server derives and stores its own.
 */
import type { LiveLevels as Live } from '../lib/measurement-form-state'
import { formatLevel, LEVELS } from '../lib/format-levels'

export function LiveLevelsPanel({ live }: { live: Live }) {
  const r = live.result
  return (
    <section aria-label="Derived levels, as you type" aria-live="polite" className="flex flex-col gap-3 rounded-panel border border-signal bg-signal-soft p-4">
      <h3 className="font-semibold">Derived as you type</h3>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-2">
        {LEVELS.map((l) => (
          <div key={l.key} className="contents">
            <dt>{l.label}</dt>
            <dd className="text-right font-mono font-semibold" data-level={l.key}>
              {formatLevel(r?.derived[l.key], l.unit)}
            </dd>
          </div>
        ))}
        {r?.derived.antennaFactorDbPerM !== undefined && (
          <div className="contents text-sm text-ink-muted">
            <dt>Antenna factor used</dt>
            <dd className="text-right font-mono">{formatLevel(r.derived.antennaFactorDbPerM, 'dB/m', 2)}</dd>
          </div>
        )}
      </dl>
      {live.waitingFor.length > 0 && <p className="text-sm">Waiting for {live.waitingFor.join('; ')}.</p>}
      {r?.problems.map((p) => (
        <p key={p.path + p.message} className="text-sm font-semibold text-danger">
          {p.message}
        </p>
      ))}
      {r && r.warnings.length > 0 && (
        <ul aria-label="Warnings" className="list-disc pl-5 text-sm text-caution">
          {r.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      )}
      {r && Object.keys(r.methods).length > 0 && (
        <details className="text-sm">
          <summary className="min-h-11 cursor-pointer py-2">Methods</summary>
          <ul className="list-disc pl-5">
            {[...new Map(Object.values(r.methods).map((m) => [m.id, m])).values()].map((m) => (
              <li key={m.id}>{m.source}</li>
            ))}
          </ul>
        </details>
      )}
      <p className="text-sm text-ink-muted">Shown for checking while you type; the server derives the stored values again from what you send.</p>
    </section>
  )
}

/** A phone's compact view: the three levels, kept in sight at the bottom of the screen. */
export function LiveLevelsBar({ live }: { live: Live }) {
  const r = live.result
  return (
    <div aria-hidden="true" className="sticky bottom-0 z-10 -mx-4 border-t-2 border-signal bg-signal-soft px-4 py-2 @4xl:hidden">
      <p className="flex flex-wrap gap-x-4 font-mono text-sm font-semibold">
        <span>E {formatLevel(r?.derived.fieldStrengthDbuvPerM, 'dBµV/m')}</span>
        <span>S {formatLevel(r?.derived.pfdDbwPerM2, 'dBW/m²')}</span>
        <span>P {formatLevel(r?.derived.isotropicReceivedPowerDbm, 'dBm')}</span>
      </p>
      {(r?.problems.length ?? 0) + (r?.warnings.length ?? 0) > 0 && <p className="text-xs">{r!.problems.length > 0 ? 'A problem to fix: see the panel above the Save button.' : `${r!.warnings.length} warning(s): see the panel above the Save button.`}</p>}
    </div>
  )
}

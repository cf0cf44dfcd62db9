/** The located source: its position, the 95 % ellipse, the EIRP when levels were used, the residuals, and the map. */
import type { SourceLocateOutput } from '@shared/calculations'
import { FieldMap } from '@/components/map'
import { fmt, fmtM } from '../lib/units'
import { Figure } from './result-parts'

export function LocateResult({ value, withMap = true }: { value: SourceLocateOutput; withMap?: boolean }) {
  const e = value.ellipse95
  const points = [...value.levelResiduals, ...value.bearingResiduals]
  return (
    <div className="flex min-w-0 flex-col gap-4">
      <p className="text-2xl font-bold break-words">
        Source near {fmt(value.latDeg, '°', 5)}, {fmt(value.lonDeg, '°', 5)}
      </p>
      <p>
        95 % ellipse: {fmtM(e.semiMajorM)} by {fmtM(e.semiMinorM)} (half-axes), long axis toward {fmt(e.orientationDeg, '°', 0)} from true north.
      </p>
      {!value.converged && <p className="font-semibold text-danger">The search did not converge ({value.stopReason}): do not rely on this position.</p>}
      <dl className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        <Figure label="EIRP (from the levels)">
          {value.eirpDbm === null ? 'Not estimated (bearings only)' : `${fmt(value.eirpDbm, 'dBm')}${value.eirpStandardErrorDb !== null ? ` ± ${fmt(value.eirpStandardErrorDb, 'dB')} (1σ)` : ''}`}
        </Figure>
        <Figure label="ERP">{value.erpDbm === null ? '—' : fmt(value.erpDbm, 'dBm')}</Figure>
        <Figure label={value.exponentFitted ? 'Path-loss exponent (fitted)' : 'Path-loss exponent'}>{value.exponent === null ? '—' : fmt(value.exponent, '', 2).trim()}</Figure>
        <Figure label="χ² per degree of freedom">{value.reducedChiSquare === null ? '—' : fmt(value.reducedChiSquare, '', 2).trim()}</Figure>
        <Figure label="Observations">
          {value.levelResiduals.length} level{value.levelResiduals.length === 1 ? '' : 's'}, {value.bearingResiduals.length} bearing{value.bearingResiduals.length === 1 ? '' : 's'}
        </Figure>
      </dl>
      {(value.levelResiduals.length > 0 || value.bearingResiduals.length > 0) && (
        <ul aria-label="Residuals" className="list-disc pl-5 text-sm">
          {value.levelResiduals.map((r, k) => (
            <li key={`l${k}`}>
              Level {k + 1}: {fmt(r.receivedPowerDbm, 'dBm')}, residual {fmt(r.residualDb, 'dB')}
            </li>
          ))}
          {value.bearingResiduals.map((r, k) => (
            <li key={`b${k}`}>
              Bearing {k + 1}: {fmt(r.bearingDeg, '°', 1)}, residual {fmt(r.residualDeg, '°', 1)}
            </li>
          ))}
        </ul>
      )}
      {withMap && (
        <FieldMap
          label="Map of the located source"
          estimatedSource={{ at: { latDeg: value.latDeg, lonDeg: value.lonDeg }, ellipse: { semiMajorM: e.semiMajorM, semiMinorM: e.semiMinorM, orientationDeg: e.orientationDeg } }}
          measurements={points.map((p, k) => ({ id: `${k}`, at: { latDeg: p.latDeg, lonDeg: p.lonDeg }, label: `Point ${k + 1}` }))}
          bearings={value.bearingResiduals.map((b, k) => ({ id: `b${k}`, from: { latDeg: b.latDeg, lonDeg: b.lonDeg }, bearingDeg: b.bearingDeg, lengthM: Math.max(2000, 3 * e.semiMajorM), label: `Bearing ${k + 1}` }))}
          heightPx={320}
        />
      )}
    </div>
  )
}

/** EIRP and exponent fitted to several readings: the figures with their 95 % intervals, R², the readings against the fitted curve, and the residuals. */
import type { EirpFitOutput } from '@shared/calculations'
import { LevelDistanceChart, ResidualChart } from '@/components/charts'
import { fmt, fmtM } from '../lib/units'
import { Figure } from './result-parts'

export function FitResult({ value }: { value: EirpFitOutput }) {
  const c = value.curve
  const at = (eirpDbm: number, d: number) => eirpDbm - c.refLossDb - 10 * c.exponent * Math.log10(d / c.refDistanceM) // the record's own formula
  const i = value.eirpInterval95Dbm
  const xi = value.exponentInterval95
  return (
    <div className="flex min-w-0 flex-col gap-4">
      <p className="text-2xl font-bold">EIRP {fmt(value.eirpDbm, 'dBm')}</p>
      <p>{i ? `95 % interval ${fmt(i.lowDbm, 'dBm')} to ${fmt(i.highDbm, 'dBm')}` : 'No interval: too few readings for one.'}</p>
      <dl className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        <Figure label="ERP">
          {fmt(value.erpDbm, 'dBm')}
          {value.erpInterval95Dbm ? ` (${fmt(value.erpInterval95Dbm.lowDbm, 'dBm')} to ${fmt(value.erpInterval95Dbm.highDbm, 'dBm')})` : ''}
        </Figure>
        <Figure label={value.exponentFixed ? 'Path-loss exponent n (fixed)' : 'Path-loss exponent n (fitted)'}>
          {fmt(value.exponent, '', 2).trim()}
          {xi ? ` (95 %: ${fmt(xi.low, '', 2).trim()} to ${fmt(xi.high, '', 2).trim()})` : ''}
        </Figure>
        <Figure label="R² of the fit">{value.rSquared === null ? '—' : fmt(value.rSquared, '', 3).trim()}</Figure>
        <Figure label="Spread of the residuals (σ)">{value.residualStandardDeviationDb === null ? '—' : fmt(value.residualStandardDeviationDb, 'dB')}</Figure>
        <Figure label="Readings, degrees of freedom">
          {value.pointCount}, {value.degreesOfFreedom}
        </Figure>
        <Figure label="Distance span (farthest / nearest)">× {fmt(value.distanceSpanRatio, '', 1).trim()}</Figure>
      </dl>
      <p className="text-sm break-words text-ink-muted">Curve: {c.formula}</p>
      <LevelDistanceChart
        title="Readings and the fitted curve (isotropic received power)"
        quantity="levelDbm"
        points={value.points.map((p, k) => ({ distanceM: p.distanceM, value: p.receivedPowerDbm, label: `Reading ${k + 1}` }))}
        curve={{ label: 'Fitted curve', valueAt: (d) => at(c.eirpDbm, d) }}
        band={i ? { label: '95 % interval of the EIRP', boundsAt: (d) => ({ lower: at(i.lowDbm, d), upper: at(i.highDbm, d) }) } : null}
        heightPx={280}
      />
      <ResidualChart title="Residuals: reading − fitted curve" residuals={value.points.map((p, k) => ({ distanceM: p.distanceM, residualDb: p.residualDb, label: `Reading ${k + 1}` }))} heightPx={200} />
      <div className="overflow-x-auto rounded-control border border-rule">
        <table className="w-full min-w-[26rem] border-collapse text-left text-sm">
          <caption className="sr-only">Readings and residuals</caption>
          <thead className="border-b-2 border-ink">
            <tr>
              <th scope="col" className="px-3 py-2">Reading</th>
              <th scope="col" className="px-3 py-2 text-right">Distance</th>
              <th scope="col" className="px-3 py-2 text-right">Level</th>
              <th scope="col" className="px-3 py-2 text-right">Fitted</th>
              <th scope="col" className="px-3 py-2 text-right">Residual</th>
            </tr>
          </thead>
          <tbody>
            {value.points.map((p, k) => (
              <tr key={k} className="border-b border-rule">
                <td className="px-3 py-2">{k + 1}</td>
                <td className="px-3 py-2 text-right font-mono">{fmtM(p.distanceM)}</td>
                <td className="px-3 py-2 text-right font-mono">{fmt(p.receivedPowerDbm, 'dBm')}</td>
                <td className="px-3 py-2 text-right font-mono">{fmt(p.fittedPowerDbm, 'dBm')}</td>
                <td className="px-3 py-2 text-right font-mono">{fmt(p.residualDb, 'dB')}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  )
}

/** EIRP from one level: EIRP and ERP with the 95 % interval, the path, and the uncertainty budget. */
import { fmt, fmtM, fmtWatts } from '../lib/units'
import type { EirpSinglePointOutput as SinglePointOutput } from '@shared/calculations'
import { Figure } from './result-parts'
import { BudgetBars } from '@/components/charts'

export function SinglePointResult({ value }: { value: SinglePointOutput }) {
  const i = value.eirpIntervalDbm
  return (
    <div className="flex min-w-0 flex-col gap-4">
      <p className="text-2xl font-bold">
        EIRP {fmt(value.eirpDbm, 'dBm')} <span className="text-lg font-normal">({fmtWatts(value.eirpW)})</span>
      </p>
      <p>{i ? `95 % interval ${fmt(i.lowDbm, 'dBm')} to ${fmt(i.highDbm, 'dBm')} (± ${fmt(value.expandedUncertaintyDb, 'dB')})` : 'No interval: no uncertainty contribution was given.'}</p>
      <dl className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
        <Figure label="ERP">
          {fmt(value.erpDbm, 'dBm')} ({fmtWatts(value.erpW)})
        </Figure>
        <Figure label="Isotropic received power">{fmt(value.isotropicReceivedPowerDbm, 'dBm')}</Figure>
        <Figure label="Path loss">{fmt(value.pathLossDb, 'dB')}</Figure>
        <Figure label="Distance">{fmtM(value.distanceM)}</Figure>
        <Figure label="Model">{value.modelMethodId ?? '—'}</Figure>
      </dl>
      {value.budget && (
        <section aria-label="Uncertainty budget" className="flex min-w-0 flex-col gap-2">
          <h4 className="font-semibold">Uncertainty budget</h4>
          <div className="overflow-x-auto rounded-control border border-rule">
            <table className="w-full min-w-[28rem] border-collapse text-left text-sm">
              <caption className="sr-only">Uncertainty budget of the EIRP</caption>
              <thead className="border-b-2 border-ink">
                <tr>
                  <th scope="col" className="px-3 py-2">Contribution</th>
                  <th scope="col" className="px-3 py-2">Distribution</th>
                  <th scope="col" className="px-3 py-2 text-right">Standard uncertainty</th>
                  <th scope="col" className="px-3 py-2 text-right">Share of u_c²</th>
                </tr>
              </thead>
              <tbody>
                {value.budget.rows.map((r) => (
                  <tr key={r.name} className="border-b border-rule">
                    <td className="px-3 py-2">{r.name}</td>
                    <td className="px-3 py-2">{r.distribution ?? '—'}</td>
                    <td className="px-3 py-2 text-right font-mono">{fmt(r.contribution, 'dB', 3)}</td>
                    <td className="px-3 py-2 text-right font-mono">{fmt(r.varianceShare * 100, '%', 1)}</td>
                  </tr>
                ))}
              </tbody>
              <tfoot>
                <tr>
                  <td colSpan={4} className="px-3 py-2">
                    Combined u_c {fmt(value.budget.combinedStandardUncertainty, 'dB', 3)}; expanded U = k·u_c {fmt(value.budget.expandedUncertainty, 'dB', 3)} with k ={' '}
                    {value.budget.coverageFactor}
                  </td>
                </tr>
              </tfoot>
            </table>
          </div>
          <BudgetBars
            title="Share of each contribution in the combined variance"
            rows={value.budget.rows.map((r) => ({ name: r.name, contributionDb: r.contribution, varianceShare: r.varianceShare }))}
            combinedStandardUncertaintyDb={value.budget.combinedStandardUncertainty}
            expandedUncertaintyDb={value.budget.expandedUncertainty}
            coverageFactor={value.budget.coverageFactor}
          />
        </section>
      )}
    </div>
  )
}

/** The peaks the analysis found, as a table (the plot's marks are numbered the same). */
import type { SpectrumSummary } from '@shared/schemas/spectrum'
import { TableFrame } from '@/components/ui/table'
import { mhz } from './spectrum-format'

export function SpectrumPeaksTable({ peaks, levelUnit }: { peaks: SpectrumSummary['peaks']; levelUnit: SpectrumSummary['levelUnit'] }) {
  return (
    <TableFrame
      caption="Peaks found in the trace"
      head={
        <tr>
          <th scope="col" className="px-3 py-2">Peak</th>
          <th scope="col" className="px-3 py-2">Frequency</th>
          <th scope="col" className="px-3 py-2">Level ({levelUnit})</th>
          <th scope="col" className="px-3 py-2">Above the noise (dB)</th>
        </tr>
      }
    >
      {peaks.length === 0 ? (
        <tr>
          <td colSpan={4} className="px-3 py-2 text-ink-muted">No peak stands out of the noise.</td>
        </tr>
      ) : (
        peaks.map((p, i) => (
          <tr key={`${p.freqHz}-${i}`} className="border-t border-rule">
            <td className="px-3 py-2">{i + 1}</td>
            <td className="px-3 py-2">{mhz(p.freqHz)}</td>
            <td className="px-3 py-2">{p.levelDbm.toFixed(1)}</td>
            <td className="px-3 py-2">{p.aboveNoiseDb.toFixed(1)}</td>
          </tr>
        ))
      )}
    </TableFrame>
  )
}

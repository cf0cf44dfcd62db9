/** Residuals (measured − model, dB) against distance on a log axis, about a zero line. */
import { useId, useMemo } from 'react'
import type uPlot from 'uplot'
import type { ResidualChartProps } from '../chart-types'
import { formatDistanceTick, residualChartData } from '../lib/chart-data'
import { CHART_COLOURS as C, distanceAxis, useUplot, zeroLinePlugin } from './use-uplot'
import { FiguresTable } from './figures-table'

export default function ResidualChart({ title, residuals, distanceRangeM, heightPx = 220 }: ResidualChartProps) {
  const titleId = useId()
  const data = useMemo(() => residualChartData(residuals, distanceRangeM), [residuals, distanceRangeM])
  const aligned = useMemo<uPlot.AlignedData>(() => [data.x, data.residual], [data])
  const key = [heightPx, data.span?.minM, data.span?.maxM, data.halfRangeDb].join('|')
  const { ref } = useUplot(
    (width) => ({
      width,
      height: heightPx,
      legend: { live: false },
      cursor: { drag: { x: false, y: false } },
      scales: {
        x: { time: false, distr: 3, log: 10, auto: false, range: [data.span?.minM ?? 1, data.span?.maxM ?? 10] },
        y: { auto: false, range: [-data.halfRangeDb, data.halfRangeDb] },
      },
      axes: [distanceAxis(), { label: 'Residual (dB)', stroke: C.ink, grid: { stroke: C.grid, width: 1 }, ticks: { stroke: C.grid, width: 1 }, size: 56 }],
      series: [
        { label: 'Distance', value: (_u, v) => (v == null ? '' : formatDistanceTick(v)) },
        { label: 'Measured − model', stroke: C.measured, fill: C.measured, width: 1, paths: () => null, points: { show: true, size: 12, width: 1.5, stroke: C.surface, fill: C.measured } },
      ],
      plugins: [zeroLinePlugin()],
    }),
    aligned,
    key,
  )
  return (
    <figure aria-labelledby={titleId} className="flex min-w-0 flex-col gap-2">
      <figcaption id={titleId} className="font-semibold">
        {title}
      </figcaption>
      <div ref={ref} aria-hidden="true" className="qb-chart min-w-0" />
      <FiguresTable
        caption={`${title}: the residuals`}
        columns={['Point', 'Distance', 'Residual (dB)']}
        rows={data.x.map((x, i) => [data.labels[i] ?? '—', formatDistanceTick(x), data.residual[i]!.toFixed(1)])}
      />
    </figure>
  )
}

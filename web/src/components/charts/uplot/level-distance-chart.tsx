/**
 * Level (or path loss) against distance on a log axis: the measured points (orange circles),
 * the model curve (a line), its interval band (shaded) and named distances (dashed verticals).
 * The canvas is a picture; the same figures are in the table under it.
 */
import { useId, useMemo } from 'react'
import type uPlot from 'uplot'
import type { LevelDistanceChartProps } from '../chart-types'
import { QUANTITY_AXIS, formatDistanceTick, levelChartData } from '../lib/chart-data'
import { CHART_COLOURS as C, distanceAxis, marksPlugin, useUplot } from './use-uplot'
import { FiguresTable } from './figures-table'

export default function LevelDistanceChart(props: LevelDistanceChartProps) {
  const { title, quantity, points, curve, band, marks, distanceRangeM, heightPx = 300 } = props
  const titleId = useId()
  const data = useMemo(() => levelChartData({ points, curve, band, marks, distanceRangeM }), [points, curve, band, marks, distanceRangeM])
  const aligned = useMemo<uPlot.AlignedData>(() => [data.x, data.measured, data.model, data.upper, data.lower], [data])
  const key = [quantity, heightPx, curve?.label, band?.label, data.span?.minM, data.span?.maxM, data.marks.map((m) => `${m.label}@${m.distanceM}`).join()].join('|')

  const { ref } = useUplot(
    (width) => ({
      width,
      height: heightPx,
      legend: { live: false },
      cursor: { drag: { x: false, y: false } },
      scales: { x: { time: false, distr: 3, log: 10, auto: false, range: [data.span?.minM ?? 1, data.span?.maxM ?? 10] } },
      axes: [distanceAxis(), { label: QUANTITY_AXIS[quantity], stroke: C.ink, grid: { stroke: C.grid, width: 1 }, ticks: { stroke: C.grid, width: 1 }, size: 56 }],
      series: [
        { label: 'Distance', value: (_u, v) => (v == null ? '' : formatDistanceTick(v)) },
        { label: 'Measured', stroke: C.measured, fill: C.measured, width: 1, paths: () => null, points: { show: true, size: 12, width: 1.5, stroke: C.surface, fill: C.measured } },
        { label: curve?.label ?? 'Model', show: !!curve, stroke: C.model, width: 2.5, spanGaps: true, pxAlign: 0, points: { show: false } },
        { label: band?.label ?? 'Interval', show: !!band, stroke: C.bandEdge, fill: C.band, width: 1, dash: [4, 4], spanGaps: true, pxAlign: 0, points: { show: false } },
        { label: band ? `${band.label} (lower)` : 'Interval (lower)', show: !!band, stroke: C.bandEdge, width: 1, dash: [4, 4], spanGaps: true, pxAlign: 0, points: { show: false } },
      ],
      bands: band ? [{ series: [3, 4], fill: C.band }] : [],
      plugins: [marksPlugin(data.marks)],
    }),
    aligned,
    key,
  )

  const unit = QUANTITY_AXIS[quantity].replace(/^.*\((.*)\)$/, '$1')
  return (
    <figure aria-labelledby={titleId} className="flex min-w-0 flex-col gap-2">
      <figcaption id={titleId} className="font-semibold">
        {title}
      </figcaption>
      <div ref={ref} aria-hidden="true" className={`qb-chart min-w-0 ${band ? 'qb-chart-band' : ''}`} />
      {data.dropped > 0 && <p className="text-sm text-ink-muted">{data.dropped} point(s) at 0 m or without a value are not shown on the log axis.</p>}
      <FiguresTable
        caption={`${title}: the measured points`}
        columns={['Point', 'Distance', `${QUANTITY_AXIS[quantity].replace(/ \(.*\)$/, '')} (${unit})`, ...(curve ? [`${curve.label} (${unit})`] : [])]}
        rows={data.x.flatMap((x, i) =>
          data.measured[i] == null ? [] : [[data.labels[i] ?? '—', formatDistanceTick(x), data.measured[i]!.toFixed(1), ...(curve ? [data.model[i]?.toFixed(1) ?? '—'] : [])]],
        )}
      />
    </figure>
  )
}

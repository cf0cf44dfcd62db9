/**
 * Time taken against the target, per group (a priority): the median and the 90th percentile
 * as paired bars, the target as a tick across the group. Hours on a log scale, so a 1-hour
 * and a 10-day target read on one chart.
 */
import { useId, useMemo } from 'react'
import uPlot from 'uplot'
import type { PerformanceChartProps } from '../chart-types'
import { CHART_COLOURS as C, useUplot } from './use-uplot'
import { FiguresTable } from './figures-table'

const fmt = (h: number | null) => (h === null ? '—' : h < 48 ? `${h.toFixed(1)} h` : `${(h / 24).toFixed(1)} d`)

/** Draws each group's target as a dark tick across its pair of bars. */
function targetTicksPlugin(targets: (number | null)[]): uPlot.Plugin {
  return {
    hooks: {
      draw: [
        (u) => {
          const ctx = u.ctx
          ctx.save()
          ctx.strokeStyle = C.ink
          ctx.lineWidth = 3 * uPlot.pxRatio
          targets.forEach((t, i) => {
            if (t === null) return
            const x = u.valToPos(i, 'x', true)
            const y = Math.round(u.valToPos(t, 'y', true))
            const half = (u.bbox.width / targets.length) * 0.36
            ctx.beginPath()
            ctx.moveTo(x - half, y)
            ctx.lineTo(x + half, y)
            ctx.stroke()
          })
          ctx.restore()
        },
      ],
    },
  }
}

export default function PerformanceChart({ title, groups, heightPx = 220 }: PerformanceChartProps) {
  const titleId = useId()
  const aligned = useMemo<uPlot.AlignedData>(
    () => [groups.map((_, i) => i), groups.map((g) => g.medianHours), groups.map((g) => g.p90Hours)],
    [groups],
  )
  const values = groups.flatMap((g) => [g.medianHours, g.p90Hours, g.targetHours]).filter((v): v is number => v !== null && v > 0)
  const maxH = Math.max(1, ...values) * 1.5
  const minH = Math.min(1, ...values) / 1.5
  const key = [heightPx, groups.length, minH, maxH, groups.map((g) => g.targetHours).join(',')].join('|')
  const bars = (align: -1 | 1) => uPlot.paths.bars!({ size: [0.34, Infinity], align, gap: 2 })
  const { ref } = useUplot(
    (width) => ({
      width,
      height: heightPx,
      legend: { show: true, live: false },
      cursor: { show: false },
      scales: {
        x: { time: false, auto: false, range: [-0.6, groups.length - 0.4] },
        y: { distr: 3, log: 10, auto: false, range: [minH, maxH] },
      },
      axes: [
        // names on two lines ("Service\nlost"), so four of them fit a phone's width
        { stroke: C.ink, size: 52, grid: { show: false }, ticks: { show: false }, splits: () => groups.map((_, i) => i), values: () => groups.map((g) => g.label.replace(' ', '\n')) },
        { label: 'Hours (log scale)', stroke: C.ink, grid: { stroke: C.grid, width: 1 }, ticks: { stroke: C.grid, width: 1 }, size: 56 },
      ],
      series: [
        { label: 'Class' },
        { label: 'Median', stroke: C.model, fill: C.model, width: 0, paths: bars(-1), points: { show: false } },
        { label: '90th percentile', stroke: C.measured, fill: C.measured, width: 0, paths: bars(1), points: { show: false } },
      ],
      plugins: [targetTicksPlugin(groups.map((g) => g.targetHours))],
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
      <p className="text-sm text-ink-muted">Bars: median and 90th percentile; dark tick: the target.</p>
      <FiguresTable
        caption={`${title}: the figures`}
        columns={['Class', 'Median', '90th percentile', 'Target']}
        rows={groups.map((g) => [g.label, fmt(g.medianHours), fmt(g.p90Hours), fmt(g.targetHours)])}
      />
    </figure>
  )
}

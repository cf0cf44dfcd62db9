/**
 * One uPlot instance in a container: made when the options change, given new data in place,
 * resized with its container's width, destroyed on unmount.
 */
import 'uplot/dist/uPlot.min.css'
import './charts.css'
import { useEffect, useRef } from 'react'
import uPlot from 'uplot'
import { formatDistanceTick, logDistanceSplits } from '../lib/chart-data'

export function useUplot(makeOptions: (width: number) => uPlot.Options, data: uPlot.AlignedData, optionsKey: string): { ref: React.RefObject<HTMLDivElement | null>; plot: React.RefObject<uPlot | null> } {
  const ref = useRef<HTMLDivElement>(null)
  const plot = useRef<uPlot | null>(null)
  const dataRef = useRef(data)
  dataRef.current = data
  const make = useRef(makeOptions)
  make.current = makeOptions

  useEffect(() => {
    const el = ref.current
    if (!el) return
    const width = Math.max(280, el.clientWidth)
    const u = new uPlot(make.current(width), dataRef.current, el)
    plot.current = u
    const observer = new ResizeObserver(() => {
      const w = Math.max(280, el.clientWidth)
      if (w !== u.width) u.setSize({ width: w, height: u.height })
    })
    observer.observe(el)
    return () => {
      observer.disconnect()
      u.destroy()
      plot.current = null
    }
  }, [optionsKey])

  useEffect(() => {
    plot.current?.setData(data)
  }, [data])

  return { ref, plot }
}

/** The palette (styles.css) as canvas colours: canvas cannot read CSS variables. */
export const CHART_COLOURS = {
  ink: '#18212b',
  inkMuted: '#4a5562',
  grid: '#d9d4c7',
  measured: '#a84b00',
  model: '#0e5a6e',
  band: 'rgba(14, 90, 110, 0.14)',
  bandEdge: 'rgba(14, 90, 110, 0.45)',
  mark: '#586270',
  surface: '#ffffff',
} as const

/** A log10 distance axis: ticks read as "10 m", "1 km", "31.6 km"… */
export function distanceAxis(): uPlot.Axis {
  return {
    label: 'Distance (log scale)',
    stroke: CHART_COLOURS.ink,
    grid: { stroke: CHART_COLOURS.grid, width: 1 },
    ticks: { stroke: CHART_COLOURS.grid, width: 1 },
    // round distances (1, 2, 5 × 10^k) rather than uPlot's own log splits, which land between them
    splits: (u) => logDistanceSplits(u.scales.x!.min ?? 1, u.scales.x!.max ?? 10),
    values: (_u, splits) => splits.map((d) => (d == null ? '' : formatDistanceTick(d))),
  }
}

/** A solid horizontal line across the plot at y = 0 (the residuals' zero). */
export function zeroLinePlugin(): uPlot.Plugin {
  return {
    hooks: {
      draw: [
        (u) => {
          const y = Math.round(u.valToPos(0, 'y', true))
          const { left, width } = u.bbox
          u.ctx.save()
          u.ctx.strokeStyle = CHART_COLOURS.ink
          u.ctx.lineWidth = 1.5 * uPlot.pxRatio
          u.ctx.beginPath()
          u.ctx.moveTo(left, y)
          u.ctx.lineTo(left + width, y)
          u.ctx.stroke()
          u.ctx.restore()
        },
      ],
    },
  }
}

/** Vertical dashed lines with their names at given distances (drawn after the series). */
export function marksPlugin(marks: { label: string; distanceM: number }[]): uPlot.Plugin {
  return {
    hooks: {
      draw: [
        (u) => {
          const ctx = u.ctx
          const { top, height } = u.bbox
          ctx.save()
          ctx.strokeStyle = CHART_COLOURS.mark
          ctx.fillStyle = CHART_COLOURS.ink
          ctx.lineWidth = 1.5 * uPlot.pxRatio
          ctx.setLineDash([6 * uPlot.pxRatio, 4 * uPlot.pxRatio])
          ctx.font = `${12 * uPlot.pxRatio}px system-ui, sans-serif`
          ctx.textBaseline = 'top'
          marks.forEach((m, i) => {
            const x = Math.round(u.valToPos(m.distanceM, 'x', true))
            ctx.beginPath()
            ctx.moveTo(x, top)
            ctx.lineTo(x, top + height)
            ctx.stroke()
            ctx.fillText(m.label, x + 4 * uPlot.pxRatio, top + (4 + 16 * i) * uPlot.pxRatio)
          })
          ctx.restore()
        },
      ],
    },
  }
}

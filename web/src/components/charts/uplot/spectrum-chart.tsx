/**
 * A spectrum: level against frequency (MHz), a second trace over it when given, the peaks as
 * marks, a picked band shaded, and the spectrogram as an image under the plot on the same
 * frequency axis (it follows the zoom). Drag across the plot to zoom; "Reset the zoom" (or a
 * double click) shows the whole span. The cursor's frequency and level are read out in words.
 */
import { useEffect, useId, useMemo, useRef, useState } from 'react'
import uPlot from 'uplot'
import { Button } from '@/components/ui/button'
import type { SpectrumChartProps } from '../spectrum-types'
import { SPECTROGRAM_RAMP, alignTraces, formatMhz, mhzTicks, spectrogramPixels } from '../lib/spectrum-data'
import { CHART_COLOURS as C, useUplot } from './use-uplot'

const SPECTROGRAM_HEIGHT_PX = 160

interface Readout {
  freqHz: number
  main: number | null
  overlay: number | null
}

export default function SpectrumChart(props: SpectrumChartProps) {
  const { title, levelUnit, main, overlay, peaks, band, spectrogram, heightPx = 320 } = props
  const titleId = useId()
  const specRef = useRef<HTMLCanvasElement>(null)
  const [readout, setReadout] = useState<Readout | null>(null)
  const [zoomed, setZoomed] = useState(false)

  const aligned = useMemo(() => alignTraces(main, overlay), [main, overlay])
  const fullRange = useMemo(() => [aligned.x[0] ?? 0, aligned.x[aligned.x.length - 1] ?? 1] as const, [aligned])
  // what the draw hook reads: kept in refs so a new band redraws without a new plot
  const drawn = useRef({ band, peaks, spectrogram })
  drawn.current = { band, peaks, spectrogram }
  const image = useMemo(() => {
    if (!spectrogram || typeof document === 'undefined') return null
    const c = document.createElement('canvas')
    c.width = spectrogram.columnCount
    c.height = spectrogram.rowCount
    const ctx = c.getContext('2d')
    if (!ctx) return null
    ctx.putImageData(new ImageData(spectrogramPixels(spectrogram.cellsBase64, spectrogram.rowCount, spectrogram.columnCount), spectrogram.columnCount, spectrogram.rowCount), 0, 0)
    return c
  }, [spectrogram])
  const imageRef = useRef(image)
  imageRef.current = image

  const key = [levelUnit, heightPx, main.label, overlay?.label ?? '', aligned.x.length].join('|')

  // made again when its shape changes (key); the band, peaks and image redraw in place
  const makeOptions = (width: number): uPlot.Options => {
    const drawSpectrogram = (u: uPlot) => {
      const canvas = specRef.current
      const s = drawn.current.spectrogram
      const img = imageRef.current
      if (!canvas || !s || !img) return
      const left = u.bbox.left / uPlot.pxRatio
      const width = u.bbox.width / uPlot.pxRatio
      canvas.style.marginLeft = `${left}px`
      canvas.style.width = `${width}px`
      canvas.width = Math.max(1, Math.round(width * uPlot.pxRatio))
      canvas.height = Math.round(SPECTROGRAM_HEIGHT_PX * uPlot.pxRatio)
      const ctx = canvas.getContext('2d')
      if (!ctx) return
      ctx.clearRect(0, 0, canvas.width, canvas.height)
      ctx.imageSmoothingEnabled = false
      // the image's columns span [first − bin/2, first + (n − ½)·bin]: placed by the plot's own x scale
      const loHz = s.firstColumnHz - s.binSpacingHz / 2
      const hiHz = loHz + s.columnCount * s.binSpacingHz
      const x0 = u.valToPos(loHz, 'x', true) - u.bbox.left
      const x1 = u.valToPos(hiHz, 'x', true) - u.bbox.left
      ctx.drawImage(img, x0, 0, x1 - x0, canvas.height)
    }
    const overlays: uPlot.Plugin = {
      hooks: {
        draw: [
          (u) => {
            const ctx = u.ctx
            const { left, top, width, height } = u.bbox
            const { band: b, peaks: p } = drawn.current
            ctx.save()
            ctx.beginPath()
            ctx.rect(left, top, width, height)
            ctx.clip()
            if (b) {
              const x0 = u.valToPos(b.lowFreqHz, 'x', true)
              const x1 = u.valToPos(b.highFreqHz, 'x', true)
              ctx.fillStyle = C.band
              ctx.fillRect(x0, top, x1 - x0, height)
              ctx.strokeStyle = C.bandEdge
              ctx.lineWidth = uPlot.pxRatio
              ctx.strokeRect(x0, top, x1 - x0, height)
            }
            ctx.fillStyle = C.measured
            ctx.strokeStyle = C.surface
            ctx.font = `${12 * uPlot.pxRatio}px system-ui, sans-serif`
            p.forEach((peak, i) => {
              const x = u.valToPos(peak.freqHz, 'x', true)
              const r = 6 * uPlot.pxRatio
              // a mark pointing down at the peak, kept inside the plot
              const tip = Math.max(u.valToPos(peak.level, 'y', true) - 2 * r, top + 1.5 * r)
              ctx.beginPath()
              ctx.moveTo(x, tip)
              ctx.lineTo(x - r, tip - 1.5 * r)
              ctx.lineTo(x + r, tip - 1.5 * r)
              ctx.closePath()
              ctx.fill()
              ctx.stroke()
              ctx.fillStyle = C.ink
              ctx.fillText(String(i + 1), x + 1.4 * r, tip - 0.6 * r)
              ctx.fillStyle = C.measured
            })
            ctx.restore()
            drawSpectrogram(u)
          },
        ],
        setCursor: [
          (u) => {
            const idx = u.cursor.idx
            if (idx == null) return setReadout(null)
            setReadout({ freqHz: u.data[0][idx]!, main: (u.data[1]![idx] as number | null) ?? null, overlay: (u.data[2]?.[idx] as number | null | undefined) ?? null })
          },
        ],
        setScale: [
          (u, scaleKey) => {
            if (scaleKey !== 'x') return
            const [lo, hi] = fullRange
            setZoomed((u.scales.x!.min ?? lo) > lo || (u.scales.x!.max ?? hi) < hi)
          },
        ],
      },
    }
    const axisStyle = { stroke: C.ink, grid: { stroke: C.grid, width: 1 }, ticks: { stroke: C.grid, width: 1 } }
    return {
      width,
      height: heightPx,
      legend: { live: false },
      cursor: { drag: { x: true, y: false, setScale: true } },
      // headroom above the highest level for the peak marks
      scales: { x: { time: false }, y: { range: (_u, min, max) => [Math.floor(min - 2), Math.ceil(max + 0.25 * Math.max(10, max - min))] } },
      axes: [
        { ...axisStyle, label: 'Frequency (MHz)', values: (_u, splits) => mhzTicks(splits) },
        { ...axisStyle, label: `Level (${levelUnit})`, size: 56 },
      ],
      series: [
        { label: 'Frequency', value: (_u, v) => (v == null ? '' : formatMhz(v)) },
        { label: main.label, stroke: C.model, width: 1.5, spanGaps: true, points: { show: false } },
        { label: overlay?.label ?? 'Second file', show: !!overlay, stroke: C.measured, width: 1.5, spanGaps: true, points: { show: false } },
      ],
      plugins: [overlays],
    }
  }
  const plotData = useMemo(() => [aligned.x, aligned.a, aligned.b] as uPlot.AlignedData, [aligned])
  const { ref: plotRef, plot } = useUplot(makeOptions, plotData, key)

  useEffect(() => {
    plot.current?.redraw(false)
  }, [band, peaks, image])

  const reset = () => plot.current?.setScale('x', { min: fullRange[0], max: fullRange[1] })
  const level = (v: number | null) => (v == null ? '—' : `${v.toFixed(1)} ${levelUnit}`)

  return (
    <figure aria-labelledby={titleId} className="flex min-w-0 flex-col gap-2">
      <figcaption id={titleId} className="font-semibold">
        {title}
      </figcaption>
      <div className="flex flex-col gap-2 sm:flex-row sm:items-center sm:justify-between">
        <p aria-live="polite" className="min-h-6 text-sm">
          {readout ? (
            <>
              <span className="font-semibold">Cursor</span> {formatMhz(readout.freqHz)} · {main.label}: {level(readout.main)}
              {overlay ? ` · ${overlay.label}: ${level(readout.overlay)}` : ''}
            </>
          ) : (
            <span className="text-ink-muted">Point at the plot to read a level; drag across it to zoom.</span>
          )}
        </p>
        <Button variant="secondary" className="w-full sm:w-auto" disabled={!zoomed} onClick={reset}>
          Reset the zoom
        </Button>
      </div>
      <div ref={plotRef} aria-hidden="true" className="qb-chart min-w-0" />
      {spectrogram && (
        <div className="flex min-w-0 flex-col gap-1">
          <p className="text-sm font-semibold">Spectrogram (time runs down, same frequency axis)</p>
          <canvas ref={specRef} aria-hidden="true" className="block max-w-full border border-rule" style={{ height: SPECTROGRAM_HEIGHT_PX }} />
          <div className="flex items-center gap-2 text-sm">
            <span>
              {spectrogram.minDb.toFixed(1)} {spectrogram.levelUnit}
            </span>
            <span aria-hidden="true" className="h-3 w-40 max-w-full rounded-sm border border-rule" style={{ background: `linear-gradient(to right, ${SPECTROGRAM_RAMP.join(', ')})` }} />
            <span>
              {spectrogram.maxDb.toFixed(1)} {spectrogram.levelUnit}
            </span>
          </div>
        </div>
      )}
    </figure>
  )
}

/** The uPlot charts behind React.lazy: uPlot and its CSS load only where a chart shows. */
import { Suspense, lazy } from 'react'
import { Loading } from '@/components/ui/loading'
import type { LevelDistanceChartProps, PerformanceChartProps, ResidualChartProps } from './chart-types'

const LevelImpl = lazy(() => import('./uplot/level-distance-chart'))
const ResidualImpl = lazy(() => import('./uplot/residual-chart'))
const PerformanceImpl = lazy(() => import('./uplot/performance-chart'))

export function LevelDistanceChart(props: LevelDistanceChartProps) {
  return (
    <Suspense fallback={<Loading label="Loading the chart…" />}>
      <LevelImpl {...props} />
    </Suspense>
  )
}

export function ResidualChart(props: ResidualChartProps) {
  return (
    <Suspense fallback={<Loading label="Loading the chart…" />}>
      <ResidualImpl {...props} />
    </Suspense>
  )
}

export function PerformanceChart(props: PerformanceChartProps) {
  return (
    <Suspense fallback={<Loading label="Loading the chart…" />}>
      <PerformanceImpl {...props} />
    </Suspense>
  )
}

/** The spectrum chart behind React.lazy: uPlot loads only where a spectrum shows. */
import { Suspense, lazy } from 'react'
import { Loading } from '@/components/ui/loading'
import type { SpectrumChartProps } from './spectrum-types'

const SpectrumImpl = lazy(() => import('./uplot/spectrum-chart'))

export function SpectrumChart(props: SpectrumChartProps) {
  return (
    <Suspense fallback={<Loading label="Loading the spectrum…" />}>
      <SpectrumImpl {...props} />
    </Suspense>
  )
}

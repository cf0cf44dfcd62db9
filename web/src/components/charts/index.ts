/**
 * Charts: uPlot, loaded only where a chart shows (LevelDistanceChart and ResidualChart are
 * lazy); BudgetBars is plain HTML. Import from here.
 */
export { LevelDistanceChart, PerformanceChart, ResidualChart } from './lazy-charts'
export { BudgetBars } from './budget-bars'
export { SpectrumChart } from './lazy-spectrum'
export type { SpectrumChartProps, SpectrumTrace } from './spectrum-types'
export type {
  BudgetBarRow,
  BudgetBarsProps,
  DistanceMark,
  LevelBand,
  LevelCurve,
  LevelDistanceChartProps,
  LevelPoint,
  LevelQuantity,
  PerformanceChartProps,
  PerformanceGroup,
  ResidualChartProps,
  ResidualPoint,
} from './chart-types'

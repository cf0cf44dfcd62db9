/**
 * The props of the charts (components/charts): distances in metres, levels in the unit their
 * quantity names, dB differences in dB.
 */

/**
 * What the y axis of a level–distance chart shows, and so the unit of every value on it:
 * received level [dBm], field strength [dBµV/m] or path loss [dB, positive].
 */
export type LevelQuantity = 'levelDbm' | 'fieldStrengthDbuvPerM' | 'pathLossDb'

/** A measured point; `value` is in the unit of the chart's `quantity`. */
export interface LevelPoint {
  distanceM: number
  value: number
  label?: string
}

/** The model curve: its value (in the unit of `quantity`) at a distance. */
export interface LevelCurve {
  label: string
  valueAt: (distanceM: number) => number
}

/** The interval band around the curve (e.g. the 95 % interval), in the unit of `quantity`. */
export interface LevelBand {
  label: string
  boundsAt: (distanceM: number) => { lower: number; upper: number }
}

/** A named distance drawn as a vertical line (a breakpoint, the victim's distance…). */
export interface DistanceMark {
  label: string
  distanceM: number
}

export interface LevelDistanceChartProps {
  /** The chart's title and accessible name. */
  title: string
  quantity: LevelQuantity
  points: LevelPoint[]
  curve?: LevelCurve | null
  band?: LevelBand | null
  marks?: DistanceMark[]
  /** The x axis span [m]; default: the points and marks, widened to whole decades' halves. */
  distanceRangeM?: { minM: number; maxM: number }
  /** Height of the plot [CSS px]; default 300. The width follows the container. */
  heightPx?: number
}

/** A residual: measured − model [dB]. */
export interface ResidualPoint {
  distanceM: number
  residualDb: number
  label?: string
}

export interface ResidualChartProps {
  title: string
  residuals: ResidualPoint[]
  distanceRangeM?: { minM: number; maxM: number }
  heightPx?: number
}

/** One row of an uncertainty budget (as the radio library's `BudgetRow`, output in dB). */
export interface BudgetBarRow {
  name: string
  /** |c_i|·u(x_i) [dB]. */
  contributionDb: number
  /** Share of u_c² (0–1). */
  varianceShare: number
}

export interface BudgetBarsProps {
  title: string
  rows: BudgetBarRow[]
  /** u_c [dB], shown under the bars when given. */
  combinedStandardUncertaintyDb?: number
  /** U = k·u_c [dB] and its k, shown under the bars when given. */
  expandedUncertaintyDb?: number
  coverageFactor?: number
}

/** One group of bars of a performance chart (a priority): hours, null where nothing happened. */
export interface PerformanceGroup {
  label: string
  medianHours: number | null
  p90Hours: number | null
  /** The target the office sets for the group, in hours; null when offices differ. */
  targetHours: number | null
}

export interface PerformanceChartProps {
  /** The chart's title and accessible name. */
  title: string
  groups: PerformanceGroup[]
  /** Height of the plot [CSS px]; default 220. The width follows the container. */
  heightPx?: number
}

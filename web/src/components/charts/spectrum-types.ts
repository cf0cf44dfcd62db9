/** The props of the spectrum chart: frequencies in Hz, levels in the chart's `levelUnit`. */
import type { SpectrogramView } from '@shared/schemas/spectrum'

export interface SpectrumTrace {
  label: string
  freqHz: number[]
  /** Level of each point, in the chart's `levelUnit`. */
  level: number[]
}

export interface SpectrumChartProps {
  title: string
  levelUnit: 'dBm' | 'dBFS'
  main: SpectrumTrace
  /** A second trace drawn over the first (another file of the case). */
  overlay?: SpectrumTrace | null
  /** Peaks of the main trace, marked on the plot. */
  peaks: { freqHz: number; level: number }[]
  /** The band picked, shaded on the plot [Hz]. */
  band?: { lowFreqHz: number; highFreqHz: number } | null
  /** Drawn as an image under the plot, on the same frequency axis. */
  spectrogram?: SpectrogramView | null
  heightPx?: number
}

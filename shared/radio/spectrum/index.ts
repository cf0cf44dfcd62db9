/**
 * Spectrum evidence: analyser traces and I/Q recordings turned into a spectrum, its peaks,
 * noise floor, channel power and occupied bandwidth. Each file names its document and section.
 */
export * from './windows'
export * from './iq'
export * from './welch-psd'
export * from './trace'
export * from './noise-floor'
export * from './peaks'
export * from './channel-power'
export * from './occupied-bandwidth'
export * from './psd-trace'
export * from './trace-csv'
export * from './sigmf'
export * from './welch-accumulator'
export * from './spectrogram'
export * from './trace-decimate'

/** Estimation: EIRP from one measurement, EIRP and exponent from several, and the source's position. */
export * from './eirp-from-measurement'
export * from './fit-eirp-exponent'
export * from './levenberg-marquardt'
export * from './locate-source'
